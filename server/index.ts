import type { Server } from 'node:http';
import { pino } from 'pino';
import { createApp } from './app';
import { loadConfig } from './config/env';
import { startEmbeddedPostgres } from './db/embedded-postgres';
import type { EmbeddedPostgres } from './db/embedded-postgres';
import { migrateToLatest } from './db/migrator';
import { createSequelize } from './db/sequelize';
import { initModels } from './models';
import { seedDemoData } from './seed/demo';

const config = loadConfig();
const logger = pino({
  level: config.LOG_LEVEL,
  transport: process.stdout.isTTY ? { target: 'pino-pretty', options: { ignore: 'pid,hostname' } } : undefined,
});

let database: EmbeddedPostgres | undefined;
let server: Server | undefined;
let sequelize: ReturnType<typeof createSequelize> | undefined;
let stopping = false;

async function stop(exitCode: number): Promise<never> {
  if (!stopping) {
    stopping = true;
    await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
    server?.closeAllConnections();
    await sequelize?.close().catch(() => {});
    if (database) {
      logger.info('Stopping the embedded PostgreSQL cluster ...');
      await database.stop();
    }
    logger.info('Halflight stopped.');
  }
  process.exit(exitCode);
}

async function main(): Promise<void> {
  if (!config.DATABASE_URL) {
    database = await startEmbeddedPostgres({
      dataRoot: config.HALFLIGHT_DATA_DIR,
      port: config.HALFLIGHT_PG_PORT,
      log: (line) => logger.info(line),
    });
    logger.info(`Embedded PostgreSQL is up on 127.0.0.1:${database.port} (data in ${database.dataRoot}).`);
  }
  sequelize = createSequelize(config.DATABASE_URL ?? database!.url);
  await sequelize.authenticate();
  const applied = await migrateToLatest(sequelize);
  if (applied.length) logger.info(`Applied migrations: ${applied.join(', ')}`);
  initModels(sequelize);
  if (config.demoData) {
    const { created } = await seedDemoData(sequelize);
    if (created) logger.info('Loaded the invented demo scenario (demo data only).');
  }

  const app = createApp({ sequelize, embeddedDatabase: database !== undefined, logger });
  server = app.listen(config.PORT, config.HOST);
  await new Promise<void>((resolve, reject) => {
    server!.once('listening', resolve);
    server!.once('error', reject);
  });
  const shownHost = config.HOST === '0.0.0.0' ? '127.0.0.1' : config.HOST;
  console.log(`\n  Halflight is ready: open http://${shownHost}:${config.PORT}\n  Press Ctrl-C to stop.\n`);
}

process.on('SIGINT', () => void stop(0));
process.on('SIGTERM', () => void stop(0));

main().catch(async (error: NodeJS.ErrnoException) => {
  if (error.code === 'EADDRINUSE') {
    logger.error(`Port ${config.PORT} on ${config.HOST} is taken. Set PORT to another port.`);
  } else {
    logger.error(error.message);
  }
  await stop(1);
});
