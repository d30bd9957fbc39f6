/**
 * `GET /api/sync`: what a device stores to work offline, as changes since its last cursor; and
 * the operator settings an administrator changes (`PATCH /api/operator/settings`).
 */
import * as z from 'zod';
import { aircraftTypeSchema, airframeSchema } from './fleet';
import { approachAdditivePolicySchema } from '../card/approach-policy';

const id = z.number().int().positive();

export const syncQuerySchema = z.strictObject({
  cursor: z.string({ error: 'The cursor must be the text the previous sync answered.' }).max(200, 'The cursor is not one this server gave out.').optional(),
});

export const syncRevisionSchema = z.object({
  id,
  speedBookId: id,
  speedBookTitle: z.string(),
  aircraftTypeId: id,
  number: z.number().int().positive(),
  status: z.enum(['published', 'superseded', 'withdrawn']),
  publishedAt: z.string(),
  supersededAt: z.string().nullable(),
  withdrawnAt: z.string().nullable(),
  content: z.record(z.string(), z.unknown()),
  contentSha256: z.string(),
  signature: z.string(),
  signingKeyId: id,
});
export type SyncRevision = z.infer<typeof syncRevisionSchema>;

/** One of the operator's public keys: the active one or one a rotation retired. */
export const syncSigningKeySchema = z.object({
  id,
  /** Raw 32-byte Ed25519 public key, standard base64. */
  publicKey: z.string(),
  createdAt: z.string(),
  /** When a rotation retired it; null for the active key. */
  retiredAt: z.string().nullable(),
});
export type SyncSigningKey = z.infer<typeof syncSigningKeySchema>;

export const syncOperatorSchema = z.object({
  id,
  name: z.string(),
  isDemo: z.boolean(),
  /** The active key: raw 32-byte Ed25519 public key, standard base64, as `GET /api/operator/signing-key` serves it. */
  publicKey: z.string(),
  signingKeyId: id,
  /**
   * Every key the operator ever published with (the active one and those rotations retired),
   * sent whole at every sync: a device verifies each revision with the key its `signingKeyId`
   * names, and refuses one whose key is not in this list.
   */
  signingKeys: z.array(syncSigningKeySchema),
  currencyLimitDays: z.number().int(),
  /** The operator's approach additive policy now: a device puts it into the inputs of every card with a wind. */
  approachAdditivePolicy: approachAdditivePolicySchema,
});

export const syncResponseSchema = z.object({
  cursor: z.string(),
  operator: syncOperatorSchema,
  aircraftTypes: z.array(aircraftTypeSchema),
  airframes: z.array(airframeSchema),
  revisions: z.array(syncRevisionSchema),
});
export type SyncResponse = z.infer<typeof syncResponseSchema>;

export const CURRENCY_LIMIT_DAYS = { min: 1, max: 365 } as const;

/**
 * `PATCH /api/operator/settings`: any of the operator's policies, each replaced whole; at least one.
 * The approach additive policy is shared/card/approach-policy.ts (zod/mini, part of the card inputs).
 */
export const operatorSettingsSchema = z
  .strictObject({
    currencyLimitDays: z
      .number({ error: 'Give the currency limit as a whole number of days.' })
      .int('Give the currency limit as a whole number of days.')
      .min(CURRENCY_LIMIT_DAYS.min, `At least ${CURRENCY_LIMIT_DAYS.min} day.`)
      .max(CURRENCY_LIMIT_DAYS.max, `At most ${CURRENCY_LIMIT_DAYS.max} days.`)
      .optional(),
    approachAdditivePolicy: z.optional(approachAdditivePolicySchema),
  })
  .refine((settings) => settings.currencyLimitDays !== undefined || settings.approachAdditivePolicy !== undefined, {
    message: 'Give the currency limit or the approach additive policy.',
  });
export type OperatorSettingsChange = z.infer<typeof operatorSettingsSchema>;

/** The operator's policies as `GET` and `PATCH /api/operator/settings` answer them. */
export const operatorSettingsViewSchema = z.object({ currencyLimitDays: z.number().int(), approachAdditivePolicy: approachAdditivePolicySchema });
export type OperatorSettings = z.infer<typeof operatorSettingsViewSchema>;

export const operatorSettingsResponseSchema = z.object({ settings: operatorSettingsViewSchema });
