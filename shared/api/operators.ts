/**
 * Setting up an operator (`npm run operator:create`, server/cli/operator.ts): its name and its
 * first administrator, checked with the same field rules as the API's invitations.
 */
import * as z from 'zod';
import { plainText } from '../text/plain-text';
import { displayNameField, invitePersonRequestSchema } from './auth';

export const operatorNameField = z
  .string()
  .check(plainText('The operator’s name'))
  .trim()
  .min(2, 'Give the operator’s name as its people know it, at least 2 characters.')
  .max(200, 'Keep the operator’s name under 200 characters.');

export const createOperatorRequestSchema = z.strictObject({
  name: operatorNameField,
  /** The first administrator's address; the invitation goes there. */
  adminEmail: invitePersonRequestSchema.shape.email,
  /** How colleagues know the first administrator; they may change it when they accept. */
  adminName: displayNameField.optional(),
});
export type CreateOperatorRequest = z.infer<typeof createOperatorRequestSchema>;

/** One operator as `npm run operator:list` shows it. */
export const operatorSummarySchema = z.object({
  id: z.number().int().positive(),
  slug: z.string(),
  name: z.string(),
  isDemo: z.boolean(),
  people: z.number().int().nonnegative(),
  aircraftTypes: z.number().int().nonnegative(),
  airframes: z.number().int().nonnegative(),
  /** Revisions in force now (status published: one per speed book at most). */
  publishedRevisions: z.number().int().nonnegative(),
  createdAt: z.string(),
});
export type OperatorSummary = z.infer<typeof operatorSummarySchema>;
