import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { QueryTypes, Sequelize } from 'sequelize';
import type { QueryInterface } from 'sequelize';
import pg from 'pg';
import { SequelizeStorage, Umzug } from 'umzug';
import { projectRoot } from '../config/env';

// Compiled (dist/server/*.js) the migrations are .js files beside the server; from source, .ts.
const compiled = fileURLToPath(import.meta.url).endsWith('.js');
const migrationsDir = path.join(projectRoot, compiled ? 'dist/server/migrations' : 'server/migrations');
const extension = compiled ? '.js' : '.ts';

/** Key of the session-level advisory lock every instance takes before migrating ("Half" in ASCII). */
export const migrationLockKey = 0x48616c66;

export interface MigrationModule {
  up(context: { context: QueryInterface }): Promise<void>;
  down(context: { context: QueryInterface }): Promise<void>;
}

/**
 * Umzug over the migration files, recording applied names in the "schema_migrations" table.
 * Migration names carry no extension, so source and compiled runs agree on what is applied.
 */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: async (context) =>
      fs
        .readdirSync(migrationsDir)
        .filter((file) => file.endsWith(extension) && !file.endsWith('.d.ts'))
        .sort()
        .map((file) => {
          const load = async () =>
            (await import(pathToFileURL(path.join(migrationsDir, file)).href)) as MigrationModule;
          return {
            name: file.slice(0, -extension.length),
            path: path.join(migrationsDir, file),
            up: async () => (await load()).up({ context }),
            down: async () => (await load()).down({ context }),
          };
        }),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** A Sequelize over exactly one connection, so a lock and a transaction cover every statement. */
function singleConnection(sequelize: Sequelize): Sequelize {
  const { database, username, password, host, port } = sequelize.config;
  return new Sequelize(database, username, password ?? undefined, {
    host,
    port: Number(port),
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: 1, min: 0, idle: 3_600_000, acquire: 60_000 },
    define: { underscored: true },
  });
}

async function backendPid(connection: Sequelize): Promise<number> {
  const [row] = await connection.query<{ pid: number }>('SELECT pg_backend_pid() AS pid', { type: QueryTypes.SELECT });
  return row!.pid;
}

/**
 * Runs `work` on a connection of its own while holding the schema lock (a session-level
 * PostgreSQL advisory lock), so that instances starting together take turns at changing the
 * schema. `onWait` is called when another instance holds it and we wait.
 */
export async function withSchemaLock<T>(
  sequelize: Sequelize,
  work: (connection: Sequelize, lockedPid: number) => Promise<T>,
  onWait?: () => void,
): Promise<T> {
  const connection = singleConnection(sequelize);
  try {
    const lockedPid = await backendPid(connection);
    const [tried] = await connection.query<{ locked: boolean }>('SELECT pg_try_advisory_lock(?) AS locked', {
      replacements: [migrationLockKey],
      type: QueryTypes.SELECT,
    });
    if (!tried!.locked) {
      onWait?.();
      await connection.query('SELECT pg_advisory_lock(?)', { replacements: [migrationLockKey] });
    }
    const result = await work(connection, lockedPid);
    await connection.query('SELECT pg_advisory_unlock(?)', { replacements: [migrationLockKey] });
    return result;
  } finally {
    // Closing the connection also releases the lock when `work` failed.
    await connection.close();
  }
}

export interface MigrateOptions {
  /** Called when another instance holds the lock and we wait for it. */
  onWait?: () => void;
  /** Runs after the migrations while the lock is still held (demo data, first admin). */
  whileLocked?: () => Promise<void>;
}

/**
 * Applies every pending migration under the schema lock, each migration in its own transaction
 * with its schema_migrations row (DDL is transactional in PostgreSQL). A second instance
 * starting at the same moment waits for the lock and then finds nothing to do; a start killed
 * mid-migration leaves that migration rolled back, so the next start applies it cleanly.
 */
export async function migrateToLatest(sequelize: Sequelize, options: MigrateOptions = {}): Promise<string[]> {
  return withSchemaLock(
    sequelize,
    async (connection, lockedPid) => {
      const migrator = createMigrator(connection);
      migrator.on('migrating', async () => {
        // The pool replaced a lost connection: the lock went with it, so stop rather than go on unlocked.
        if ((await backendPid(connection)) !== lockedPid) throw new Error('Lost the migration lock connection.');
        await connection.query('BEGIN');
      });
      migrator.on('migrated', async () => {
        await connection.query('COMMIT');
      });
      let applied: string[];
      try {
        applied = (await migrator.up()).map((migration) => migration.name);
      } catch (error) {
        await connection.query('ROLLBACK').catch(() => {});
        throw error;
      }
      await options.whileLocked?.();
      return applied;
    },
    options.onWait,
  );
}
