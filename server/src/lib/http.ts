// Small helpers at the HTTP edge: validate with a shared zod schema and keep the parsed value.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { z } from 'zod';
import type { Role } from '../../shared/case-status';
import { AppError, forbidden, unauthorized } from './errors';

export function fieldsOf(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

export function parseOr400<S extends z.ZodType>(schema: S, value: unknown, message = 'Some of what you sent needs fixing.'): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw new AppError(400, 'invalid_input', message, fieldsOf(result.error));
  return result.data;
}

export const idParam = z.coerce.number({ error: 'Not a valid id.' }).int().positive().max(2_147_483_647);

export function parseId(value: unknown, what = 'That'): number {
  const result = idParam.safeParse(value);
  if (!result.success) throw new AppError(404, 'not_found', `${what} was not found.`);
  return result.data;
}

export function requireUser(req: Request): Express.User {
  if (!req.user) throw unauthorized();
  return req.user;
}

export function requireRole(...roles: Role[]): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return next(unauthorized());
    if (!roles.includes(req.user.role)) return next(forbidden());
    next();
  };
}

export const requireSignedIn: RequestHandler = (req, _res, next) => (req.user ? next() : next(unauthorized()));

export const pageQuery = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
