import type { Server } from 'node:http';
import { pino } from 'pino';
import { createApp } from './app';
import type { HalflightApp } from './app';
import { loadConfig } from './config/env';
import { startEmbeddedPostgres } from './db/embedded-postgres';
import type { EmbeddedPostgres } from './db/embedded-postgres';
import { migrateToLatest } from './db/migrator';
import { createSequelize } from './db/sequelize';
import { resolveSessionSecret } from './lib/session-secret';
import { startMailCatcher } from './mail/catcher';
import type { MailCatcher } from './mail/catcher';
import { createMailer } from './mail/mailer';
import type { Mailer } from './mail/mailer';
import { initModels } from './models';
import { seedDemoData } from './seed/demo';
import { ensureFirstAdmin } from './services/first-admin.service';

const config = loadConfig();
const logger = pino({
  level: config.LOG_LEVEL,
  transport: process.stdout.isTTY ? { target: 'pino-pretty', options: { ignore: 'pid,hostname' } } : undefined,
});

let database: EmbeddedPostgres | undefined;
let sequelize: ReturnType<typeof createSequelize> | undefined;
let catcher: MailCatcher | undefined;
let mailer: Mailer | undefined;
let app: HalflightApp | undefined;
let server: Server | undefined;
let stopping = false;

/** Stops everything that started, in reverse order, then exits. */
async function stop(exitCode: number): Promise<never> {
  if (!stopping) {
    stopping = true;
    await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
    server?.closeAllConnections();
    await app?.closeResources().catch(() => {});
    mailer?.close();
    await catcher?.stop();
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
  const databaseUrl = config.DATABASE_URL ?? database!.url;
  sequelize = createSequelize(databaseUrl);
  await sequelize.authenticate();
  const applied = await migrateToLatest(sequelize);
  if (applied.length) logger.info(`Applied migrations: ${applied.join(', ')}`);
  initModels(sequelize);

  if (config.demoData && (await seedDemoData(sequelize)).created) {
    logger.info('Loaded the invented demo scenario (demo data only; sign-ins in README.md).');
  }
  const { HALFLIGHT_FIRST_ADMIN_EMAIL: email, HALFLIGHT_FIRST_ADMIN_PASSWORD: password } = config;
  if (email && password) {
    const labName = config.HALFLIGHT_FIRST_LAB_NAME ?? 'My lab';
    if ((await ensureFirstAdmin(sequelize, { email, password, labName })).created) {
      logger.info(`Created the first admin ${email} of "${labName}".`);
    }
  }

  if (config.SMTP_URL) {
    mailer = createMailer(config.SMTP_URL, config.MAIL_FROM);
  } else {
    catcher = await startMailCatcher();
    mailer = createMailer(catcher.url, config.MAIL_FROM, { tagForCatcher: true });
    logger.info(`No SMTP_URL: outgoing mail is caught on 127.0.0.1:${catcher.port}; admins read it in the app.`);
  }

  app = createApp({
    sequelize,
    embeddedDatabase: database !== undefined,
    logger,
    databaseUrl,
    sessionSecret: resolveSessionSecret(config.SESSION_SECRET, config.HALFLIGHT_DATA_DIR),
    mailer,
    mailCatcher: catcher !== undefined,
    publicUrl: config.publicUrl,
    behindTls: config.HALFLIGHT_BEHIND_TLS,
    jobWorker: config.HALFLIGHT_JOB_WORKER,
  });
  await app.startJobs();
  server = app.listen(config.PORT, config.HOST);
  await new Promise<void>((resolve, reject) => {
    server!.once('listening', resolve);
    server!.once('error', reject);
  });
  console.log(`\n  Halflight is ready: open ${config.publicUrl}\n  Press Ctrl-C to stop.\n`);
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
