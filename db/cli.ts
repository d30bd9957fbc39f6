/**
 * `npm run db:start | db:stop | db:migrate | db:rollback` — the private development database.
 * With DATABASE_URL set, migrate and rollback act on that server instead. (`npm run db:seed`,
 * the invented demo data, is `server/dev/seed.ts`: it seeds through the server's services.)
 */
import { createSequelize } from './connection';
import { openLocalDatabase, stopLocalInstance } from './local';
import { createMigrator } from './migrator';

async function databaseUrl(): Promise<string> {
  return process.env['DATABASE_URL'] ?? (await openLocalDatabase('dev', 'speedwright')).url;
}

async function withDatabase(work: (sequelize: ReturnType<typeof createSequelize>) => Promise<void>): Promise<void> {
  const sequelize = createSequelize(await databaseUrl());
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
