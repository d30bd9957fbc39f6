/**
 * A field-by-field diff of two revision contents, for the approver's review. Lists of keyed
 * items are matched by key, not by position: configurations by `key`, speeds by code and
 * configuration, so inserting a speed does not show every later one as changed. Other lists
 * are compared position by position when their length is the same, else as a whole.
 */
export type ChangeKind = 'added' | 'removed' | 'changed';

export interface ContentChange {
  /**
   * Where, as dotted names; keyed items as `[key]`:
   * `configurations[landing-flap].positionError.1.casKt`, `speeds[VR@takeoff-flap].referenceKt`.
   */
  path: string;
  before?: unknown;
  after?: unknown;
  kind: ChangeKind;
}

type Keyer = (item: Record<string, unknown>) => string;

/** The lists whose items carry their own identity, by path from the content's root. */
const KEYED_LISTS: Record<string, Keyer> = {
  configurations: (item) => String(item['key']),
  speeds: (item) => `${String(item['code'])}@${String(item['configurationKey'])}`,
};

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);

function sameJson(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((item, i) => sameJson(item, b[i]));
  if (isRecord(a) && isRecord(b)) {
    const keys = Object.keys(a).filter((k) => a[k] !== undefined);
    return keys.length === Object.keys(b).filter((k) => b[k] !== undefined).length && keys.every((k) => sameJson(a[k], b[k]));
  }
  return false;
}

const join = (path: string, name: string) => (path ? `${path}.${name}` : name);

/**
 * The changes that turn `before` into `after`, in the order of `after` (removed items where
 * they stood). Both may be any JSON (drafts need not be complete); identical contents give [].
 *
 * @example diffContent({ limits: { vneKt: 160 } }, { limits: { vneKt: 163 } })
 *   // [{ path: 'limits.vneKt', before: 160, after: 163, kind: 'changed' }]
 */
export function diffContent(before: unknown, after: unknown): ContentChange[] {
  const changes: ContentChange[] = [];
  walk(before, after, '', '', changes);
  return changes;
}

function walk(before: unknown, after: unknown, path: string, schemaPath: string, out: ContentChange[]): void {
  if (sameJson(before, after)) return;
  if (before === undefined) {
    out.push({ path, after, kind: 'added' });
    return;
  }
  if (after === undefined) {
    out.push({ path, before, kind: 'removed' });
    return;
  }
  if (isRecord(before) && isRecord(after)) {
    const keys = [...Object.keys(after), ...Object.keys(before).filter((k) => !(k in after))];
    for (const key of keys) walk(before[key], after[key], join(path, key), join(schemaPath, key), out);
    return;
  }
  const keyer = KEYED_LISTS[schemaPath];
  if (keyer && Array.isArray(before) && Array.isArray(after) && before.every(isRecord) && after.every(isRecord)) {
    walkKeyed(before, after, keyer, path, schemaPath, out);
    return;
  }
  if (Array.isArray(before) && Array.isArray(after) && before.length === after.length) {
    before.forEach((item, i) => walk(item, after[i], join(path, String(i)), join(schemaPath, '#'), out));
    return;
  }
  out.push({ path, before, after, kind: 'changed' });
}

function walkKeyed(
  before: Record<string, unknown>[],
  after: Record<string, unknown>[],
  keyer: Keyer,
  path: string,
  schemaPath: string,
  out: ContentChange[],
): void {
  const beforeByKey = new Map(before.map((item) => [keyer(item), item]));
  const afterKeys = new Set(after.map(keyer));
  // Removed items are reported where they stood relative to the items that remain.
  let b = 0;
  const flushRemovedUpTo = (stop: string | undefined) => {
    while (b < before.length && keyer(before[b]) !== stop) {
      const key = keyer(before[b]);
      if (!afterKeys.has(key)) out.push({ path: `${path}[${key}]`, before: before[b], kind: 'removed' });
      b++;
    }
    if (b < before.length) b++;
  };
  for (const item of after) {
    const key = keyer(item);
    if (beforeByKey.has(key)) flushRemovedUpTo(key);
    walk(beforeByKey.get(key), item, `${path}[${key}]`, `${schemaPath}[]`, out);
  }
  flushRemovedUpTo(undefined);
}
