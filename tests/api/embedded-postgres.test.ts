import { spawn } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { reachableClusterBase, startEmbeddedPostgres } from '../../server/db/embedded-postgres';
import { isRoot } from '../../server/db/postgres-binaries';
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

describe('the embedded PostgreSQL cluster', { timeout: 120_000 }, () => {
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

  it('when the lock file names a live process that is not its owner (a reused pid), then start goes ahead', async () => {
    // Any live process of ours that is not a Halflight: its pid stands for one reused after a reboot.
    const stranger = spawn('sleep', ['60'], { stdio: 'ignore' });
    const lockFile = path.join(dataRoot, 'halflight.lock');
    try {
      const hourAgo = Date.now() - 3_600_000;
      for (const content of [
        JSON.stringify({ pid: stranger.pid, startedAt: hourAgo }),
        // Lock files of earlier versions hold only the pid; this one was written before the process started.
        String(stranger.pid),
      ]) {
        fs.writeFileSync(lockFile, content);
        fs.utimesSync(lockFile, new Date(hourAgo), new Date(hourAgo));
        const cluster = await startEmbeddedPostgres({ dataRoot, port: await freePort() });
        expect(JSON.parse(fs.readFileSync(lockFile, 'utf8'))).toMatchObject({ pid: process.pid });
        await cluster.stop();
      }
    } finally {
      stranger.kill();
    }
  });

  it('when the folder is in use by a running start, then a second start is refused, naming the process', async () => {
    const cluster = await startEmbeddedPostgres({ dataRoot, port: await freePort() });
    try {
      await expect(startEmbeddedPostgres({ dataRoot, port: await freePort() })).rejects.toThrow(
        `Another Halflight process (pid ${process.pid}) is already using the database folder`,
      );
    } finally {
      await cluster.stop();
    }
  });
});

describe.runIf(isRoot())('the embedded cluster when running as root', { timeout: 120_000 }, () => {
  it('when a parent folder is closed to the postgres user, then no permission is changed and the cluster lives in a folder it can reach', async () => {
    const closedParent = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-closed-'));
    fs.chmodSync(closedParent, 0o700);
    const inside = path.join(closedParent, 'data');
    const elsewhere = path.join(
      reachableClusterBase,
      crypto.createHash('sha256').update(inside).digest('hex').slice(0, 16),
    );
    const lines: string[] = [];
    try {
      const cluster = await startEmbeddedPostgres({
        dataRoot: inside,
        port: await freePort(),
        log: (line) => lines.push(line),
      });
      try {
        expect(fs.statSync(closedParent).mode & 0o777).toBe(0o700);
        expect(cluster.pgdata).toBe(path.join(elsewhere, 'pgdata'));
        expect(lines.join('\n')).toContain(`the built-in cluster lives in ${elsewhere}`);
        expect(await query(cluster.url, 'SELECT 1 AS one')).toEqual([{ one: 1 }]);
      } finally {
        await cluster.stop();
      }
      // The next start finds the same cluster there.
      const again = await startEmbeddedPostgres({ dataRoot: inside, port: await freePort() });
      expect(again.pgdata).toBe(path.join(elsewhere, 'pgdata'));
      await again.stop();
    } finally {
      fs.rmSync(closedParent, { recursive: true, force: true });
      fs.rmSync(elsewhere, { recursive: true, force: true });
      // The base folder goes too, unless another cluster lives there.
      if (fs.readdirSync(reachableClusterBase).length === 0) fs.rmdirSync(reachableClusterBase);
    }
  });

  it('when a cluster already exists in a folder the postgres user cannot reach, then start stops with a clear message', async () => {
    const closedParent = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-closed-'));
    const inside = path.join(closedParent, 'data');
    fs.mkdirSync(path.join(inside, 'pgdata'), { recursive: true });
    fs.writeFileSync(path.join(inside, 'pgdata', 'PG_VERSION'), '15\n');
    try {
      await expect(startEmbeddedPostgres({ dataRoot: inside, port: await freePort() })).rejects.toThrow(
        /the postgres user cannot reach it because a parent folder .* is closed to other users/,
      );
      expect(fs.statSync(closedParent).mode & 0o777).toBe(0o700);
      expect(fs.existsSync(path.join(inside, 'halflight.lock'))).toBe(false);
    } finally {
      fs.rmSync(closedParent, { recursive: true, force: true });
    }
  });
});
