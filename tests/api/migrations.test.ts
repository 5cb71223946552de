import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { setTimeout as sleep } from 'node:timers/promises';
import { afterAll, describe, expect, it } from 'vitest';
import { projectRoot } from '../../server/config/env';
import { createMigrator } from '../../server/db/migrator';
import { createSequelize } from '../../server/db/sequelize';
import { startServerProcess } from '../support/server-process';
import { startThrowawayCluster } from '../support/throwaway-cluster';

const migrationCount = fs
  .readdirSync(path.join(projectRoot, 'server/migrations'))
  .filter((file) => file.endsWith('.ts')).length;
const cleanups: Array<() => Promise<void> | void> = [];
afterAll(async () => {
  for (const cleanup of cleanups.reverse()) await cleanup();
});

/** The production server on an existing database (DATABASE_URL), as a second host would run it. */
async function startOn(url: string, extra: Record<string, string> = {}) {
  const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-migrate-'));
  cleanups.push(() => fs.rmSync(dataRoot, { recursive: true, force: true }));
  const server = await startServerProcess({ DATABASE_URL: url, HALFLIGHT_DATA_DIR: dataRoot, ...extra });
  cleanups.push(() => server.kill('SIGKILL'));
  return server;
}

async function appliedMigrations(cluster: Awaited<ReturnType<typeof startThrowawayCluster>>): Promise<string[]> {
  const rows = await cluster.query<{ name: string }>('SELECT name FROM schema_migrations ORDER BY name');
  return rows.map((row) => row.name);
}

// Each test starts server processes and clusters: minutes, not seconds, on a busy machine.
describe('migrations at start', { timeout: 240_000 }, () => {
  it('when two instances start at the same moment on an empty database, then both become healthy and each migration runs once', async () => {
    const cluster = await startThrowawayCluster({ migrate: false });
    cleanups.push(() => cluster.stop());
    // Demo data too: it is loaded under the same lock, so it must not be loaded twice.
    const [first, second] = await Promise.all([
      startOn(cluster.url, { HALFLIGHT_DEMO_DATA: 'true' }),
      startOn(cluster.url, { HALFLIGHT_DEMO_DATA: 'true' }),
    ]);
    await Promise.all([first.waitForHealthy(), second.waitForHealthy()]);
    const applied = await appliedMigrations(cluster);
    expect(applied).toHaveLength(migrationCount);
    expect(new Set(applied).size).toBe(migrationCount);
    const [labs] = await cluster.query<{ count: number }>("SELECT count(*)::int FROM labs WHERE slug LIKE 'demo-%'");
    expect(labs!.count).toBe(2);
    expect(first.output() + second.output()).toContain('Another Halflight instance is migrating this database');
    for (const server of [first, second]) {
      server.kill('SIGTERM');
      expect(await server.waitForExit()).toBe(0);
    }
  });

  it('when a start is killed in the middle of a migration, then that migration is rolled back and the next start is clean', async () => {
    const cluster = await startThrowawayCluster({ migrate: false });
    cleanups.push(() => cluster.stop());
    const sequelize = createSequelize(cluster.url);
    await createMigrator(sequelize).up({ to: '20261201-0005-studies' });
    await sequelize.close();

    // Migration 0006 adds compounds.charge, then indexes redox_potentials. Holding a lock on
    // redox_potentials stops it between the two statements, where the start is then killed.
    const blocker = new pg.Client({ connectionString: cluster.url });
    blocker.on('error', () => {});
    await blocker.connect();
    cleanups.push(() => blocker.end().catch(() => {}));
    await blocker.query('BEGIN');
    await blocker.query('LOCK TABLE redox_potentials IN ACCESS EXCLUSIVE MODE');
    const killed = await startOn(cluster.url);
    for (let waited = 0; ; waited += 100) {
      const [waiting] = await cluster.query<{ count: number }>(
        `SELECT count(*)::int FROM pg_stat_activity
          WHERE datname = current_database() AND wait_event_type = 'Lock' AND query ILIKE '%redox_potentials%'`,
      );
      if (waiting!.count > 0) break;
      if (waited > 90_000 || killed.child.exitCode !== null) throw new Error(`0006 never waited:\n${killed.output()}`);
      await sleep(100);
    }
    killed.kill('SIGKILL');
    await killed.exited;
    await blocker.query('ROLLBACK');
    // The server ends the orphaned backend when it next talks to it; wait until it is gone.
    for (let waited = 0; ; waited += 100) {
      const [others] = await cluster.query<{ count: number }>(
        'SELECT count(*)::int FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid() AND backend_type = $1',
        ['client backend'],
      );
      if (others!.count <= 1 || waited > 30_000) break; // the blocker's own connection remains
      await sleep(100);
    }
    const chargeColumn = () =>
      cluster.query(
        "SELECT 1 FROM information_schema.columns WHERE table_name = 'compounds' AND column_name = 'charge'",
      );
    expect(await chargeColumn()).toEqual([]);
    expect(await appliedMigrations(cluster)).not.toContain('20261201-0006-library-extra');

    const clean = await startOn(cluster.url);
    await clean.waitForHealthy();
    expect(await appliedMigrations(cluster)).toHaveLength(migrationCount);
    expect(await chargeColumn()).toHaveLength(1);
    clean.kill('SIGTERM');
    expect(await clean.waitForExit()).toBe(0);
  });
});
