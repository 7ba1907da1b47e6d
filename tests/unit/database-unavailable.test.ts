// The database out of reach is a 503 with Retry-After, never a 500. The errors are real ones, made by the
// real connector and Sequelize against a port where nothing listens (127.0.0.1:9, the discard port).
import { describe, expect, test } from 'vitest';
import * as mariadb from 'mariadb';
import { Sequelize, UniqueConstraintError, ValidationError } from 'sequelize';
import { ZodError } from 'zod';
import { AppError } from '@/lib/errors';
import { isDatabaseUnavailable, toErrorResponse } from '@/lib/http/errors';

const nowhere = { host: '127.0.0.1', port: 9, user: 'nobody', password: 'x', connectTimeout: 1000 };

async function thrown(p: Promise<unknown>): Promise<unknown> {
  try {
    await p;
  } catch (err) {
    return err;
  }
  throw new Error('expected a failure');
}

describe('database unavailable', () => {
  test('the connector refused a connection (mariadb 3.5: SqlError, ECONNREFUSED)', async () => {
    const err = await thrown(mariadb.createConnection(nowhere));
    expect(isDatabaseUnavailable(err)).toBe(true);
  });

  test('Sequelize could not connect (SequelizeConnectionRefusedError) → 503, Retry-After, a plain message', async () => {
    const s = new Sequelize('none', 'nobody', 'x', { host: '127.0.0.1', port: 9, dialect: 'mariadb', dialectModule: mariadb, logging: false, pool: { acquire: 2000 }, dialectOptions: { connectTimeout: 1000 } });
    const err = await thrown(s.query('SELECT 1'));
    await s.close();
    expect((err as Error).name).toMatch(/^Sequelize/);
    const { status, body, headers } = toErrorResponse(err);
    expect(status).toBe(503);
    expect(headers?.['retry-after']).toMatch(/^\d+$/);
    expect(body.error).toBe('unavailable');
    expect(body.message).toMatch(/try again/i);
    expect(JSON.stringify(body)).not.toMatch(/ECONNREFUSED|127\.0\.0\.1|Sequelize/);
  });

  test('a connection that died under a query (connector errno 45009 ER_SOCKET_UNEXPECTED_CLOSE, fatal), wrapped as Sequelize does', () => {
    const sqlError = Object.assign(new Error('socket has unexpectedly been closed'), { name: 'SqlError', errno: 45009, code: 'ER_SOCKET_UNEXPECTED_CLOSE', fatal: true });
    const wrapped = Object.assign(new Error(sqlError.message), { name: 'SequelizeDatabaseError', parent: sqlError, original: sqlError });
    expect(isDatabaseUnavailable(wrapped)).toBe(true);
    expect(toErrorResponse(wrapped).status).toBe(503);
  });

  test('other errors keep their own answers', () => {
    expect(isDatabaseUnavailable(new UniqueConstraintError({}))).toBe(false);
    expect(toErrorResponse(new UniqueConstraintError({})).status).toBe(409);
    expect(isDatabaseUnavailable(new ValidationError('bad', []))).toBe(false);
    // A syntax error from the server (1064) is our bug, not an outage: a 500.
    const syntax = Object.assign(new Error('You have an error in your SQL syntax'), { name: 'SequelizeDatabaseError', parent: { name: 'SqlError', errno: 1064, fatal: false } });
    expect(isDatabaseUnavailable(syntax)).toBe(false);
    expect(toErrorResponse(syntax).status).toBe(500);
    expect(toErrorResponse(new ZodError([])).status).toBe(400);
    expect(toErrorResponse(new AppError('not_found', 'x')).status).toBe(404);
  });
});
