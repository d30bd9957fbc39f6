/**
 * Mail about revisions, for the revision workflow to call once its change is committed.
 *
 * - `notifyRevisionSubmitted` → every approver of the operator except the author;
 * - `notifyRevisionPublished` and `notifyRevisionWithdrawn` → every pilot of the operator.
 *
 * Only people who can sign in are told (not locked by the administrator, invitation
 * accepted). Each person gets their own message. These functions never reject: a mail that
 * cannot be sent is logged and the workflow goes on. Pass `transaction` to send only once it
 * commits (nothing is sent if it rolls back); the promise then resolves at once.
 */
import { Op, type Transaction } from 'sequelize';
import type { Role } from '@shared/auth/roles';
import { SpeedBook, User } from '../models';
import { revisionPublishedMail, revisionSubmittedMail, revisionWithdrawnMail, type RevisionMailFacts } from './messages';
import { outbox, type OutgoingMail } from './outbox';

/** What the mails need to know of a revision; a `Revision` model instance fits. */
export interface RevisionNotice {
  id: number;
  number: number;
  speedBookId: number;
  changeSummary?: string | null;
  /** The author, left out of the "submitted" mail. */
  authorId?: number | null;
  /** Looked up from `speed_books` when left out. */
  speedBookTitle?: string;
}

export interface NotifyOptions {
  /** Send after this transaction commits, and not at all if it rolls back. */
  transaction?: Transaction;
  /** Who did it, named in the mail. */
  actorId?: number;
}

export function notifyRevisionSubmitted(revision: RevisionNotice, operatorId: number, options: NotifyOptions = {}): Promise<void> {
  return deliver(options, async () => {
    const approvers = await recipients(operatorId, 'approver', revision.authorId ?? options.actorId);
    const facts = await factsOf(revision, operatorId);
    const submittedBy = (await nameOf(options.actorId ?? revision.authorId)) ?? 'A fleet engineer';
    return approvers.map((person) =>
      revisionSubmittedMail({ ...facts, ...person, submittedBy, link: outbox().link(`/review/${revision.id}`) }),
    );
  });
}

export function notifyRevisionPublished(revision: RevisionNotice, operatorId: number, options: NotifyOptions = {}): Promise<void> {
  return deliver(options, async () => {
    const pilots = await recipients(operatorId, 'pilot');
    const facts = await factsOf(revision, operatorId);
    return pilots.map((person) => revisionPublishedMail({ ...facts, ...person, link: outbox().link(`/speed-books/${revision.speedBookId}`) }));
  });
}

export function notifyRevisionWithdrawn(
  revision: RevisionNotice,
  operatorId: number,
  reason: string,
  options: NotifyOptions = {},
): Promise<void> {
  return deliver(options, async () => {
    const pilots = await recipients(operatorId, 'pilot');
    const facts = await factsOf(revision, operatorId);
    return pilots.map((person) =>
      revisionWithdrawnMail({ ...facts, ...person, reason, link: outbox().link(`/speed-books/${revision.speedBookId}`) }),
    );
  });
}

/** Runs now or after the commit; logs and swallows every failure. */
function deliver({ transaction }: NotifyOptions, compose: () => Promise<OutgoingMail[]>): Promise<void> {
  const run = async () => {
    try {
      const mails = await compose();
      for (const mail of mails) await outbox().send(mail);
    } catch (error) {
      outbox().log.error({ err: error }, 'revision mail could not be prepared');
    }
  };
  if (transaction) {
    transaction.afterCommit(() => void run());
    return Promise.resolve();
  }
  return run();
}

async function recipients(operatorId: number, role: Role, exceptUserId?: number | null): Promise<{ to: string; displayName: string }[]> {
  const people = await User.findAll({
    where: {
      operatorId,
      role,
      lockedByAdmin: false,
      passwordHash: { [Op.ne]: null },
      ...(exceptUserId ? { id: { [Op.ne]: exceptUserId } } : {}),
    },
    attributes: ['email', 'displayName'],
    order: [['id', 'ASC']],
  });
  return people.map((person) => ({ to: person.email, displayName: person.displayName }));
}

async function factsOf(revision: RevisionNotice, operatorId: number): Promise<Omit<RevisionMailFacts, 'to' | 'displayName' | 'link'>> {
  return {
    speedBookTitle: revision.speedBookTitle ?? (await speedBookTitle(revision.speedBookId, operatorId)),
    revisionNumber: revision.number,
    changeSummary: revision.changeSummary ?? null,
  };
}

async function speedBookTitle(speedBookId: number, operatorId: number): Promise<string> {
  const book = await SpeedBook.findOne({ where: { id: speedBookId, operatorId }, attributes: ['title'] });
  return book?.title ?? `speed book ${speedBookId}`;
}

async function nameOf(userId: number | null | undefined): Promise<string | undefined> {
  if (!userId) return undefined;
  return (await User.findByPk(userId, { attributes: ['displayName'] }))?.displayName;
}
