import { Router } from 'express';
import { actorOf } from '../middleware/request-actor';
import { requireCapability } from '../middleware/authorize';
import { operatorSettingsSchema } from '../../shared/api/sync';
import { parseOrThrow } from '../middleware/validate';
import { publicSigningKey } from '../revisions/signing';
import { operatorSettings, updateOperatorSettings } from './operator.service';

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
    res.json({ settings: await operatorSettings(actorOf(req).operatorId) });
  });
  router.patch('/settings', requireCapability('manage-people'), async (req, res) => {
    const input = parseOrThrow(operatorSettingsSchema, req.body, 'settings');
    res.json({ settings: await updateOperatorSettings(actorOf(req), input) });
  });
  return router;
}
