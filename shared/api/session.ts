import * as z from 'zod/mini';
import { ROLES } from '../auth/roles';

/**
 * The schemas of signing in and of the session, the only ones the app's first screen needs:
 * written with zod's small build (`zod/mini`, the same rules and messages, functions instead of
 * methods), so the full zod library stays out of the first download on a phone. The server
 * validates with these same objects (re-exported by `auth.ts`).
 */

/** The signed-in person as the API returns it (`/api/auth/login`, `/api/auth/me`). */
export const sessionUserSchema = z.object({
  id: z.number().check(z.int(), z.positive()),
  email: z.string().check(z.email()),
  displayName: z.string(),
  role: z.enum(ROLES),
  operatorId: z.number().check(z.int(), z.positive()),
  operatorName: z.string(),
  /** A demo operator's figures are invented; its cards say so (and the flag is part of their digest). */
  operatorIsDemo: z.boolean(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const loginRequestSchema = z.strictObject({
  email: z.string().check(z.trim(), z.toLowerCase(), z.email('Enter an e-mail address such as name@example.com.'), z.maxLength(254)),
  password: z.string().check(z.minLength(1, 'Enter your password.'), z.maxLength(200)),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const loginResponseSchema = z.object({
  user: sessionUserSchema,
  /** When this sign-in ends whatever happens (12 hours after it, ASVS 3.3.2); the device keeps it. */
  sessionExpiresAt: z.optional(z.string()),
});
export const csrfResponseSchema = z.object({ token: z.string().check(z.minLength(1)) });

/**
 * Every error the API sends has this shape. `fields` maps a dotted field path to a sentence
 * when the request itself was at fault.
 */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.optional(z.record(z.string(), z.string())),
    requestId: z.optional(z.string()),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;
