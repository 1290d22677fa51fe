import express from 'express';
import request from 'supertest';
import { ConnectionAcquireTimeoutError, DatabaseError } from 'sequelize';
import { errorHandler } from '@/server/http/error-handler';

/** An app whose one route throws `error`, answered by the one error middleware. */
const throwing = (error: () => unknown) => {
  const app = express();
  app.use(express.json());
  app.post('/x', () => {
    throw error();
  });
  app.use(errorHandler);
  return app;
};

/** What the pg driver puts on a failed query, as Sequelize wraps it. */
const pgError = (code: string, extra: Record<string, unknown> = {}) =>
  new DatabaseError(Object.assign(new Error(`pg error ${code}`), { code, sql: 'SELECT 1', parameters: [], ...extra }) as never);

describe('errorHandler: database conditions become answers a client can act on', () => {
  it('answers a pool acquire timeout with 503 busy and Retry-After', async () => {
    const res = await request(throwing(() => new ConnectionAcquireTimeoutError(new Error('timeout')))).post('/x');
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('busy');
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('answers lock_not_available (a NOWAIT lock held by another writer) with 409 busy', async () => {
    const res = await request(throwing(() => pgError('55P03'))).post('/x');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('busy');
  });

  it('answers numeric_value_out_of_range with 400, not 500', async () => {
    const res = await request(throwing(() => pgError('22003'))).post('/x');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
  });

  it('still answers an unknown failure with a generic 500', async () => {
    const spy = jest.spyOn(console, 'error').mockImplementation(() => {});
    const res = await request(throwing(() => new Error('boom'))).post('/x');
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('internal');
    spy.mockRestore();
  });
});
