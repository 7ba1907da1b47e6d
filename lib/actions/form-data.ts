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

const UNSAFE_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/**
 * A form whose fields are named with dots, as react-hook-form names them ('spec.zone', 'readings.0.value'),
 * as nested objects and lists for the zod schema. Runs of numbered keys become lists in their order; a name
 * that clashes with another ('spec' and 'spec.zone') or reaches for an object's prototype is a 400.
 */
export function nestedFields(input: unknown): Record<string, unknown> {
  type Node = { [key: string]: Node | FormDataEntryValue };
  const root: Node = {};
  const refuse = (name: string) => new AppError('validation', `The form field “${name.slice(0, 60)}” could not be read; reload the page and try again.`);
  for (const [name, value] of Object.entries(formFields(input))) {
    const path = name.split('.');
    if (path.some((key) => key === '' || UNSAFE_KEYS.has(key))) throw refuse(name);
    let node = root;
    for (const [i, key] of path.entries()) {
      const last = i === path.length - 1;
      const here = Object.hasOwn(node, key) ? node[key] : undefined;
      if (last) {
        if (here !== undefined) throw refuse(name);
        node[key] = value;
      } else {
        if (here !== undefined && (typeof here === 'string' || here instanceof Blob)) throw refuse(name);
        node = (here as Node | undefined) ?? (node[key] = {});
      }
    }
  }
  const listed = (node: Node | FormDataEntryValue): unknown => {
    if (typeof node === 'string' || node instanceof Blob) return node;
    const keys = Object.keys(node);
    const numbered = keys.length > 0 && keys.every((k) => /^\d{1,4}$/.test(k));
    if (numbered) return keys.sort((a, b) => Number(a) - Number(b)).map((k) => listed(node[k]!));
    return Object.fromEntries(keys.map((k) => [k, listed(node[k]!)]));
  };
  return listed(root) as Record<string, unknown>;
}
