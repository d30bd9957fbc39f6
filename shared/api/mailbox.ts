import * as z from 'zod';

/**
 * `GET /api/dev/mailbox` (administrators, only while the local fake mail server is in use):
 * the messages sent to the operator's people, newest first.
 */
export const mailboxMessageSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  receivedAt: z.string(),
  text: z.string(),
  links: z.array(z.string()),
});
export type MailboxMessage = z.infer<typeof mailboxMessageSchema>;
export const mailboxResponseSchema = z.object({ messages: z.array(mailboxMessageSchema) });
