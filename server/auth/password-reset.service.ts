/**
 * "Forgot my password": a single-use link valid for one hour, mailed only when the account
 * exists, while the answer to the request is the same either way.
 */
import { Op, QueryTypes } from 'sequelize';
import type { PasswordResetConfirm } from '@shared/api/new-password';
import type { RequestOrigin } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { DomainError } from '../errors/domain-error';
import { passwordResetMail } from '../mail/messages';
import { outbox } from '../mail/outbox';
import { Invitation, PasswordResetToken, User } from '../models';
import { assertLinkUsable, hashLinkToken, newLinkToken, type LinkWording } from './link-tokens';
import { hashPassword } from './passwords';
import { refuseIfPersonal, signingInAccount } from './invitations.service';
import { database, transact } from '../transactions';

export const RESET_LINK_MINUTES = 60;
/** More requests than this in an hour for one account send no further mail (a mailbox is not a target). */
export const RESET_LINKS_PER_HOUR = 3;

const WORDS: LinkWording = {
  unknown: 'This password-reset link is not valid. Open it again from the e-mail, or ask for a new one.',
  used: 'This password-reset link has already been used. Ask for a new one if you need it.',
  replaced: 'Your password was changed after this link was sent, so the link no longer works. Ask for a new one if you need it.',
  expired: 'This password-reset link has expired (it works for one hour). Ask for a new one.',
};

/** What a reset request did, for the log only (the answer to the request is the same whatever it did). */
export type PasswordResetOutcome = { sent: 'mailed' } | { sent: 'nothing' } | { sent: 'held'; userId: number };

/**
 * Issues and mails a link when `email` belongs to an account that may sign in; does nothing
 * otherwise. The mail goes out after the caller has answered, so the time taken says nothing.
 */
export async function requestPasswordReset(email: string, origin: RequestOrigin): Promise<PasswordResetOutcome> {
  // The account that signs in with the address; else a pending invitation of it (a reset also
  // answers an invitation), the oldest first.
  const user = (await signingInAccount(email)) ?? (await User.findOne({ where: { email }, order: [['id', 'ASC']] }));
  if (!user || user.lockedByAdmin) return { sent: 'nothing' };
  const since = new Date(Date.now() - 3600_000);
  if ((await PasswordResetToken.count({ where: { userId: user.id, createdAt: { [Op.gt]: since } } })) >= RESET_LINKS_PER_HOUR) {
    return { sent: 'held', userId: user.id };
  }
  const { token, tokenHash } = newLinkToken();
  const expiresAt = new Date(Date.now() + RESET_LINK_MINUTES * 60_000);
  await transact(async (transaction) => {
    await PasswordResetToken.create({ userId: user.id, tokenHash, expiresAt, usedAt: null, revokedAt: null }, { transaction });
    await recordAudit(
      { operatorId: user.operatorId, actorId: null, action: 'user.password-reset-requested', entityType: 'user', entityId: user.id, origin },
      transaction,
    );
  });
  void outbox().send(
    passwordResetMail({ to: user.email, displayName: user.displayName, link: outbox().link('/reset-password', { token }), expiresAt }),
  );
  return { sent: 'mailed' };
}

/** Sets the new password, spends the link and every other open link, and signs the person out everywhere. */
export async function confirmPasswordReset(input: PasswordResetConfirm, origin: RequestOrigin): Promise<{ email: string }> {
  const tokenHash = hashLinkToken(input.token);
  const pending = await PasswordResetToken.findOne({ where: { tokenHash } });
  assertLinkUsable(pending, WORDS);
  await refuseIfPersonal(pending.userId, input.password);
  const passwordHash = await hashPassword(input.password);

  return transact(async (transaction) => {
    const link = await PasswordResetToken.findOne({ where: { tokenHash }, lock: transaction.LOCK.UPDATE, transaction });
    assertLinkUsable(link, WORDS);
    const user = await User.findByPk(link.userId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!user) throw new DomainError('gone', 'link_used', WORDS.used);
    const now = new Date();
    await user.update({ passwordHash, failedSignIns: 0, lockedUntil: null }, { transaction });
    await link.update({ usedAt: now }, { transaction });
    await PasswordResetToken.update(
      { revokedAt: now },
      { where: { userId: user.id, usedAt: null, revokedAt: null, id: { [Op.ne]: link.id } }, transaction },
    );
    // Choosing a password through a reset also answers an invitation still open.
    await Invitation.update({ revokedAt: now }, { where: { userId: user.id, usedAt: null, revokedAt: null }, transaction });
    // Whoever knew the old password is signed out too.
    await database().query("DELETE FROM sessions WHERE JSON_VALUE(data, '$.passport.user') = ?", {
      replacements: [user.id],
      type: QueryTypes.DELETE,
      transaction,
    });
    await recordAudit(
      { operatorId: user.operatorId, actorId: user.id, action: 'user.password-reset', entityType: 'user', entityId: user.id, origin },
      transaction,
    );
    return { email: user.email };
  });
}
