/**
 * Invitations: an administrator adds a person without a password; the mail carries a link
 * that lets them choose one. Single use, seven days, only the hash stored.
 */
import { Op, type Transaction } from 'sequelize';
import type { AcceptInvitationRequest } from '@shared/api/new-password';
import type { RequestOrigin } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { DomainError } from '../errors/domain-error';
import { invitationMail } from '../mail/messages';
import { outbox } from '../mail/outbox';
import { Invitation, Operator, User } from '../models';
import { assertLinkUsable, hashLinkToken, newLinkToken, type LinkWording } from './link-tokens';
import { assertPasswordNotPersonal, hashPassword } from './passwords';
import { transact } from '../transactions';

export const INVITATION_DAYS = 7;

const WORDS: LinkWording = {
  unknown: 'This invitation link is not valid. Open it again from the e-mail, or ask your administrator for a new one.',
  used: 'This invitation has already been used. Sign in with the password you chose, or ask for a password reset.',
  replaced: 'A newer invitation was sent after this one. Use the link in the latest e-mail.',
  expired: 'This invitation has expired. Ask your administrator to send a new one.',
};

const ADDRESS_IN_USE =
  'This address already signs in to Speedwright for another operator, and one address signs in for one operator only. Ask the administrator who invited you to invite another of your addresses.';

/** The person who signs in with `email` (the one with a password), if any. */
export function signingInAccount(email: string): Promise<User | null> {
  return User.findOne({ where: { email, passwordHash: { [Op.ne]: null } }, include: [{ model: Operator, as: 'operator' }] });
}

export interface IssuedInvitation {
  token: string;
  expiresAt: Date;
}

/**
 * Creates an invitation for `user` (revoking earlier unused ones) inside the caller's
 * transaction. `invitedById` is null when no person invited them (the first administrator of
 * an operator set up from the command line).
 */
export async function issueInvitation(user: User, invitedById: number | null, transaction: Transaction): Promise<IssuedInvitation> {
  const now = new Date();
  await Invitation.update({ revokedAt: now }, { where: { userId: user.id, usedAt: null, revokedAt: null }, transaction });
  const { token, tokenHash } = newLinkToken();
  const expiresAt = new Date(now.getTime() + INVITATION_DAYS * 24 * 3600_000);
  await Invitation.create(
    { operatorId: user.operatorId, userId: user.id, invitedById, tokenHash, expiresAt, usedAt: null, revokedAt: null },
    { transaction },
  );
  return { token, expiresAt };
}

/** The link an invitation mail carries (its token after `#`, never in server logs). */
export function invitationLink(invitation: IssuedInvitation): string {
  return outbox().link('/invitation', { token: invitation.token });
}

/**
 * Mails the invitation; resolves whether the mail server took it. Call after the commit.
 * `invitedById` null: nobody of the operator invited them; the mail names `Your IT team`.
 */
export async function sendInvitation(user: User, invitedById: number | null, invitation: IssuedInvitation): Promise<boolean> {
  const [operator, invitedBy] = await Promise.all([Operator.findByPk(user.operatorId), invitedById === null ? null : User.findByPk(invitedById)]);
  const link = invitationLink(invitation);
  const addressInUse = (await signingInAccount(user.email)) !== null;
  return outbox().send(
    invitationMail({
      addressInUse,
      to: user.email,
      displayName: user.displayName,
      operatorName: operator?.name ?? 'your operator',
      invitedBy: invitedBy?.displayName ?? (invitedById === null ? 'Your IT team' : 'Your administrator'),
      link,
      expiresAt: invitation.expiresAt,
    }),
  );
}

/** Sets the invited person's password and spends the link. Answers the e-mail to sign in with. */
export async function acceptInvitation(input: AcceptInvitationRequest, origin: RequestOrigin): Promise<{ email: string }> {
  const tokenHash = hashLinkToken(input.token);
  // Check before hashing the password, so made-up tokens cost no argon2 work.
  const pending = await Invitation.findOne({ where: { tokenHash } });
  assertLinkUsable(pending, WORDS);
  await refuseIfPersonal(pending.userId, input.password);
  const passwordHash = await hashPassword(input.password);

  return transact(async (transaction) => {
    const invitation = await Invitation.findOne({ where: { tokenHash }, lock: transaction.LOCK.UPDATE, transaction });
    assertLinkUsable(invitation, WORDS);
    const user = await User.findByPk(invitation.userId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!user || user.operatorId !== invitation.operatorId) throw new DomainError('gone', 'link_used', WORDS.used);
    if (user.passwordHash) throw new DomainError('gone', 'link_used', WORDS.used);
    // One person per address signs in: locking every row of the address serialises two accepts.
    const sameAddress = await User.findAll({ where: { email: user.email }, lock: transaction.LOCK.UPDATE, transaction });
    if (sameAddress.some((other) => other.id !== user.id && other.passwordHash !== null)) {
      throw new DomainError('conflict', 'address_in_use', ADDRESS_IN_USE);
    }

    const now = new Date();
    await user.update(
      { passwordHash, failedSignIns: 0, lockedUntil: null, ...(input.displayName ? { displayName: input.displayName } : {}) },
      { transaction },
    );
    await invitation.update({ usedAt: now }, { transaction });
    await Invitation.update(
      { revokedAt: now },
      { where: { userId: user.id, usedAt: null, revokedAt: null, id: { [Op.ne]: invitation.id } }, transaction },
    );
    await recordAudit(
      {
        operatorId: user.operatorId,
        actorId: user.id,
        action: 'invitation.accepted',
        entityType: 'user',
        entityId: user.id,
        details: { invitationId: invitation.id, ...(input.displayName ? { displayName: input.displayName } : {}) },
        origin,
      },
      transaction,
    );
    return { email: user.email };
  });
}

/** A password built on the person's own name, address or operator is refused before any hashing. */
export async function refuseIfPersonal(userId: number, password: string): Promise<void> {
  const user = await User.findByPk(userId, { include: [{ model: Operator, as: 'operator' }] });
  if (user) assertPasswordNotPersonal(password, user, user.operator?.name ?? '', 'password');
}
