import crypto from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { addDatabaseTime } from './database-time';
import { isDatabaseUnavailable } from './unavailable';

type PgConnection = {
  query(
    query: string | { name: string; text: string; values: unknown[] },
    values?: unknown[],
  ): Promise<{ rows: unknown[] }>;
  _invalid?: boolean;
};

/** A statement whose text never changes, run under a name of its own (see fixedStatement). */
export interface FixedStatement {
  name: string;
  text: string;
}

/**
 * A statement asked on every request of a kind, sent as a named prepared statement: PostgreSQL
 * parses it once per connection and, after five runs, keeps its generic plan instead of planning
 * it on every run. For the study detail the planning took longer than the execution (about 1 ms
 * against 0.4 ms, EXPLAIN ANALYZE on the test database; 0.03 ms once the plan is kept). Only for
 * lookups by key (a generic plan is as good as a custom one there), never for statements whose
 * best plan depends on the values (a list filtered by a large or a small lab). The name is the
 * text's hash, so one name always means one text on every connection.
 */
export function fixedStatement(text: string): FixedStatement {
  return { name: `hl_${crypto.createHash('sha256').update(text).digest('hex').slice(0, 24)}`, text };
}

const statementsByText = new Map<string, FixedStatement>();

/**
 * The fixedStatement of a text built from a few fixed pieces (which filters a list has): one
 * object per text, so its name is hashed once per process. Only for texts drawn from a small set;
 * values always go in as binds.
 */
export function fixedStatementOf(text: string): FixedStatement {
  let statement = statementsByText.get(text);
  if (!statement) statementsByText.set(text, (statement = fixedStatement(text)));
  return statement;
}

/**
 * Rows of one fixed SELECT with $1, $2, … bound, as plain objects, on a connection of Sequelize's
 * pool (so the pool's size and reconnects still hold). For the statements every read request
 * asks: Sequelize's own query path builds a query object, captures a stack trace and runs its
 * hooks for each one, a large share of a cheap read's CPU under load. Node-postgres parses the
 * values as it does for Sequelize (same connection, same type parsers).
 */
export async function selectRows<T>(
  sequelize: Sequelize,
  sql: string | FixedStatement,
  values: unknown[] = [],
): Promise<T[]> {
  const manager = sequelize.connectionManager;
  // 'SELECT' as Sequelize's own queries pass it: the read pool (createSequelize). Its typings say
  // 'read', which the pool takes for a write.
  const connection = (await manager.getConnection({ type: 'SELECT' as 'read' })) as PgConnection;
  const started = performance.now();
  try {
    const result =
      typeof sql === 'string' ? await connection.query(sql, values) : await connection.query({ ...sql, values });
    return result.rows as T[];
  } catch (error) {
    // As Sequelize does: a connection that was cut is not handed out again.
    if (isDatabaseUnavailable(error)) connection._invalid = true;
    throw error;
  } finally {
    addDatabaseTime(performance.now() - started);
    manager.releaseConnection(connection);
  }
}
