import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../config/env';
import { startEmbeddedPostgres } from '../db/embedded-postgres';
import { migrateToLatest } from '../db/migrator';
import { seedDemoData } from '../seed/demo';
import { ensureFirstAdmin } from '../services/first-admin.service';
import { refitOutdatedFits } from '../services/studies/refit-outdated-fits';

export interface DatabaseHandle {
  url: string;
  /** True when Halflight runs the cluster itself (no DATABASE_URL). */
  embedded: boolean;
  /** Stops the built-in cluster (pg_ctl stop -m fast); nothing for a configured database. */
  stop(): Promise<void>;
}

/**
 * The database Halflight talks to: DATABASE_URL, or the built-in cluster started here. Only one
 * process per data folder may do this (a later multi-worker mode calls it in the primary only,
 * once, and hands the URL to the workers).
 */
export async function startDatabase(config: AppConfig, logger: Logger): Promise<DatabaseHandle> {
  if (config.DATABASE_URL) return { url: config.DATABASE_URL, embedded: false, stop: async () => {} };
  const cluster = await startEmbeddedPostgres({
    dataRoot: config.HALFLIGHT_DATA_DIR,
    port: config.HALFLIGHT_PG_PORT,
    log: (line) => logger.info(line),
  });
  logger.info(`Embedded PostgreSQL is up on 127.0.0.1:${cluster.port} (cluster in ${cluster.pgdata}).`);
  return {
    url: cluster.url,
    embedded: true,
    async stop() {
      logger.info('Stopping the embedded PostgreSQL cluster ...');
      await cluster.stop();
    },
  };
}

/**
 * Migrations, then the refit of outdated stored fits, the demo data and the first admin, all under
 * the migration lock so that
 * instances starting together neither collide nor seed twice. Models must be initialised.
 */
export async function prepareSchema(sequelize: Sequelize, config: AppConfig, logger: Logger): Promise<void> {
  const applied = await migrateToLatest(sequelize, {
    onWait: () => logger.info('Another Halflight instance is migrating this database; waiting for it ...'),
    whileLocked: async () => {
      const refitted = await refitOutdatedFits(sequelize);
      if (refitted) logger.info(`Fitted ${refitted} studies again whose latest fit an older engine stored.`);
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
    },
  });
  if (applied.length) logger.info(`Applied migrations: ${applied.join(', ')}`);
}
