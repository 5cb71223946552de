import type { RequestHandler } from 'express';
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import pg from 'pg';
import type { Logger } from 'pino';
import { addDatabaseTime } from '../db/database-time';
import { fixedStatementOf } from '../db/select-rows';
import { readWithSessionFor, type ReadWithSession } from './read-with-session';
import { endUnchangedSessionsPlainly } from './unchanged-session-end';
import { rememberVerifiedSessionCookies } from './verified-session-cookies';

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
    /** When the idle expiry last moved (ms since the epoch); see slidingExpiry. */
    activeAt?: number;
  }
}

/** Idle timeout (it slides with use, see slidingExpiry) and the absolute lifetime of a sign-in. */
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

/** Session store connections per process: for its SELECTs (session reads), and for its writes. */
export const defaultSessionPools = { read: 5, write: 2 };

/** How often a session in active use has its expiry moved (the idle timeout is 12 hours). */
export const sessionSlideEveryMs = 5 * 60_000;

type StoredSession = session.Session & Partial<session.SessionData>;

/** The session's own fields, without its cookie and the slide mark: what a slide leaves alone. */
const fieldsOf = (sess: StoredSession) => {
  const { cookie: _cookie, activeAt: _activeAt, ...rest } = sess;
  return JSON.stringify(rest);
};

/**
 * The idle timeout slides, but not on every request: a rolling cookie costs a Set-Cookie on every
 * answer and (with express-session's touch) a store write per request, the largest share of a
 * read's database work. Instead the expiry moves when the stored one (kept in the session's own
 * cookie data, so every instance agrees) is more than five minutes old: the mark `activeAt`
 * changes, so express-session saves the session and sends the cookie with the new expiry once.
 * The idle timeout thus ends up to five minutes early, never late. A fresh session costs a read
 * GET nothing beyond reading its row.
 *
 * Such a save only moves the expiry (an UPDATE of an existing row, never an insert, and none of
 * the other fields), so a request that was already running when the session was signed out, ended
 * from another browser or changed by another request cannot bring it back or undo the change.
 */
function slidingExpiry(store: session.Store, pool: pg.Pool): RequestHandler {
  const slideOnly = new WeakMap<object, string>();
  const set = store.set.bind(store);
  store.set = (sid, data, callback) => {
    const sess = data as StoredSession;
    const before = slideOnly.get(sess);
    if (before === undefined || before !== fieldsOf(sess)) return set(sid, data, callback);
    const expires = sess.cookie.expires ?? new Date(Date.now() + sessionIdleMs);
    pool
      .query(
        `UPDATE sessions SET expire = $3,
           sess = jsonb_set(jsonb_set(sess::jsonb, '{cookie}', $2::jsonb), '{activeAt}', to_jsonb($4::bigint))::json
         WHERE sid = $1`,
        [sid, JSON.stringify(sess.cookie), expires, sess.activeAt],
      )
      .then(
        () => callback?.(),
        (error: unknown) => callback?.(error),
      );
  };
  return (req, _res, next) => {
    const sess = req.session as StoredSession | undefined;
    const expires = sess?.cookie.expires;
    // A session made by this request expires a whole idle timeout from now: nothing to move.
    if (sess && expires && expires.getTime() - Date.now() < sessionIdleMs - sessionSlideEveryMs) {
      slideOnly.set(sess, fieldsOf(sess));
      sess.activeAt = Date.now();
    }
    next();
  };
}

/**
 * On a lab route (/api/labs/:labId/…) the session row is read together with the person's membership
 * of that lab (sessionWithMembershipSql), which the access guard then takes instead of asking
 * again (server/middleware/access.ts); on GET /api/session, together with the person's session
 * state (sessionWithStateSql), which the route takes. One round trip less on each (see
 * readWithSessionFor). express-session calls store.get synchronously from its middleware
 * (express-session 1.19, index.js), so the request being served is known at that moment; were
 * that ever not so, the store reads the session alone and the guard or the route asks for its part
 * itself, as on any request this did not read.
 */
function readWithSessionRow(store: session.Store, pool: pg.Pool, sessionMiddleware: RequestHandler) {
  let asking: ReadWithSession | undefined;
  const plainGet = store.get.bind(store);
  store.get = (sid, callback) => {
    const ask = asking;
    asking = undefined;
    if (!ask) return plainGet(sid, callback);
    // connect-pg-simple's expiry test, in whole seconds as it writes it.
    const now = Math.ceil(Date.now() / 1000);
    pool.query(ask.sql.text, [sid, now, ...ask.values]).then(
      (result: pg.QueryResult<{ sess: unknown }>) => {
        const row = result.rows[0];
        if (!row) return callback(null, null);
        let sess: session.SessionData;
        try {
          // node-postgres parses a json column; text is parsed here, and a row that is not JSON is
          // removed, as connect-pg-simple does.
          sess = (typeof row.sess === 'string' ? JSON.parse(row.sess) : row.sess) as session.SessionData;
        } catch {
          return store.destroy(sid, callback);
        }
        ask.remember(row);
        callback(null, sess);
      },
      (error: unknown) => callback(error),
    );
  };
  const middleware: RequestHandler = (req, res, next) => {
    asking = readWithSessionFor(req);
    try {
      sessionMiddleware(req, res, next);
    } finally {
      asking = undefined;
    }
  };
  return middleware;
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
  rememberVerifiedSessionCookies();
  const sizes = options.pools ?? defaultSessionPools;
  const pools = [sizes.read, sizes.write].map((max) => {
    const pool = new pg.Pool({ connectionString: options.databaseUrl, max, connectionTimeoutMillis: 10_000 });
    // An idle connection cut by a database restart or pg_terminate_backend is reported here; without
    // a listener it would end the process. The pool drops that client and connects anew next time.
    pool.on('error', (error) => options.logger.warn({ err: error }, 'session store lost a database connection'));
    return pool;
  }) as [pg.Pool, pg.Pool];
  const timed = options.logger.isLevelEnabled('debug');
  // The store only calls query(). Like Sequelize's pools (server/db/sequelize.ts), its SELECTs take
  // one pool and its writes (a sign-in's insert, a slide, a sign-out) the other, so a write is
  // never queued behind session reads; which request a statement serves is not known here.
  // The store's statements are a few fixed lookups and writes by sid: each runs prepared (see
  // fixedStatementOf), so PostgreSQL does not parse and plan the session read of every request.
  const pool = {
    async query(text: string, values: unknown[] = []) {
      const statement = fixedStatementOf(text);
      const chosen = /^\s*SELECT\b/i.test(text) ? pools[0] : pools[1];
      if (!timed) return chosen.query({ ...statement, values });
      // The store's reads and writes count into the request's database time, like Sequelize's queries.
      const started = performance.now();
      try {
        return await chosen.query({ ...statement, values });
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
    // The expiry moves with slidingExpiry, not with a write after every request.
    disableTouch: true,
    errorLog: (message: string, error?: unknown) => options.logger.warn({ err: error }, message),
  });
  const middleware = [
    readWithSessionRow(
      store,
      pool,
      endUnchangedSessionsPlainly(
        store,
        session({
          name: cookieName,
          secret: options.secret,
          store,
          resave: false,
          saveUninitialized: false,
          rolling: false,
          cookie: { httpOnly: true, sameSite: 'lax', secure: options.secure, maxAge: sessionIdleMs, path: '/' },
        }),
      ),
    ),
    slidingExpiry(store, pool),
  ];
  return {
    middleware,
    cookieName,
    async close() {
      store.close();
      await Promise.all(pools.map((each) => each.end()));
    },
  };
}
