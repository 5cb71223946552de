import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { startEmbeddedPostgres } from '../../server/db/embedded-postgres';
import { migrateToLatest } from '../../server/db/migrator';
import { createSequelize } from '../../server/db/sequelize';
import { freePort } from './free-port';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

/**
 * A throwaway PostgreSQL cluster for one test project: a temporary folder, a free port on
 * 127.0.0.1, the real migrations; stopped and deleted when the project's tests end.
 */
export default async function setup(project: TestProject) {
  const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-test-'));
  const database = await startEmbeddedPostgres({ dataRoot, port: await freePort(), database: 'halflight_test' });
  try {
    const sequelize = createSequelize(database.url);
    await migrateToLatest(sequelize);
    await sequelize.close();
  } catch (error) {
    await database.stop();
    throw error;
  }
  project.provide('databaseUrl', database.url);
  return async () => {
    await database.stop();
    fs.rmSync(dataRoot, { recursive: true, force: true });
  };
}
