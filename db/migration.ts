import type { QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

/** One step of a migration (`up` or `down`); the migrations import only this and their libraries, never live code. */
export type Migration = MigrationFn<QueryInterface>;
