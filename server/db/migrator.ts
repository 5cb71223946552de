import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';

const migrationsDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../migrations');

export interface MigrationModule {
  up(context: { context: QueryInterface }): Promise<void>;
  down(context: { context: QueryInterface }): Promise<void>;
}

/** Umzug over server/migrations/*.ts, recording applied names in the "schema_migrations" table. */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: {
      glob: ['*.ts', { cwd: migrationsDir, ignore: ['*.d.ts'] }],
      resolve: ({ name, path: file, context }) => ({
        name: name.replace(/\.ts$/, ''),
        up: async () => ((await import(pathToFileURL(file!).href)) as MigrationModule).up({ context }),
        down: async () => ((await import(pathToFileURL(file!).href)) as MigrationModule).down({ context }),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

export async function migrateToLatest(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((migration) => migration.name);
}
