/**
 * Serves the API and the web app: `npm run serve` (the compiled build, `node dist/server/main.js`)
 * and the processes `npm start` runs. Needs DATABASE_URL, SESSION_SECRET, SIGNING_KEY_SECRET and,
 * in production, PUBLIC_URL and SMTP_URL (README.md lists every variable; config.ts checks them
 * before any process starts). Never seeds anything: the demo data is `npm start`'s alone.
 *
 * SIGTERM or SIGINT stops gracefully: readiness turns 503, no new connection is taken, requests
 * in flight finish within SHUTDOWN_GRACE_SECONDS, then the database pool closes.
 */
import cluster from 'node:cluster';
import { createServer } from 'node:http';
import { createApp } from './app';
import { databaseReadUrls, loadConfig } from './config';
import { createSequelize } from '../db/connection';
import { gracefulStopper, type StopOutcome } from './graceful-stop';
import { createLogger } from './logging/request-log';
import { initModels } from './models';
import { superviseWorkers } from './supervisor';

/** Beyond the grace period, how long closing the pools may take before the process exits anyway. */
const EXIT_AFTER_GRACE_MS = 5000;

export async function serve(env: NodeJS.ProcessEnv = process.env) {
  const config = loadConfig(env);
  const logger = createLogger(config.LOG_LEVEL);
  const sequelize = createSequelize(config.DATABASE_URL, databaseReadUrls(config));
  initModels(sequelize);
  const { app, beginDraining, close } = createApp({ config, sequelize, logger });
  const server = createServer(app);
  // Watching requests from the first one on, so a stop knows every request in flight.
  const stopper = gracefulStopper(server);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.PORT, config.HOST, () => {
      server.off('error', reject);
      resolve();
    });
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  const graceMs = config.SHUTDOWN_GRACE_SECONDS * 1000;
  return {
    port,
    logger,
    graceMs,
    /** Drains and closes; resolves with what was in flight and what had to be cut. */
    async stop(): Promise<StopOutcome> {
      beginDraining();
      const outcome = await stopper.stop(graceMs);
      await close();
      await sequelize.close();
      return outcome;
    },
  };
}

/**
 * WEB_CONCURRENCY: how many server processes share the port (Node's cluster, one per core is
 * usual); 1, the default, is one server process beside the supervisor. Every process is stateless apart
 * from the public card check's limit on unknown codes, which each keeps for itself.
 */
export function webConcurrency(value: string | undefined): number {
  if (value === undefined || value === '') return 1;
  const count = Number(value);
  if (!Number.isInteger(count) || count < 1 || count > 64) throw new Error(`WEB_CONCURRENCY must be a whole number from 1 to 64, not "${value}".`);
  return count;
}

function serveHere(): void {
  serve().then(
    ({ port, logger, graceMs, stop }) => {
      logger.info(`Speedwright listening on port ${port}${cluster.isWorker ? ` (process ${process.pid})` : ''}`);
      let stopping = false;
      // A supervisor (systemd, the cluster primary) may send the signal more than once: the
      // first starts the stop, the others must not end the process by the default action.
      const shutdown = (signal: NodeJS.Signals) => {
        if (stopping) return;
        stopping = true;
        logger.info({ signal, graceMs }, 'stopping: no new connections, finishing the requests in flight');
        setTimeout(() => process.exit(1), graceMs + EXIT_AFTER_GRACE_MS).unref();
        stop().then(
          ({ inFlight, cut }) => {
            logger.info({ inFlight, cut }, 'stopped');
            process.exit(0);
          },
          (error: unknown) => {
            logger.error({ err: error }, 'the stop did not complete');
            process.exit(1);
          },
        );
      };
      process.on('SIGINT', shutdown);
      process.on('SIGTERM', shutdown);
    },
    (error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    },
  );
}

/**
 * The primary: keeps WEB_CONCURRENCY server processes running (one included), replacing one
 * that dies with a back-off (supervisor.ts), and stops them all on SIGINT/SIGTERM.
 */
function supervise(count: number): void {
  const supervisor = superviseWorkers({ count });
  supervisor.listening.then(
    (port) => console.log(`Speedwright supervisor (process ${process.pid}): ${count} server process${count === 1 ? '' : 'es'} on port ${port}; SIGTERM stops them gracefully.`),
    (error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    },
  );
  let stopping = false;
  const shutdown = () => {
    if (stopping) return;
    stopping = true;
    void supervisor.stop().then(() => process.exit(0));
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

if (require.main === module) {
  let workers: number;
  try {
    workers = webConcurrency(process.env['WEB_CONCURRENCY']);
    // Checked once here, before any server process starts, so a refusal is said once.
    if (cluster.isPrimary) loadConfig(process.env);
  } catch (error) {
    console.error(`Speedwright did not start. ${(error as Error).message}`);
    process.exit(1);
  }
  if (cluster.isPrimary) supervise(workers);
  else serveHere();
}
