import type { Sequelize } from 'sequelize';
import { addDatabaseTime } from './database-time';
import { isDatabaseUnavailable } from './unavailable';

type PgConnection = {
  query(sql: string, values: unknown[]): Promise<{ rows: unknown[] }>;
  _invalid?: boolean;
};

/**
 * Rows of one fixed SELECT with $1, $2, … bound, as plain objects, on a connection of Sequelize's
 * pool (so the pool's size and reconnects still hold). For the statements every read request
 * asks: Sequelize's own query path builds a query object, captures a stack trace and runs its
 * hooks for each one, a large share of a cheap read's CPU under load. Node-postgres parses the
 * values as it does for Sequelize (same connection, same type parsers).
 */
export async function selectRows<T>(sequelize: Sequelize, sql: string, values: unknown[] = []): Promise<T[]> {
  const manager = sequelize.connectionManager;
  // 'SELECT' as Sequelize's own queries pass it: the read pool, unless the request writes
  // (createSequelize). Its typings say 'read', which the pool takes for a write.
  const connection = (await manager.getConnection({ type: 'SELECT' as 'read' })) as PgConnection;
  const started = performance.now();
  try {
    return (await connection.query(sql, values)).rows as T[];
  } catch (error) {
    // As Sequelize does: a connection that was cut is not handed out again.
    if (isDatabaseUnavailable(error)) connection._invalid = true;
    throw error;
  } finally {
    addDatabaseTime(performance.now() - started);
    manager.releaseConnection(connection);
  }
}
