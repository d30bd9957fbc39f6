import { Router } from 'express';
import { Op } from 'sequelize';
import type { MailboxMessage } from '@shared/api/mailbox';
import { operatorScope, requireCapability } from '../middleware/authorize';
import { User } from '../models';
import { readMailbox } from './mailbox';

const MOST_MESSAGES = 200;

/**
 * `/api/dev/mailbox`: what the local fake mail server received, for trying invitations and
 * resets without real mail. Mounted only when that server is in use (MAILBOX_DIR). An admin
 * sees only messages to their own operator's people (not to an address that signs in at
 * another operator), and never the token of a password-reset or unlock link: those open the
 * person's account, which is not the administrator's to open (issue 12, informational).
 */
export function mailboxRoutes(dir: string): Router {
  const router = Router();
  router.get('/', requireCapability('manage-people'), async (req, res) => {
    const operatorId = operatorScope(req);
    const people = await User.findAll({ where: { operatorId }, attributes: ['email'] });
    const elsewhere = await User.findAll({
      where: { email: people.map((person) => person.email), operatorId: { [Op.ne]: operatorId }, passwordHash: { [Op.ne]: null } },
      attributes: ['email'],
    });
    const theirs = new Set(elsewhere.map((person) => person.email.toLowerCase()));
    const ours = new Set(people.map((person) => person.email.toLowerCase()).filter((email) => !theirs.has(email)));
    const messages: MailboxMessage[] = readMailbox(dir)
      .filter((entry) => entry.to.length > 0 && entry.to.every((address) => ours.has(address.toLowerCase())))
      .reverse()
      .slice(0, MOST_MESSAGES)
      .map(({ id, from, to, subject, receivedAt, text, links }) => ({ id, from, to, subject, receivedAt, text: hidePersonalTokens(text), links: links.map(hidePersonalTokens) }));
    res.set('Cache-Control', 'no-store').json({ messages });
  });
  return router;
}

/** Links that sign a person in or set their password keep their path but lose their token. */
const PERSONAL_LINK = /(\/(?:reset-password|unlock))#token=[^\s]+/g;
export function hidePersonalTokens(text: string): string {
  return text.replace(PERSONAL_LINK, '$1#token=(hidden: only the person it was sent to may open it)');
}
