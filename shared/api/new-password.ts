/**
 * The requests that set a password: accept an invitation, confirm a reset, change one's own.
 * Apart from `auth.ts` because the password rule carries the common-password list (about 1 MB),
 * which only the password pages load.
 */
import * as z from 'zod';
import { NEW_PASSWORD_MAX_LENGTH, newPasswordProblem } from '../auth/password-strength';
import { displayNameField, linkTokenSchema } from './auth';

/** A new password: long enough, not common, not guessable (`shared/auth/password-strength.ts`). */
export const newPasswordSchema = z.string({ error: 'Choose a password.' }).superRefine((password, context) => {
  const problem = newPasswordProblem(password);
  if (problem) context.addIssue({ code: 'custom', message: problem, input: password });
});

/** `POST /api/auth/invitations/accept`: the invited person chooses a password. */
export const acceptInvitationRequestSchema = z.strictObject({
  token: linkTokenSchema,
  password: newPasswordSchema,
  displayName: displayNameField.optional(),
});
export type AcceptInvitationRequest = z.infer<typeof acceptInvitationRequestSchema>;

/** `POST /api/auth/password-reset/confirm`. */
export const passwordResetConfirmSchema = z.strictObject({ token: linkTokenSchema, password: newPasswordSchema });
export type PasswordResetConfirm = z.infer<typeof passwordResetConfirmSchema>;

/** `POST /api/auth/password` (signed in): the current password proves it is the person at the keyboard. */
export const changePasswordRequestSchema = z.strictObject({
  currentPassword: z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(NEW_PASSWORD_MAX_LENGTH),
  newPassword: newPasswordSchema,
});
export type ChangePasswordRequest = z.infer<typeof changePasswordRequestSchema>;
