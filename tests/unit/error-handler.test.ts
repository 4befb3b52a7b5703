// What the error handler answers when the database is away and when its pool is only full.
import express from 'express';
import request from 'supertest';
import { ConnectionAcquireTimeoutError, ConnectionRefusedError } from 'sequelize';
import { describe, expect, test } from 'vitest';
import { errorHandler } from '../../server/src/lib/error-handler';

function appThrowing(error: Error) {
  const app = express();
  app.get('/boom', () => {
    throw error;
  });
  app.use(errorHandler);
  return app;
}

describe('the error handler, for the database', () => {
  test('when every pooled connection stays in use for the whole wait, then 503 says Sporewell is busy, with a short Retry-After', async () => {
    const res = await request(appThrowing(new ConnectionAcquireTimeoutError(new Error('Operation timeout')))).get('/boom');
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('busy');
    expect(res.body.error.message).toMatch(/busy/);
    expect(res.headers['retry-after']).toBe('2');
  });

  test('when the database refuses connections, then 503 says it cannot be reached, with Retry-After', async () => {
    const res = await request(appThrowing(new ConnectionRefusedError(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' })))).get('/boom');
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('database_unavailable');
    expect(res.headers['retry-after']).toBe('5');
  });
});
