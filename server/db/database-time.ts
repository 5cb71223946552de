import { AsyncLocalStorage } from 'node:async_hooks';
import type { RequestHandler } from 'express';

export interface DatabaseTime {
  queries: number;
  ms: number;
}

const current = new AsyncLocalStorage<DatabaseTime>();

/**
 * Counts the database round trips of each request and the time they took (Sequelize's and the
 * session store's), kept in res.locals.databaseTime so the request's log line can show them at
 * debug level (see createApp). Queries outside a request count nowhere.
 */
export const countDatabaseTime: RequestHandler = (_req, res, next) => {
  const time: DatabaseTime = { queries: 0, ms: 0 };
  res.locals.databaseTime = time;
  current.run(time, next);
};

/** Adds one finished query to the request it ran for. */
export function addDatabaseTime(ms: number): void {
  const time = current.getStore();
  if (!time) return;
  time.queries += 1;
  time.ms += ms;
}
