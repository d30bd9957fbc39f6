import * as z from 'zod';
import { operatorPersonSchema } from './auth';

/**
 * The answer of `POST /api/users` (invite) and `POST /api/users/:id/invitation` (send again):
 * the person, and whether the mail server took the invitation.
 */
export const invitationSentSchema = z.object({ user: operatorPersonSchema, mailSent: z.boolean() });
export type InvitationSent = z.infer<typeof invitationSentSchema>;
