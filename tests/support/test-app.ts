import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pino } from 'pino';
import { inject } from 'vitest';
import { createApp } from '../../server/app';
import type { CreateAppOptions } from '../../server/app';
import { createSequelize } from '../../server/db/sequelize';
import { startMailCatcher } from '../../server/mail/catcher';
import { createMailer } from '../../server/mail/mailer';
import { defaultRateLimits } from '../../server/middleware/rate-limits';
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
  const caughtMailDir = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-caught-mail-'));
  const catcher = await startMailCatcher({ emlDir: caughtMailDir });
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
    // Generous attempt limits, so tests that sign in often are not refused; tests of the limits
    // pass their own. Each app's counters live in the shared database, under their own prefix.
    rateLimits: Object.fromEntries(
      Object.entries(defaultRateLimits).map(([name, limit]) => [name, { ...limit, points: 100_000 }]),
    ),
    ...overrides,
  });
  await app.startJobs();
  return {
    app,
    sequelize,
    /** Where the catcher writes each message as an .eml file. */
    caughtMailDir,
    async close() {
      await app.closeResources();
      mailer.close();
      await catcher.stop();
      fs.rmSync(caughtMailDir, { recursive: true, force: true });
      if (ownsDatabase) await sequelize.close();
    },
  };
}
