import { jsonBoundsBreach, jsonBoundsProblem, type JsonBounds } from './json-bounds';

// Bounds on free-form JSON (ASVS 5.1.4; common practice): checked without recursion, so even
// nesting far past the call stack's depth is measured, not overflowed.
const bounds: JsonBounds = { maxDepth: 3, maxValues: 10, maxStringLength: 5 };

describe('jsonBoundsProblem', () => {
  it('accepts values within every bound', () => {
    expect(jsonBoundsProblem({ a: [1, 2, { b: 'five!' }] }, bounds)).toBeNull();
    expect(jsonBoundsProblem('plain', bounds)).toBeNull();
  });

  it('names depth, count, text and key length, each when one past its bound', () => {
    expect(jsonBoundsProblem({ a: { b: { c: {} } } }, bounds)).toBe('It nests more than 3 levels deep, deeper than this field accepts.');
    expect(jsonBoundsProblem([1, 2, 3, 4, 5, 6, 7, 8, 9, 10], bounds)).toBe('It holds more than 10 values, more than this field accepts.');
    expect(jsonBoundsProblem({ a: 'sixsix' }, bounds)).toBe('A text in it is longer than 5 characters.');
    expect(jsonBoundsProblem({ sixsix: 1 }, bounds)).toBe('A name in it is longer than 5 characters.');
  });

  it('measures 100,000 levels without overflowing the stack, and says where the breach lies', () => {
    let deep: unknown = 1;
    for (let i = 0; i < 100_000; i++) deep = { a: deep };
    const breach = jsonBoundsBreach({ entries: [deep] }, { maxDepth: 64, maxValues: 1_000_000, maxStringLength: 10 });
    expect(breach).toEqual({ path: ['entries', 0, 'a', 'a'], message: 'It nests more than 64 levels deep, deeper than this field accepts.' });
  });
});
