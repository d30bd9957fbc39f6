/**
 * A revision's content as a card may use it: its canonical-JSON SHA-256 equal to the published
 * hash, then parsed by the revision-content schema and frozen; cached per content object.
 */
import { contentSha256 } from '../speed-book/canonical';
import { revisionContentSchema, type RevisionContent } from '../speed-book/revision-content';
import type { CardRevision } from './card';
import { refuse } from './card-refusal';

/**
 * Content already checked, by the content object it was read from: a live card is rebuilt on
 * every keystroke from the same revision, and hashing and parsing the content is most of the
 * work. The card is always computed from the parsed, frozen copy taken when the hash matched,
 * so a later change to the caller's object cannot reach a card; a different published hash is
 * checked afresh.
 */
const checkedContents = new WeakMap<object, { contentSha256: string; content: RevisionContent }>();

/** The checked, frozen content of `revision`; refuses the card for a hash mismatch or incomplete content. */
export function checkedContent(revision: CardRevision): RevisionContent {
  const raw = revision.content;
  const cached = typeof raw === 'object' && raw !== null ? checkedContents.get(raw) : undefined;
  if (cached && cached.contentSha256 === revision.contentSha256) return cached.content;
  const content = verifiedContent(revision);
  if (typeof raw === 'object' && raw !== null) checkedContents.set(raw, { contentSha256: revision.contentSha256, content });
  return content;
}

function verifiedContent(revision: CardRevision): RevisionContent {
  if (contentSha256(revision.content) !== revision.contentSha256) {
    refuse(
      'content-hash-mismatch',
      'revision',
      `The data of revision ${revision.number} does not match its published hash; it may have been altered. Sync again before using it.`,
    );
  }
  const parsed = revisionContentSchema.safeParse(revision.content);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    refuse('invalid-content', 'revision', `Revision ${revision.number} is not complete (${issue.path.join('.')}: ${issue.message})`);
  }
  return deepFreeze(parsed.data);
}

/** Freezes `value` and everything in it (zod's parse output is a fresh copy, so nothing of the caller's). */
function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const item of Object.values(value)) deepFreeze(item);
  }
  return value;
}
