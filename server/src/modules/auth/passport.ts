import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
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
  // Loaded fresh on every request, so a role change or a disabled account takes effect at once.
  passport.deserializeUser((id: number, done) => {
    usersRepository.findById(Number(id)).then(
      (user) => done(null, user && !user.disabled ? user : false),
      (error) => done(error),
    );
  });
  return passport;
}
