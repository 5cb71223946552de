import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { runPg, startEmbeddedPostgres } from '../../server/db/embedded-postgres';
import { migrateToLatest } from '../../server/db/migrator';
import { createSequelize } from '../../server/db/sequelize';
import { freePort } from './free-port';

/**
 * A PostgreSQL cluster of one test file's own, for fault tests that restart or cut it (the
 * project's shared test cluster is never disturbed). Migrated unless `migrate: false`.
 */
export async function startThrowawayCluster(options: { migrate?: boolean } = {}) {
  const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-fault-'));
  const database = await startEmbeddedPostgres({ dataRoot, port: await freePort(), database: 'halflight_fault' });
  if (options.migrate !== false) {
    const sequelize = createSequelize(database.url);
    await migrateToLatest(sequelize).finally(() => sequelize.close());
  }
  const logFile = path.join(dataRoot, 'postgres.log');

  async function pgCtl(...args: string[]): Promise<void> {
    const result = await runPg(database.binDir, 'pg_ctl', [...args, '-D', database.pgdata, '-w', '-t', '60']);
    if (result.code !== 0) throw new Error(`pg_ctl ${args.join(' ')} failed:\n${result.output}`);
  }

  /** One statement on a connection of its own, outside the app's pools. */
  async function query<T extends pg.QueryResultRow>(sql: string, values: unknown[] = []): Promise<T[]> {
    const client = new pg.Client({ connectionString: database.url });
    client.on('error', () => {});
    await client.connect();
    try {
      return (await client.query<T>(sql, values)).rows;
    } finally {
      await client.end();
    }
  }

  return {
    url: database.url,
    dataRoot,
    pgdata: database.pgdata,
    binDir: database.binDir,
    query,
    /** `pg_ctl restart -m fast`: every connection is cut and the server is back in about a second. */
    restart: () => pgCtl('restart', '-m', 'fast', '-l', logFile),
    stopServer: () => pgCtl('stop', '-m', 'fast'),
    startServer: () => pgCtl('start', '-l', logFile, '-o', `-p ${database.port}`),
    /** Ends every backend of the database except the one asking. */
    terminateOthers: async () =>
      (
        await query<{ ended: number }>(
          `SELECT count(*) FILTER (WHERE pg_terminate_backend(pid)) AS ended FROM pg_stat_activity
            WHERE datname = current_database() AND pid <> pg_backend_pid()`,
        )
      )[0]!.ended,
    async stop() {
      await database.stop();
      fs.rmSync(dataRoot, { recursive: true, force: true });
    },
  };
}
