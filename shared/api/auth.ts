import * as z from 'zod';
import { ROLES } from '../auth/roles';
import { plainText } from '../text/plain-text';

// Signing in and the session: in zod's small build, for the app's first screen (session.ts).
export { apiErrorSchema, csrfResponseSchema, loginRequestSchema, loginResponseSchema, sessionUserSchema } from './session';
export type { ApiError, LoginRequest, SessionUser } from './session';

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

export const healthSchema = z.object({ status: z.enum(['ok', 'degraded']), db: z.enum(['ok', 'down']) });

/** `POST /api/auth/unlock`: the token of the link in the "wrong passwords were typed" mail. */
export const unlockRequestSchema = z.strictObject({
  token: z
    .string({ error: 'This link is not complete. Open it again from the e-mail, or copy the whole link.' })
    .regex(/^[1-9]\d{0,15}\.\d{1,12}\.[A-Za-z0-9_-]{43}$/, 'This link is not complete. Open it again from the e-mail, or copy the whole link.'),
});
