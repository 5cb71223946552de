import { pino } from 'pino';
import { inject } from 'vitest';
import { createApp } from '../../server/app';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/models';

/** The real application on the project's throwaway database, for supertest and the browser. */
export function createTestApp() {
  const sequelize = createSequelize(inject('databaseUrl'));
  initModels(sequelize);
  const app = createApp({ sequelize, embeddedDatabase: true, logger: pino({ level: 'silent' }) });
  return { app, sequelize, close: () => sequelize.close() };
}
