import 'server-only';
import { AsyncLocalStorage } from 'node:async_hooks';
import type { Transaction } from 'sequelize';
import { QueryTypes } from 'sequelize';
import { cache } from 'react';
import { getSequelize } from '../../db/connection';
import { AppError } from '../errors';
import { authorizeProject, type Actor, type ProjectAction, type ProjectFacts, type Visibility } from '../auth/policy';
import { builderTag, expireTags, HOME_TAG, NOT_SHOWN_TAG, projectTag } from './cache-tags';

/** Where a piece of the log sits, and the facts the policy needs about its project. */
export type LogScope = {
  projectId: number;
  projectSlug: string;
  projectTitle: string;
  units: 'mm' | 'in';
  sessionId?: number;
  entryId?: number;
  mediaId?: number;
  facts: ProjectFacts;
};

type Target = { projectId: number } | { sessionId: number } | { entryId: number } | { mediaId: number } | { noteId: number };

const NAMES: Record<string, string> = { projectId: 'project', sessionId: 'session', entryId: 'entry', mediaId: 'photo or clip', noteId: 'note' };

type Row = {
  projectId: number;
  slug: string;
  title: string;
  units: 'mm' | 'in';
  ownerId: number;
  visibility: Visibility;
  sessionId: number | null;
  sessionVisibility: Visibility | null;
  entryId: number | null;
  mediaId: number | null;
  mentorIds: string | null;
  follows: number;
};

// From the piece up to its project in one statement: the joins each piece needs, the mentors as a list,
// and whether the actor follows the project or its builder (the policy's follower relation).
const FROM: Record<keyof typeof NAMES, string> = {
  noteId: `time_notes n JOIN media m ON m.id = n.media_id JOIN entries e ON e.id = m.entry_id JOIN shop_sessions s ON s.id = e.session_id JOIN projects p ON p.id = s.project_id WHERE n.id = :id`,
  mediaId: `media m JOIN entries e ON e.id = m.entry_id JOIN shop_sessions s ON s.id = e.session_id JOIN projects p ON p.id = s.project_id WHERE m.id = :id`,
  entryId: `entries e JOIN shop_sessions s ON s.id = e.session_id JOIN projects p ON p.id = s.project_id WHERE e.id = :id`,
  sessionId: `shop_sessions s JOIN projects p ON p.id = s.project_id WHERE s.id = :id`,
  projectId: `projects p WHERE p.id = :id`,
};

// Which of the pieces each kind of target joins (project always).
const JOINED: Record<string, { s: boolean; e: boolean; m: boolean }> = {
  noteId: { s: true, e: true, m: true },
  mediaId: { s: true, e: true, m: true },
  entryId: { s: true, e: true, m: false },
  sessionId: { s: true, e: false, m: false },
  projectId: { s: false, e: false, m: false },
};

function walkColumns(kind: string, actorId: number): [string, string][] {
  const j = JOINED[kind];
  return [
    ['projectId', 'p.id'],
    ['slug', 'p.slug'],
    ['title', 'p.title'],
    ['units', 'p.units'],
    ['ownerId', 'p.owner_id'],
    ['visibility', 'p.visibility'],
    ['sessionId', j.s ? 's.id' : 'NULL'],
    ['sessionVisibility', j.s ? 's.visibility' : 'NULL'],
    ['entryId', j.e ? 'e.id' : 'NULL'],
    ['mediaId', j.m ? 'm.id' : 'NULL'],
    ['mentorIds', "(SELECT GROUP_CONCAT(pm.user_id) FROM project_memberships pm WHERE pm.project_id = p.id AND pm.role = 'mentor')"],
    // actorId is a number from the session, never text from the request.
    ['follows', actorId ? `EXISTS (SELECT 1 FROM follows f WHERE f.user_id = ${Number(actorId)} AND (f.project_id = p.id OR f.builder_id = p.owner_id))` : '0'],
  ];
}

async function walk(kind: string, id: number, actorId: number, transaction?: Transaction): Promise<Row | null> {
  const sql = `SELECT ${walkColumns(kind, actorId).map(([name, expr]) => `${expr} AS ${name}`).join(', ')} FROM ${FROM[kind]}`;
  const rows = await getSequelize().query<Row>(sql, { type: QueryTypes.SELECT, replacements: { id }, transaction });
  return rows[0] ?? null;
}

/**
 * The same walk as one JSON value, for a loader to read along with its own row (a correlated subquery:
 * `idSql` names the outer row's id column, e.g. '`Entry`.`id`'); hand the value to `rememberWalk`.
 */
export function walkSubquery(kind: 'entryId' | 'sessionId', idSql: string, actor: Actor): string {
  const cols = walkColumns(kind, actor?.id ?? 0).map(([name, expr]) => `'${name}', ${expr}`).join(', ');
  return `(SELECT JSON_OBJECT(${cols}) FROM ${FROM[kind].replace(':id', idSql)})`;
}

/** Remembers a walk read by `walkSubquery` for the rest of the request (only outside a transaction). */
export function rememberWalk(kind: 'entryId' | 'sessionId', id: number, actor: Actor, value: unknown): void {
  const memo = memoStore.getStore() ?? renderMemo();
  const key = `${kind}:${id}:${actor?.id ?? 0}`;
  if (memo.has(key)) return;
  const row = typeof value === 'string' ? (JSON.parse(value) as Row) : ((value ?? null) as Row | null);
  memo.set(key, Promise.resolve(row));
}

// Reads outside a transaction are remembered for the rest of the request (a page asks about the same
// entry for its body, records, comments and flags): per React render through cache(), and inside
// withReadMemo() for loaders called elsewhere (route handlers, tests).
const memoStore = new AsyncLocalStorage<Map<string, Promise<Row | null>>>();
const renderMemo = cache(() => new Map<string, Promise<Row | null>>());

/** Runs `fn` with the log walk remembered across its calls. */
export function withReadMemo<T>(fn: () => Promise<T>): Promise<T> {
  return memoStore.getStore() ? fn() : memoStore.run(new Map(), fn);
}

function walkRemembered(kind: string, id: number, actorId: number): Promise<Row | null> {
  const memo = memoStore.getStore() ?? renderMemo();
  const key = `${kind}:${id}:${actorId}`;
  let hit = memo.get(key);
  if (!hit) {
    hit = walk(kind, id, actorId);
    memo.set(key, hit);
    hit.catch(() => memo.delete(key));
  }
  return hit;
}

/**
 * Walks up from a note, media, entry or session to its project (one query), then asks the policy.
 * Missing anything on the way is a 404; so is a private project the actor may not see. A write (any
 * action but 'view' inside a transaction) expires the project's cached public pages once it commits.
 */
export async function authorizeLog(
  actor: Actor,
  action: ProjectAction,
  target: Target,
  transaction?: Transaction,
  /** Facts of the piece acted on that the walk cannot know, e.g. the author of a comment or flag. */
  extra?: Pick<ProjectFacts, 'authorId'>,
): Promise<LogScope> {
  const kind = Object.keys(target)[0];
  const id = (target as Record<string, number>)[kind];
  const notFound = () => new AppError('not_found', `That ${NAMES[kind]} was not found.`);
  if (!Number.isInteger(id) || id <= 0) throw notFound();
  const row = transaction ? await walk(kind, id, actor?.id ?? 0, transaction) : await walkRemembered(kind, id, actor?.id ?? 0);
  if (!row) throw notFound();
  const facts: ProjectFacts = {
    ownerId: row.ownerId,
    visibility: row.visibility,
    mentorIds: row.mentorIds ? row.mentorIds.split(',').map(Number) : [],
    followerIds: actor && Number(row.follows) ? [actor.id] : [],
    ...(row.sessionVisibility ? { sessionVisibility: row.sessionVisibility } : {}),
  };
  authorizeProject(actor, action, { ...facts, ...(extra ?? {}) });
  if (transaction && action !== 'view') expireAfterCommit(transaction, row.projectId, row.ownerId);
  const scope: LogScope = { projectId: row.projectId, projectSlug: row.slug, projectTitle: row.title, units: row.units, facts };
  if (row.sessionId !== null) scope.sessionId = row.sessionId;
  if (row.entryId !== null) scope.entryId = row.entryId;
  if (row.mediaId !== null) scope.mediaId = row.mediaId;
  return scope;
}

/**
 * After the transaction commits, the cached public pages are read afresh: the project's, its builder's, the
 * home lists (and, while the cached pages carry only the site-wide tag, all of them: `public`).
 */
export function expireAfterCommit(transaction: Transaction, projectId: number, ownerId: number): void {
  transaction.afterCommit(() => expireTags(projectTag(projectId), builderTag(ownerId), HOME_TAG, NOT_SHOWN_TAG));
}
