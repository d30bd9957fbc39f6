import * as z from 'zod';
import { ROLES } from '../auth/roles';
import { plainText } from '../text/plain-text';

/** The signed-in person as the API returns it (`/api/auth/login`, `/api/auth/me`). */
export const sessionUserSchema = z.object({
  id: z.number().int().positive(),
  email: z.string().email(),
  displayName: z.string(),
  role: z.enum(ROLES),
  operatorId: z.number().int().positive(),
  operatorName: z.string(),
  /** A demo operator's figures are invented; its cards say so (and the flag is part of their digest). */
  operatorIsDemo: z.boolean(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const loginRequestSchema = z.strictObject({
  email: z.string().trim().toLowerCase().email('Enter an e-mail address such as name@example.com.').max(254),
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const loginResponseSchema = z.object({
  user: sessionUserSchema,
  /** When this sign-in ends whatever happens (12 hours after it, ASVS 3.3.2); the device keeps it. */
  sessionExpiresAt: z.string().optional(),
});
export const csrfResponseSchema = z.object({ token: z.string().min(1) });

/** A person of the operator as the admin's people list shows it (`GET /api/users`). */
export const operatorPersonSchema = z.object({
  id: z.number().int().positive(),
  email: z.string(),
  displayName: z.string(),
  role: z.enum(ROLES),
  locked: z.boolean(),
  /** Invited but has not chosen a password yet (the invitation can be sent again). */
  invitationPending: z.boolean(),
  lastSignInAt: z.string().nullable(),
  createdAt: z.string(),
});
export type OperatorPerson = z.infer<typeof operatorPersonSchema>;
export const operatorPeopleSchema = z.object({ users: z.array(operatorPersonSchema) });
export const operatorPersonResponseSchema = z.object({ user: operatorPersonSchema });

const emailField = z.string().trim().toLowerCase().email('Enter an e-mail address such as name@example.com.').max(254);
export const displayNameField = z
  .string()
  .check(plainText('The name'))
  .trim()
  .min(1, 'Enter the name colleagues know this person by.')
  .max(200, 'Keep the name under 200 characters.');

/** The token of an invitation or password-reset link: 32 random bytes, base64url. */
export const linkTokenSchema = z
  .string()
  .regex(/^[A-Za-z0-9_-]{43}$/, 'This link is not complete. Open it again from the e-mail, or copy the whole link.');

/** `POST /api/users` (admin): invite a person by e-mail. */
export const invitePersonRequestSchema = z.strictObject({
  email: emailField,
  displayName: displayNameField,
  role: z.enum(ROLES, { message: `Choose one of the roles: ${ROLES.join(', ')}.` }),
});
export type InvitePersonRequest = z.infer<typeof invitePersonRequestSchema>;

/** `PATCH /api/users/:id` (admin): any of role, lock, name. */
export const updatePersonRequestSchema = z
  .strictObject({
    role: z.enum(ROLES, { message: `Choose one of the roles: ${ROLES.join(', ')}.` }).optional(),
    locked: z.boolean({ message: 'Say true to lock the account or false to unlock it.' }).optional(),
    displayName: displayNameField.optional(),
  })
  .refine((body) => body.role !== undefined || body.locked !== undefined || body.displayName !== undefined, {
    message: 'Send at least one of role, locked or displayName.',
  });
export type UpdatePersonRequest = z.infer<typeof updatePersonRequestSchema>;

/** `POST /api/auth/password-reset`: always answered 202, whether or not the account exists. */
export const passwordResetRequestSchema = z.strictObject({ email: emailField });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

/** The answer of accept and confirm: the address to sign in with next. */
export const passwordSetResponseSchema = z.object({ email: z.string() });

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

/** `POST /api/auth/unlock`: the token of the link in the "wrong passwords were typed" mail. */
export const unlockRequestSchema = z.strictObject({
  token: z
    .string({ error: 'This link is not complete. Open it again from the e-mail, or copy the whole link.' })
    .regex(/^[1-9]\d{0,15}\.\d{1,12}\.[A-Za-z0-9_-]{43}$/, 'This link is not complete. Open it again from the e-mail, or copy the whole link.'),
});
