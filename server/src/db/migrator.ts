// Schema migrations with umzug on Sequelize's QueryInterface. Names are stored without
// their extension so built .js copies and .ts sources count as the same migration.
import { Umzug, SequelizeStorage } from 'umzug';
import type { Sequelize, QueryInterface } from 'sequelize';
import { fileURLToPath } from 'node:url';
import { basename } from 'node:path';

export type MigrationContext = { queryInterface: QueryInterface; sequelize: Sequelize };
export type Migration = { up: (ctx: MigrationContext) => Promise<void>; down?: (ctx: MigrationContext) => Promise<void> };

const migrationsGlob = fileURLToPath(new URL('./migrations/*.{ts,js}', import.meta.url)).replaceAll('\\', '/');

export function createMigrator(sequelize: Sequelize) {
  return new Umzug<MigrationContext>({
    migrations: {
      glob: migrationsGlob,
      resolve: ({ name, path }) => {
        const migrationName = basename(name).replace(/\.(ts|js)$/, '');
        return {
          name: migrationName,
          up: async ({ context }) => ((await import(path!)) as Migration).up(context),
          down: async ({ context }) => ((await import(path!)) as Migration).down?.(context),
        };
      },
    },
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}
