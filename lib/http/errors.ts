// The one error type the app raises on purpose, and the one map from errors to HTTP statuses.
import { ZodError } from 'zod';

export type ErrorCode =
  | 'validation'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'too_large'
  | 'unsupported_media_type'
  | 'rate_limited'
  | 'internal';

const STATUS: Record<ErrorCode, number> = {
  validation: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  internal: 500,
};

export type FieldErrors = Record<string, string[]>;

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fieldErrors?: FieldErrors,
  ) {
    super(message);
    this.name = 'AppError';
  }
  get status(): number {
    return STATUS[this.code];
  }
}

export const unauthenticated = (what = 'do that') => new AppError('unauthenticated', `Sign in to ${what}.`);
export const forbidden = (why = 'You are not allowed to do that.') => new AppError('forbidden', why);
export const notFound = (what = 'That page') => new AppError('not_found', `${what} was not found.`);

export function fieldErrorsOf(error: ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function validationError(error: ZodError): AppError {
  const fields = fieldErrorsOf(error);
  const named = Object.keys(fields).filter((k) => k !== '_');
  const message = named.length
    ? `Please check ${named.join(', ')}: ${Object.values(fields)[0][0]}`
    : Object.values(fields)[0]?.[0] ?? 'The request was not understood.';
  return new AppError('validation', message, fields);
}

export type ErrorBody = { error: ErrorCode; message: string; fieldErrors?: FieldErrors };

/** Turns anything thrown into a status and a body that leaks nothing of the server's insides. */
export function toErrorResponse(err: unknown): { status: number; body: ErrorBody } {
  if (err instanceof ZodError) err = validationError(err);
  if (err instanceof AppError) {
    return { status: err.status, body: { error: err.code, message: err.message, ...(err.fieldErrors ? { fieldErrors: err.fieldErrors } : {}) } };
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
