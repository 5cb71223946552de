import type pg from 'pg';
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import { QueryTypes } from 'sequelize';
import type { Sequelize, Transaction } from 'sequelize';

/**
 * Durable background work in PostgreSQL (pg-boss): jobs are rows in the "pgboss" schema, written
 * in the same transaction as the change that asks for them, claimed with SKIP LOCKED (so each job
 * runs once however many instances poll) and retried with exponential backoff when they fail.
 */
export interface JobQueueOptions {
  databaseUrl: string;
  sequelize: Sequelize;
  logger: Logger;
  /** Run the worker in this process (one instance of several may be the only one that does). */
  runWorker: boolean;
  /** First retry delay in seconds; it doubles (with jitter) on each failure. */
  retryDelaySeconds?: number;
  pollingIntervalSeconds?: number;
}

export type JobHandler<T> = (data: T, job: { id: string; retryCount: number }) => Promise<void>;

export interface JobQueue {
  /** Adds a job; with a transaction it is stored (and later run) only if that transaction commits. */
  send<T extends object>(name: string, data: T, options?: { transaction?: Transaction }): Promise<void>;
  /** Registers the handler for a queue; it runs only where the worker runs. */
  handle<T extends object>(name: string, handler: JobHandler<T>): void;
  start(): Promise<void>;
  stop(): Promise<void>;
  /** Jobs not yet finished (waiting, retrying or running) in the given queues, for tests and health. */
  pending(names: string[]): Promise<number>;
}

// About four to eight days of retries before a job is given up as failed (5 s doubling, capped by
// pg-boss at 2^16 steps); each failure is logged.
const retryLimit = 16;

export function createJobQueue(options: JobQueueOptions): JobQueue {
  const newBoss = () => {
    const created = new PgBoss({
      connectionString: options.databaseUrl,
      max: 3,
      application_name: 'halflight-jobs',
      // Only the worker instance runs pg-boss's maintenance (expiring stuck jobs, deleting old ones).
      supervise: options.runWorker,
      schedule: false,
    });
    created.on('error', (error) => options.logger.warn({ err: error }, 'job queue: database error (will retry)'));
    return created;
  };
  let boss = newBoss();
  const handlers = new Map<string, JobHandler<object>>();
  const retryDelay = options.retryDelaySeconds ?? 5;
  let started: Promise<void> | undefined;
  let stopped = false;

  async function startOnce(): Promise<void> {
    await boss.start();
    for (const name of handlers.keys()) {
      await boss.createQueue(name, {
        name,
        retryLimit,
        retryDelay,
        retryBackoff: true,
        expireInSeconds: 120,
        retentionMinutes: 60 * 24 * 14,
      });
    }
    if (!options.runWorker) return;
    for (const [name, handler] of handlers) {
      await boss.work<object>(
        name,
        { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: options.pollingIntervalSeconds ?? 1 },
        async ([job]) => {
          if (!job) return;
          try {
            await handler(job.data, { id: job.id, retryCount: job.retryCount });
          } catch (error) {
            const last = job.retryCount >= retryLimit;
            options.logger[last ? 'error' : 'warn'](
              { err: error, job: { queue: name, id: job.id, retry: job.retryCount } },
              last ? 'job failed for good after its last retry' : 'job failed; it will be retried later',
            );
            throw error;
          }
        },
      );
    }
  }

  const queue: JobQueue = {
    async send(name, data, sendOptions) {
      await queue.start();
      const transaction = sendOptions?.transaction;
      // pg-boss writes the job through the transaction's own connection (Sequelize keeps the
      // pg client of a transaction on it), so the job exists only if the transaction commits.
      const connection = (transaction as unknown as { connection?: pg.ClientBase } | undefined)?.connection;
      if (transaction && !connection) throw new Error('job queue: the transaction has no connection');
      const db = connection
        ? { executeSql: async (text: string, values: unknown[]) => connection.query(text, values) }
        : undefined;
      await boss.send(name, data, { retryLimit, retryDelay, retryBackoff: true, db });
    },
    handle(name, handler) {
      if (started) throw new Error(`job queue: register "${name}" before the queue starts`);
      handlers.set(name, handler as JobHandler<object>);
    },
    start() {
      if (stopped) return Promise.reject(new Error('job queue: already stopped'));
      started ??= startOnce().catch(async (error: unknown) => {
        // pg-boss cannot start twice (a failed start leaves it "starting" for good), so the next
        // send starts a fresh one once the database is back; this one's pool is closed.
        const failed = boss;
        boss = newBoss();
        started = undefined;
        await (failed.getDb() as PgBoss.Db & { close?: () => Promise<void> }).close?.().catch(() => {});
        throw error;
      });
      return started;
    },
    async stop() {
      if (stopped) return;
      stopped = true;
      if (started) await started.catch(() => {});
      // Graceful: running jobs get up to 10 s to finish; unfinished ones are retried elsewhere.
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 }).catch(() => {});
    },
    async pending(names) {
      const [row] = await options.sequelize.query<{ count: number }>(
        `SELECT count(*)::int AS count FROM pgboss.job WHERE name IN (:names) AND state < 'completed'`,
        { replacements: { names }, type: QueryTypes.SELECT },
      );
      return row?.count ?? 0;
    },
  };
  return queue;
}
