import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import connectSessionSequelize from 'connect-session-sequelize';
import { csrfSync } from 'csrf-sync';
import express, { type Express, type RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import session from 'express-session';
import compression from 'compression';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Sequelize } from 'sequelize';
import { attachmentsRoutes } from './attachments/attachments.routes';
import { accountLinksRoutes } from './auth/account-links.routes';
import { authRoutes } from './auth/auth.routes';
import { configurePassport } from './auth/passport';
import { MariaDbRateLimitStore } from './auth/rate-limit-store';
import { jsonBoundsBreach, REQUEST_BODY_BOUNDS } from '@shared/api/json-bounds';
import { absoluteSessionLifetime } from './auth/session-lifetime';
import { databaseReadUrls, type ServerConfig } from './config';
import { readSessionsFromPrimary } from './auth/session-reads-on-primary';
import { readYourWrites } from './middleware/read-your-writes';
import { healthRoutes } from './health/health.routes';
import { createReadinessProbe } from './health/readiness';
import { logPseudonym } from './logging/log-pseudonym';
import { requestLogOptions } from './logging/request-log';
import { DomainError } from './errors/domain-error';
import { createOutbox, setOutbox } from './mail/outbox';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { uploadsRoutes } from './uploads/uploads.routes';
import { usersRoutes } from './users/users.routes';
import { auditRoutes } from './audit/audit.routes';
import { isHashedAsset } from './web-app/hashed-asset';
import { aircraftTypesRoutes, airframesRoutes } from './fleet/fleet.routes';
import { airframeCardPdfRoutes } from './cards/card-pdf.routes';
import { openApiRoutes } from './openapi/openapi.routes';
import { operatorRoutes } from './operator/operator.routes';
import { revisionsRoutes } from './revisions/revisions.routes';
import { speedBooksRoutes } from './speed-books/speed-books.routes';
import { cardIssuesRoutes, cardsRoutes } from './cards/cards.routes';
import { syncRoutes } from './sync/sync.routes';
import { createReadPool } from './verify/read-pool';
import { verifyRoutes } from './verify/verify.routes';
import { fontPreloadLinks } from './web-app/font-preload';
import { hashedAssets } from './web-app/hashed-assets';
import { fetchPreloadLinks, firstScreenRequests } from './web-app/first-screen-requests';
import { firstScreenModules, modulePreloadLinks, modulesForPath, type FirstScreenModules } from './web-app/first-screen-preload';

export const SESSION_COOKIE = 'speedwright.sid';
const SESSION_HOURS = 12;

export interface AppDeps {
  config: ServerConfig;
  sequelize: Sequelize;
  logger: Logger;
}

export interface SpeedwrightApp {
  app: Express;
  /** From now on readiness answers 503 `shutting_down` (graceful shutdown; main.ts). */
  beginDraining(): void;
  /** Stops the session store's timers and closes the card check's read pool; the caller closes Sequelize. */
  close(): Promise<void>;
}

/**
 * A parsed JSON body within REQUEST_BODY_BOUNDS, or a 400 that names the field it breaks them
 * in (its first levels: "content", "entries.0.inputs") and how.
 */
const boundedBody: RequestHandler = (req, _res, next) => {
  const breach = req.body === undefined ? null : jsonBoundsBreach(req.body, REQUEST_BODY_BOUNDS);
  if (breach) next(new DomainError('invalid', 'invalid_request', `The request body is not accepted. ${breach.message}`, { [breach.path.join('.') || '(body)']: breach.message }));
  else next();
};

/** Builds the Express app: security headers, logs, sessions, CSRF, the API, then the web app. */
export function createApp({ config, sequelize, logger }: AppDeps): SpeedwrightApp {
  const app = express();
  const cardCheckReads = createReadPool(config.DATABASE_URL, databaseReadUrls(config));
  const pseudonym = logPseudonym(config.SESSION_SECRET);
  const readiness = createReadinessProbe(sequelize);
  setOutbox(createOutbox(config, logger, pseudonym));
  app.disable('x-powered-by');
  app.set('trust proxy', parseTrustProxy(config.TRUST_PROXY));

  // The build's hashed scripts, styles and fonts: before the document headers, compressed once.
  app.use(hashedAssets(resolve(config.APP_DIST)));

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'script-src': ["'self'"],
          // Angular adds component styles at run time as <style> elements. Its CSP nonce
          // (ngCspNonce) would need a fresh nonce stamped into index.html on every answer, but the
          // service worker checks index.html against the hash in ngsw.json and would refuse the
          // changed file, breaking the offline app; a fixed nonce protects nothing. Scripts stay
          // 'self' only, so injected markup cannot run code (issue 12, informational).
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'worker-src': ["'self'"],
          'manifest-src': ["'self'"],
          // Served over plain HTTP on a LAN or localhost too; TLS is the proxy's business.
          'upgrade-insecure-requests': null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );

  // The public card check, before the request logger and the sessions: no session lookup, and a
  // compact log line of its own (pino-http serialises every header of every request, a quarter
  // of the cost of an answer on a route that must answer 1,500 times a second).
  app.use('/api/verify', verifyRoutes({ reads: cardCheckReads, logger, pseudonym, unknownCodesPer15Min: config.VERIFY_UNKNOWN_CODES_PER_15_MIN }));

  // Every other /api answer carries personal or operator data: no browser, proxy or service
  // worker keeps a copy (ASVS 8.2.1). Routes may only make it stricter. The public card check
  // above sets its own header.
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });

  // gzip for JSON answers (a full sync is mostly revision content) and the app's files.
  app.use(compression());

  // JSON lines with request ids and no personal data in clear (logging/request-log.ts).
  app.use(pinoHttp(requestLogOptions(logger, pseudonym)));

  // Health first: it must answer even when sessions (which need the database) cannot.
  app.use('/api/health', healthRoutes(sequelize, readiness));

  const SequelizeStore = connectSessionSequelize(session.Store);
  const store = new SequelizeStore({
    db: sequelize,
    tableName: 'sessions',
    expiration: SESSION_HOURS * 3600_000,
    checkExpirationInterval: 15 * 60_000,
  });
  readSessionsFromPrimary(sequelize);

  app.use(
    '/api',
    // 1 MB holds the largest revision content the CSV uploads can make (256 kB of CSV each) many
    // times over; then no body deeper or larger than REQUEST_BODY_BOUNDS reaches a route.
    express.json({ limit: '1mb', strict: true }),
    boundedBody,
    session({
      name: SESSION_COOKIE,
      secret: config.SESSION_SECRET,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      proxy: undefined,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.COOKIE_SECURE === 'auto' ? 'auto' : config.COOKIE_SECURE === 'true',
        maxAge: SESSION_HOURS * 3600_000,
        path: '/',
      },
    }),
  );

  const passport = configurePassport({
    policy: { lockAfterFailedSignIns: config.LOCK_AFTER_FAILED_SIGN_INS, lockMinutes: config.LOCK_MINUTES },
    sequelize,
    secret: config.SESSION_SECRET,
  });
  app.use('/api', passport.initialize(), passport.session(), absoluteSessionLifetime());
  if (databaseReadUrls(config).length) app.use('/api', readYourWrites(sequelize));

  const { csrfSynchronisedProtection, generateToken } = csrfSync({
    getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined,
  });
  app.use('/api', csrfSynchronisedProtection);

  const loginLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: config.LOGIN_RATE_LIMIT_PER_15_MIN,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new MariaDbRateLimitStore(sequelize, 'login:'),
    handler: (_req, _res, next) =>
      next(new DomainError('too-many', 'too_many_attempts', 'Too many sign-in attempts from this device. Wait 15 minutes and try again.')),
  });

  app.use(
    '/api/auth',
    authRoutes({
      passport,
      generateCsrfToken: generateToken,
      loginLimiter,
      sessionCookieName: SESSION_COOKIE,
      secret: config.SESSION_SECRET,
      cookieSecure: (req) => (config.COOKIE_SECURE === 'auto' ? req.secure : config.COOKIE_SECURE === 'true'),
    }),
  );
  app.use('/api/users', usersRoutes());
  app.use('/api/aircraft-types', aircraftTypesRoutes());
  app.use('/api/airframes', airframesRoutes());
  app.use('/api/airframes', airframeCardPdfRoutes({ publicUrl: config.PUBLIC_URL }));
  app.use('/api/speed-books', speedBooksRoutes());
  app.use('/api/revisions', revisionsRoutes({ signingKeySecret: config.SIGNING_KEY_SECRET, attachmentsDir: config.ATTACHMENTS_DIR, logger }));
  app.use('/api/operator', operatorRoutes({ signingKeySecret: config.SIGNING_KEY_SECRET }));
  app.use('/api/sync', syncRoutes({ signingKeySecret: config.SIGNING_KEY_SECRET }));
  app.use('/api/audit', auditRoutes());
  app.use('/api/cards', cardsRoutes());
  app.use('/api/card-issues', cardIssuesRoutes());
  app.use('/api/openapi.json', openApiRoutes());
  const accountLinkLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: config.LOGIN_RATE_LIMIT_PER_15_MIN,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new MariaDbRateLimitStore(sequelize, 'account-link:'),
    handler: (_req, _res, next) =>
      next(new DomainError('too-many', 'too_many_attempts', 'Too many requests from this device. Wait 15 minutes and try again.')),
  });
  app.use('/api/auth', accountLinksRoutes({ limiter: accountLinkLimiter, sequelize, secret: config.SESSION_SECRET }));
  // The fake mailbox's page: only when a fake mail server runs (the launcher or the API tests
  // set MAILBOX_DIR). A development piece, loaded here on demand and never imported statically.
  if (config.MAILBOX_DIR) app.use('/api/dev/mailbox', devMailboxRoutes(resolve(config.MAILBOX_DIR)));
  app.use('/api/uploads', uploadsRoutes());
  app.use('/api', attachmentsRoutes({ attachmentsDir: config.ATTACHMENTS_DIR, logger }));
  app.use('/api', apiNotFound);

  serveWebApp(app, resolve(config.APP_DIST));
  app.use(errorHandler);

  return {
    app,
    beginDraining: () => readiness.beginDraining(),
    close: async () => {
      store.stopExpiringSessions();
      await cardCheckReads.close();
    },
  };
}

/** `server/dev/mailbox.routes.ts`, imported when the app is built with a mailbox and answering once it has loaded. */
function devMailboxRoutes(dir: string): RequestHandler {
  const loading = import('./dev/mailbox.routes').then(({ mailboxRoutes }) => mailboxRoutes(dir));
  // A failed load answers each request through the error middleware (below), not as an unhandled rejection.
  loading.catch(() => undefined);
  return (req, res, next) => {
    loading.then((router) => router(req, res, next), next);
  };
}

/** The production build of the Angular app with its service worker; every other path gets index.html. */
function serveWebApp(app: Express, distDir: string): void {
  const index = join(distDir, 'index.html');
  let fontLinks: string | undefined;
  app.use(
    express.static(distDir, {
      index: false,
      setHeaders: (res, path) => {
        if (isHashedAsset(path)) {
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        } else {
          // index.html, ngsw.json, ngsw-worker.js, the manifest: always ask again.
          res.setHeader('Cache-Control', 'no-cache');
        }
      },
    }),
  );
  let pageModules: FirstScreenModules | undefined;
  app.get('/{*path}', (req, res, next) => {
    if (!existsSync(index)) {
      next(new DomainError('unavailable', 'app_not_built', 'The web app has not been built yet: run `npm run build`.'));
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    fontLinks ??= fontPreloadLinks(distDir) ?? '';
    pageModules ??= firstScreenModules(distDir);
    const links = [
      ...(fontLinks ? [fontLinks] : []),
      ...modulePreloadLinks(modulesForPath(pageModules, req.path, typeof req.query['c'] === 'string')),
      ...fetchPreloadLinks(firstScreenRequests(req.originalUrl)),
    ];
    if (links.length > 0) res.setHeader('Link', links.join(', '));
    res.sendFile(index);
  });
}

function parseTrustProxy(value: string): boolean | number | string {
  if (value === 'true') return true;
  if (value === 'false') return false;
  if (/^\d+$/.test(value)) return Number(value);
  return value;
}
