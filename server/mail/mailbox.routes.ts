import { Router } from 'express';
import type { MailboxMessage } from '../../shared/api/mailbox';
import { operatorScope, requireCapability } from '../middleware/authorize';
import { User } from '../models';
import { readMailbox } from './mailbox';

const MOST_MESSAGES = 200;

/**
 * `/api/dev/mailbox`: what the local fake mail server received, for trying invitations and
 * resets without real mail. Mounted only when that server is in use (MAILBOX_DIR). An admin
 * sees only messages to their own operator's people — a reset link for someone else's
 * account is not theirs to read.
 */
export function mailboxRoutes(dir: string): Router {
  const router = Router();
  router.get('/', requireCapability('manage-people'), async (req, res) => {
    const people = await User.findAll({ where: { operatorId: operatorScope(req) }, attributes: ['email'] });
    const ours = new Set(people.map((person) => person.email.toLowerCase()));
    const messages: MailboxMessage[] = readMailbox(dir)
      .filter((entry) => entry.to.length > 0 && entry.to.every((address) => ours.has(address.toLowerCase())))
      .reverse()
      .slice(0, MOST_MESSAGES)
      .map(({ id, from, to, subject, receivedAt, text, links }) => ({ id, from, to, subject, receivedAt, text, links }));
    res.set('Cache-Control', 'no-store').json({ messages });
  });
  return router;
}
