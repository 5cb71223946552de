import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import pg from 'pg';
import type { Logger } from 'pino';

declare module 'express-session' {
  interface SessionData {
    csrfIssued?: boolean;
  }
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
}) {
  const PgStore = connectPgSimple(session);
  const pool = new pg.Pool({ connectionString: options.databaseUrl, max: 4, connectionTimeoutMillis: 10_000 });
  // An idle connection cut by a database restart or pg_terminate_backend is reported here; without
  // a listener it would end the process. The pool drops that client and connects anew next time.
  pool.on('error', (error) => options.logger.warn({ err: error }, 'session store lost a database connection'));
  const cookieName = options.secure ? '__Host-halflight.sid' : 'halflight.sid';
  const store = new PgStore({
    pool,
    tableName: 'sessions',
    createTableIfMissing: false,
    pruneSessionInterval: 15 * 60,
    errorLog: (message: string, error?: unknown) => options.logger.warn({ err: error }, message),
  });
  const middleware = session({
    name: cookieName,
    secret: options.secret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: options.secure, maxAge: 12 * 60 * 60_000, path: '/' },
  });
  return {
    middleware,
    cookieName,
    async close() {
      store.close();
      await pool.end();
    },
  };
}
