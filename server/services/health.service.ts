import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { Health } from '@shared/schemas/health';
import { appVersion } from '../lib/version';

const startedAt = Date.now();

/** A real round trip to PostgreSQL: its version and the count of applied migrations. */
export async function checkHealth(sequelize: Sequelize, embedded: boolean): Promise<Health> {
  const base = {
    version: appVersion,
    uptimeSeconds: Math.round((Date.now() - startedAt) / 1000),
    time: new Date().toISOString(),
  };
  const began = performance.now();
  try {
    const [row] = await sequelize.query<{ server_version: string; migrations: number }>(
      `SELECT current_setting('server_version') AS server_version,
              (SELECT count(*) FROM schema_migrations) AS migrations`,
      { type: QueryTypes.SELECT },
    );
    return {
      ...base,
      status: 'ok',
      database: {
        status: 'up',
        latencyMs: Math.round((performance.now() - began) * 100) / 100,
        serverVersion: row?.server_version ?? null,
        embedded,
        migrationsApplied: row?.migrations ?? null,
      },
    };
  } catch (error) {
    return {
      ...base,
      status: 'degraded',
      database: {
        status: 'down',
        latencyMs: null,
        serverVersion: null,
        embedded,
        migrationsApplied: null,
        message: (error as Error).message,
      },
    };
  }
}
