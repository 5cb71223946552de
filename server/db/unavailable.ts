import { BaseError, ConnectionError } from 'sequelize';

/** Seconds a client is asked to wait (Retry-After) while the database cannot be reached. */
export const databaseRetryAfterSeconds = 5;

// SQLSTATE classes and codes that mean "the connection or the server went away", not "this
// query is wrong": 08 connection exception, 57P01-57P03 admin shutdown, crash shutdown and
// cannot connect now (PostgreSQL manual, appendix A "PostgreSQL Error Codes").
const unavailableCodes = new Set(['57P01', '57P02', '57P03', '53300']);
const socketCodes = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH']);
// node-postgres reports a socket that closed under it with these messages and no code.
const lostConnection = /Connection terminated|not queryable|connection error|timeout exceeded when trying to connect/i;

function looksUnavailable(error: { code?: unknown; message?: unknown }): boolean {
  const code = typeof error.code === 'string' ? error.code : '';
  if (code.startsWith('08') || unavailableCodes.has(code) || socketCodes.has(code)) return true;
  return code === '' && typeof error.message === 'string' && lostConnection.test(error.message);
}

/**
 * True when an error (from Sequelize or straight from node-postgres, as the session store
 * gives them) means the database is unreachable or restarting, so the request should get 503
 * and be tried again, rather than 500.
 */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (!error || typeof error !== 'object') return false;
  if (error instanceof ConnectionError) return true;
  if (error instanceof BaseError) {
    const cause = (error as BaseError & { parent?: unknown; original?: unknown }).parent;
    return cause !== undefined && isDatabaseUnavailable(cause);
  }
  return looksUnavailable(error as { code?: unknown; message?: unknown });
}
