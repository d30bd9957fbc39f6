import * as z from 'zod';
import { ROLES } from '../auth/roles';

/** The signed-in person as the API returns it (`/api/auth/login`, `/api/auth/me`). */
export const sessionUserSchema = z.object({
  id: z.number().int().positive(),
  email: z.string().email(),
  displayName: z.string(),
  role: z.enum(ROLES),
  operatorId: z.number().int().positive(),
  operatorName: z.string(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const loginRequestSchema = z.strictObject({
  email: z.string().trim().toLowerCase().email('Enter an e-mail address such as name@example.com.').max(254),
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const loginResponseSchema = z.object({ user: sessionUserSchema });
export const csrfResponseSchema = z.object({ token: z.string().min(1) });

/** A person of the operator as the admin's people list shows it (`GET /api/users`). */
export const operatorPersonSchema = z.object({
  id: z.number().int().positive(),
  email: z.string(),
  displayName: z.string(),
  role: z.enum(ROLES),
  locked: z.boolean(),
  lastSignInAt: z.string().nullable(),
  createdAt: z.string(),
});
export type OperatorPerson = z.infer<typeof operatorPersonSchema>;
export const operatorPeopleSchema = z.object({ users: z.array(operatorPersonSchema) });

/**
 * Every error the API sends has this shape. `fields` maps a dotted field path to a sentence
 * when the request itself was at fault.
 */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    requestId: z.string().optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

export const healthSchema = z.object({ status: z.enum(['ok', 'degraded']), db: z.enum(['ok', 'down']) });
