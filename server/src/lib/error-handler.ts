import type { ErrorRequestHandler } from 'express';
import { z } from 'zod';
import { databaseAnswer } from '../db/sequelize';
import { AppError } from './errors';
import { fieldsOf } from './http';
import { log } from './logger';

export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  let database: AppError | null;
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
  } else if ((database = databaseAnswer(error))) {
    status = database.status;
    body = { code: database.code, message: database.message };
    if (database.headers) res.set(database.headers);
    log.error(database.code === 'busy' ? 'db.pool_busy' : 'db.unavailable', { path: req.path });
  } else {
    log.error('http.unhandled', { method: req.method, path: req.path, error: error?.stack ?? String(error) });
  }
  if (res.headersSent) return;
  res.status(status).json({ error: body });
};
