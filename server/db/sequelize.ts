import { Sequelize } from 'sequelize';
import pg from 'pg';
import { addDatabaseTime } from './database-time';

// PostgreSQL bigint (int8) and numeric arrive as strings by default; counts we read are small.
pg.types.setTypeParser(pg.types.builtins.INT8, (value) => Number(value));

/**
 * Connections per process: for plain SELECTs, and for transactions and changes. A transaction
 * holds its connection through every round trip of its change, each waiting its turn in a busy
 * event loop, so writes need more than a few: under bench:load (20 writes/s asked while 200
 * connections of reads saturate, 2 web processes, a busy machine) with 3 write connections the
 * wait for one was the longest part of a write (median 0.7-1.1 s of 1.4-2.0 s; 8.8 writes/s
 * done), with 10 it was mostly none (15.2 writes/s, median 617 ms). Six keep four web processes
 * within PostgreSQL's default 100 connections (README, "Several instances").
 */
export interface PoolSizes {
  read: number;
  write: number;
}
export const defaultPoolSizes: PoolSizes = { read: 8, write: 6 };

type PooledConnection = { queryType?: 'read' | 'write' };
type Pools = {
  read: { maxSize: number; destroy(connection: PooledConnection): unknown };
  write: { maxSize: number; _factory?: { max: number }; destroy(connection: PooledConnection): unknown };
  destroy(connection: PooledConnection): void;
};

/**
 * `timeQueries`: count each query's time into the request it ran for (server/db/database-time.ts).
 *
 * Two pools on the same database (Sequelize's read/write replication with one server), by
 * Sequelize's own rule: a SELECT outside a transaction takes the read pool; a transaction (every
 * statement in it) and any other statement take the smaller write pool, so a change never waits
 * for a connection behind a queue of reads. Reads themselves are kept few by their turns
 * (server/middleware/read-admission.ts), so a write's plain SELECTs find a read connection free.
 * (Routing every statement of a writing request to the write pool took an AsyncLocalStorage, whose
 * promise hooks slowed every later promise of the process: node CPU per read 2.6 -> 4-5 ms.)
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
  return sequelize;
}

/** The sizes of the two pools as they are (for tests and the start log). */
export function poolSizesOf(sequelize: Sequelize): PoolSizes {
  const made = (sequelize.connectionManager as unknown as { pool: Pools }).pool;
  return { read: made.read.maxSize, write: made.write.maxSize };
}
