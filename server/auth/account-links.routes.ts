import { Router, type RequestHandler } from 'express';
import { passwordResetRequestSchema, unlockRequestSchema } from '@shared/api/auth';
import { acceptInvitationRequestSchema, passwordResetConfirmSchema } from '@shared/api/new-password';
import type { Sequelize } from 'sequelize';
import { parseOrThrow } from '../middleware/validate';
import { originOf } from '../middleware/request-actor';
import { unlockSignIn } from './unlock.service';
import { acceptInvitation } from './invitations.service';
import { confirmPasswordReset, requestPasswordReset } from './password-reset.service';

/**
 * `/api/auth`: the links people get by mail — accepting an invitation and resetting a
 * password. Nobody is signed in for these; the token in the link is the proof.
 */
export function accountLinksRoutes({ limiter, sequelize, secret }: { limiter: RequestHandler; sequelize: Sequelize; secret: string }): Router {
  const router = Router();

  router.post('/invitations/accept', limiter, async (req, res) => {
    const input = parseOrThrow(acceptInvitationRequestSchema, req.body, 'invitation');
    res.json(await acceptInvitation(input, originOf(req)));
  });

  router.post('/password-reset', limiter, async (req, res) => {
    const { email } = parseOrThrow(passwordResetRequestSchema, req.body, 'password reset');
    const outcome = await requestPasswordReset(email, originOf(req));
    if (outcome.sent === 'held') req.log?.warn({ userId: outcome.userId }, 'password reset not sent: too many requests this hour');
    // The same answer whether or not the account exists.
    res.status(202).json({ message: 'If an account uses this e-mail address, a link to choose a new password is on its way. It works for one hour.' });
  });

  router.post('/password-reset/confirm', limiter, async (req, res) => {
    const input = parseOrThrow(passwordResetConfirmSchema, req.body, 'new password');
    res.json(await confirmPasswordReset(input, originOf(req)));
  });

  router.post('/unlock', limiter, async (req, res) => {
    const { token } = parseOrThrow(unlockRequestSchema, req.body, 'unlock');
    res.json(await unlockSignIn(token, { sequelize, secret }, originOf(req)));
  });

  return router;
}
