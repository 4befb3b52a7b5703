import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Request } from 'express';
import { sessionUserOf } from '../../lib/session';
import { usersRepository } from '../users/users.repository';
import { authenticate } from './auth.service';

let configured = false;

export function configurePassport(): typeof passport {
  if (configured) return passport;
  configured = true;
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', passReqToCallback: true, session: true }, (req, email, password, done) => {
      authenticate({ email, password }, req.ip).then(
        (user) => done(null, user),
        (error) => done(error),
      );
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  // Fresh on every request, so a role change or a disabled account takes effect at once: the
  // session store reads the user together with the session row (lib/session.ts); only a
  // session that came some other way is looked up here.
  passport.deserializeUser((req: Request, id: number, done: (error: unknown, user?: Express.User | false) => void) => {
    const read = sessionUserOf(req);
    if (read !== undefined && (read === null || read.id === Number(id))) return done(null, read && !read.disabled ? read : false);
    usersRepository.findById(Number(id)).then(
      (user) => done(null, user && !user.disabled ? user : false),
      (error) => done(error),
    );
  });
  return passport;
}
