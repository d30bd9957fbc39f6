import { Router } from 'express';
import { actorOf } from '../audit/actor';
import { requireCapability } from '../middleware/authorize';
import { Revision } from '../models';
import { activeSigningKey } from '../revisions/signing';

/** `/api/operator/signing-key`: the public key devices verify published revisions with. */
export function operatorRoutes({ signingKeySecret }: { signingKeySecret: string }): Router {
  const router = Router();
  router.get('/signing-key', requireCapability('read-published'), async (req, res) => {
    const actor = actorOf(req);
    // Made on first need, like at the first publication; locked so two first calls make one.
    const key = await Revision.sequelize!.transaction((transaction) => activeSigningKey(actor.operatorId, signingKeySecret, transaction, actor));
    res.json({
      signingKey: { id: key.id, algorithm: 'Ed25519', publicKey: key.publicKey, publicKeyEncoding: 'raw-base64', createdAt: key.createdAt.toISOString() },
    });
  });
  return router;
}
