/**
 * `npm start` seeds the invented demo operators into the database it is given. With
 * DATABASE_URL it would do so into any database, an operator's real one included; this check,
 * run by the launcher (and `npm run db:seed`) before it migrates or seeds a database named by
 * DATABASE_URL, refuses one that holds an operator that is not a demo one. (A real installation starts with `npm run serve`, which never seeds.)
 */
import { QueryTypes, type Sequelize } from 'sequelize';

/** MariaDB's ER_NO_SUCH_TABLE: a database never migrated holds no operator. */
const NO_SUCH_TABLE = 1146;

/** How many operators of the database are not demo operators (0 for a database never migrated). */
export async function realOperatorCount(sequelize: Sequelize): Promise<number> {
  try {
    const [row] = await sequelize.query<{ count: number }>('SELECT COUNT(*) AS count FROM operators WHERE is_demo = 0', { type: QueryTypes.SELECT });
    return Number(row?.count ?? 0);
  } catch (error) {
    if ((error as { original?: { errno?: number } }).original?.errno === NO_SUCH_TABLE) return 0;
    throw error;
  }
}

/** Throws, with a sentence, when the database holds a real operator. */
export async function refuseRealOperatorDatabase(sequelize: Sequelize): Promise<void> {
  const count = await realOperatorCount(sequelize);
  if (count > 0) {
    throw new Error(
      `DATABASE_URL names a database with ${count} operator${count === 1 ? '' : 's'} of its own; the demo (npm start, npm run db:seed) would add the invented demo operators there. ` +
        'Run a real installation with `npm run build` and `npm run serve` (README.md, "Running it for your operator").',
    );
  }
}
