// The one error type the app raises on purpose, with its codes and field errors. Which HTTP status each code
// answers with is decided at the edge, in lib/http/errors.ts.
import type { ZodError } from 'zod';

export type ErrorCode =
  | 'validation'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'too_large'
  | 'unsupported_media_type'
  | 'rate_limited'
  | 'unavailable'
  | 'internal';

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
