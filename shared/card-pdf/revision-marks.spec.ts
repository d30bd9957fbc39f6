import { buildCard } from '../card/build-card';
import { HAND_CONTEXT, handPistonContent, handPistonInputs, revisionOf } from '../card/testing/test-fixtures';
import type { RevisionContent } from '../speed-book/revision-content';
import { cardChanges, cardLines, lineKey, previousCardOf } from './revision-marks';

// Invented test data — not for flight. Expected sets are worked by hand from the fixture
// (shared/card/testing/test-fixtures.ts): which printed lines depend on which entry of the speed book.

const inputs = handPistonInputs();
const current = (content: RevisionContent) => buildCard(revisionOf(content, 12, 4), inputs, HAND_CONTEXT);
const previousOf = (content: RevisionContent) => previousCardOf(revisionOf(content, 11, 3), inputs, HAND_CONTEXT);

function changedBetween(before: RevisionContent, after: RevisionContent) {
  return cardChanges(current(after), previousOf(before));
}

describe('revision marks', () => {
  it('marks nothing when the revisions give the same card', () => {
    const changes = changedBetween(handPistonContent(), handPistonContent());
    expect(changes).toEqual({ againstRevision: 3, compared: true, changed: new Set(), removed: [] });
  });

  it('marks only the line of a speed whose value changed', () => {
    const after = handPistonContent();
    const vy = after.speeds.find((speed) => speed.code === 'VY')!;
    if (vy.kind !== 'fixed') throw new Error('fixture changed');
    vy.valueKt = 82;
    expect([...changedBetween(handPistonContent(), after).changed]).toEqual([lineKey.speed('VY', 'clean')]);
  });

  it('marks every line that follows a changed limit: the limit, its arc and line, each altitude row', () => {
    const after = handPistonContent();
    after.limits.vneKt = 140;
    const card = current(after);
    const changes = changedBetween(handPistonContent(), after);
    // VNE bounds the yellow arc and is the red line; it is the limit of every altitude row (no VMO).
    const expected = [lineKey.limit('VNE'), lineKey.arc('yellow'), lineKey.line('VNE'), ...card.altitudeTable.map((row) => lineKey.altitude(row.pressureAltitudeFt))];
    expect([...changes.changed].sort()).toEqual(expected.sort());
    expect(card.altitudeTable.length).toBeGreaterThan(1);
  });

  it('marks a speed the previous revision did not have, and names one it had that is gone', () => {
    const before = handPistonContent();
    const after = handPistonContent();
    after.speeds = after.speeds.filter((speed) => speed.code !== 'VY');
    after.speeds.push({ code: 'VX', label: 'Best angle of climb', phase: 'climb', configurationKey: 'clean', basis: 'ias', kind: 'fixed', valueKt: 70 });
    const changes = changedBetween(before, after);
    expect([...changes.changed]).toEqual([lineKey.speed('VX', 'clean')]);
    expect(changes.removed).toEqual(['VY, best rate of climb']);
  });

  it('marks every line when the previous revision refuses a card for these inputs', () => {
    const before = handPistonContent();
    before.weights.maximumTakeoffKg = 850; // the inputs' 900 kg is outside its data
    before.weights.maximumLandingKg = 850;
    const previous = previousOf(before);
    expect(previous.kind).toBe('refused');
    const card = current(handPistonContent());
    const changes = cardChanges(card, previous);
    expect(changes.changed).toEqual(new Set(cardLines(card).keys()));
    expect(changes.changed.has(lineKey.speed('VR', 'flap'))).toBe(true);
  });

  it('marks nothing on the first revision, and says when the previous one is not at hand', () => {
    const card = current(handPistonContent());
    expect(cardChanges(card, previousCardOf(null, inputs, HAND_CONTEXT))).toEqual({ againstRevision: null, compared: true, changed: new Set(), removed: [] });
    expect(cardChanges(card, { kind: 'unavailable', revisionNumber: 3 })).toEqual({ againstRevision: 3, compared: false, changed: new Set(), removed: [] });
  });
});
