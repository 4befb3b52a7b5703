// Builds the Express app: middleware, routers, 404 and the error handler. No listen here, so
// tests can import it.
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import compression from 'compression';
import expressStaticGzip from 'express-static-gzip';
import express, { type Express, type NextFunction, type Request, type RequestHandler, type Response } from 'express';
import type { AppContext } from './context';
import { renderShell, shellTemplate, type ShellData } from './lib/client-shell';
import { errorHandler } from './lib/error-handler';
import { AppError, notFound } from './lib/errors';
import { crossSiteGuard, jsonOnly, securityHeaders } from './lib/security';
import { pastAbsoluteLimit } from './lib/session';
import { authRouter } from './modules/auth/auth.router';
import { batchesRouter } from './modules/batches/batches.router';
import { casesRouter } from './modules/cases/cases.router';
import { libraryRouter } from './modules/library/library.router';
import { mentorsRouter } from './modules/mentors/mentors.router';
import { mentorApplicationsRouter } from './modules/mentor-applications/mentor-applications.router';
import { moderationRouter } from './modules/moderation/moderation.router';
import { threadsRouter } from './modules/threads/threads.router';
import { toPublicUser } from './modules/auth/auth.service';
import { configurePassport } from './modules/auth/passport';
import { healthRouter } from './modules/health/health.router';
import { stewardRouter } from './modules/steward/steward.router';
import { vocabularyRouter } from './modules/vocabulary/vocabulary.router';

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const CLIENT_DIST = path.join(projectRoot, 'dist/client');

export function buildApp(ctx: AppContext): Express {
  const { config } = ctx;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.TRUST_PROXY ? 1 : false);
  app.set('query parser', 'extended');

  app.use(securityHeaders({ hsts: config.secureCookies }));
  // Growers are often on weak rural connections: compress text responses (JSON, the HTML shell;
  // the built scripts and stylesheets go as the build's own brotli or gzip copies, serveClient).
  app.use(compression());

  const api = express.Router();
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.use(crossSiteGuard(config.publicUrl));
  api.use(jsonOnly());
  api.use(express.json({ limit: '100kb', strict: true }));
  const passport = configurePassport();
  // Who is signed in: for the API, and for the HTML shell, which carries the person to the client.
  const session: RequestHandler[] = [
    ctx.sessions.middleware,
    absoluteSessionTimeout(config.SESSION_ABSOLUTE_HOURS),
    passport.initialize(),
    passport.session(),
  ];
  api.use(session);

  api.use('/health', healthRouter());
  api.use('/vocabulary', vocabularyRouter());
  api.use('/auth', authRouter(ctx));
  api.use('/steward', stewardRouter(ctx));
  api.use('/cases', threadsRouter(ctx));
  api.use('/cases', casesRouter(ctx));
  api.use('/library', libraryRouter(ctx));
  api.use(batchesRouter(ctx));
  api.use(mentorsRouter(ctx));
  api.use(mentorApplicationsRouter(ctx));
  api.use(moderationRouter(ctx));
  api.use((req, _res, next) => next(new AppError(404, 'not_found', `There is no ${req.method} ${req.baseUrl}${req.path}.`)));
  app.use('/api', api);

  serveClient(app, session);
  app.use((_req, _res, next) => next(notFound('That page')));
  app.use(errorHandler);
  return app;
}

function absoluteSessionTimeout(hours: number) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (pastAbsoluteLimit(req.session?.startedAt, hours)) {
      return req.session.destroy(() => {
        // A fresh, empty session object stands in for the rest of this request.
        (req as { user?: unknown }).user = undefined;
        req.sessionStore.generate(req);
        next();
      });
    }
    next();
  };
}

function serveClient(app: Express, session: RequestHandler[]): void {
  const template = shellTemplate(path.join(CLIENT_DIST, 'index.html'));
  // The build's brotli or gzip copy of a script or stylesheet (vite.config.ts, precompress), as
  // the browser accepts. express-static-gzip lists the copies once, so it is made again when a
  // build has replaced the client (index.html's time changes; the build touches it after the
  // copies are written). A file without a copy goes out through compression() like any answer.
  const assets = path.join(CLIENT_DIST, 'assets');
  const indexFile = path.join(CLIENT_DIST, 'index.html');
  let precompressed: { builtAt: number; serve: RequestHandler } | null = null;
  app.use('/assets', (req, res, next) => {
    let builtAt = 0;
    try {
      builtAt = fs.statSync(indexFile).mtimeMs;
    } catch {
      // not built yet: nothing to list
    }
    if (!precompressed || precompressed.builtAt !== builtAt) {
      precompressed = {
        builtAt,
        serve: expressStaticGzip(assets, {
          enableBrotli: true,
          orderPreference: ['br', 'gzip'],
          index: false,
          serveStatic: { immutable: true, maxAge: '1y', index: false, fallthrough: true },
        }),
      };
    }
    precompressed.serve(req, res, next);
  });
  app.use(express.static(CLIENT_DIST, { index: false, maxAge: '1h' }));
  // The SPA's own routes (e.g. /cases/42) get the client on a deep link.
  app.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/api/') || req.path.startsWith('/uploads/') || req.path.startsWith('/assets/') || path.extname(req.path)) return next();
    const html = template();
    if (html === null) {
      res.status(503).type('text/plain').send('The client is not built yet. Run `npm run build`.');
      return;
    }
    void readShellData(req, res, session).then((data) => {
      // The page names the person, so no cache may keep it (nor show it after a sign-out).
      res.set('Cache-Control', 'no-store').type('html').send(renderShell(html, data));
    });
  });
}

/** Runs the session middleware for one page request; a session that cannot be read (the
 * database away) gives undefined, and the client then asks the API itself. */
function readShellData(req: Request, res: Response, session: RequestHandler[]): Promise<ShellData | undefined> {
  return new Promise((resolve) => {
    const step = (i: number) => (error?: unknown) => {
      if (error) return resolve(undefined);
      if (i === session.length) return resolve({ user: req.user ? toPublicUser(req.user) : null });
      try {
        void session[i](req, res, step(i + 1));
      } catch {
        resolve(undefined);
      }
    };
    step(0)();
  });
}
