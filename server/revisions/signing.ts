/**
 * The operators' Ed25519 signing keys: made on first need, the private key kept only as
 * AES-256-GCM ciphertext under a key derived with HKDF-SHA-256 from SIGNING_KEY_SECRET and a
 * salt of its own, so the database alone cannot sign. The public key is the raw 32 bytes in
 * standard base64, as WebCrypto (`importKey('raw', …)`) and @noble/ed25519 take it.
 */
import { createCipheriv, createDecipheriv, createPrivateKey, createPublicKey, generateKeyPairSync, hkdfSync, randomBytes, sign, verify, type KeyObject } from 'node:crypto';
import type { Transaction } from 'sequelize';
import type { Actor } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { Operator, SigningKey } from '../models';
import { transact } from '../transactions';

const FORMAT = 'v1';
const HKDF_INFO = 'speedwright signing key v1';

function wrappingKey(secret: string, salt: Buffer): Buffer {
  return Buffer.from(hkdfSync('sha256', Buffer.from(secret, 'utf8'), salt, HKDF_INFO, 32));
}

/** `v1.<salt>.<iv>.<tag>.<ciphertext>`, each part base64: the PKCS#8 DER private key, encrypted. */
export function encryptPrivateKey(privateKey: KeyObject, secret: string): string {
  const salt = randomBytes(16);
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', wrappingKey(secret, salt), iv);
  const ciphertext = Buffer.concat([cipher.update(privateKey.export({ format: 'der', type: 'pkcs8' })), cipher.final()]);
  return [FORMAT, salt, iv, cipher.getAuthTag(), ciphertext].map((part) => (typeof part === 'string' ? part : part.toString('base64'))).join('.');
}

export function decryptPrivateKey(sealed: string, secret: string): KeyObject {
  const [format, ...parts] = sealed.split('.');
  if (format !== FORMAT || parts.length !== 4) throw new Error('The stored signing key has an unknown format.');
  const [salt, iv, tag, ciphertext] = parts.map((part) => Buffer.from(part, 'base64'));
  const decipher = createDecipheriv('aes-256-gcm', wrappingKey(secret, salt), iv);
  decipher.setAuthTag(tag);
  const der = Buffer.concat([decipher.update(ciphertext), decipher.final()]);
  return createPrivateKey({ key: der, format: 'der', type: 'pkcs8' });
}

/** The raw 32-byte public key, standard base64. */
function rawPublicKey(publicKey: KeyObject): string {
  const jwk = publicKey.export({ format: 'jwk' });
  return Buffer.from(String(jwk.x), 'base64url').toString('base64');
}

/** A Node key object for a raw 32-byte Ed25519 public key in base64. */
export function publicKeyFromRaw(publicKeyBase64: string): KeyObject {
  return createPublicKey({ key: { kty: 'OKP', crv: 'Ed25519', x: Buffer.from(publicKeyBase64, 'base64').toString('base64url') }, format: 'jwk' });
}

/** A new key pair for the operator, stored active with its private half encrypted, read back as stored. */
async function createSigningKey(operatorId: number, secret: string, transaction: Transaction): Promise<SigningKey> {
  const { publicKey, privateKey } = generateKeyPairSync('ed25519');
  const key = await SigningKey.create(
    { operatorId, publicKey: rawPublicKey(publicKey), encryptedPrivateKey: encryptPrivateKey(privateKey, secret), active: true, retiredAt: null },
    { transaction },
  );
  // As stored (whole seconds), so the first answer matches every later one.
  await key.reload({ transaction });
  return key;
}

/**
 * The operator's active key, made (and stored encrypted) when it has none. Locks the operator's
 * row so two first publications at once make one key.
 */
export async function activeSigningKey(operatorId: number, secret: string, transaction: Transaction, actor?: Pick<Actor, 'origin'> & { userId?: number }): Promise<SigningKey> {
  await Operator.findByPk(operatorId, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
  const existing = await SigningKey.findOne({ where: { operatorId, active: true }, order: [['id', 'DESC']], transaction });
  if (existing) return existing;
  const key = await createSigningKey(operatorId, secret, transaction);
  await recordAudit(
    { operatorId, actorId: actor?.userId ?? null, action: 'signing-key.created', entityType: 'signing-key', entityId: key.id, details: { algorithm: 'Ed25519', publicKey: key.publicKey }, origin: actor?.origin },
    transaction,
  );
  return key;
}

/**
 * The operator's active key for reading its public half (sync, the public-key route): a plain
 * read, so that devices syncing at once do not queue on the operator row; only an operator
 * without a key yet goes through `activeSigningKey`'s locked creation.
 */
export async function publicSigningKey(operatorId: number, secret: string, actor?: Actor): Promise<SigningKey> {
  const existing = await SigningKey.findOne({ where: { operatorId, active: true }, order: [['id', 'DESC']] });
  return existing ?? transact((transaction) => activeSigningKey(operatorId, secret, transaction, actor));
}

/**
 * The operator's active key and every key it ever had (newest first), made on first need like
 * `publicSigningKey`. Read from the primary (`useMaster`, a no-op without replicas), as every read
 * behind a sync is: a lagging replica could miss a key that a revision read from the primary names.
 */
export async function publishedSigningKeys(operatorId: number, secret: string, actor?: Actor): Promise<{ active: SigningKey; all: SigningKey[] }> {
  // One plain read in the usual case (a sync runs it on every call); only an operator without a key yet locks.
  const all = await SigningKey.findAll({ where: { operatorId }, order: [['id', 'DESC']], useMaster: true });
  const active = all.find((key) => key.active);
  if (active) return { active, all };
  const made = await transact((transaction) => activeSigningKey(operatorId, secret, transaction, actor));
  return { active: made, all: await SigningKey.findAll({ where: { operatorId }, order: [['id', 'DESC']], useMaster: true }) };
}

/**
 * Signing-key rotation: a new Ed25519 key becomes the operator's active key, and the key it
 * replaces is retired — kept, with its public half still served, so every revision it signed
 * stays verifiable; only new publications use the new key. The operator row is locked, so a
 * rotation and a publication (or two rotations) never interleave: a publication signs with
 * either the old key before the rotation or the new one after it. Audited as
 * `signing-key.rotated`, in the same transaction.
 */
export async function rotateSigningKey(actor: Actor, secret: string): Promise<{ active: SigningKey; retired: SigningKey[] }> {
  return transact(async (transaction) => {
    const { operatorId } = actor;
    await Operator.findByPk(operatorId, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
    const retiring = await SigningKey.findAll({ where: { operatorId, active: true }, order: [['id', 'ASC']], transaction });
    // Whole seconds, as the DATETIME column keeps it.
    const retiredAt = new Date(Math.floor(Date.now() / 1000) * 1000);
    for (const key of retiring) await key.update({ active: false, retiredAt }, { transaction });
    const active = await createSigningKey(operatorId, secret, transaction);
    await recordAudit(
      {
        operatorId,
        actorId: actor.userId,
        action: 'signing-key.rotated',
        entityType: 'signing-key',
        entityId: active.id,
        details: { algorithm: 'Ed25519', publicKey: active.publicKey, retiredKeyIds: retiring.map((key) => key.id) },
        origin: actor.origin,
      },
      transaction,
    );
    return { active, retired: retiring };
  });
}

/** Ed25519 signature (64 bytes, standard base64) of the UTF-8 bytes of `statement`. */
export function signStatement(key: SigningKey, secret: string, statement: string): string {
  return sign(null, Buffer.from(statement, 'utf8'), decryptPrivateKey(key.encryptedPrivateKey, secret)).toString('base64');
}

/** Whether `signatureBase64` is the key's signature of `statement`. */
export function verifyStatement(publicKeyBase64: string, statement: string, signatureBase64: string): boolean {
  return verify(null, Buffer.from(statement, 'utf8'), publicKeyFromRaw(publicKeyBase64), Buffer.from(signatureBase64, 'base64'));
}
