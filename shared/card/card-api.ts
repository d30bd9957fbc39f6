/**
 * The card API as it travels (`POST /api/cards/preview`, `POST` and `GET /api/card-issues`):
 * request schemas the server validates with and response schemas the client parses with.
 */
import * as z from 'zod';
import { AIRCRAFT_CATEGORIES, SPEED_BASES, SPEED_PHASES } from '../speed-book/revision-content';
import { CARD_CODE_PATTERN } from './card-code-form';
import { boundedJsonObject, CARD_INPUTS_BOUNDS } from '../api/json-bounds';
import { CARD_REFUSAL_CODES, CARD_VERSION, cardInputsSchema, type SpeedCard } from './card';

const id = z.number().int().positive();
const recordId = (what: string) => z.number({ error: `Give ${what}.` }).int(`Give ${what}.`).positive(`Give ${what}.`);

// ---------------------------------------------------------------------------------------------
// Preview

/** `POST /api/cards/preview`. Inputs are checked by `buildCard`, which names the field at fault. */
export const cardPreviewRequestSchema = z.strictObject({
  revisionId: recordId('the revision'),
  inputs: boundedJsonObject(CARD_INPUTS_BOUNDS, 'Give the card’s inputs as an object.'),
});
export type CardPreviewRequest = z.infer<typeof cardPreviewRequestSchema>;

const limitSpeed = z.object({ iasKt: z.number(), casKt: z.number() });

const cardWindSchema = z.object({
  runwayHeadingDeg: z.number(),
  directionDeg: z.number(),
  speedKt: z.number(),
  gustKt: z.number().nullable(),
  headwindKt: z.number(),
  crosswindKt: z.number(),
  crosswindFrom: z.enum(['left', 'right']).nullable(),
  gust: z.object({ headwindKt: z.number(), crosswindKt: z.number() }).nullable(),
  cautions: z.array(z.string()),
});

const cardAerodromeSchema = z.object({
  pressureAltitudeFt: z.number(),
  densityAltitudeFt: z.number().nullable(),
  isaDeviationC: z.number(),
  highDensityAltitude: z.boolean(),
  wind: cardWindSchema.optional(),
});

const cardApproachSchema = z.object({
  windAt: z.enum(['departure', 'arrival']),
  policy: z.object({ headwindFraction: z.number(), gustFraction: z.number(), minimumKt: z.number(), maximumKt: z.number() }),
  policyStatement: z.string(),
  additiveKt: z.number(),
  speeds: z.array(
    z.object({
      code: z.string(),
      configurationKey: z.string(),
      configurationLabel: z.string(),
      vrefIasKt: z.number(),
      approachIasKt: z.number(),
      caution: z.string().nullable(),
    }),
  ),
});

/** The card as JSON (see `SpeedCard` in card.ts for what each field means). */
export const speedCardSchema = z.object({
  digest: z.string().regex(/^[0-9a-f]{64}$/),
  cardVersion: z.literal(CARD_VERSION),
  demo: z.boolean(),
  revision: z.object({ id, number: z.number().int().positive(), publishedAt: z.string().nullable(), contentSha256: z.string() }),
  speedBook: z.object({ id, title: z.string() }),
  airframe: z.object({ id, registration: z.string() }),
  aircraftType: z.object({ designator: z.string(), name: z.string(), category: z.enum(AIRCRAFT_CATEGORIES), engines: z.number().int(), ceilingFt: z.number().int() }),
  inputs: cardInputsSchema,
  takeoffConfiguration: z.object({ key: z.string(), label: z.string() }),
  landing: z.object({ source: z.enum(['entered', 'takeoff-weight', 'maximum-landing-weight']), statement: z.string(), weightKg: z.number() }),
  departure: cardAerodromeSchema,
  arrival: cardAerodromeSchema.nullable(),
  approach: cardApproachSchema.optional(),
  speeds: z.array(
    z.object({
      code: z.string(),
      label: z.string(),
      phase: z.enum(SPEED_PHASES),
      configurationKey: z.string(),
      configurationLabel: z.string(),
      kind: z.enum(['scaled', 'tabulated', 'fixed']),
      basis: z.enum(SPEED_BASES),
      weightKg: z.number(),
      iasKt: z.number(),
      casKt: z.number(),
      rounding: z.enum(['limit-down', 'stall-up', 'nearest']),
    }),
  ),
  stallInTurn: z.array(z.object({ bankDeg: z.number(), loadFactor: z.number(), iasKt: z.number(), casKt: z.number() })),
  limits: z.object({
    basis: z.enum(SPEED_BASES),
    vno: limitSpeed.nullable(),
    vne: limitSpeed.nullable(),
    vmo: limitSpeed.nullable(),
    mmo: z.number().nullable(),
    vfe: z.array(limitSpeed.extend({ configurationKey: z.string(), configurationLabel: z.string() })),
    vle: limitSpeed.nullable(),
    vlo: limitSpeed.nullable(),
    vmc: limitSpeed.nullable(),
    vyse: limitSpeed.nullable(),
  }),
  crossoverAltitudeFt: z.number().nullable(),
  cruise: z.union([z.object({ iasKt: z.number(), casKt: z.number().nullable() }), z.object({ mach: z.number() })]),
  altitudeTable: z.array(
    z.object({
      pressureAltitudeFt: z.number(),
      oatC: z.number(),
      iasKt: z.number().nullable(),
      casKt: z.number().nullable(),
      easKt: z.number().nullable(),
      tasKt: z.number().nullable(),
      mach: z.number().nullable(),
      cruiseNote: z.string().nullable(),
      limitIasKt: z.number().nullable(),
      limitCasKt: z.number().nullable(),
      limitKind: z.enum(['vne', 'vmo', 'mmo']).nullable(),
      aboveLimit: z.boolean(),
    }),
  ),
  indicator: z.object({
    basis: z.enum(SPEED_BASES),
    arcs: z.array(z.object({ colour: z.enum(['white', 'green', 'yellow']), fromKt: z.number(), toKt: z.number() })),
    lines: z.array(z.object({ colour: z.enum(['red', 'blue']), code: z.enum(['VNE', 'VMO', 'VMC', 'VYSE']), kt: z.number() })),
  }),
}) satisfies z.ZodType<SpeedCard>;

export const cardPreviewResponseSchema = z.object({ card: speedCardSchema });

// ---------------------------------------------------------------------------------------------
// Card log

const timestamp = z.iso.datetime({ offset: true, error: 'An ISO 8601 date and time, such as 2026-12-01T09:30:00.000Z.' });

/** One card log entry as the device reports it. `inputs` are bounded here and checked when the card is re-derived. */
export const cardIssueEntrySchema = z.strictObject({
  id: z.uuid({ error: 'The entry id is a UUID.' }),
  airframeId: recordId('the airframe'),
  revisionId: recordId('the revision'),
  inputs: boundedJsonObject(CARD_INPUTS_BOUNDS, 'Give the card’s inputs as an object.'),
  digest: z.string({ error: 'Give the card’s digest.' }).regex(/^[0-9a-f]{64}$/, 'The digest is 64 lower-case hexadecimal digits.'),
  issuedAt: timestamp,
});
export type CardIssueEntry = z.infer<typeof cardIssueEntrySchema>;

/** Most entries one `POST /api/card-issues` takes; a device sends a longer outbox in batches. */
export const MAX_CARD_ISSUES_PER_BATCH = 100;

export const cardIssueBatchSchema = z.strictObject({
  entries: z
    .array(cardIssueEntrySchema, { error: 'Give the entries as a list.' })
    .min(1, 'Give at least one entry.')
    .max(MAX_CARD_ISSUES_PER_BATCH, `At most ${MAX_CARD_ISSUES_PER_BATCH} entries per request.`),
});
export type CardIssueBatch = z.infer<typeof cardIssueBatchSchema>;

/**
 * What became of one reported entry. `recorded` (201): in the card log, now or by an earlier
 * report of the same entry — a replay answers exactly as the first report did. `conflict` (409):
 * the id is already used by a different entry. `refused` (422): not recorded, because the
 * re-derived card differs (`digest_mismatch`), the card cannot be given (`card_refused`), or the
 * airframe or revision cannot carry a card (`not_found`, `revision_not_published`). Refused
 * entries may be reported again once corrected; conflicts and refusals are never retried as is.
 */
export const cardIssueResultSchema = z.discriminatedUnion('outcome', [
  z.object({
    id: z.string(),
    outcome: z.literal('recorded'),
    status: z.literal(201),
    /** The card code to print (shared/card-check); the same on every replay of the entry. */
    code: z.string().regex(CARD_CODE_PATTERN),
    digest: z.string(),
    receivedAt: z.string(),
  }),
  z.object({
    id: z.string(),
    outcome: z.enum(['conflict', 'refused']),
    status: z.union([z.literal(409), z.literal(422), z.literal(404)]),
    error: z.object({
      code: z.string(),
      message: z.string(),
      fields: z.record(z.string(), z.string()).optional(),
      refusal: z.object({ code: z.enum(CARD_REFUSAL_CODES), field: z.string() }).optional(),
    }),
  }),
]);
export type CardIssueResult = z.infer<typeof cardIssueResultSchema>;
export const cardIssueBatchResponseSchema = z.object({ results: z.array(cardIssueResultSchema) });

const numericId = (what: string) => z.string().regex(/^[1-9]\d{0,9}$/, `${what} is a record id (digits).`);

export const cardIssueQuerySchema = z.strictObject({
  airframeId: numericId('airframeId').optional(),
  revisionId: numericId('revisionId').optional(),
  /** Issued at or after, ISO 8601. */
  from: timestamp.optional(),
  /** Issued at or before, ISO 8601. */
  to: timestamp.optional(),
  limit: z.coerce.number({ error: 'limit is a number from 1 to 200.' }).int('limit is a whole number.').min(1, 'limit is at least 1.').max(200, 'limit is at most 200.').default(50),
  /** `nextCursor` of the previous page. */
  cursor: z.string().regex(/^[0-9]{13}~[0-9a-f-]{36}$/, 'cursor is the nextCursor of the previous page.').optional(),
});
export type CardIssueQuery = z.infer<typeof cardIssueQuerySchema>;

export const cardIssueViewSchema = z.object({
  id: z.string(),
  /** The card code printed on the card. */
  code: z.string().regex(CARD_CODE_PATTERN),
  airframe: z.object({ id, registration: z.string() }),
  revision: z.object({ id, number: z.number().int().positive(), speedBookId: id }),
  issuedBy: z.object({ id, name: z.string() }),
  inputs: z.record(z.string(), z.unknown()),
  digest: z.string(),
  issuedAt: z.string(),
  receivedAt: z.string(),
});
export type CardIssueView = z.infer<typeof cardIssueViewSchema>;

export const cardIssuePageSchema = z.object({
  entries: z.array(cardIssueViewSchema),
  /** Pass as `cursor` for the next (earlier) page; null on the last page. */
  nextCursor: z.string().nullable(),
});
export const cardIssueResponseSchema = z.object({ entry: cardIssueViewSchema });
