import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';

const migrationsDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../migrations');

export type MigrationContext = QueryInterface;
export interface Migration {
  up(params: { context: QueryInterface }): Promise<void>;
  down(params: { context: QueryInterface }): Promise<void>;
}

/**
 * Migrations are timestamp-named TypeScript files in `database/migrations/`, each exporting
 * `up` and `down` that receive the Sequelize QueryInterface as `context`. Applied names are
 * kept in the `SequelizeMeta` table.
 */
export function createMigrator(sequelize: Sequelize, logger: Pick<Console, 'info'> | undefined = undefined) {
  return new Umzug<QueryInterface>({
    migrations: {
      glob: ['*.ts', { cwd: migrationsDir, ignore: ['*.test.ts', '*.d.ts'] }],
      // Import through our own module so the TypeScript loader in use (tsx, vitest) handles it.
      resolve: ({ name, path: file, context }) => ({
        name,
        up: async () => ((await import(file!)) as Migration).up({ context }),
        down: async () => ((await import(file!)) as Migration).down({ context }),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize }),
    logger: logger ? { info: (m) => logger.info(m), warn: (m) => logger.info(m), error: (m) => logger.info(m), debug: () => {} } : undefined,
  });
}
