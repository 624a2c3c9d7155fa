import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { Member } from '../db/models/index.ts';
import { decoyHash, verifyPassword } from './passwords.ts';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // The signed-in member as passport attaches it to req.user.
    interface User extends Member {}
  }
}

export function configurePassport() {
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const member = await Member.findOne({ where: { email: email.trim().toLowerCase() } });
        const ok = await verifyPassword(member?.passwordHash ?? (await decoyHash()), password);
        done(null, member && ok ? member : false);
      } catch (err) {
        done(err);
      }
    }),
  );
  passport.serializeUser((member, done) => done(null, (member as Member).id));
  passport.deserializeUser(async (id: string, done) => {
    try {
      const member = await Member.findByPk(id);
      done(null, member && member.active ? member : false);
    } catch (err) {
      done(err);
    }
  });
  return passport;
}
