/**
 * Serves the API and the web app. Needs DATABASE_URL and SESSION_SECRET (README.md lists
 * every variable); `npm start` sets both for the private demo instance.
 */
import { pino } from 'pino';
import { createApp } from './app';
import { loadConfig } from './config';
import { createSequelize } from './database';
import { initModels } from './models';

export async function serve(env: NodeJS.ProcessEnv = process.env) {
  const config = loadConfig(env);
  const logger = pino({ level: config.LOG_LEVEL });
  const readUrls = config.DATABASE_READ_URLS?.split(',').map((url) => url.trim()).filter(Boolean) ?? [];
  const sequelize = createSequelize(config.DATABASE_URL, readUrls);
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
      close();
      await sequelize.close();
    },
  };
}

if (require.main === module) {
  serve().then(
    ({ port, logger, stop }) => {
      logger.info(`Speedwright listening on port ${port}`);
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
