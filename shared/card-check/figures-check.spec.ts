/**
 * The digest check of a check URL, on the hand-worked test type (shared/card/testing/test-fixtures.ts):
 * the issued card matches; altered inputs, an altered digest, another revision and inputs the
 * flight manual's data cannot carry each say that the figures do not match.
 */
import { buildCard } from '../card/build-card';
import { HAND_CONTEXT, HAND_PISTON_CARD_DIGEST, handPistonContent, handPistonInputs, revisionOf } from '../card/testing/test-fixtures';
import { FIGURES_DIFFER, checkFigures } from './figures-check';

const revision = revisionOf(handPistonContent());
const card = buildCard(revision, handPistonInputs(), HAND_CONTEXT);
const payload = { revisionId: revision.id, inputs: card.inputs, digest: card.digest };
const online = { revision, context: HAND_CONTEXT, issuedDigest: card.digest };

describe('checkFigures', () => {
  it('re-derives the issued card (the digest pinned in test-fixtures.ts)', () => {
    const result = checkFigures(payload, online);
    expect(result).toMatchObject({ outcome: 'matches', sentence: expect.stringContaining('match the card that was issued') });
    if (result.outcome === 'matches') expect(result.card.digest).toBe(HAND_PISTON_CARD_DIGEST);
  });

  it('offline, says only that the figures fit their own digest', () => {
    expect(checkFigures(payload, { ...online, issuedDigest: null })).toMatchObject({ outcome: 'matches', sentence: expect.stringContaining('this device’s copy of revision 3') });
  });

  it('tells altered inputs (their digest no longer fits)', () => {
    const altered = { ...payload, inputs: { ...payload.inputs, weightKg: 950 } };
    expect(checkFigures(altered, online)).toEqual({ outcome: 'differs', sentence: FIGURES_DIFFER, detail: expect.stringContaining('figures were altered') });
    // Offline too, without the issued digest.
    expect(checkFigures(altered, { ...online, issuedDigest: null })).toMatchObject({ outcome: 'differs' });
  });

  it('tells a code whose inputs and digest were both replaced by another card’s', () => {
    const other = buildCard(revision, { ...handPistonInputs(), weightKg: 950 }, HAND_CONTEXT);
    const forged = { revisionId: revision.id, inputs: other.inputs, digest: other.digest };
    expect(checkFigures(forged, online)).toMatchObject({ outcome: 'differs', detail: expect.stringContaining('not the digest of the card issued') });
  });

  it('tells another revision and inputs outside the flight manual’s data', () => {
    expect(checkFigures({ ...payload, revisionId: 12 }, online)).toMatchObject({ outcome: 'differs', detail: expect.stringContaining('another revision') });
    const heavy = { ...payload, inputs: { ...payload.inputs, weightKg: 1200 } };
    expect(checkFigures(heavy, { ...online, issuedDigest: null })).toMatchObject({ outcome: 'differs', detail: expect.stringContaining('give no card from revision 3') });
  });
});
