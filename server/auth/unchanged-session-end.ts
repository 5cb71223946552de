import type { RequestHandler, Response } from 'express';
import type session from 'express-session';

type StoredSession = session.Session & Partial<session.SessionData>;

/** What express-session's change test compares: the session's own fields, without its cookie. */
const fieldsOf = (sess: StoredSession) => {
  const { cookie: _cookie, ...rest } = sess;
  return JSON.stringify(rest);
};

/**
 * express-session (1.19, index.js) tells whether a session changed by hashing it: once when it is
 * read, once when the headers go out (should the cookie be sent?), and twice more at res.end
 * (should it be saved? touched?): four JSON serialisations through a replacer and four SHA-1s
 * for every signed-in request, nearly all of them reads that change nothing.
 *
 * For a session read from the store, this keeps the fields' JSON as they were read and, at
 * res.end, compares it with their JSON then: when the request kept the same session object under
 * the same id and changed none of its fields (a slide of the expiry sets `activeAt`, a change),
 * express-session would neither send the cookie nor save (and its touch is off, see
 * disableTouch), so the answer goes out through the res.end and res.writeHead it replaced. In any
 * other case (a new, regenerated, destroyed or changed session, headers already sent, or another
 * wrapper of writeHead after express-session's) its own res.end runs as before.
 */
export function endUnchangedSessionsPlainly(store: session.Store, sessionMiddleware: RequestHandler): RequestHandler {
  const readFromStore = new WeakMap<object, StoredSession>();
  const createSession = store.createSession.bind(store);
  store.createSession = (req, data) => {
    const made = createSession(req, data);
    readFromStore.set(req, made);
    return made;
  };
  return (req, res, next) => {
    const plainEnd = res.end;
    const plainWriteHead = res.writeHead;
    sessionMiddleware(req, res, (error?: unknown) => {
      const sess = req.session as StoredSession | undefined;
      if (error || !sess || readFromStore.get(req) !== sess) return next(error);
      const id = req.sessionID;
      const before = fieldsOf(sess);
      const sessionEnd = res.end;
      const sessionWriteHead = res.writeHead;
      res.end = function end(this: Response, ...args: unknown[]) {
        const unchanged =
          !res.headersSent &&
          res.writeHead === sessionWriteHead &&
          req.session === sess &&
          req.sessionID === id &&
          fieldsOf(sess) === before;
        if (!unchanged) return (sessionEnd as (...all: unknown[]) => Response).apply(this, args);
        res.writeHead = plainWriteHead;
        return (plainEnd as (...all: unknown[]) => Response).apply(this, args);
      } as Response['end'];
      next();
    });
  };
}
