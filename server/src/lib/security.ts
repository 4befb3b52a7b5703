// Headers and cross-site checks (ASVS 3.4, 3.5, 14.4). SameSite=Lax cookies already keep a
// cross-site POST from carrying the session; on top of that, any state-changing request whose
// Origin (or Sec-Fetch-Site) says it came from another site is refused, and JSON routes accept
// only JSON bodies, so a plain HTML form or a text/plain POST can change nothing.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import helmet from 'helmet';
import { AppError } from './errors';

/** `hsts`: the public address is https, so browsers are told to use nothing else for it. */
export function securityHeaders({ hsts }: { hsts: boolean }): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'"],
        'connect-src': ["'self'"],
        'worker-src': ["'self'", 'blob:'],
        'object-src': ["'none'"],
        'base-uri': ["'none'"],
        'frame-ancestors': ["'none'"],
        'form-action': ["'self'"],
      },
    },
    referrerPolicy: { policy: 'same-origin' },
    crossOriginEmbedderPolicy: false,
    // 180 days, this host only: a deployment's other subdomains are not ours to bind to https.
    strictTransportSecurity: hsts ? { maxAge: 180 * 24 * 3600, includeSubDomains: false } : false,
  });
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export function allowedOrigins(publicUrl: string, req: Request): Set<string> {
  const origins = new Set<string>([new URL(publicUrl).origin]);
  const host = req.headers.host;
  if (host) {
    origins.add(`http://${host}`);
    origins.add(`https://${host}`);
  }
  return origins;
}

export function crossSiteGuard(publicUrl: string): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const origin = req.headers.origin;
    if (origin && !allowedOrigins(publicUrl, req).has(origin)) {
      return next(new AppError(403, 'cross_site', 'Requests from other sites are not accepted.'));
    }
    if (!origin && req.headers['sec-fetch-site'] === 'cross-site') {
      return next(new AppError(403, 'cross_site', 'Requests from other sites are not accepted.'));
    }
    next();
  };
}

/** Bodies on /api must be JSON, except the upload routes, which are multipart. */
export function jsonOnly(): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method) || req.method === 'DELETE') return next();
    const length = Number(req.headers['content-length'] ?? 0);
    const chunked = req.headers['transfer-encoding'] !== undefined;
    if (!length && !chunked) return next();
    if (req.is('application/json')) return next();
    if (req.is('multipart/form-data') && /\/photos$/.test(req.path)) return next();
    next(new AppError(415, 'unsupported_media_type', 'Send the body as JSON (Content-Type: application/json).'));
  };
}
