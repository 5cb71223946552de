import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { setTimeout as sleep } from 'node:timers/promises';
import pg from 'pg';
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, inject, it } from 'vitest';
import type { ReadAdmission } from '../../server/middleware/read-admission';
import { defineRoute } from '../../server/http/define-route';
import { apiRoutes } from '../../server/routes';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createTestApp } from '../support/test-app';

/** The order in which the probe's reads started (each sends its number). */
const started: number[] = [];
let readStudies: () => Promise<unknown> = () => Promise.reject(new Error('the app is not made yet'));

// A read like the studies list: it waits for any lock a writer holds on the studies table.
const probe = defineRoute<{ n: string }>({
  method: 'get',
  path: '/api/test-admission-probe/:n',
  summary: 'Test only: reads the studies table',
  tags: ['test'],
  responses: { 200: { description: 'read' } },
  access: 'public',
  handler: async ({ req, res }) => {
    started.push(Number(req.params.n));
    await readStudies();
    res.json({ n: Number(req.params.n) });
  },
});

/** Streams of the slow-download probe still open, each ended by calling it. */
const openStreams: Array<() => void> = [];

// A read like a download to a slow client: its headers and a first part go out, the rest later.
const slowDownload = defineRoute<{ n: string }>({
  method: 'get',
  path: '/api/test-admission-slow/:n',
  summary: 'Test only: sends its headers, then holds its body open',
  tags: ['test'],
  responses: { 200: { description: 'streamed' } },
  access: 'public',
  handler: async ({ res }) => {
    res.writeHead(200, { 'Content-Type': 'application/octet-stream' });
    res.write('first part');
    await new Promise<void>((resolve) => openStreams.push(resolve));
    res.end();
  },
});

/** Writes of the held-write probe still running, each let go by calling it. */
const heldWrites: Array<() => void> = [];

// A request that changes something and takes its time (its statements waiting on the database).
const heldWrite = defineRoute({
  method: 'post',
  path: '/api/test-admission-write',
  summary: 'Test only: a write that runs until the test lets it go',
  tags: ['test'],
  responses: { 200: { description: 'done' } },
  access: 'public',
  handler: async ({ res }) => {
    await new Promise<void>((resolve) => heldWrites.push(resolve));
    res.json({ done: true });
  },
});

const testApp = await createTestApp({
  routes: [...apiRoutes, probe, slowDownload, heldWrite],
  readAdmission: { concurrency: 2, queue: 3, whileWriting: 1 },
});
readStudies = () => testApp.sequelize.query('SELECT count(*) AS n FROM studies', { type: QueryTypes.SELECT });
const admission = testApp.app.locals.services.readAdmission as ReadAdmission;
const server = testApp.app.listen(0, '127.0.0.1');
await new Promise((resolve) => server.once('listening', resolve));
const port = (server.address() as AddressInfo).port;

afterAll(async () => {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
  await testApp.close();
});

type Answer = { status: number; headers: http.IncomingHttpHeaders; body: string };

/** A GET on its own connection: the request (to cut it) and its answer. */
function get(path: string) {
  const request = http.get({ host: '127.0.0.1', port, path, agent: false });
  const answer = new Promise<Answer>((resolve, reject) => {
    request.on('error', reject);
    request.on('response', (response) => {
      let body = '';
      response.setEncoding('utf8');
      response.on('data', (chunk: string) => (body += chunk));
      response.on('end', () => resolve({ status: response.statusCode!, headers: response.headers, body }));
    });
  });
  return { request, answer };
}

/** Waits (bounded) until the condition holds; throws naming it otherwise. */
async function until(what: string, condition: () => boolean) {
  for (let tries = 0; tries < 500; tries++) {
    if (condition()) return;
    await sleep(20);
  }
  throw new Error(`still not so after 10 s: ${what}`);
}

/**
 * Locks the studies table from another connection until the returned function is called (it may
 * be called more than once), so reads that touch it stay in the database holding their turns.
 */
async function holdStudiesTable() {
  const holder = new pg.Client({ connectionString: inject('databaseUrl') });
  await holder.connect();
  try {
    await holder.query('BEGIN');
    await holder.query('LOCK TABLE studies IN ACCESS EXCLUSIVE MODE');
  } catch (error) {
    await holder.end();
    throw error;
  }
  let released = false;
  return async () => {
    if (released) return;
    released = true;
    await holder.query('ROLLBACK');
    await holder.end();
  };
}

describe('reads wait for a turn', () => {
  it('when reads held in the database fill the limit, then later reads queue in order, a write and /api/health still answer, a queued read whose client left never runs, and a full queue answers 503', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const researcher = await apiClient(server);
    await researcher.signIn(users.researcher);

    // Another connection holds the studies table, as a long migration or a slow writer would.
    const release = await holdStudiesTable();
    try {
      const running = [get('/api/test-admission-probe/1'), get('/api/test-admission-probe/2')];
      await until('two reads run, blocked in the database', () => started.length === 2 && admission.running === 2);

      const queued = [];
      for (const n of [3, 4]) {
        queued.push(get(`/api/test-admission-probe/${n}`));
        await until(`read ${n} waits`, () => admission.waiting === n - 2);
      }
      // This client gives up while waiting: its read must leave the queue without running.
      const leaving = get('/api/test-admission-probe/5');
      leaving.answer.catch(() => {});
      await until('read 5 waits', () => admission.waiting === 3);
      leaving.request.destroy();
      await until('read 5 has left the queue', () => admission.waiting === 2);
      queued.push(get('/api/test-admission-probe/6'));
      await until('read 6 waits', () => admission.waiting === 3);

      // The queue is full: the next read is refused at once, in the API's error shape.
      const refused = await get('/api/test-admission-probe/7').answer;
      expect(refused.status).toBe(503);
      expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
      expect(JSON.parse(refused.body)).toEqual({
        error: { code: 'server_busy', message: expect.stringContaining('Try again') },
      });

      // Neither a write that does not touch the held table nor the health check waits for a turn.
      const write = await researcher.post(`/api/labs/${lab.id}/compounds`, {
        name: 'Admission test quencher',
        roleHint: 'quencher',
      });
      expect(write.status).toBe(201);
      expect((await get('/api/health').answer).status).toBe(200);
      expect(started).toEqual([1, 2]);
      expect(admission.waiting).toBe(3);

      await release();
      const answers = await Promise.all([...running, ...queued].map((each) => each.answer));
      expect(answers.map((answer) => answer.status)).toEqual([200, 200, 200, 200, 200]);
      expect(answers.map((answer) => JSON.parse(answer.body).n)).toEqual([1, 2, 3, 4, 6]);
      // Queued reads started in arrival order; the one whose client left never started.
      expect(started).toEqual([1, 2, 3, 4, 6]);
      // Each read gave its turn back exactly once.
      await until('every turn is given back', () => admission.running === 0);
      expect(admission.waiting).toBe(0);
    } finally {
      await release();
    }
  });

  it('when reads end, then their turns are free again for the next reads', async () => {
    const answers = await Promise.all([11, 12, 13, 14, 15].map((n) => get(`/api/test-admission-probe/${n}`).answer));
    expect(answers.map((answer) => answer.status)).toEqual([200, 200, 200, 200, 200]);
    await until('every turn is given back', () => admission.running === 0);
    expect(admission.waiting).toBe(0);
  });

  it('when reads have sent their headers and stream their bodies to slow clients, then their turns are free for the next reads', async () => {
    // Two downloads (the whole limit) that have begun their answers and wait to send the rest.
    const slow = [get('/api/test-admission-slow/1'), get('/api/test-admission-slow/2')];
    const heads = slow.map((each) => new Promise<void>((resolve) => each.request.on('response', () => resolve())));
    await Promise.all(heads);
    await until('both downloads hold their bodies open', () => openStreams.length === 2);
    // Their database and CPU work is done: they hold no turn while the bytes trickle out.
    expect(admission.running).toBe(0);
    const next = await get('/api/test-admission-probe/21').answer;
    expect(next.status).toBe(200);
    openStreams.splice(0).forEach((end) => end());
    const answers = await Promise.all(slow.map((each) => each.answer));
    expect(answers.map((answer) => [answer.status, answer.body])).toEqual([
      [200, 'first part'],
      [200, 'first part'],
    ]);
    await until('every turn is given back', () => admission.running === 0);
  });

  it('when a write is in progress, then one read runs at a time until it ends, and the waiting reads start in order after it', async () => {
    const researcher = await apiClient(server);
    // Reads held in the database, so each keeps its turn until the test lets them go.
    const release = await holdStudiesTable();
    try {
      started.length = 0;
      const write = researcher.post('/api/test-admission-write', {});
      const written = write.then((answer) => answer.status);
      await until('the write is in progress', () => heldWrites.length === 1 && admission.writing === 1);

      const first = get('/api/test-admission-probe/31');
      await until('read 31 runs', () => started.length === 1 && admission.running === 1);
      // Two turns in all, but only one while the write runs: read 32 waits.
      const second = get('/api/test-admission-probe/32');
      await until('read 32 waits', () => admission.waiting === 1);
      expect(admission.running).toBe(1);
      expect(started).toEqual([31]);

      heldWrites.splice(0).forEach((letGo) => letGo());
      expect(await written).toBe(200);
      // The write has ended: the second turn is free again.
      await until('read 32 runs', () => admission.running === 2 && admission.waiting === 0);
      expect(admission.writing).toBe(0);
      expect(started).toEqual([31, 32]);

      await release();
      const answers = await Promise.all([first.answer, second.answer]);
      expect(answers.map((answer) => answer.status)).toEqual([200, 200]);
      await until('every turn is given back', () => admission.running === 0);
    } finally {
      heldWrites.splice(0).forEach((letGo) => letGo());
      await release();
    }
  });
});
