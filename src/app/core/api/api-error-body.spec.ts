import * as fc from 'fast-check';
import { apiErrorSchema } from '@shared/api/session';
import { readApiErrorBody } from './api-error-body';

/** The hand check must agree with the shared schema (the server's contract) on every body. */
describe('readApiErrorBody', () => {
  const verdictOfSchema = (body: unknown) => {
    const result = apiErrorSchema.safeParse(body);
    return result.success ? result.data.error : null;
  };

  it.each([
    [{ error: { code: 'csrf_invalid', message: 'Reload.' } }],
    [{ error: { code: 'invalid_request', message: 'Fix it.', fields: { email: 'Enter an e-mail.' }, requestId: 'r-1' } }],
    [{ error: { code: 'x', message: 'y', extra: 1 }, other: true }],
    [{ error: { code: 'x' } }],
    [{ error: { code: 1, message: 'y' } }],
    [{ error: { code: 'x', message: 'y', fields: { a: 1 } } }],
    [{ error: { code: 'x', message: 'y', fields: ['a'] } }],
    [{ error: { code: 'x', message: 'y', requestId: 5 } }],
    [{ error: null }],
    [{ error: 'text' }],
    ['<html>Bad gateway</html>'],
    [null],
    [[]],
  ])('gives the schema’s verdict for %j', (body) => {
    expect(readApiErrorBody(body)).toEqual(verdictOfSchema(body));
  });

  it('gives the schema’s verdict for generated bodies (property test, fast-check)', () => {
    const text = fc.oneof(fc.string(), fc.integer(), fc.constant(undefined), fc.constant(null));
    const body = fc.oneof(
      fc.record({ error: fc.record({ code: text, message: text, fields: fc.oneof(fc.constant(undefined), fc.dictionary(fc.string(), text)), requestId: text }, { requiredKeys: [] }) }),
      fc.anything(),
    );
    fc.assert(fc.property(body, (value) => expect(readApiErrorBody(value)).toEqual(verdictOfSchema(value))));
  });
});
