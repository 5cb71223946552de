import { Sequelize } from 'sequelize';
import pg from 'pg';
import { addDatabaseTime } from './database-time';

// PostgreSQL bigint (int8) and numeric arrive as strings by default; counts we read are small.
pg.types.setTypeParser(pg.types.builtins.INT8, (value) => Number(value));

/** `timeQueries`: count each query's time into the request it ran for (server/db/database-time.ts). */
export function createSequelize(databaseUrl: string, options: { timeQueries?: boolean } = {}): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: options.timeQueries ? (_sql: string, ms?: number) => addDatabaseTime(ms ?? 0) : false,
    benchmark: options.timeQueries ?? false,
    // Connections cut by a restart are dropped by Sequelize's own 'error' listener and replaced on
    // the next acquire; the timeouts keep requests from hanging while the server is unreachable.
    pool: { max: 10, min: 0, idle: 10_000, acquire: 20_000 },
    dialectOptions: { connectionTimeoutMillis: 10_000, keepAlive: true },
    define: { underscored: true },
  });
}
