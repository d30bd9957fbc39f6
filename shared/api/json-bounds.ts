/**
 * Bounds on free-form JSON that the API accepts (a draft's content, a card's inputs), checked
 * without recursion before anything recursive — the RFC 8785 canonicaliser, the diff — sees the
 * value: nesting depth, number of values, length of strings and keys. ASVS 5.1.4 / OWASP's
 * "JSON parsing" advice to limit depth and size of structured input; common practice.
 */
import * as z from 'zod';

export interface JsonBounds {
  /** Containers (objects, arrays) inside one another, the outermost counted as 1. */
  maxDepth: number;
  /** Values of any kind, containers included. */
  maxValues: number;
  /** Characters of one string or object key. */
  maxStringLength: number;
}

/**
 * A draft's revision content: the deepest real content nests 8 levels (speeds → table →
 * valuesKt[weight][altitude][oat]); 100,000 values hold a large multi-engine book's tables
 * many times over; the body parser's 1 MB limit caps the rest.
 */
export const REVISION_CONTENT_BOUNDS: JsonBounds = { maxDepth: 32, maxValues: 200_000, maxStringLength: 10_000 };

/** A card's inputs: about a dozen values, 3 levels deep (inputs → departure → elevationFt). */
export const CARD_INPUTS_BOUNDS: JsonBounds = { maxDepth: 8, maxValues: 200, maxStringLength: 200 };

/** Any JSON request body, whatever the route: a last guard before routes see it (server/app.ts). */
export const REQUEST_BODY_BOUNDS: JsonBounds = { maxDepth: 64, maxValues: 500_000, maxStringLength: 1_000_000 };

/** Path segments kept for a breach: enough to name the field ("entries.0.inputs"), never the whole depth. */
const NAMED_LEVELS = 4;

export interface JsonBoundsBreach {
  /** Where the breach lies, its first `NAMED_LEVELS` segments from the value's top. */
  path: (string | number)[];
  message: string;
}

/**
 * The first bound `value` breaks, with where, or null. Walks with its own stack (never the call
 * stack) and stops at the first breach, so its work is bounded by `maxValues`.
 */
export function jsonBoundsBreach(value: unknown, bounds: JsonBounds): JsonBoundsBreach | null {
  const stack: { value: unknown; depth: number; path: (string | number)[] }[] = [{ value, depth: 0, path: [] }];
  let values = 0;
  const at = (path: (string | number)[], key: string | number) => (path.length < NAMED_LEVELS ? [...path, key] : path);
  while (stack.length > 0) {
    const { value: current, depth, path } = stack.pop()!;
    if (++values > bounds.maxValues) return { path: [], message: `It holds more than ${bounds.maxValues.toLocaleString('en-US')} values, more than this field accepts.` };
    if (typeof current === 'string') {
      if (current.length > bounds.maxStringLength) return { path, message: `A text in it is longer than ${bounds.maxStringLength.toLocaleString('en-US')} characters.` };
      continue;
    }
    if (current === null || typeof current !== 'object') continue;
    if (depth + 1 > bounds.maxDepth) return { path, message: `It nests more than ${bounds.maxDepth} levels deep, deeper than this field accepts.` };
    if (Array.isArray(current)) {
      current.forEach((item, index) => stack.push({ value: item, depth: depth + 1, path: at(path, index) }));
      continue;
    }
    for (const [key, item] of Object.entries(current)) {
      if (key.length > bounds.maxStringLength) return { path, message: `A name in it is longer than ${bounds.maxStringLength.toLocaleString('en-US')} characters.` };
      stack.push({ value: item, depth: depth + 1, path: at(path, key) });
    }
  }
  return null;
}

/** The first bound `value` breaks, as a sentence, or null. */
export function jsonBoundsProblem(value: unknown, bounds: JsonBounds): string | null {
  return jsonBoundsBreach(value, bounds)?.message ?? null;
}

/** A JSON object whose content is not checked here, only bounded (400 with the field's path). */
export function boundedJsonObject(bounds: JsonBounds, message: string) {
  return z.record(z.string(), z.unknown(), { error: message }).superRefine((value, context) => {
    const problem = jsonBoundsProblem(value, bounds);
    if (problem) context.addIssue({ code: 'custom', message: problem });
  });
}
