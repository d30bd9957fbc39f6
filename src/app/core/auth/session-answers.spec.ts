import * as fc from 'fast-check';
import { csrfResponseSchema, loginResponseSchema } from '@shared/api/session';
import { ROLES } from '@shared/auth/roles';
import { readCsrfAnswer, readSessionAnswer } from './session-answers';

/** The hand checks must give the shared schemas' verdicts (the server's contract) on every body. */
const verdict = (schema: { safeParse(body: unknown): { success: boolean; data?: unknown } }, body: unknown) => {
  const result = schema.safeParse(body);
  return result.success ? result.data : null;
};

const user = {
  id: 7,
  email: 'engineer@demo.speedwright.example',
  displayName: 'Ines Marlow',
  role: 'engineer',
  operatorId: 1,
  operatorName: 'Kestrel Fen Aviation (demo)',
  operatorIsDemo: true,
};

describe('readSessionAnswer', () => {
  it.each([
    [{ user }],
    [{ user: { ...user, extra: 'dropped' }, other: 1 }],
    [{ user: { ...user, id: 0 } }],
    [{ user: { ...user, id: 1.5 } }],
    [{ user: { ...user, operatorId: -2 } }],
    [{ user: { ...user, id: Number.MAX_SAFE_INTEGER + 2 } }],
    [{ user: { ...user, email: 'not an address' } }],
    [{ user: { ...user, email: 'a..b@example.com' } }],
    [{ user: { ...user, role: 'captain' } }],
    [{ user: { ...user, operatorIsDemo: 'yes' } }],
    [{ user: { ...user, displayName: undefined } }],
    [{ user: null }],
    [null],
    ['text'],
  ])('gives the schema’s verdict for %j', (body) => {
    expect(readSessionAnswer(body)).toEqual(verdict(loginResponseSchema, body));
  });

  it('gives the schema’s verdict for generated bodies (property test, fast-check)', () => {
    const field = <T>(valid: fc.Arbitrary<T>) => fc.oneof(valid, fc.anything());
    const body = fc.record({
      user: fc.record({
        id: field(fc.integer()),
        email: field(fc.oneof(fc.emailAddress(), fc.string())),
        displayName: field(fc.string()),
        role: field(fc.constantFrom(...ROLES, 'pilot ', 'captain')),
        operatorId: field(fc.integer()),
        operatorName: field(fc.string()),
        operatorIsDemo: field(fc.boolean()),
      }),
    });
    fc.assert(fc.property(fc.oneof(body, fc.anything()), (value) => expect(readSessionAnswer(value)).toEqual(verdict(loginResponseSchema, value))), { numRuns: 500 });
  });
});

describe('readCsrfAnswer', () => {
  it.each([[{ token: 'abc' }], [{ token: '' }], [{ token: 5 }], [{}], [null], [[]]])('gives the schema’s verdict for %j', (body) => {
    expect(readCsrfAnswer(body)).toEqual(verdict(csrfResponseSchema, body));
  });

  it('gives the schema’s verdict for generated bodies (property test, fast-check)', () => {
    fc.assert(fc.property(fc.oneof(fc.record({ token: fc.oneof(fc.string(), fc.anything()) }), fc.anything()), (value) => expect(readCsrfAnswer(value)).toEqual(verdict(csrfResponseSchema, value))));
  });
});
