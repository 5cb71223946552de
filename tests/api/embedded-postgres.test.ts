import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { startEmbeddedPostgres } from '../../server/db/embedded-postgres';
import { freePort } from '../support/free-port';

const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-embedded-'));
afterAll(() => fs.rmSync(dataRoot, { recursive: true, force: true }));

async function query<T>(url: string, sql: string): Promise<T[]> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query(sql)).rows as T[];
  } finally {
    await client.end();
  }
}

describe('the embedded PostgreSQL cluster', () => {
  it('when started, stopped and started again, then the data of the first run is still there', async () => {
    const port = await freePort();
    const first = await startEmbeddedPostgres({ dataRoot, port });
    await query(first.url, "CREATE TABLE kept (note text); INSERT INTO kept VALUES ('first run')");
    const [settings] = await query<{ listen_addresses: string }>(first.url, 'SHOW listen_addresses');
    expect(settings!.listen_addresses).toBe('127.0.0.1');
    await first.stop();
    expect(fs.existsSync(path.join(dataRoot, 'halflight.lock'))).toBe(false);

    const second = await startEmbeddedPostgres({ dataRoot, port });
    try {
      expect(second.url).toBe(first.url);
      expect(await query(second.url, 'SELECT note FROM kept')).toEqual([{ note: 'first run' }]);
    } finally {
      await second.stop();
    }
  });

  it('when a client has no password, then the cluster refuses it', async () => {
    const cluster = await startEmbeddedPostgres({ dataRoot, port: await freePort() });
    try {
      const secretMode = fs.statSync(path.join(dataRoot, 'pg-password')).mode & 0o777;
      expect(secretMode).toBe(0o600);
      const withoutPassword = cluster.url.replace(/:[^:@/]+@/, ':wrong@');
      await expect(query(withoutPassword, 'SELECT 1')).rejects.toThrow(/password authentication failed/);
    } finally {
      await cluster.stop();
    }
  });
});
