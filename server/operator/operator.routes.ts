import { Router } from 'express';
import type { SigningKeyResponse, SigningKeyView } from '@shared/api/revisions';
import { actorOf } from '../middleware/request-actor';
import { requireCapability } from '../middleware/authorize';
import { operatorSettingsSchema } from '@shared/api/sync';
import { parseOrThrow } from '../middleware/validate';
import type { SigningKey } from '../models';
import { publishedSigningKeys, rotateSigningKey } from '../revisions/signing';
import { operatorSettings, updateOperatorSettings } from './operator.service';

function signingKeyView(key: SigningKey): SigningKeyView {
  return {
    id: key.id,
    algorithm: 'Ed25519',
    publicKey: key.publicKey,
    publicKeyEncoding: 'raw-base64',
    createdAt: key.createdAt.toISOString(),
    retiredAt: key.retiredAt?.toISOString() ?? null,
  };
}

function signingKeysAnswer(active: SigningKey, all: readonly SigningKey[]): SigningKeyResponse {
  return { signingKey: signingKeyView(active), signingKeys: all.map(signingKeyView) };
}

/**
 * `/api/operator/signing-key`: the public keys devices verify published revisions with (the
 * active one and every retired one); `…/rotate`: an administrator replaces the active key;
 * `/api/operator/settings`: the operator's policies (the currency limit), set by an administrator.
 */
export function operatorRoutes({ signingKeySecret }: { signingKeySecret: string }): Router {
  const router = Router();
  router.get('/signing-key', requireCapability('read-published'), async (req, res) => {
    const actor = actorOf(req);
    // Made on first need, like at the first publication; locked so two first calls make one.
    const { active, all } = await publishedSigningKeys(actor.operatorId, signingKeySecret, actor);
    res.json(signingKeysAnswer(active, all));
  });
  router.post('/signing-key/rotate', requireCapability('manage-people'), async (req, res) => {
    const actor = actorOf(req);
    await rotateSigningKey(actor, signingKeySecret);
    const { active, all } = await publishedSigningKeys(actor.operatorId, signingKeySecret, actor);
    res.status(201).json(signingKeysAnswer(active, all));
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
