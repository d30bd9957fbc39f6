import { Router } from 'express';
import { actorOf } from '../audit/actor';
import { requireCapability } from '../middleware/authorize';
import { operatorSettingsSchema } from '../../shared/api/sync';
import { recordAudit } from '../audit/audit.service';
import { parseOrThrow } from '../middleware/validate';
import { Operator } from '../models';
import { publicSigningKey } from '../revisions/signing';

/**
 * `/api/operator/signing-key`: the public key devices verify published revisions with;
 * `/api/operator/settings`: the operator's policies (the currency limit), set by an administrator.
 */
export function operatorRoutes({ signingKeySecret }: { signingKeySecret: string }): Router {
  const router = Router();
  router.get('/signing-key', requireCapability('read-published'), async (req, res) => {
    const actor = actorOf(req);
    // Made on first need, like at the first publication; locked so two first calls make one.
    const key = await publicSigningKey(actor.operatorId, signingKeySecret, actor);
    res.json({
      signingKey: { id: key.id, algorithm: 'Ed25519', publicKey: key.publicKey, publicKeyEncoding: 'raw-base64', createdAt: key.createdAt.toISOString() },
    });
  });
  router.get('/settings', requireCapability('manage-people'), async (req, res) => {
    const operator = await Operator.findByPk(actorOf(req).operatorId, { rejectOnEmpty: true });
    res.json({ settings: { currencyLimitDays: operator.currencyLimitDays } });
  });
  router.patch('/settings', requireCapability('manage-people'), async (req, res) => {
    const actor = actorOf(req);
    const input = parseOrThrow(operatorSettingsSchema, req.body, 'settings');
    const settings = await Operator.sequelize!.transaction(async (transaction) => {
      const operator = await Operator.findByPk(actor.operatorId, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
      const before = operator.currencyLimitDays;
      await operator.update({ currencyLimitDays: input.currencyLimitDays }, { transaction });
      await recordAudit(
        { operatorId: actor.operatorId, actorId: actor.userId, action: 'operator.settings-updated', entityType: 'operator', entityId: actor.operatorId, details: { currencyLimitDays: { before, after: input.currencyLimitDays } }, req },
        transaction,
      );
      return { currencyLimitDays: operator.currencyLimitDays };
    });
    res.json({ settings });
  });
  return router;
}
