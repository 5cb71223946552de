import { Passport } from 'passport';
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
  // The session row is the proof of sign-in (signing out or ending a session deletes it), so the id
  // is taken as it is: no query per request. Routes that need the person or a lab look them up.
  passport.deserializeUser((id: string, done) => done(null, { id }));
  return passport;
}
