import { pino } from 'pino';
import { startDatabase, prepareSchema } from './boot/database';
import type { DatabaseHandle } from './boot/database';
import { stopOnSignals } from './boot/signals';
import { startWeb } from './boot/web';
import { loadConfig } from './config/env';
import { createSequelize } from './db/sequelize';
import { initModels } from './models';

/**
 * Boot: the database (the built-in cluster unless DATABASE_URL is set), migrations and demo data
 * under the migration lock, then the web server. Production runs this compiled
 * (dist/server/index.js) under plain node; Ctrl-C or SIGTERM stops it in reverse order, once.
 */
const config = loadConfig();
const logger = pino({
  level: config.LOG_LEVEL,
  transport: process.stdout.isTTY ? { target: 'pino-pretty', options: { ignore: 'pid,hostname' } } : undefined,
});

// Kept as promises so that a signal during start waits for a cluster still starting, then stops it.
let databaseStarting: Promise<DatabaseHandle> | undefined;
let webStarting: Promise<Awaited<ReturnType<typeof startWeb>>> | undefined;
let sequelize: ReturnType<typeof createSequelize> | undefined;

const stop = stopOnSignals(async () => {
  const web = await webStarting?.catch(() => undefined);
  await web?.stop().catch((error: unknown) => logger.error({ err: error }, 'web server did not close cleanly'));
  await sequelize?.close().catch(() => {});
  const database = await databaseStarting?.catch(() => undefined);
  await database?.stop();
  logger.info('Halflight stopped.');
}, logger);

async function main(): Promise<void> {
  databaseStarting = startDatabase(config, logger);
  const database = await databaseStarting;
  sequelize = createSequelize(database.url);
  initModels(sequelize);
  await prepareSchema(sequelize, config, logger);
  webStarting = startWeb({
    config,
    sequelize,
    databaseUrl: database.url,
    embeddedDatabase: database.embedded,
    logger,
  });
  await webStarting;
  console.log(`\n  Halflight is ready: open ${config.publicUrl}\n  Press Ctrl-C to stop.\n`);
}

main().catch(async (error: NodeJS.ErrnoException) => {
  if (error.code === 'EADDRINUSE') {
    logger.error(`Port ${config.PORT} on ${config.HOST} is taken. Set PORT to another port.`);
  } else {
    logger.error(error.message);
  }
  await stop(1);
});
