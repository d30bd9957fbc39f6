import { randomUUID } from 'node:crypto';
import { Router, type ErrorRequestHandler, type RequestHandler, type Response } from 'express';
import type { Logger } from 'pino';
import { rateLimit } from 'express-rate-limit';
import { validateCardCode } from '@shared/card-check/card-code';
import { DomainError } from '../errors/domain-error';
import type { LogPseudonym } from '../logging/log-pseudonym';
import type { ReadPool } from './read-pool';
import { cardSourceOf, verifyCardCode } from './verify.service';

export interface VerifyRoutesOptions {
  /** The card check's own prepared-statement reads (`read-pool.ts`). */
  reads: ReadPool;
  /** The app's logger: this router sits before pino-http and logs one short line per answer. */
  logger: Logger;
  /** Turns the client's address into the pseudonym the logs carry (logging/log-pseudonym.ts). */
  pseudonym: LogPseudonym;
  /** Unknown or malformed codes one address may ask about in 15 minutes (answers for real codes do not count). */
  unknownCodesPer15Min: number;
}

const TOO_MANY_UNKNOWN = () =>
  new DomainError('too-many', 'too_many_unknown_codes', 'Too many codes from this device matched no card. Wait 15 minutes and try again.');

/** Set by the limiter's handler: this address is over its limit of codes that matched no card. */
const overGuessLimit = (res: Response) => res.locals['guessLimitReached'] === true;

/**
 * The code of the path in stored form, or a 400 that says what is wrong with it (429 once the
 * address is over its limit: a malformed code is a guess too).
 */
function codeOf(raw: string, res: Response): string {
  const checked = validateCardCode(raw);
  if (checked.ok) return checked.code;
  if (overGuessLimit(res)) throw TOO_MANY_UNKNOWN();
  const code = checked.problem === 'check' ? 'code_check_failed' : 'invalid_code';
  throw new DomainError('invalid', code, checked.message, { code: checked.message });
}

/**
 * `/api/verify`: the public card check, mounted before sessions (no session lookup, no cookie,
 * no CSRF). Answers are never cached: a card's status changes when a revision is published.
 *
 * Rate limit: per address, in this process's memory (a shared MariaDB counter would cost a
 * write on every request of a route that must answer over 1,500 times a second), counting only
 * answers that found no card — what someone guessing codes gets. Over the limit the code is
 * still looked up: a real card answers as always (someone at the same airport's shared address
 * who typed a few wrong codes must still be able to check the card in their hand), and only a
 * code that matches no card answers 429. With several instances the limit applies per instance.
 */
export function verifyRoutes({ reads, logger, pseudonym, unknownCodesPer15Min }: VerifyRoutesOptions): Router {
  const router = Router();
  const guessLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: unknownCodesPer15Min,
    skipSuccessfulRequests: true,
    requestWasSuccessful: (_req, res) => res.locals['cardFound'] === true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Not refused here: the route decides once it knows whether the code is a real card's.
    handler: (_req, res, next) => {
      res.locals['guessLimitReached'] = true;
      next();
    },
  });
  const noStore: RequestHandler = (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  };
  /** One short log line per answer, with a request id as the rest of the API gives (see app.ts). */
  const compactLog: RequestHandler = (req, res, next) => {
    const started = process.hrtime.bigint();
    const id = randomUUID();
    // As pino-http would: the error middleware puts it in every error answer.
    req.id = id;
    res.setHeader('x-request-id', id);
    res.once('finish', () => {
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      logger.info({ reqId: id, method: req.method, path: req.originalUrl.split('?')[0], status: res.statusCode, responseTime: Math.round(ms * 10) / 10, ...(req.ip ? { client: pseudonym(req.ip) } : {}) }, 'card check answered');
    });
    next();
  };
  router.use(compactLog, noStore, guessLimiter);

  router.get('/:code', async (req, res) => {
    const answer = await verifyCardCode(reads, codeOf(String(req.params['code']), res));
    res.locals['cardFound'] = answer.status !== 'unknown';
    if (!res.locals['cardFound'] && overGuessLimit(res)) throw TOO_MANY_UNKNOWN();
    if (res.locals['cardFound']) res.removeHeader('Retry-After');
    // Written directly: res.json would hash the body for an ETag, which no-store makes useless.
    res.status(200).setHeader('Content-Type', 'application/json; charset=utf-8');
    res.end(JSON.stringify(answer));
  });
  router.get('/:code/source', async (req, res) => {
    const source = await cardSourceOf(reads, codeOf(String(req.params['code']), res));
    if (!source && overGuessLimit(res)) throw TOO_MANY_UNKNOWN();
    if (!source) throw new DomainError('not-found', 'unknown_code', 'No card was issued with this code here.');
    res.locals['cardFound'] = true;
    res.removeHeader('Retry-After');
    res.json(source);
  });
  // pino-http's req.log is not there yet: anything unexpected is logged here, then answered as usual.
  const logUnexpected: ErrorRequestHandler = (error, req, _res, next) => {
    if (!(error instanceof DomainError)) logger.error({ err: error, reqId: req.id }, 'card check failed');
    next(error);
  };
  router.use(logUnexpected);
  return router;
}
