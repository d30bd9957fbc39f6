import type { FindOptions, Sequelize } from 'sequelize';

/**
 * With read replicas (DATABASE_READ_URLS), Sequelize sends every plain SELECT to a replica. A
 * session is written on the primary at sign-in and read on the very next request, before a
 * replica may have it; the person would be told to sign in again. So the session store's model
 * (connect-session-sequelize defines it as `Session`) always reads from the primary
 * (Sequelize's `useMaster` query option). Without replicas this changes nothing.
 */
export function readSessionsFromPrimary(sequelize: Sequelize, modelName = 'Session'): void {
  const model = sequelize.models[modelName];
  if (!model) throw new Error(`The session store's model ${modelName} is not defined yet.`);
  model.addHook('beforeFind', 'readSessionsFromPrimary', (options: FindOptions & { useMaster?: boolean }) => {
    options.useMaster = true;
  });
}
