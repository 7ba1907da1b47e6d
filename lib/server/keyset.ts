import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { AppError } from '../errors';

/**
 * Keyset paging: a page is the rows after the last one shown, in the list's own order, read through an
 * index, so page 400 costs what page 1 costs. The cursor is the last row's sort key and id as base64url JSON:
 * opaque to clients, read back strictly; one that cannot be read is a 400 naming its field (`after` by default).
 */

type Cursor = { key: Date | number; id: number };

const MAX_CURSOR_CHARS = 120;

/** The cursor of a row: its sort key (a time, or a number such as a position) and its id. */
function writeCursor(c: Cursor): string {
  const k = c.key instanceof Date ? `t:${c.key.toISOString()}` : c.key;
  return Buffer.from(JSON.stringify({ k, id: c.id })).toString('base64url');
}

function unreadable(field: string): AppError {
  return new AppError('validation', `Please check ${field}: that page could not be read.`, { [field]: ['Start again from the first page.'] });
}

/**
 * Reads `after` as the cursor of a list sorted by a time (`keyKind: 'time'`) or a number; null for no cursor
 * (the first page). Anything else that is not one of our cursors is a 400 naming `field`.
 */
export function readCursor(after: unknown, keyKind: 'time' | 'number', field = 'after'): Cursor | null {
  if (after === undefined || after === null || after === '') return null;
  if (typeof after !== 'string' || after.length > MAX_CURSOR_CHARS || !/^[A-Za-z0-9_-]+$/.test(after)) throw unreadable(field);
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(after, 'base64url').toString('utf8'));
  } catch {
    throw unreadable(field);
  }
  const { k, id } = (parsed ?? {}) as { k?: unknown; id?: unknown };
  if (typeof id !== 'number' || !Number.isSafeInteger(id) || id <= 0) throw unreadable(field);
  if (keyKind === 'number') {
    if (typeof k !== 'number' || !Number.isSafeInteger(k)) throw unreadable(field);
    return { key: k, id };
  }
  if (typeof k !== 'string' || !k.startsWith('t:')) throw unreadable(field);
  const t = new Date(k.slice(2));
  if (Number.isNaN(t.getTime())) throw unreadable(field);
  return { key: t, id };
}

/**
 * The where-fragment for "after this cursor" on (column, id): ascending lists take the rows with a greater
 * key (or the same key and a greater id), descending ones the smaller.
 */
export function afterCursor(column: string, cursor: Cursor | null, direction: 'ASC' | 'DESC'): WhereOptions {
  if (!cursor) return {};
  const op = direction === 'ASC' ? Op.gt : Op.lt;
  return { [Op.or]: [{ [column]: { [op]: cursor.key } }, { [column]: cursor.key, id: { [op]: cursor.id } }] };
}

/** Rows read with `limit: size + 1`: the page, and the cursor of its last row when more follow. */
export function pageOf<T extends { id: number }>(rows: T[], size: number, keyOf: (row: T) => Date | number): { items: T[]; nextCursor: string | null } {
  const items = rows.slice(0, size);
  const last = items[items.length - 1];
  return { items, nextCursor: rows.length > size && last ? writeCursor({ key: keyOf(last), id: last.id }) : null };
}

/** A page size asked for in a query (`?limit=`), kept between 1 and the list's maximum; a bad one is a 400 naming `limit`. */
export function readLimit(raw: unknown, fallback: number, max: number): number {
  if (raw === undefined || raw === null || raw === '') return fallback;
  const n = typeof raw === 'number' ? raw : typeof raw === 'string' && /^\d{1,6}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isInteger(n) || n < 1 || n > max) {
    throw new AppError('validation', `Please check limit: it must be a whole number from 1 to ${max}.`, { limit: [`A whole number from 1 to ${max}.`] });
  }
  return n;
}
