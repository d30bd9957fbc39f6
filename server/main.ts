/**
 * Serves the API and the web app. Needs DATABASE_URL and SESSION_SECRET (README.md lists
 * every variable); `npm start` sets both for the private demo instance.
 */
import cluster from 'node:cluster';
import { pino } from 'pino';
import { createApp } from './app';
import { databaseReadUrls, loadConfig } from './config';
import { createSequelize } from '../db/connection';
import { initModels } from './models';
import { superviseWorkers } from './supervisor';

export async function serve(env: NodeJS.ProcessEnv = process.env) {
  const config = loadConfig(env);
  const logger = pino({ level: config.LOG_LEVEL });
  const sequelize = createSequelize(config.DATABASE_URL, databaseReadUrls(config));
  initModels(sequelize);
  const { app, close } = createApp({ config, sequelize, logger });
  const server = await new Promise<import('node:http').Server>((resolve, reject) => {
    const listening = app.listen(config.PORT, config.HOST, (error?: Error) => (error ? reject(error) : resolve(listening)));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  return {
    port,
    logger,
    async stop() {
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await closed;
      await close();
      await sequelize.close();
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
    ({ port, logger, stop }) => {
      logger.info(`Speedwright listening on port ${port}${cluster.isWorker ? ` (process ${process.pid})` : ''}`);
      const shutdown = () => stop().then(() => process.exit(0));
      process.once('SIGINT', shutdown);
      process.once('SIGTERM', shutdown);
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
  supervisor.listening.catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
  const shutdown = () => void supervisor.stop().then(() => process.exit(0));
  process.once('SIGINT', shutdown);
  process.once('SIGTERM', shutdown);
}

if (require.main === module) {
  let workers: number;
  try {
    workers = webConcurrency(process.env['WEB_CONCURRENCY']);
  } catch (error) {
    console.error((error as Error).message);
    process.exit(1);
  }
  if (cluster.isPrimary) supervise(workers);
  else serveHere();
}
