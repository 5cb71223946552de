import cluster from 'node:cluster';
import { pino } from 'pino';
import { startDatabase, prepareSchema } from './boot/database';
import type { DatabaseHandle } from './boot/database';
import { stopOnSignals } from './boot/signals';
import { startWeb } from './boot/web';
import { startWorkers } from './boot/workers';
import type { WorkerBoot, WorkerMessage } from './boot/workers';
import { loadConfig } from './config/env';
import { createSequelize } from './db/sequelize';
import { resolveSessionSecret } from './lib/session-secret';
import { initModels } from './models';

/**
 * Boot: the database (the built-in cluster unless DATABASE_URL is set), migrations and demo data
 * under the migration lock, then the web server. Production runs this compiled
 * (dist/server/index.js) under plain node; Ctrl-C or SIGTERM stops it in reverse order, once.
 *
 * With HALFLIGHT_WORKERS above 1 (the default on a machine with several cores) this process is the
 * primary: it starts and stops the database exactly once, listens on the port and hands each
 * connection to one of the web servers, forked workers (server/boot/workers.ts) that share the database.
 */
const config = loadConfig();
const logger = pino({
  level: config.LOG_LEVEL,
  transport: process.stdout.isTTY ? { target: 'pino-pretty', options: { ignore: 'hostname' } } : undefined,
});

const reportStartError = (error: NodeJS.ErrnoException) => {
  if (error.code === 'EADDRINUSE') {
    logger.error(`Port ${config.PORT} on ${config.HOST} is taken. Set PORT to another port.`);
  } else {
    logger.error(error.message);
  }
};
const databasePools = { read: config.HALFLIGHT_DB_POOL_READ, write: config.HALFLIGHT_DB_POOL_WRITE };
const announceReady = () => console.log(`\n  Halflight is ready: open ${config.publicUrl}\n  Press Ctrl-C to stop.\n`);

// Kept as promises so that a signal during start waits for what is still starting, then stops it.
let databaseStarting: Promise<DatabaseHandle> | undefined;
let webStarting: Promise<Awaited<ReturnType<typeof startWeb>>> | undefined;
let workers: ReturnType<typeof startWorkers> | undefined;
let sequelize: ReturnType<typeof createSequelize> | undefined;

/** Database, migrations and demo data; the Sequelize of this process stays open for `keepOpen`. */
async function prepareDatabase(keepOpen: boolean): Promise<DatabaseHandle> {
  databaseStarting = startDatabase(config, logger);
  const database = await databaseStarting;
  sequelize = createSequelize(database.url, {
    timeQueries: keepOpen && logger.isLevelEnabled('debug'),
    pools: databasePools,
  });
  initModels(sequelize);
  await prepareSchema(sequelize, config, logger);
  if (!keepOpen) {
    await sequelize.close();
    sequelize = undefined;
  }
  return database;
}

async function stopEverything(): Promise<void> {
  await workers?.stop();
  const web = await webStarting?.catch(() => undefined);
  await web?.stop().catch((error: unknown) => logger.error({ err: error }, 'web server did not close cleanly'));
  await sequelize?.close().catch(() => {});
  const database = await databaseStarting?.catch(() => undefined);
  await database?.stop();
  if (cluster.isPrimary) logger.info('Halflight stopped.');
}

const stop = stopOnSignals(stopEverything, logger);

/** One process does everything (HALFLIGHT_WORKERS=1). */
async function runAlone(): Promise<void> {
  const database = await prepareDatabase(true);
  webStarting = startWeb({
    config,
    sequelize: sequelize!,
    databaseUrl: database.url,
    embeddedDatabase: database.embedded,
    logger,
  });
  await webStarting;
  announceReady();
}

/** The primary of several web workers: database once, then the workers. */
async function runPrimary(): Promise<void> {
  const database = await prepareDatabase(false);
  // Made here once, so the workers read one file instead of racing to create it.
  resolveSessionSecret(config.SESSION_SECRET, config.HALFLIGHT_DATA_DIR);
  workers = startWorkers({
    count: config.workers,
    port: config.PORT,
    host: config.HOST,
    databaseUrl: database.url,
    embeddedDatabase: database.embedded,
    runJobs: config.HALFLIGHT_JOB_WORKER,
    logger,
    onFatal: (reason) => {
      logger.error(reason);
      void stop(1);
    },
  });
  await workers.ready;
  logger.info(`${config.workers} web workers are serving (pids ${workers.pids().join(', ')}).`);
  announceReady();
}

/** A forked web worker: waits for the primary's database address, then serves. */
async function runWorker(): Promise<void> {
  // Without the primary there is no one to hand out connections or stop the database: stop too.
  process.on('disconnect', () => void stop(0));
  const boot = await new Promise<WorkerBoot>((resolve) => {
    process.on('message', (message: WorkerBoot) => message?.type === 'boot' && resolve(message));
    process.send!({ type: 'hello' } satisfies WorkerMessage);
  });
  sequelize = createSequelize(boot.databaseUrl, { timeQueries: logger.isLevelEnabled('debug'), pools: databasePools });
  initModels(sequelize);
  webStarting = startWeb({
    config,
    sequelize,
    databaseUrl: boot.databaseUrl,
    embeddedDatabase: boot.embeddedDatabase,
    logger,
    runsJobs: boot.runsJobs,
    handedConnections: true,
  });
  await webStarting;
  process.send!({ type: 'ready' } satisfies WorkerMessage);
}

const run = cluster.isWorker ? runWorker : config.workers > 1 ? runPrimary : runAlone;
run().catch(async (error: NodeJS.ErrnoException) => {
  reportStartError(error);
  await stop(1);
});
