import { AsyncLocalStorage } from 'node:async_hooks';
import type { RequestHandler } from 'express';

const writing = new AsyncLocalStorage<true>();
const readMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Marks every request that may change something (any method but GET, HEAD and OPTIONS), so each of
 * its database round trips (the session row, the membership, its transaction, the answer's re-read)
 * takes a connection of the pools kept for writes. Reads saturating their own pools then cannot
 * queue a write behind them (see createSequelize and the session store).
 */
export const markWriteRequests: RequestHandler = (req, _res, next) => {
  if (readMethods.has(req.method)) return next();
  writing.run(true, next);
};

/** True inside a request marked by markWriteRequests. */
export const inWriteRequest = (): boolean => writing.getStore() === true;
