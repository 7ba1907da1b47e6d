// The one map from errors to HTTP statuses and bodies, at the edge; the error type itself is lib/errors.ts.
import { ZodError } from 'zod';
import { AppError, validationError, type ErrorCode, type FieldErrors } from '../errors';

const STATUS_OF_CODE: Record<ErrorCode, number> = {
  validation: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  unavailable: 503,
  internal: 500,
};

export type ErrorBody = { error: ErrorCode; message: string; fieldErrors?: FieldErrors };

// ── The database out of reach ────────────────────────────────────────────────────────────────
// Sequelize's connection errors (refused, timed out, no connection from the pool in time), and a query
// whose connection died under it (the connector marks those fatal; MariaDB's shutdown, killed and gone-away
// numbers; the connector's own 45xxx socket and pool numbers). Pure duck typing: no database import here.
const UNAVAILABLE_ERRNOS = new Set([1040, 1053, 1927, 2002, 2003, 2006, 2013, 45001, 45009, 45012, 45013, 45019, 45026, 45027, 45028, 45035, 45037, 45060, 45061]);
const UNAVAILABLE_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'PROTOCOL_CONNECTION_LOST']);

/** Seconds a client is told to wait before trying again while the database is out of reach. */
export const DATABASE_RETRY_AFTER_SECONDS = 5;

type MaybeDbError = { name?: unknown; errno?: unknown; code?: unknown; fatal?: unknown; parent?: unknown; original?: unknown };

export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (typeof err !== 'object' || err === null || depth > 3) return false;
  const e = err as MaybeDbError;
  if (typeof e.name === 'string' && /^Sequelize(Connection\w*|HostNot\w*|InvalidConnection|AccessDenied)Error$/.test(e.name)) return true;
  if (typeof e.errno === 'number' && UNAVAILABLE_ERRNOS.has(e.errno)) return true;
  if (typeof e.code === 'string' && UNAVAILABLE_CODES.has(e.code)) return true;
  if (e.fatal === true && e.name === 'SqlError') return true;
  return isDatabaseUnavailable(e.parent, depth + 1) || (e.original !== e.parent && isDatabaseUnavailable(e.original, depth + 1));
}

export const databaseUnavailable = () =>
  new AppError('unavailable', 'Scribeline cannot reach its database just now, so nothing was saved. Please try again in a few seconds.');

/** Turns anything thrown into a status and a body that leaks nothing of the server's insides. */
export function toErrorResponse(err: unknown): { status: number; body: ErrorBody; headers?: Record<string, string> } {
  if (err instanceof ZodError) err = validationError(err);
  if (!(err instanceof AppError) && isDatabaseUnavailable(err)) {
    console.warn(`[scribeline] database unavailable: ${err instanceof Error ? err.message.slice(0, 200) : String(err)}`);
    err = databaseUnavailable();
  }
  if (err instanceof AppError && err.code === 'unavailable') {
    return { status: 503, body: { error: err.code, message: err.message }, headers: { 'retry-after': String(DATABASE_RETRY_AFTER_SECONDS) } };
  }
  if (err instanceof AppError) {
    return { status: STATUS_OF_CODE[err.code], body: { error: err.code, message: err.message, ...(err.fieldErrors ? { fieldErrors: err.fieldErrors } : {}) } };
  }
  if (isUniqueConstraintError(err)) {
    return { status: 409, body: { error: 'conflict', message: 'That already exists.' } };
  }
  console.error('[scribeline] unexpected error', err);
  return { status: 500, body: { error: 'internal', message: 'Something went wrong on our side. Please try again.' } };
}

function isUniqueConstraintError(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as { name?: string }).name === 'SequelizeUniqueConstraintError';
}
