import type { IncomingMessage } from 'node:http';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { Member } from '../db/models/index.ts';
import { decoyHash, verifyPassword } from './passwords.ts';
import { takeSignedInMember } from './session.ts';

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
  // The session store has usually read the member already, in the same statement as the session.
  passport.deserializeUser(async (req: IncomingMessage, id: string, done: (err: unknown, user?: Express.User | false) => void) => {
    try {
      const member = takeSignedInMember(req, id) ?? (await Member.findByPk(id));
      done(null, member && member.active ? member : false);
    } catch (err) {
      done(err);
    }
  });
  return passport;
}
