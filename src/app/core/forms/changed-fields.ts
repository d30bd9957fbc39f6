/**
 * The fields of `after` whose value differs from `before` (strict equality): the body of a
 * PATCH that sends only what the person changed. An empty object when nothing changed.
 */
export function changedFields<T extends object>(before: T, after: Partial<T>): Partial<T> {
  const change: Partial<T> = {};
  for (const key of Object.keys(after) as (keyof T)[]) {
    if (after[key] !== before[key]) change[key] = after[key];
  }
  return change;
}
