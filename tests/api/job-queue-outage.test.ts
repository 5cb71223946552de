import express from 'express';
import pg from 'pg';
import request from 'supertest';
import { pino } from 'pino';
import { afterAll, describe, expect, it } from 'vitest';
import { createSequelize } from '../../server/db/sequelize';
import { createJobQueue } from '../../server/jobs/job-queue';
import { errorHandler } from '../../server/middleware/error-handler';
import { initModels } from '../../server/models';
import { apiClient } from '../support/accounts';
import { createTestApp } from '../support/test-app';
import { startThrowawayCluster } from '../support/throwaway-cluster';

// The job queue lives in PostgreSQL (pg-boss): this file stops its own cluster under it; the
// project's shared test cluster is left alone.
const cluster = await startThrowawayCluster();
await cluster.query('CREATE DATABASE jobs_fresh');
const freshUrl = cluster.url.replace(/\/halflight_fault$/, '/jobs_fresh');
const sequelize = createSequelize(cluster.url);
initModels(sequelize);
const testApp = await createTestApp({ sequelize, databaseUrl: cluster.url });
afterAll(async () => {
  await cluster.startServer().catch(() => {});
  await testApp.close();
  await sequelize.close();
  await cluster.stop();
});

const oneErrorShape = { error: { code: 'database_unavailable', message: expect.any(String) } };

describe('the job queue while its database cannot be reached', { timeout: 120_000 }, () => {
  it('when the database under the queue is stopped, then a request that queues mail answers 503 with Retry-After, and the same request succeeds once it is back', async () => {
    const client = await apiClient(testApp.app);
    await cluster.stopServer();
    try {
      const refused = await client.post('/api/password-resets', { email: 'someone@halflight.invalid' });
      expect(refused.status, JSON.stringify(refused.body)).toBe(503);
      expect(refused.headers['retry-after']).toMatch(/^[1-9]\d*$/);
      expect(refused.body).toEqual(oneErrorShape);
    } finally {
      await cluster.startServer();
    }
    const deadline = Date.now() + 15_000;
    let status = 0;
    while (Date.now() < deadline && status !== 202) {
      status = (await client.post('/api/password-resets', { email: 'someone@halflight.invalid' })).status;
      if (status !== 202) await new Promise((resolve) => setTimeout(resolve, 250));
    }
    expect(status).toBe(202);
  });

  it('when the queue first starts during an outage, then its error answers 503 with Retry-After, and it starts and keeps jobs once the database is back', async () => {
    // A queue that has never run on this database (no pgboss schema yet), as on a first start.
    const queue = createJobQueue({
      databaseUrl: freshUrl,
      sequelize,
      logger: pino({ level: 'silent' }),
      runWorker: false,
    });
    queue.handle('outage-probe', async () => {});
    const app = express();
    app.post('/queue', async (_req, res, next) => {
      try {
        await queue.send('outage-probe', { at: Date.now() });
        res.status(202).end();
      } catch (error) {
        next(error);
      }
    });
    app.use(errorHandler);
    try {
      await cluster.stopServer();
      try {
        const refused = await request(app).post('/queue');
        expect(refused.status, JSON.stringify(refused.body)).toBe(503);
        expect(refused.headers['retry-after']).toMatch(/^[1-9]\d*$/);
        expect(refused.body).toEqual(oneErrorShape);
      } finally {
        await cluster.startServer();
      }
      // A failed start must not leave the queue half-started: this send creates its tables and keeps the job.
      expect((await request(app).post('/queue')).status).toBe(202);
      const client = new pg.Client({ connectionString: freshUrl });
      await client.connect();
      const { rows } = await client.query<{ count: number }>(
        "SELECT count(*)::int AS count FROM pgboss.job WHERE name = 'outage-probe'",
      );
      await client.end();
      expect(rows[0]!.count).toBe(1);
    } finally {
      await queue.stop();
    }
  });
});
