import * as z from 'zod';

/** The 202 answer of `POST /api/auth/password-reset`: one sentence, whether or not the account exists. */
export const passwordResetRequestedSchema = z.object({ message: z.string() });
