import bcrypt from 'bcryptjs';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { User } from '../db/models';

/** A passport instance of our own (not the global one), so every app built in a test is separate. */
export function createPassport() {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
        if (!user || !(await bcrypt.compare(password, user.passwordHash))) return done(null, false);
        return done(null, user);
      } catch (err) {
        return done(err);
      }
    }),
  );
  passport.serializeUser((user, done) => done(null, (user as User).id));
  passport.deserializeUser(async (id: number, done) => {
    try {
      done(null, (await User.findByPk(id)) ?? false);
    } catch (err) {
      done(err);
    }
  });
  return passport;
}
