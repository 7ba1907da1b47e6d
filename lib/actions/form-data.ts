import 'server-only';
import { z } from 'zod';
import { AppError } from '../errors';
import { idSchema } from '../validations/log';

/**
 * A form's fields as a plain object for the zod schema, which names any field it refuses. A server action
 * can be called with any serialisable argument: anything but FormData is a 400, never a 500.
 */
export function formFields(input: unknown): Record<string, FormDataEntryValue> {
  if (!(input instanceof FormData)) throw new AppError('validation', 'The form could not be read; reload the page and try again.');
  const out: Record<string, FormDataEntryValue> = {};
  for (const [key, value] of input) if (!key.startsWith('$ACTION')) out[key] = value;
  return out;
}

/** A whole-number field (an id or a version) read from a form; the schema refuses what is not one. */
export function numberField(fields: Record<string, FormDataEntryValue>, name: string): number | string | undefined {
  const raw = fields[name];
  if (typeof raw !== 'string') return raw === undefined ? undefined : String(raw);
  return /^\d{1,15}$/.test(raw.trim()) ? Number(raw.trim()) : raw;
}

/** A row's id from a hidden field; a missing or bad one is a 400 naming the field. */
export function idField(fields: Record<string, FormDataEntryValue>, name: string): number {
  return z.object({ [name]: idSchema(name) }).parse({ [name]: fields[name] })[name] as number;
}
