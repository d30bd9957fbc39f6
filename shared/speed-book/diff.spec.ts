import { demoPistonTrainerContent, demoPistonTrainerContentRevised } from './demo-content';
import { diffContent } from './diff';

describe('diffContent', () => {
  it('gives nothing for identical contents, whatever the key order', () => {
    const reversedKeys = (value: unknown): unknown =>
      Array.isArray(value)
        ? value.map(reversedKeys)
        : typeof value === 'object' && value !== null
          ? Object.fromEntries(Object.entries(value).reverse().map(([k, v]) => [k, reversedKeys(v)]))
          : value;
    const a = demoPistonTrainerContent();
    expect(diffContent(a, demoPistonTrainerContent())).toEqual([]);
    const b = reversedKeys(a);
    expect(Object.keys(b as object)[0]).toBe('notes');
    expect(diffContent(a, b)).toEqual([]);
  });

  it('lists the demo trainer’s changes field by field, speeds matched by code and configuration', () => {
    expect(diffContent(demoPistonTrainerContent(), demoPistonTrainerContentRevised())).toEqual([
      { path: 'configurations[landing-flap].positionError.1.casKt', before: 50, after: 51, kind: 'changed' },
      { path: 'speeds[VR@takeoff-flap].referenceKt', before: 55, after: 56, kind: 'changed' },
      { path: 'speeds[VX@clean].referenceKt', before: 62, after: 63, kind: 'changed' },
      { path: 'speeds[VREF@landing-flap].referenceKt', before: 63, after: 65, kind: 'changed' },
      {
        path: 'speeds[VAPP@takeoff-flap]',
        after: { code: 'VAPP', label: 'Approach, flaps 10°', phase: 'approach', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'scaled', referenceKt: 68 },
        kind: 'added',
      },
      { path: 'limits.vfeKt.landing-flap', before: 85, after: 87, kind: 'changed' },
      { path: 'notes', before: 'Invented demo data — not for flight.', after: expect.stringMatching(/Revision 2 corrects/), kind: 'changed' },
    ]);
  });

  it('matches keyed items by key, not position, and reports removals where they stood', () => {
    const before = demoPistonTrainerContent();
    const after = demoPistonTrainerContent();
    after.speeds.reverse();
    expect(diffContent(before, after)).toEqual([]);

    after.speeds = after.speeds.filter((s) => s.code !== 'VA');
    after.configurations = [after.configurations[2], after.configurations[0]];
    const changes = diffContent(before, after);
    expect(changes.map(({ path, kind }) => ({ path, kind }))).toEqual([
      { path: 'configurations[takeoff-flap]', kind: 'removed' },
      { path: 'speeds[VA@clean]', kind: 'removed' },
    ]);
  });

  it('shows a change of kind as the fields that went and came', () => {
    const before = demoPistonTrainerContent();
    const after = demoPistonTrainerContent();
    after.speeds[2] = { ...after.speeds[2], kind: 'fixed', valueKt: 57 } as never;
    delete (after.speeds[2] as { referenceKt?: number }).referenceKt;
    expect(diffContent(before, after)).toEqual([
      { path: 'speeds[VR@takeoff-flap].kind', before: 'scaled', after: 'fixed', kind: 'changed' },
      { path: 'speeds[VR@takeoff-flap].valueKt', after: 57, kind: 'added' },
      { path: 'speeds[VR@takeoff-flap].referenceKt', before: 55, kind: 'removed' },
    ]);
  });

  it('compares other lists position by position, or whole when their length changed', () => {
    const before = demoPistonTrainerContent();
    const after = demoPistonTrainerContent();
    after.configurations[0].positionError.push({ iasKt: 170, casKt: 166 });
    expect(diffContent(before, after)).toEqual([
      { path: 'configurations[clean].positionError', before: before.configurations[0].positionError, after: after.configurations[0].positionError, kind: 'changed' },
    ]);
  });

  it('diffs incomplete drafts too', () => {
    expect(diffContent({}, { notes: 'x' })).toEqual([{ path: 'notes', after: 'x', kind: 'added' }]);
    expect(diffContent(null, { notes: 'x' })).toEqual([{ path: '', before: null, after: { notes: 'x' }, kind: 'changed' }]);
  });

  it('shows an ice increment stated, changed or withdrawn on its configuration', () => {
    const before = demoPistonTrainerContent();
    const after = demoPistonTrainerContent();
    after.configurations[2].iceIncrementKt = 10;
    expect(diffContent(before, after)).toEqual([{ path: 'configurations[landing-flap].iceIncrementKt', after: 10, kind: 'added' }]);
    expect(diffContent(after, before)).toEqual([{ path: 'configurations[landing-flap].iceIncrementKt', before: 10, kind: 'removed' }]);
  });
});
