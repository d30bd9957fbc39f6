import { signedRevisionStatement } from './signature';

describe('signedRevisionStatement', () => {
  it('is the canonical JSON of the revision’s identity and content hash, keys sorted, no spaces', () => {
    // The exact text devices rebuild to verify; a change here breaks every signature in the field.
    expect(
      signedRevisionStatement({
        speedBookId: 3,
        revisionId: 17,
        operatorId: 1,
        number: 2,
        contentSha256: 'ab'.repeat(32),
        publishedAt: '2026-12-01T22:30:00.000Z',
      }),
    ).toBe(
      `{"contentSha256":"${'ab'.repeat(32)}","number":2,"operatorId":1,"publishedAt":"2026-12-01T22:30:00.000Z","purpose":"speedwright.revision.v1","revisionId":17,"speedBookId":3}`,
    );
  });

  it('differs when any field differs', () => {
    const base = { speedBookId: 3, revisionId: 17, operatorId: 1, number: 2, contentSha256: 'ab'.repeat(32), publishedAt: '2026-12-01T22:30:00.000Z' };
    const statement = signedRevisionStatement(base);
    for (const change of [{ speedBookId: 4 }, { revisionId: 18 }, { operatorId: 2 }, { number: 3 }, { contentSha256: 'ac'.repeat(32) }, { publishedAt: '2026-12-01T22:30:01.000Z' }]) {
      expect(signedRevisionStatement({ ...base, ...change })).not.toBe(statement);
    }
  });
});
