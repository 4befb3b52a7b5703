import { Router, type Request } from 'express';
import passport from 'passport';
import { z } from 'zod';
import { accountPatchSchema, emailSchema, loginSchema, passwordChangeSchema, passwordSchema, registerSchema } from '../../../shared/auth-schemas';
import type { AppContext } from '../../context';
import { destroyUserSessions, sessionCookieName } from '../../lib/session';
import { AppError } from '../../lib/errors';
import { parseOr400, requireSignedIn, requireUser } from '../../lib/http';
import { log } from '../../lib/logger';
import { sessionEvents } from '../../lib/session-events';
import { usersRepository, type UserRecord } from '../users/users.repository';
import * as auth from './auth.service';

function signIn(req: Request, user: UserRecord): Promise<void> {
  // passport 0.7 regenerates the session id inside req.login (ASVS 7.2.4).
  return new Promise((resolve, reject) =>
    req.login(user, (error) => {
      if (error) return reject(error);
      req.session.startedAt = Date.now();
      req.session.save((saveError) => (saveError ? reject(saveError) : resolve()));
    }),
  );
}

function signOut(req: Request): Promise<void> {
  const sid = req.sessionID;
  return new Promise((resolve, reject) =>
    req.logout((error) => {
      if (error) return reject(error);
      req.session.destroy(() => {
        sessionEvents.emit('session:ended', sid);
        resolve();
      });
    }),
  );
}

export function authRouter(ctx: AppContext): Router {
  const { config } = ctx;
  const router = Router();

  router.post('/register', async (req, res) => {
    const input = parseOr400(registerSchema, req.body);
    const user = await auth.register(input, config.publicUrl);
    ctx.pokeMail();
    await signIn(req, user);
    log.security('auth.registered', { userId: user.id, ip: req.ip });
    res.status(201).json(auth.toPublicUser(user));
  });

  router.post('/login', async (req, res, next) => {
    req.body = parseOr400(loginSchema, req.body);
    passport.authenticate('local', { session: false }, (error: unknown, user: UserRecord | false) => {
      if (error) return next(error);
      if (!user) return next(new AppError(401, 'bad_credentials', 'That e-mail and password do not match.'));
      signIn(req, user).then(() => res.json(auth.toPublicUser(user)), next);
    })(req, res, next);
  });

  router.post('/logout', async (req, res) => {
    if (req.user) log.security('auth.sign_out', { userId: req.user.id });
    if (req.session) await signOut(req);
    res.clearCookie(sessionCookieName(config.secureCookies), { path: '/', httpOnly: true, sameSite: 'lax', secure: config.secureCookies });
    res.status(204).end();
  });

  router.get('/me', (req, res) => {
    res.json(auth.toPublicUser(requireUser(req)));
  });

  router.patch('/me', requireSignedIn, async (req, res) => {
    const { displayName } = parseOr400(accountPatchSchema, req.body);
    const updated = await usersRepository.update(requireUser(req).id, { displayName });
    res.json(auth.toPublicUser(updated ?? requireUser(req)));
  });

  // The other sessions end (their sockets too); this one goes on.
  router.post('/password', requireSignedIn, async (req, res) => {
    const input = parseOr400(passwordChangeSchema, req.body);
    const user = requireUser(req);
    await auth.changePassword(user, input, req.ip, config.publicUrl);
    ctx.pokeMail();
    for (const sid of await destroyUserSessions(ctx.sessions.pool, user.id, req.sessionID)) sessionEvents.emit('session:ended', sid);
    res.json({ ok: true });
  });

  router.post('/verify-email', async (req, res) => {
    const { token } = parseOr400(z.object({ token: z.string().min(10).max(200) }), req.body);
    const user = await auth.verifyEmail(token);
    res.json(auth.toPublicUser(user));
  });

  router.post('/verify-email/resend', async (req, res) => {
    await auth.resendVerification(requireUser(req), config.publicUrl);
    ctx.pokeMail();
    res.status(202).json({ ok: true });
  });

  router.post('/password-reset/request', async (req, res) => {
    const { email } = parseOr400(z.object({ email: emailSchema }), req.body);
    await auth.requestPasswordReset(email, config.publicUrl);
    ctx.pokeMail();
    res.status(202).json({ ok: true, message: 'If an account has that e-mail, a reset link is on its way.' });
  });

  router.post('/password-reset', async (req, res) => {
    const { token, password } = parseOr400(z.object({ token: z.string().min(10).max(200), password: passwordSchema }), req.body);
    const user = await auth.resetPassword(token, password);
    await destroyUserSessions(ctx.sessions.pool, user.id);
    sessionEvents.emit('user:sessions-ended', user.id);
    res.json({ ok: true });
  });

  return router;
}
