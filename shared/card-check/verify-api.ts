/**
 * The public card check API (no sign-in), as it travels:
 *
 * - `GET /api/verify/:code` — whether the revision a card was built from is still the one in
 *   force: `current` (it is the published revision of its speed book), `superseded` (a later
 *   revision was published), `withdrawn` (the revision was withdrawn: its figures may no longer be used), or
 *   `unknown` (no card was issued with this code, or not by this Speedwright host). Besides the
 *   status it gives only what is printed on the card: the revision's number and publication
 *   date, the registration and the issue time.
 * - `GET /api/verify/:code/source` — what the card was built from, so the check page can
 *   re-derive the figures of a check URL with `buildCard`: the content of that one revision
 *   (the flight-manual speed data the card was computed from), the header the card prints
 *   (registration, type, speed book title, demo mark, with their record ids, which the card's
 *   digest covers), the digest of the card that was issued, and the revision's signature with
 *   the public key that made it (active or retired), so the page can verify it. Nothing about
 *   people, other cards or other revisions.
 *
 * Written with zod's small build (`zod/mini`: functions instead of methods) so the public check
 * page carries no full zod; the server's tests and the OpenAPI document read these same objects.
 * The path parameter's schema, for the OpenAPI document only, is in `verify-params.ts`.
 */
import * as z from 'zod/mini';

const id = z.number().check(z.int(), z.positive());
const timestamp = z.string();

export const VERIFY_STATUSES = ['current', 'superseded', 'withdrawn', 'unknown'] as const;
export type VerifyStatus = (typeof VERIFY_STATUSES)[number];

export const verifyKnownSchema = z.strictObject({
  status: z.enum(['current', 'superseded', 'withdrawn']),
  revision: z.strictObject({ number: z.number().check(z.int(), z.positive()), publishedAt: timestamp }),
  registration: z.string(),
  issuedAt: timestamp,
});
export const verifyUnknownSchema = z.strictObject({ status: z.literal('unknown') });

/** `GET /api/verify/:code`. */
export const verifyResponseSchema = z.union([verifyKnownSchema, verifyUnknownSchema]);
export type VerifyResponse = z.infer<typeof verifyResponseSchema>;
export type VerifyKnown = z.infer<typeof verifyKnownSchema>;

/** `GET /api/verify/:code/source` (404 for an unknown code). */
export const verifySourceResponseSchema = z.strictObject({
  /** The digest of the card that was issued with this code (as the card log holds it). */
  digest: z.string().check(z.regex(/^[0-9a-f]{64}$/)),
  revision: z.strictObject({
    id,
    number: z.number().check(z.int(), z.positive()),
    publishedAt: timestamp,
    contentSha256: z.string().check(z.regex(/^[0-9a-f]{64}$/)),
    content: z.unknown(),
  }),
  context: z.strictObject({
    airframe: z.strictObject({ id, registration: z.string() }),
    aircraftType: z.strictObject({ designator: z.string(), name: z.string() }),
    speedBook: z.strictObject({ id, title: z.string() }),
    demo: z.boolean(),
  }),
  /**
   * The revision's Ed25519 signature and the public key its `keyId` names — the operator's
   * active key or one a rotation retired (`keyRetiredAt`) — so the check page verifies the
   * revision as a device does (shared/speed-book/signature.ts: the statement needs the
   * operator's id besides the revision's fields).
   */
  signature: z.strictObject({
    algorithm: z.literal('Ed25519'),
    operatorId: id,
    keyId: id,
    /** Raw 32-byte Ed25519 public key, standard base64. */
    publicKey: z.string(),
    keyRetiredAt: z.nullable(timestamp),
    /** 64 bytes, standard base64. */
    value: z.string(),
  }),
});
export type VerifySource = z.infer<typeof verifySourceResponseSchema>;

export const VERIFY_PATHS = {
  verify: (code: string) => `/api/verify/${encodeURIComponent(code)}`,
  source: (code: string) => `/api/verify/${encodeURIComponent(code)}/source`,
} as const;
