import type { Request, RequestHandler } from 'express';
import { Passport } from 'passport';
import passportRequest from 'passport/lib/http/request.js';
import { Strategy as LocalStrategy } from 'passport-local';
import { User } from '../models';
import { hashPassword, needsRehash, verifyPassword } from './passwords';

/** One passport instance per app: e-mail + password, the session holding only the user id. */
export function createPassport(): InstanceType<typeof Passport> {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
        const valid = await verifyPassword(password, user?.passwordHash);
        if (valid && user && needsRehash(user.passwordHash)) {
          // An older hash (bcrypt) is replaced by scrypt now that the password is known to be right.
          await user.update({ passwordHash: await hashPassword(password) });
        }
        done(null, valid && user ? { id: user.id } : false);
      } catch (error) {
        done(error);
      }
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  return passport;
}

type SessionPassport = { passport?: { user?: unknown } };

/**
 * What passport.session() does on each request, without its strategy machinery: the session row is
 * the proof of sign-in (signing out or ending a session deletes it), so the id stored at sign-in
 * becomes req.user as it is, with no query. passport.session() runs passport's authenticate for
 * the "session" strategy on every request (a strategy object, half a dozen closures and a
 * deserializer chain each time), about 1.5 % of a read's node time in the read-mix profile.
 *
 * req.logIn / logOut / isAuthenticated (passport's own functions, which passport puts on each
 * request it authenticates) are put once on the app's request prototype instead, with passport's
 * session manager, so signing in (serializeUser above) and out work exactly as with
 * passport.session(). Passport's own check is kept: a request without a session is an error.
 */
export function sessionUser(passport: InstanceType<typeof Passport>, requestPrototype: Request): RequestHandler {
  const sessionManager = (passport as unknown as { _sm: unknown })._sm;
  Object.assign(requestPrototype, {
    login: passportRequest.logIn,
    logIn: passportRequest.logIn,
    logout: passportRequest.logOut,
    logOut: passportRequest.logOut,
    isAuthenticated: passportRequest.isAuthenticated,
    isUnauthenticated: passportRequest.isUnauthenticated,
    _sessionManager: sessionManager,
  });
  return (req, _res, next) => {
    const session = req.session as (typeof req.session & SessionPassport) | undefined;
    if (!session) {
      next(new Error('Login sessions require session support. Did you forget to use `express-session` middleware?'));
      return;
    }
    // passport's session strategy takes any stored user but undefined, null, '' and false.
    const id = session.passport?.user;
    if (id || id === 0) req.user = { id: id as string };
    next();
  };
}
