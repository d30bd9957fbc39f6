import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import type { InvitePersonRequest, OperatorPerson, UpdatePersonRequest } from '@shared/api/auth';
import type { Actor } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { issueInvitation, sendInvitation } from '../auth/invitations.service';
import { clearFailures } from '../auth/sign-in-throttle';
import { DomainError, notFound } from '../errors/domain-error';
import { Operator, User } from '../models';
import { database, transact } from '../transactions';

const PERSON = 'That person';

/** The operator's people, for its administrator. */
export async function listOperatorPeople(operatorId: number): Promise<OperatorPerson[]> {
  const users = await User.findAll({ where: { operatorId }, order: [['displayName', 'ASC']] });
  return users.map(toOperatorPerson);
}

export function toOperatorPerson(user: User): OperatorPerson {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    locked: user.lockedByAdmin || (user.lockedUntil !== null && user.lockedUntil.getTime() > Date.now()),
    invitationPending: user.passwordHash === null,
    lastSignInAt: user.lastSignInAt?.toISOString() ?? null,
    createdAt: user.createdAt.toISOString(),
  };
}

export interface InviteResult {
  user: OperatorPerson;
  /** Whether the mail server took the invitation; the admin can send it again when not. */
  mailSent: boolean;
}

/** Adds a person without a password and mails them an invitation to choose one. */
export async function invitePerson(actor: Actor, input: InvitePersonRequest): Promise<InviteResult> {
  const { operatorId, userId: actorId, origin } = actor;
  let created: { user: User; invitation: Awaited<ReturnType<typeof issueInvitation>> };
  try {
    created = await transact(async (transaction) => {
      // Only this operator's own people are checked: whether the address signs in elsewhere is not
      // this administrator's business, and the invitation mail tells its owner what to do.
      if (await User.findOne({ where: { operatorId, email: input.email }, transaction })) throw emailTaken();
      const user = await User.create(
        { operatorId, email: input.email, displayName: input.displayName, role: input.role, passwordHash: null, lockedUntil: null, lastSignInAt: null },
        { transaction },
      );
      const invitation = await issueInvitation(user, actorId, transaction);
      await recordAudit(
        { operatorId, actorId, action: 'user.invited', entityType: 'user', entityId: user.id, details: { email: user.email, role: user.role }, origin },
        transaction,
      );
      return { user, invitation };
    });
  } catch (error) {
    // Two admins inviting the same address at once: the unique index decides.
    if (error instanceof UniqueConstraintError) throw emailTaken();
    throw error;
  }
  const mailSent = await sendInvitation(created.user, actorId, created.invitation);
  return { user: toOperatorPerson(created.user), mailSent };
}

/** A new invitation link for someone who has not chosen a password yet; earlier links stop working. */
export async function resendInvitation(actor: Actor, userId: number): Promise<InviteResult> {
  const { operatorId, userId: actorId, origin } = actor;
  const { user, invitation } = await transact(async (transaction) => {
    const user = await User.findOne({ where: { id: userId, operatorId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!user) throw notFound(PERSON);
    if (user.passwordHash !== null) {
      throw new DomainError('conflict', 'invitation_accepted', `${user.displayName} has already accepted the invitation. If they forgot the password, they can ask for a reset on the sign-in page.`);
    }
    const invitation = await issueInvitation(user, actorId, transaction);
    await recordAudit({ operatorId, actorId, action: 'user.invitation-resent', entityType: 'user', entityId: user.id, origin }, transaction);
    return { user, invitation };
  });
  const mailSent = await sendInvitation(user, actorId, invitation);
  return { user: toOperatorPerson(user), mailSent };
}

/**
 * Changes role, lock or name. Keeps at least one administrator who can sign in, and never
 * lets an administrator lock themself out. The change applies to open sessions at once,
 * because every request reloads the person.
 */
export async function updatePerson(actor: Actor, userId: number, input: UpdatePersonRequest): Promise<OperatorPerson> {
  const { operatorId, userId: actorId, origin } = actor;
  return transact(async (transaction) => {
    // The operator row serialises changes to its people, so two admins demoting each other
    // at once cannot both succeed and leave nobody in charge.
    await Operator.findByPk(operatorId, { lock: transaction.LOCK.UPDATE, transaction });
    const user = await User.findOne({ where: { id: userId, operatorId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!user) throw notFound(PERSON);

    if (input.locked === true && user.id === actorId) {
      throw new DomainError('conflict', 'cannot_lock_self', 'You cannot lock your own account. Ask another administrator if it must be locked.', {
        locked: 'You cannot lock your own account.',
      });
    }
    const staysActiveAdmin = (input.role ?? user.role) === 'admin' && !(input.locked ?? user.lockedByAdmin);
    const isActiveAdmin = user.role === 'admin' && !user.lockedByAdmin;
    if (isActiveAdmin && !staysActiveAdmin && (await otherActiveAdmins(operatorId, user.id, transaction)) === 0) {
      throw new DomainError(
        'conflict',
        'last_admin',
        `${user.displayName} is the operator's only administrator who can sign in. Make someone else an administrator first.`,
      );
    }

    const audits: { action: string; details?: Record<string, unknown> }[] = [];
    if (input.role !== undefined && input.role !== user.role) {
      audits.push({ action: 'user.role-changed', details: { from: user.role, to: input.role } });
      user.role = input.role;
    }
    if (input.locked !== undefined && input.locked !== user.lockedByAdmin) {
      audits.push({ action: input.locked ? 'user.locked' : 'user.unlocked' });
      user.lockedByAdmin = input.locked;
    }
    if (input.locked === false) {
      // Unlocking also lifts the wait after failed sign-ins.
      user.lockedUntil = null;
      user.failedSignIns = 0;
      await clearFailures(database(), user.email);
    }
    if (input.displayName !== undefined && input.displayName !== user.displayName) {
      audits.push({ action: 'user.renamed', details: { from: user.displayName, to: input.displayName } });
      user.displayName = input.displayName;
    }
    await user.save({ transaction });
    for (const audit of audits) {
      await recordAudit({ operatorId, actorId, entityType: 'user', entityId: user.id, origin, ...audit }, transaction);
    }
    return toOperatorPerson(user);
  });
}

function otherActiveAdmins(operatorId: number, exceptUserId: number, transaction: Transaction): Promise<number> {
  return User.count({
    where: { operatorId, role: 'admin', lockedByAdmin: false, passwordHash: { [Op.ne]: null }, id: { [Op.ne]: exceptUserId } },
    transaction,
  });
}

function emailTaken(): DomainError {
  return new DomainError('conflict', 'email_taken', 'This e-mail address already belongs to one of your people.', {
    email: 'This e-mail address already belongs to one of your people.',
  });
}
