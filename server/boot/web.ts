import { createServer } from 'node:http';
import type { Server } from 'node:http';
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import { createApp } from '../app';
import { withSchemaLock } from '../db/migrator';
import type { AppConfig } from '../config/env';
import { resolveSessionSecret } from '../lib/session-secret';
import { startMailCatcher } from '../mail/catcher';
import type { MailCatcher } from '../mail/catcher';
import { createMailer } from '../mail/mailer';
import type { Mailer } from '../mail/mailer';
import { fileStoreFromConfig } from '../services/studies/files/file-store-config';
import { serveHandedConnections } from './handed-connections';

/** How long requests in progress may take to finish once stopping has begun. */
const drainMs = 10_000;

/** The mailer of a process that only queues mail: the job worker of another process sends it. */
const queueOnlyMailer: Mailer = {
  send: () => Promise.reject(new Error('This process only queues mail; the job worker sends it.')),
  close: () => {},
};

/**
 * The web server of one process: mail, the job queue, the Express app and the listener. `stop`
 * stops taking connections, lets requests in progress finish (at most 10 s in all, counting the
 * handlers still running for clients that have gone away) and closes what it opened (the job
 * worker gets its own 10 s to finish a running job). With several web workers, only the one that
 * runs the jobs (`runsJobs`) sends mail and runs the local mail catcher, and none listens on the
 * port: each serves the connections the primary hands it (`handedConnections`).
 */
export async function startWeb(options: {
  config: AppConfig;
  sequelize: Sequelize;
  databaseUrl: string;
  embeddedDatabase: boolean;
  logger: Logger;
  /** Run the job worker (and the mail catcher when there is no SMTP_URL) here; default HALFLIGHT_JOB_WORKER. */
  runsJobs?: boolean;
  /** Serve the connections the primary hands over (connection-balancer.ts) instead of listening. */
  handedConnections?: boolean;
}): Promise<{ stop(): Promise<void> }> {
  const { config, logger } = options;
  const runsJobs = options.runsJobs ?? config.HALFLIGHT_JOB_WORKER;
  let catcher: MailCatcher | undefined;
  if (!config.SMTP_URL && runsJobs) {
    const emlDir = path.join(config.HALFLIGHT_DATA_DIR, 'caught-mail');
    catcher = await startMailCatcher({ emlDir, logger });
    const where = `caught on 127.0.0.1:${catcher.port}, written under ${emlDir} and shown in the app to each addressee`;
    if (config.demoData) logger.info(`No SMTP_URL: outgoing mail is ${where}.`);
    else {
      logger.warn(
        `SMTP_URL is not set: no e-mail leaves this machine (it is ${where}). Set SMTP_URL on a real deployment.`,
      );
    }
  }
  const mailer = !runsJobs
    ? queueOnlyMailer
    : config.SMTP_URL
      ? createMailer(config.SMTP_URL, config.MAIL_FROM)
      : createMailer(catcher!.url, config.MAIL_FROM, { tagForCatcher: true });
  const app = createApp({
    sequelize: options.sequelize,
    embeddedDatabase: options.embeddedDatabase,
    logger,
    databaseUrl: options.databaseUrl,
    sessionSecret: resolveSessionSecret(config.SESSION_SECRET, config.HALFLIGHT_DATA_DIR),
    mailer,
    mailCatcher: !config.SMTP_URL,
    publicUrl: config.publicUrl,
    behindTls: config.HALFLIGHT_BEHIND_TLS,
    trustProxy: config.trustProxy,
    jobWorker: runsJobs,
    files: fileStoreFromConfig(config).files,
    sessionPools: { read: config.HALFLIGHT_SESSION_POOL_READ, write: config.HALFLIGHT_SESSION_POOL_WRITE },
    readAdmission: {
      concurrency: config.HALFLIGHT_READ_CONCURRENCY,
      queue: config.HALFLIGHT_READ_QUEUE,
      whileWriting: config.HALFLIGHT_READ_WHILE_WRITING,
    },
  });
  let server: Server | undefined;
  const closeRest = async () => {
    await app.closeResources().catch(() => {});
    mailer.close();
    await catcher?.stop();
  };
  try {
    // The job queue creates its own tables on first start; instances take turns, as for migrations.
    await withSchemaLock(options.sequelize, () => app.startJobs());
    if (options.handedConnections) {
      const handed = serveHandedConnections(createServer(app));
      return {
        async stop() {
          const deadline = Date.now() + drainMs;
          await handed.close(drainMs);
          await app.handlersSettled(deadline);
          await closeRest();
        },
      };
    }
    server = app.listen(config.PORT, config.HOST);
    await new Promise<void>((resolve, reject) => {
      server!.once('listening', resolve);
      server!.once('error', reject);
    });
  } catch (error) {
    await closeRest();
    throw error;
  }
  const listening = server;
  return {
    async stop() {
      const deadline = Date.now() + drainMs;
      const closed = new Promise<void>((resolve) => listening.close(() => resolve()));
      listening.closeIdleConnections();
      await Promise.race([closed, sleep(drainMs)]);
      listening.closeAllConnections();
      await app.handlersSettled(deadline);
      await closeRest();
    },
  };
}
