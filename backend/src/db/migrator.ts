import path from 'node:path';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface } from 'sequelize';
import { sequelize } from './sequelize';

export type MigrationContext = { queryInterface: QueryInterface };

/**
 * Versioned migrations: backend/src/db/migrations/NNNN-name.ts, each exporting `up` and `down`.
 * Applied names are stored in the `schema_migrations` table.
 */
export const migrator = new Umzug<MigrationContext>({
  migrations: {
    glob: ['migrations/*.ts', { cwd: path.join(import.meta.dirname) }],
  },
  context: () => ({ queryInterface: sequelize.getQueryInterface() }),
  storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
  logger: undefined,
});

export async function migrateUp(): Promise<string[]> {
  const applied = await migrator.up();
  return applied.map((m) => m.name);
}
