import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import pg from 'pg';

declare module 'express-session' {
  interface SessionData {
    csrfIssued?: boolean;
  }
}

/**
 * express-session with sessions kept in PostgreSQL (the "sessions" table, made by a migration).
 * Cookies are httpOnly and SameSite=Lax, and Secure when the app runs behind TLS.
 */
export function createSessionMiddleware(options: { databaseUrl: string; secret: string; secure: boolean }) {
  const PgStore = connectPgSimple(session);
  const pool = new pg.Pool({ connectionString: options.databaseUrl, max: 4 });
  const cookieName = options.secure ? '__Host-halflight.sid' : 'halflight.sid';
  const store = new PgStore({
    pool,
    tableName: 'sessions',
    createTableIfMissing: false,
    pruneSessionInterval: 15 * 60,
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
