import crypto from 'node:crypto';
import type { Server } from 'node:http';
import { setTimeout as sleep } from 'node:timers/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { freePort } from '../support/free-port';
import { exactPoints, studyBody } from '../support/studies';
import { createTestApp } from '../support/test-app';
import { startThrowawayCluster } from '../support/throwaway-cluster';

// This file restarts and cuts its own cluster; the project's shared test cluster is left alone.
const cluster = await startThrowawayCluster();
const sequelize = createSequelize(cluster.url);
initModels(sequelize);
const testApp = await createTestApp({ sequelize, databaseUrl: cluster.url });
const port = await freePort();
const baseUrl = `http://127.0.0.1:${port}`;
let server: Server;
let labId = '';
let researcher: Awaited<ReturnType<typeof apiClient>>;
const recoveryLimitMs = 15_000;

beforeAll(async () => {
  server = await new Promise((resolve) => {
    const listening = testApp.app.listen(port, '127.0.0.1', () => resolve(listening));
  });
  const { lab, users } = await createLabWithMembers(sequelize, { roles: ['researcher'] });
  labId = lab.id;
  researcher = await apiClient(baseUrl);
  await researcher.signIn(users.researcher);
});
afterAll(async () => {
  server?.closeAllConnections();
  await new Promise((resolve) => server?.close(resolve));
  await testApp.close();
  await sequelize.close();
  await cluster.stop();
});

interface Answer {
  route: string;
  status: number;
  body: { error?: { code?: unknown; message?: unknown } };
  retryAfter: string | undefined;
}

const studiesUrl = (studyId = '') => `/api/labs/${labId}/studies${studyId ? `/${studyId}` : ''}`;

async function healthStatus(): Promise<number> {
  try {
    return (await fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(5_000) })).status;
  } catch {
    return 0;
  }
}

/**
 * Three signed-in workers create studies, replace points and read lists without pause while
 * `disrupt` runs; then /api/health is polled until it answers 200. Returns every answer and
 * the milliseconds from the start of the disruption to the first healthy answer.
 */
async function underLoad(disrupt: () => Promise<unknown>) {
  const answers: Answer[] = [];
  const acknowledged = new Set<string>();
  let running = true;
  const record = async (route: string, pending: PromiseLike<{ status: number; body: unknown; headers: object }>) => {
    const response = await pending;
    const headers = response.headers as Record<string, string | undefined>;
    answers.push({
      route,
      status: response.status,
      body: response.body as Answer['body'],
      retryAfter: headers['retry-after'],
    });
    return response as { status: number; body: { id: string; version: number } };
  };
  const worker = async (index: number) => {
    let own: { id: string; version: number | null } | undefined;
    for (let round = 0; running; round++) {
      const created = await record(
        'create',
        researcher.post(studiesUrl(), studyBody(`load-${index}-${round}-${crypto.randomUUID()}`)),
      );
      if (created.status === 201) {
        acknowledged.add(created.body.id);
        own ??= { id: created.body.id, version: created.body.version };
      }
      if (own && own.version === null) {
        const fresh = await record('read', researcher.get(studiesUrl(own.id)));
        if (fresh.status === 200) own.version = fresh.body.version;
      }
      if (own && own.version !== null) {
        const body = { version: own.version, points: exactPoints.slice(0, 3 + (round % 4)) };
        const saved = await record('points', researcher.patch(`${studiesUrl(own.id)}/points`, body));
        // After a failed answer the change may or may not have been committed: read the version again.
        own.version = saved.status === 200 ? saved.body.version : null;
      }
      await record('list', researcher.get(studiesUrl()));
    }
  };
  const workers = [0, 1, 2].map(worker);
  await sleep(400);
  const began = performance.now();
  await disrupt();
  let recoveredAfterMs: number | null = null;
  while (performance.now() - began < recoveryLimitMs + 5_000) {
    if ((await healthStatus()) === 200) {
      recoveredAfterMs = Math.round(performance.now() - began);
      break;
    }
    await sleep(100);
  }
  await sleep(500);
  running = false;
  await Promise.all(workers);
  return { answers, acknowledged, recoveredAfterMs };
}

const summary = (answers: Answer[]) =>
  `${answers.length} answers, ${answers.filter((answer) => answer.status === 503).length} of them 503`;

function expectOnlySuccessOr503(answers: Answer[]) {
  const unexpected = answers.filter((answer) => answer.status >= 300 && answer.status !== 503);
  expect(unexpected.map((answer) => `${answer.route} ${answer.status} ${JSON.stringify(answer.body)}`)).toEqual([]);
  for (const answer of answers.filter((item) => item.status === 503)) {
    expect(answer.body).toEqual({ error: { code: 'database_unavailable', message: expect.any(String) } });
    expect(answer.retryAfter).toMatch(/^[1-9]\d*$/);
  }
}

/** Studies, points and audit rows agree with each other and with every acknowledged creation. */
async function expectConsistent(acknowledged: Set<string>) {
  const rows = await cluster.query<{
    id: string;
    version: number;
    points: number;
    created_audits: number;
    points_audits: number;
    last_saved: number | null;
  }>(
    `SELECT s.id, s.version,
            (SELECT count(*)::int FROM study_points p WHERE p.study_id = s.id) AS points,
            (SELECT count(*)::int FROM audit_events a
              WHERE a.target_id = s.id::text AND a.action = 'study_created') AS created_audits,
            (SELECT count(*)::int FROM audit_events a
              WHERE a.target_id = s.id::text AND a.action = 'study_points_replaced') AS points_audits,
            (SELECT jsonb_array_length(a.details->'after') FROM audit_events a
              WHERE a.target_id = s.id::text AND a.action = 'study_points_replaced'
              ORDER BY a.id DESC LIMIT 1) AS last_saved
       FROM studies s WHERE s.lab_id = $1`,
    [labId],
  );
  const [orphans] = await cluster.query<{ count: number }>(
    `SELECT count(*)::int FROM audit_events a WHERE a.lab_id = $1 AND a.target_type = 'study'
        AND NOT EXISTS (SELECT 1 FROM studies s WHERE s.id::text = a.target_id)`,
    [labId],
  );
  expect(orphans!.count).toBe(0);
  const stored = new Set(rows.map((row) => row.id));
  expect([...acknowledged].filter((id) => !stored.has(id))).toEqual([]);
  for (const row of rows) {
    expect(row.created_audits).toBe(1);
    // Each saved series bumps the version once and writes one audit row, in one transaction.
    expect(row.version).toBe(row.points_audits);
    expect(row.points).toBe(row.last_saved ?? 0);
  }
  return rows;
}

async function expectWritesWork() {
  const created = await researcher.post(studiesUrl(), studyBody(`after-${crypto.randomUUID()}`));
  expect(created.status).toBe(201);
}

describe('the database goes away and comes back', { timeout: 120_000 }, () => {
  it('when the cluster restarts (pg_ctl restart -m fast) under load, then the same process recovers within 15 s and nothing is half-written', async () => {
    const { answers, acknowledged, recoveredAfterMs } = await underLoad(() => cluster.restart());
    console.warn(`recovered ${recoveredAfterMs} ms after the start of pg_ctl restart; ${summary(answers)}`);
    expect(recoveredAfterMs).not.toBeNull();
    expect(recoveredAfterMs!).toBeLessThan(recoveryLimitMs);
    expectOnlySuccessOr503(answers);
    expect((await expectConsistent(acknowledged)).length).toBeGreaterThan(0);
    await expectWritesWork();
  });

  it('when every app connection is ended (pg_terminate_backend) under load, then the same process recovers within 15 s', async () => {
    let ended = 0;
    const { answers, acknowledged, recoveredAfterMs } = await underLoad(async () => {
      ended = await cluster.terminateOthers();
    });
    console.warn(
      `recovered ${recoveredAfterMs} ms after pg_terminate_backend of ${ended} connections; ${summary(answers)}`,
    );
    expect(ended).toBeGreaterThan(1);
    expect(recoveredAfterMs).not.toBeNull();
    expect(recoveredAfterMs!).toBeLessThan(recoveryLimitMs);
    expectOnlySuccessOr503(answers);
    await expectConsistent(acknowledged);
    await expectWritesWork();
  });

  it('when idle connections are ended, then the process survives and the next requests succeed', async () => {
    // Both pools hold idle connections after a few requests; ending them is what killed the process.
    await researcher.get(studiesUrl()).expect(200);
    await sleep(200);
    expect(await cluster.terminateOthers()).toBeGreaterThan(0);
    await sleep(200);
    await researcher.get(studiesUrl()).expect(200);
    expect(await healthStatus()).toBe(200);
  });

  it('when the database is down, then /api/health says so and requests get 503 with Retry-After; when it is back, service resumes', async () => {
    await cluster.stopServer();
    try {
      const health = await fetch(`${baseUrl}/api/health`);
      expect(health.status).toBe(503);
      expect(health.headers.get('retry-after')).toMatch(/^[1-9]\d*$/);
      expect(await health.json()).toMatchObject({ status: 'degraded', database: { status: 'down' } });
      const answers: Answer[] = [];
      for (const [route, pending] of [
        ['list', researcher.get(studiesUrl())],
        ['create', researcher.post(studiesUrl(), studyBody(`down-${crypto.randomUUID()}`))],
      ] as const) {
        const response = await pending;
        answers.push({
          route,
          status: response.status,
          body: response.body as Answer['body'],
          retryAfter: response.headers['retry-after'] as string | undefined,
        });
      }
      expect(answers.map((answer) => answer.status)).toEqual([503, 503]);
      expectOnlySuccessOr503(answers);
    } finally {
      await cluster.startServer();
    }
    const began = performance.now();
    while ((await healthStatus()) !== 200) {
      expect(performance.now() - began).toBeLessThan(recoveryLimitMs);
      await sleep(100);
    }
    await expectWritesWork();
  });
});
