/**
 * `npm run db:start | db:stop | db:migrate | db:rollback | db:seed` — the private development
 * database. With DATABASE_URL set, migrate and seed act on that server instead.
 */
import { createSequelize } from '../server/database';
import { initModels } from '../server/models';
import { openLocalDatabase, stopLocalInstance } from './local';
import { createMigrator } from './migrator';
import { DEFAULT_DEMO_PASSWORD, seedDemo } from './seed';

async function databaseUrl(): Promise<string> {
  return process.env['DATABASE_URL'] ?? (await openLocalDatabase('dev', 'speedwright')).url;
}

async function withDatabase(work: (sequelize: ReturnType<typeof createSequelize>) => Promise<void>): Promise<void> {
  const sequelize = createSequelize(await databaseUrl());
  initModels(sequelize);
  try {
    await work(sequelize);
  } finally {
    await sequelize.close();
  }
}

const commands: Record<string, () => Promise<void>> = {
  async start() {
    const { instance } = await openLocalDatabase('dev', 'speedwright');
    console.log(`MariaDB ${instance.startedHere ? 'started' : 'already running'} on 127.0.0.1:${instance.port} (data in ${instance.dir})`);
  },
  async stop() {
    console.log((await stopLocalInstance('dev')) ? 'MariaDB stopped.' : 'MariaDB was not running.');
  },
  migrate: () => withDatabase(async (sequelize) => void (await createMigrator(sequelize, console).up())),
  rollback: () => withDatabase(async (sequelize) => void (await createMigrator(sequelize, console).down())),
  seed: () =>
    withDatabase(async (sequelize) => {
      await seedDemo(sequelize, process.env['DEMO_PASSWORD'] ?? DEFAULT_DEMO_PASSWORD);
      console.log('Demo data seeded (invented demo data — not for flight).');
    }),
};

const command = commands[process.argv[2] ?? ''];
if (!command) {
  console.error(`Usage: tsx db/cli.ts ${Object.keys(commands).join('|')}`);
  process.exit(2);
}
command().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
