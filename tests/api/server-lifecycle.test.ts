import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { afterAll, describe, expect, it } from 'vitest';
import { apiClient } from '../support/accounts';
import { freePort } from '../support/free-port';
import { postgresProcessesOf, startServerProcess } from '../support/server-process';
import { createStudy } from '../support/studies';

const folders: string[] = [];
afterAll(() => folders.forEach((folder) => fs.rmSync(folder, { recursive: true, force: true })));

/**
 * A fresh data folder and free ports: the production server with its own built-in cluster, as a
 * primary with two web workers (so the cluster is started and stopped by the primary alone).
 */
async function startWithOwnCluster(demoData = false) {
  const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-start-'));
  folders.push(dataRoot);
  const server = await startServerProcess({
    HALFLIGHT_DATA_DIR: dataRoot,
    HALFLIGHT_PG_PORT: String(await freePort()),
    HALFLIGHT_DEMO_DATA: String(demoData),
    HALFLIGHT_WORKERS: '2',
  });
  return { server, dataRoot, pgdata: path.join(dataRoot, 'pgdata') };
}

async function expectStoppedCleanly(started: Awaited<ReturnType<typeof startWithOwnCluster>>) {
  const { server, dataRoot, pgdata } = started;
  expect(await server.waitForExit()).toBe(0);
  expect(server.output()).toContain('Halflight stopped.');
  expect(postgresProcessesOf(pgdata)).toEqual([]);
  expect(fs.existsSync(path.join(pgdata, 'postmaster.pid'))).toBe(false);
  expect(fs.existsSync(path.join(dataRoot, 'halflight.lock'))).toBe(false);
}

// Each test starts a server process with its own cluster: minutes, not seconds, on a busy machine.
describe('npm start (compiled server under plain node)', { timeout: 240_000 }, () => {
  it('when Ctrl-C comes twice within a second, then it stops once, in order, and no PostgreSQL process is left', async () => {
    const started = await startWithOwnCluster(true);
    await started.server.waitForHealthy();
    // The compiled build serves the real work too: a demo researcher uploads a file, read in a worker thread.
    const client = await apiClient(started.server.baseUrl);
    const signedIn = await client.signIn({
      email: 'priya.halvorsen@demo.halflight.example',
      password: 'halflight-demo',
    });
    const labId = signedIn.body.user.labs[0].labId as string;
    const study = await createStudy(client, labId, 'compiled');
    const upload = await client.agent
      .post(`/api/labs/${labId}/studies/${study.id}/uploads`)
      .set('x-csrf-token', signedIn.body.csrfToken)
      .attach(
        'file',
        fs.readFileSync(path.join(import.meta.dirname, '../fixtures/uploads/series-comma-mM.csv')),
        'series.csv',
      );
    expect(upload.status, JSON.stringify(upload.body)).toBe(201);
    // SQL fragments name the models ("Compound"."id", "Study"."title"): the bundle must keep the class names.
    const compounds = await client.get(`/api/labs/${labId}/compounds`);
    expect(compounds.status, JSON.stringify(compounds.body)).toBe(200);
    expect(compounds.body.total).toBeGreaterThan(0);
    const search = await client.get(`/api/labs/${labId}/studies?q=compiled`);
    expect(search.status, JSON.stringify(search.body)).toBe(200);
    expect(search.body.total).toBe(1);
    // Two web workers serve; one PostgreSQL (one postmaster) serves them both.
    expect(started.server.output()).toContain('2 web workers are serving');
    expect(postgresProcessesOf(started.pgdata)).toHaveLength(1);
    // The serving process is node itself running JavaScript: no TypeScript loader in between.
    const commandLine = fs.readFileSync(`/proc/${started.server.child.pid}/cmdline`, 'utf8').split('\0');
    expect(commandLine.slice(0, 2)).toEqual([process.execPath, expect.stringMatching(/dist\/server\/index\.js$/)]);

    // A request still arriving holds the stop open (requests in progress may finish), so the
    // second Ctrl-C surely lands while it is stopping, however fast the machine.
    const held = net.connect(Number(new URL(started.server.baseUrl).port), '127.0.0.1');
    await new Promise<void>((resolve) => held.once('connect', () => resolve()));
    held.write(
      'POST /api/session HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\nContent-Length: 1000\r\n\r\n{',
    );
    await sleep(100);
    started.server.kill('SIGINT');
    await started.server.waitForOutput('SIGINT: stopping Halflight');
    started.server.kill('SIGINT');
    await started.server.waitForOutput('SIGINT again: already stopping');
    held.destroy();
    await expectStoppedCleanly(started);
  });

  it('when SIGTERM arrives twice while it is still starting, then the cluster it started is stopped too', async () => {
    const started = await startWithOwnCluster();
    await started.server.waitForOutput('Initialising a new PostgreSQL cluster');
    started.server.kill('SIGTERM');
    await sleep(200);
    started.server.kill('SIGTERM');
    await expectStoppedCleanly(started);
  });
});
