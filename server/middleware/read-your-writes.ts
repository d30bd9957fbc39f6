import { AsyncLocalStorage } from 'node:async_hooks';
import type { RequestHandler } from 'express';
import type { FindOptions, Sequelize } from 'sequelize';

declare module 'express-session' {
  interface SessionData {
    /** Epoch ms until which this session's reads go to the primary (it wrote recently). */
    primaryReadsUntil?: number;
  }
}

/** How long after a write a session keeps reading from the primary: far above a healthy replica's lag. */
export const READ_YOUR_WRITES_MS = 10_000;

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const onPrimary = new AsyncLocalStorage<true>();

/**
 * Read-your-writes with read replicas (common practice: "session stickiness after a write"). A
 * request that may write (any method but GET, HEAD, OPTIONS) marks its session; for the next
 * READ_YOUR_WRITES_MS that session's model reads go to the primary (Sequelize's `useMaster`, set
 * by a hook on every model find), so a publisher sees the revision they just published even while
 * a replica is behind. Other sessions read from the replicas. Mounted at `/api`. Mounted only when
 * DATABASE_READ_URLS names replicas; without them every read is on the primary anyway.
 */
export function readYourWrites(sequelize: Sequelize, now: () => number = Date.now): RequestHandler {
  sequelize.addHook('beforeFind', 'readYourWrites', (options: FindOptions & { useMaster?: boolean }) => {
    if (onPrimary.getStore()) options.useMaster = true;
  });
  return (req, _res, next) => {
    if (!req.session) return next();
    // Signing in or out writes only the session, which is always read from the primary
    // (server/auth/session-reads-on-primary.ts): it does not pin the person's reads.
    if (req.path.startsWith('/auth/')) return next();
    const at = now();
    if (!SAFE_METHODS.has(req.method)) {
      req.session.primaryReadsUntil = at + READ_YOUR_WRITES_MS;
      return onPrimary.run(true, next);
    }
    if ((req.session.primaryReadsUntil ?? 0) > at) return onPrimary.run(true, next);
    next();
  };
}
