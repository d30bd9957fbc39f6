/**
 * The card's inputs as `buildCard` reads them: checked against `cardInputsSchema` (a refusal at
 * the first field at fault), and written into the card with their keys in RFC 8785 order.
 */
import { cardInputsSchema, type CardInputs } from './card';
import { refuse } from './card-refusal';

/** `raw` checked against the inputs schema; refuses the card at the first field at fault. */
export function parseInputs(raw: unknown): CardInputs {
  const result = cardInputsSchema.safeParse(raw);
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  const path = issue.path.map(String).join('.');
  if (issue.code === 'unrecognized_keys') {
    refuse('invalid-inputs', [path, issue.keys[0]].filter(Boolean).join('.'), `The input ${issue.keys[0]} is not expected.`);
  }
  refuse('invalid-inputs', path || '(inputs)', issue.message);
}

/** A copy of plain data with every object's keys in UTF-16 order (the inputs, as zod returns them in schema order). */
export function sortedKeys<T>(value: T): T {
  if (Array.isArray(value)) return value.map(sortedKeys) as T;
  if (typeof value !== 'object' || value === null) return value;
  const sorted: Record<string, unknown> = {};
  for (const key of Object.keys(value).sort()) {
    const item = (value as Record<string, unknown>)[key];
    if (item !== undefined) sorted[key] = sortedKeys(item);
  }
  return sorted as T;
}
