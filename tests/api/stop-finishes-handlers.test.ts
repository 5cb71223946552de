import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import pg from 'pg';
import { pino } from 'pino';
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { startWeb } from '../../server/boot/web';
import { loadConfig } from '../../server/config/env';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { freePort } from '../support/free-port';

// One web process as server/index.ts starts it (boot/web.ts), in this test's process, on the
// throwaway database: its stop is what a SIGTERM to a worker runs before the pools are closed.
const databaseUrl = inject('databaseUrl');
const sequelize = createSequelize(databaseUrl);
initModels(sequelize);
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-stop-'));
const port = await freePort();
const config = loadConfig({
  DATABASE_URL: databaseUrl,
  PORT: String(port),
  HOST: '127.0.0.1',
  HALFLIGHT_DATA_DIR: dataDir,
  HALFLIGHT_DEMO_DATA: 'false',
  HALFLIGHT_JOB_WORKER: 'false',
  SESSION_SECRET: crypto.randomBytes(32).toString('hex'),
});
const web = await startWeb({
  config,
  sequelize,
  databaseUrl,
  embeddedDatabase: false,
  logger: pino({ level: 'silent' }),
});
let stopped = false;

afterAll(async () => {
  if (!stopped) await web.stop();
  await sequelize.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

/** Waits (bounded) until the condition holds; throws naming it otherwise. */
async function until(what: string, condition: () => Promise<boolean>) {
  for (let tries = 0; tries < 500; tries++) {
    if (await condition()) return;
    await sleep(20);
  }
  throw new Error(`still not so after 10 s: ${what}`);
}

describe('stopping a web process', () => {
  it('when a write is still running for a client that has gone away, then stop waits for it before closing what it uses, and the write is kept', async () => {
    const { lab, users } = await createLabWithMembers(sequelize, { roles: ['researcher'] });
    const researcher = await apiClient(`http://127.0.0.1:${port}`);
    await researcher.signIn(users.researcher);

    // Another connection holds the compounds table, as a long migration or a slow writer would.
    const holder = new pg.Client({ connectionString: databaseUrl });
    await holder.connect();
    await holder.query('BEGIN');
    await holder.query('LOCK TABLE compounds IN ACCESS EXCLUSIVE MODE');
    let released = false;
    const release = async () => {
      if (released) return;
      released = true;
      await holder.query('ROLLBACK');
      await holder.end();
    };
    try {
      const name = `Stop test quencher ${crypto.randomUUID()}`;
      // The client gives up after a moment (a closed tab, a proxy's timeout); its write goes on.
      const gaveUp = researcher
        .post(`/api/labs/${lab.id}/compounds`, { name, roleHint: 'quencher' })
        .timeout(300)
        .then(
          () => false,
          () => true,
        );
      await until('the write waits for the held table', async () => {
        const rows = await sequelize.query<{ n: number }>(
          "SELECT count(*)::int AS n FROM pg_stat_activity WHERE wait_event_type = 'Lock' AND query ILIKE '%compounds%'",
          { type: QueryTypes.SELECT },
        );
        return rows[0]!.n > 0;
      });
      expect(await gaveUp).toBe(true);

      const stopping = web.stop().then(() => (stopped = true));
      // Its connection is gone, yet the write's handler has not ended: stop must not close the
      // session store, the upload threads and the rest under it (a bounded wait, not a timing target).
      await sleep(500);
      expect(stopped).toBe(false);

      await release();
      await stopping;
      const kept = await sequelize.query<{ n: number }>('SELECT count(*)::int AS n FROM compounds WHERE name = $1', {
        bind: [name],
        type: QueryTypes.SELECT,
      });
      expect(kept[0]!.n).toBe(1);
    } finally {
      await release();
    }
  });
});
