import type { ErrorRequestHandler } from 'express';
import { z } from 'zod';
import { isConnectionError } from '../db/sequelize';
import { AppError } from './errors';
import { fieldsOf } from './http';
import { log } from './logger';

export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  let status = 500;
  let body: { code: string; message: string; fields?: Record<string, string> } = {
    code: 'server_error',
    message: 'Something went wrong on our side. Try again in a moment.',
  };
  if (error instanceof AppError) {
    status = error.status;
    body = { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) };
    if (error.headers) res.set(error.headers);
    if (status === 401 || status === 403) log.security('access.refused', { status, code: error.code, method: req.method, path: req.path, userId: req.user?.id, ip: req.ip });
  } else if (error instanceof z.ZodError) {
    status = 400;
    body = { code: 'invalid_input', message: 'Some of what you sent needs fixing.', fields: fieldsOf(error) };
  } else if (error?.type === 'entity.too.large' || error?.code === 'LIMIT_FILE_SIZE') {
    status = 413;
    body = { code: 'too_large', message: 'That is more than Sporewell accepts in one go.' };
  } else if (error?.type === 'entity.parse.failed') {
    status = 400;
    body = { code: 'malformed_json', message: 'The body is not valid JSON.' };
  } else if (typeof error?.status === 'number' && error.status >= 400 && error.status < 500 && error.expose) {
    status = error.status;
    body = { code: 'bad_request', message: String(error.message) };
  } else if (error?.name === 'SequelizeConnectionAcquireTimeoutError') {
    // Every connection of the pool was in use for the whole wait: the database is there, Sporewell
    // is just busy (the same answer a socket gets, realtime/thread-handlers.ts).
    status = 503;
    body = { code: 'busy', message: 'Sporewell is very busy just now. Try again in a moment.' };
    res.set('Retry-After', '2');
    log.error('db.pool_busy', { path: req.path });
  } else if (isConnectionError(error)) {
    status = 503;
    body = { code: 'database_unavailable', message: 'Sporewell cannot reach its database just now. Try again in a few seconds.' };
    res.set('Retry-After', '5');
    log.error('db.unavailable', { path: req.path });
  } else {
    log.error('http.unhandled', { method: req.method, path: req.path, error: error?.stack ?? String(error) });
  }
  if (res.headersSent) return;
  res.status(status).json({ error: body });
};
