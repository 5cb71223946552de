import crypto from 'node:crypto';
import { pino } from 'pino';
import { inject } from 'vitest';
import { createApp } from '../../server/app';
import type { CreateAppOptions } from '../../server/app';
import { createSequelize } from '../../server/db/sequelize';
import { startMailCatcher } from '../../server/mail/catcher';
import { createMailer } from '../../server/mail/mailer';
import { initModels } from '../../server/models';

/**
 * The real application on the project's throwaway database, with the local mail catcher, for
 * supertest and the browser. Rate limits are generous unless a test asks for tight ones.
 */
export async function createTestApp(overrides: Partial<CreateAppOptions> = {}) {
  const databaseUrl = inject('databaseUrl');
  // Models are bound to one Sequelize instance per process: a second app in the same file shares it.
  const ownsDatabase = !overrides.sequelize;
  const sequelize = overrides.sequelize ?? createSequelize(databaseUrl);
  if (ownsDatabase) initModels(sequelize);
  const catcher = await startMailCatcher();
  const mailer = createMailer(catcher.url, 'Halflight tests <tests@halflight.invalid>', { tagForCatcher: true });
  const app = createApp({
    sequelize,
    embeddedDatabase: true,
    logger: pino({ level: 'silent' }),
    databaseUrl,
    sessionSecret: crypto.randomBytes(32).toString('hex'),
    mailer,
    mailCatcher: true,
    publicUrl: 'http://127.0.0.1:4310',
    jobRetryDelaySeconds: 1,
    rateLimits: {
      signIn: { windowMs: 60_000, limit: 1000 },
      passwordReset: { windowMs: 60_000, limit: 1000 },
      invitation: { windowMs: 60_000, limit: 1000 },
    },
    ...overrides,
  });
  await app.startJobs();
  return {
    app,
    sequelize,
    async close() {
      await app.closeResources();
      mailer.close();
      await catcher.stop();
      if (ownsDatabase) await sequelize.close();
    },
  };
}
