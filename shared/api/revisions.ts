/**
 * Speed books, revisions and the operator's signing key as the API carries them
 * (`/api/speed-books`, `/api/revisions`, `/api/operator/signing-key`).
 */
import * as z from 'zod';
import { CONTRIBUTION_KINDS } from '../speed-book/four-eyes';
import { boundedJsonObject, REVISION_CONTENT_BOUNDS } from './json-bounds';
import { plainText } from '../text/plain-text';

export const REVISION_STATUSES = ['draft', 'in_review', 'published', 'superseded', 'withdrawn'] as const;
export type RevisionStatus = (typeof REVISION_STATUSES)[number];

const id = z.number().int().positive();
const timestamp = z.string().describe('ISO 8601, UTC');

/**
 * Revision content while it is a draft: any JSON object (work in progress). Submitting for
 * review checks it against the full revision content schema (`RevisionContent`). Bounded in
 * depth and size (json-bounds.ts) before the canonicaliser or the diff walks it.
 */
export const draftContentSchema = boundedJsonObject(REVISION_CONTENT_BOUNDS, 'The content must be a JSON object.');

export const revisionSummarySchema = z.object({
  id,
  speedBookId: id,
  number: z.number().int().positive(),
  status: z.enum(REVISION_STATUSES),
  changeSummary: z.string(),
  authorId: id,
  authorName: z.string(),
  submittedAt: timestamp.nullable(),
  approverId: id.nullable(),
  approverName: z.string().nullable(),
  publishedAt: timestamp.nullable(),
  supersededAt: timestamp.nullable(),
  withdrawnAt: timestamp.nullable(),
  contentSha256: z.string().nullable(),
  createdAt: timestamp,
  updatedAt: timestamp,
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;

/** One person who contributed to a revision, and how (shared/speed-book/four-eyes.ts). */
export const revisionContributorSchema = z.object({
  userId: id,
  name: z.string(),
  kinds: z.array(z.enum(CONTRIBUTION_KINDS)),
});
export type RevisionContributorView = z.infer<typeof revisionContributorSchema>;

export const revisionSchema = revisionSummarySchema.extend({
  content: draftContentSchema,
  returnedAt: timestamp.nullable(),
  returnReason: z.string().nullable(),
  withdrawnById: id.nullable(),
  withdrawReason: z.string().nullable(),
  /** Ed25519 signature, standard base64, over `signedRevisionStatement(...)` (shared/speed-book/signature.ts). */
  signature: z.string().nullable(),
  signingKeyId: id.nullable(),
  /** While draft or in review: field path → sentence for what submitting would refuse (empty when none). */
  problems: z.record(z.string(), z.string()),
  /** Everyone who started, changed, gave source pages to or submitted it, in order of first contribution; none of them may approve it. */
  contributors: z.array(revisionContributorSchema),
});
export type RevisionView = z.infer<typeof revisionSchema>;
export const revisionResponseSchema = z.object({ revision: revisionSchema });

export const speedBookSummarySchema = z.object({
  id,
  title: z.string(),
  aircraftTypeId: id,
  /** The published revision, or null when none is (none yet, or the last was withdrawn). */
  currentRevision: revisionSummarySchema.nullable(),
});
export type SpeedBookSummary = z.infer<typeof speedBookSummarySchema>;
export const speedBookListSchema = z.object({ speedBooks: z.array(speedBookSummarySchema) });

export const speedBookSchema = speedBookSummarySchema.extend({
  /** Newest first. Roles that may not edit speed books see only revisions that were published. */
  revisions: z.array(revisionSummarySchema),
  createdAt: timestamp,
  updatedAt: timestamp,
});
export const speedBookResponseSchema = z.object({ speedBook: speedBookSchema });

export const createSpeedBookSchema = z.strictObject({
  aircraftTypeId: z.number({ error: 'Choose the aircraft type.' }).int().positive('Choose the aircraft type.'),
  title: z.string({ error: 'Give the speed book’s title.' }).check(plainText('The title')).trim().min(1, 'Give the speed book’s title.').max(200, 'At most 200 characters.'),
});

const changeSummary = z
  .string({ error: 'Say in a sentence what this revision changes.' })
  .check(plainText('The change summary', 'multi-line'))
  .trim()
  .min(1, 'Say in a sentence what this revision changes.')
  .max(2000, 'At most 2,000 characters.');

export const createRevisionSchema = z.strictObject({
  /** Without it the draft starts as a copy of the latest published content. */
  content: draftContentSchema.optional(),
  changeSummary,
});
export const updateRevisionSchema = z
  .strictObject({ content: draftContentSchema.optional(), changeSummary: changeSummary.optional() })
  .refine((value) => value.content !== undefined || value.changeSummary !== undefined, 'Change the content or the change summary.');

/**
 * `POST /api/revisions/coverage`: the envelope sweep of content not saved yet (the editor's live
 * picture). The content is checked as revision content by the server, field by field.
 */
export const contentCoverageRequestSchema = z.strictObject({ content: draftContentSchema });
export type ContentCoverageRequest = z.infer<typeof contentCoverageRequestSchema>;

export const reasonSchema = z.strictObject({
  reason: z.string({ error: 'Give the reason.' }).check(plainText('The reason', 'multi-line')).trim().min(1, 'Give the reason.').max(2000, 'At most 2,000 characters.'),
});

export const contentChangeSchema = z.object({
  path: z.string(),
  before: z.unknown().optional(),
  after: z.unknown().optional(),
  kind: z.enum(['added', 'removed', 'changed']),
});
export const diffQuerySchema = z.strictObject({
  against: z.string({ error: 'Give the revision to compare with as ?against=<id>.' }).regex(/^[1-9]\d{0,9}$/, 'Give the revision to compare with as ?against=<id>.'),
});
export const revisionDiffSchema = z.object({ revisionId: id, againstId: id, changes: z.array(contentChangeSchema) });

export const signingKeySchema = z.object({
  id,
  algorithm: z.literal('Ed25519'),
  /** The raw 32-byte Ed25519 public key in standard base64 (WebCrypto "raw" import, @noble/ed25519). */
  publicKey: z.string(),
  publicKeyEncoding: z.literal('raw-base64'),
  createdAt: timestamp,
  /** When a rotation retired it (it still verifies what it signed); null for the active key. */
  retiredAt: timestamp.nullable(),
});
export type SigningKeyView = z.infer<typeof signingKeySchema>;
/**
 * `GET /api/operator/signing-key` and the answer of a rotation: the active key (new
 * publications) and every key the operator ever published with, newest first.
 */
export const signingKeyResponseSchema = z.object({ signingKey: signingKeySchema, signingKeys: z.array(signingKeySchema) });
export type SigningKeyResponse = z.infer<typeof signingKeyResponseSchema>;
