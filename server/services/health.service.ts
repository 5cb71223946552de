import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { Health } from '@shared/schemas/health';
import { isDatabaseUnavailable } from '../db/unavailable';
import { appVersion } from '../lib/version';

const startedAt = Date.now();

/**
 * A real round trip to PostgreSQL: its version and the count of applied migrations. A query that
 * fails for another reason than an unreachable database goes to `onQueryError` (to be logged).
 */
export async function checkHealth(
  sequelize: Sequelize,
  embedded: boolean,
  onQueryError?: (error: unknown) => void,
): Promise<Health> {
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
    if (!isDatabaseUnavailable(error)) onQueryError?.(error);
    return {
      ...base,
      status: 'degraded',
      database: {
        status: 'down',
        latencyMs: null,
        serverVersion: null,
        embedded,
        migrationsApplied: null,
        // A public route: say what kind of failure, not the address or the driver's words.
        message: isDatabaseUnavailable(error)
          ? 'The database cannot be reached; Halflight reconnects by itself when it is back.'
          : 'The database answered the check with an error; see the server log.',
      },
    };
  }
}
