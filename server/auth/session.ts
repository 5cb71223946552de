import type { RequestHandler } from 'express';
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import pg from 'pg';
import type { Logger } from 'pino';
import { addDatabaseTime } from '../db/database-time';
import { inWriteRequest } from '../db/request-kind';

declare module 'express-session' {
  interface SessionData {
    csrfIssued?: boolean;
    /** When the person signed in (ms since the epoch): the absolute lifetime counts from here. */
    signedInAt?: number;
    userAgent?: string;
    ip?: string;
    /** A right password waiting for its second step (who, and since when). */
    twoFactorPending?: { userId: string; since: number };
    /** This sign-in passed the second step, or set it up. */
    twoFactorVerified?: boolean;
    /** A new authenticator secret waiting for its first code. */
    totpSetupSecret?: string;
  }
}

/** Idle timeout (the cookie rolls with each request) and the absolute lifetime of a sign-in. */
export const sessionIdleMs = 12 * 60 * 60_000;
export const sessionAbsoluteMs = 7 * 24 * 60 * 60_000;

/**
 * Ends a signed-in session older than the absolute lifetime, however active it was (and one that
 * never recorded when it started). The request goes on signed out: guarded routes answer 401.
 */
export function enforceSessionLifetime(absoluteMs = sessionAbsoluteMs): RequestHandler {
  return async (req, _res, next) => {
    const signedInAt = req.session?.signedInAt;
    if (req.user && (!signedInAt || Date.now() - signedInAt > absoluteMs)) {
      await new Promise<void>((resolve, reject) =>
        req.session.regenerate((error) => (error ? reject(error) : resolve())),
      );
      req.user = undefined;
    }
    next();
  };
}

/** Session store connections per process: for read requests, and kept for requests that write. */
export const defaultSessionPools = { read: 5, write: 2 };

/** How often a session in active use has its expiry moved in the store (the idle timeout is 12 hours). */
const touchEveryMs = 5 * 60_000;

/**
 * express-session touches the store after every request of a signed-in person to move the
 * expiry: an UPDATE (and a WAL flush) per request, the largest share of a read's database work.
 * This moves it at most every five minutes per session and process, so the idle timeout ends up
 * to five minutes early, never late. Sessions touched recently are remembered in this process only
 * (a bounded map; another instance touches on its own schedule), so nothing here is shared state.
 */
function throttleTouches(store: session.Store): void {
  const touchedAt = new Map<string, number>();
  const remember = (sid: string) => {
    if (touchedAt.size >= 50_000) touchedAt.clear();
    touchedAt.set(sid, Date.now());
  };
  const touch = store.touch!.bind(store);
  const set = store.set.bind(store);
  const destroy = store.destroy.bind(store);
  store.touch = (sid, data, callback) => {
    const last = touchedAt.get(sid);
    if (last !== undefined && Date.now() - last < touchEveryMs) return callback?.();
    remember(sid);
    touch(sid, data, callback);
  };
  store.set = (sid, data, callback) => {
    remember(sid);
    set(sid, data, callback);
  };
  store.destroy = (sid, callback) => {
    touchedAt.delete(sid);
    destroy(sid, callback);
  };
}

/**
 * express-session with sessions kept in PostgreSQL (the "sessions" table, made by a migration).
 * Cookies are httpOnly and SameSite=Lax, and Secure when the app runs behind TLS.
 */
export function createSessionMiddleware(options: {
  databaseUrl: string;
  secret: string;
  secure: boolean;
  logger: Logger;
  /** Connections for the session rows of read requests, and of requests that write (default 5 and 2). */
  pools?: { read: number; write: number };
}) {
  const PgStore = connectPgSimple(session);
  const sizes = options.pools ?? defaultSessionPools;
  const pools = [sizes.read, sizes.write].map((max) => {
    const pool = new pg.Pool({ connectionString: options.databaseUrl, max, connectionTimeoutMillis: 10_000 });
    // An idle connection cut by a database restart or pg_terminate_backend is reported here; without
    // a listener it would end the process. The pool drops that client and connects anew next time.
    pool.on('error', (error) => options.logger.warn({ err: error }, 'session store lost a database connection'));
    return pool;
  }) as [pg.Pool, pg.Pool];
  const timed = options.logger.isLevelEnabled('debug');
  // The store only calls query(); a request that writes (server/db/request-kind.ts) gets its own
  // small pool, so its session row is not read behind a queue of reads.
  const pool = {
    async query(...args: unknown[]) {
      const chosen = inWriteRequest() ? pools[1] : pools[0];
      const query = chosen.query.bind(chosen) as (...args: unknown[]) => Promise<unknown>;
      if (!timed) return query(...args);
      // The store's reads and writes count into the request's database time, like Sequelize's queries.
      const started = performance.now();
      try {
        return await query(...args);
      } finally {
        addDatabaseTime(performance.now() - started);
      }
    },
  } as unknown as pg.Pool;
  const cookieName = options.secure ? '__Host-halflight.sid' : 'halflight.sid';
  const store = new PgStore({
    pool,
    tableName: 'sessions',
    createTableIfMissing: false,
    pruneSessionInterval: 15 * 60,
    errorLog: (message: string, error?: unknown) => options.logger.warn({ err: error }, message),
  });
  throttleTouches(store);
  const middleware = session({
    name: cookieName,
    secret: options.secret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: options.secure, maxAge: sessionIdleMs, path: '/' },
  });
  return {
    middleware,
    cookieName,
    async close() {
      store.close();
      await Promise.all(pools.map((each) => each.end()));
    },
  };
}
