import { Sequelize } from 'sequelize';
import pg from 'pg';
import { addDatabaseTime } from './database-time';
import { inWriteRequest } from './request-kind';

// PostgreSQL bigint (int8) and numeric arrive as strings by default; counts we read are small.
pg.types.setTypeParser(pg.types.builtins.INT8, (value) => Number(value));

/** Connections per process: for the reads of GET requests, and kept for requests that write. */
export interface PoolSizes {
  read: number;
  write: number;
}
export const defaultPoolSizes: PoolSizes = { read: 8, write: 3 };

type PooledConnection = { queryType?: 'read' | 'write' };
type Pools = {
  read: { maxSize: number; destroy(connection: PooledConnection): unknown };
  write: { maxSize: number; _factory?: { max: number }; destroy(connection: PooledConnection): unknown };
  destroy(connection: PooledConnection): void;
};

/**
 * `timeQueries`: count each query's time into the request it ran for (server/db/database-time.ts).
 *
 * Two pools on the same database (Sequelize's read/write replication with one server): SELECTs of
 * read requests take the read pool; transactions, changes and every statement of a request that
 * writes (server/db/request-kind.ts) take the smaller write pool, so writes never wait behind a
 * queue of reads.
 */
export function createSequelize(
  databaseUrl: string,
  options: { timeQueries?: boolean; pools?: Partial<PoolSizes> } = {},
): Sequelize {
  const pools = { ...defaultPoolSizes, ...options.pools };
  const sequelize = new Sequelize(databaseUrl, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: options.timeQueries ? (_sql: string, ms?: number) => addDatabaseTime(ms ?? 0) : false,
    benchmark: options.timeQueries ?? false,
    // Both pools are made with the read size; the write pool is set to its own size below.
    replication: { read: [{}], write: {} },
    // Connections cut by a restart are dropped by Sequelize's own 'error' listener and replaced on
    // the next acquire; the timeouts keep requests from hanging while the server is unreachable.
    pool: { max: pools.read, min: 0, idle: 10_000, acquire: 20_000 },
    dialectOptions: { connectionTimeoutMillis: 10_000, keepAlive: true },
    define: { underscored: true },
  });
  const made = (sequelize.connectionManager as unknown as { pool: Pools }).pool;
  // sequelize-pool reads its size from the factory on each acquire; there is no public setter.
  if (!made.write._factory) throw new Error('Sequelize no longer has a separate write pool to size.');
  made.write._factory.max = pools.write;
  // Sequelize's 'error' listener on a connection calls pool.destroy, which with two pools looks the
  // pool up by the connection's queryType. A connection cut while it is still being opened (its
  // first SET statement running when the database restarts) has no queryType yet, so the lookup
  // threw a TypeError out of the event emitter: an uncaught exception that ends the process. Such
  // a connection belongs to no pool; its opening fails by itself and the acquire reports it.
  made.destroy = (connection) => {
    if (connection.queryType) made[connection.queryType].destroy(connection);
  };
  sequelize.addHook('beforePoolAcquire', (acquire: { useMaster?: boolean }) => {
    if (inWriteRequest()) acquire.useMaster = true;
  });
  return sequelize;
}

/** The sizes of the two pools as they are (for tests and the start log). */
export function poolSizesOf(sequelize: Sequelize): PoolSizes {
  const made = (sequelize.connectionManager as unknown as { pool: Pools }).pool;
  return { read: made.read.maxSize, write: made.write.maxSize };
}
