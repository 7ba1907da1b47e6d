import 'server-only';
import { literal, Op, type Transaction } from 'sequelize';
import { initModels, Entry, Media, ShopSession } from '../../db/models';
import { getSequelize, withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import type { Actor, ProjectFacts } from '../auth/policy';
import { authorizeLog, rememberWalk, walkSubquery, type LogScope } from './log-scope';
import { listedSessionWhere } from './session-listing';
import { afterCursor, pageOf, readCursor } from './keyset';
import { entryMediaStats, lockProjectRow, placeAt, toEntrySummary } from './entries';
import { deleteStoredFiles, queueFileDeletions } from './upload-service';
import { moveSchema, sessionInputSchema, sessionUpdateSchema } from '../validations/log';
import type { SessionView } from '../types/log';

export async function toSessionViews(sessions: ShopSession[], transaction?: Transaction): Promise<SessionView[]> {
  const ids = sessions.map((s) => s.id);
  const entries = ids.length ? await Entry.findAll({ where: { sessionId: { [Op.in]: ids } }, order: [['position', 'ASC'], ['id', 'ASC']], transaction }) : [];
  // Counts and the photos in one grouped read.
  const { counts, photos } = await entryMediaStats(entries.map((e) => e.id), transaction);
  return sessions.map((s) => {
    const own = entries.filter((e) => e.sessionId === s.id);
    const summaries = own.map((e) => toEntrySummary(e, counts.get(e.id)!));
    const thumb = own.map((e) => photos.find((p) => p.entryId === e.id)).find(Boolean);
    return {
      id: s.id,
      projectId: s.projectId,
      position: s.position,
      title: s.title,
      heldOn: s.heldOn,
      minutesSpent: s.minutesSpent,
      planned: s.planned,
      done: s.done,
      nextSteps: s.nextSteps,
      version: s.version,
      visibility: s.visibility,
      publishedAt: s.publishedAt ? s.publishedAt.toISOString() : null,
      entries: summaries,
      thumbnail: thumb ? { url: thumb.url, width: thumb.width, height: thumb.height, name: thumb.name } : null,
      counts: {
        entries: summaries.length,
        photos: summaries.reduce((n, e) => n + e.photoCount, 0),
        clips: summaries.reduce((n, e) => n + e.clipCount, 0),
        notes: summaries.reduce((n, e) => n + e.noteCount, 0),
      },
    };
  });
}

/** Sessions on one page of a project's log (in log order; the next page follows its `nextCursor`). */
export const SESSIONS_PER_PAGE = 50;

export type SessionPage = {
  sessions: SessionView[];
  /** The next page (`?after=` on GET /api/projects/[id]/sessions), or null on the last. */
  nextCursor: string | null;
  /** Open risk flags per session id on this page (only those with any). */
  openFlags: Record<number, number>;
};

export type SessionTotals = { sessions: number; minutes: number; openFlags: number; records: number };

const sqlList = (values: string[]) => values.map((v) => getSequelize().escape(v)).join(', ');

/**
 * One page of the sessions this viewer is shown in a project, in log order: keyset on (position, id) (index
 * shop_sessions(project_id, position)), each with its open flags and measurement records counted in the same
 * read. With `totals`, the same statement also counts every listed session, their minutes, open flags and
 * records, so a count never hints at a hidden session and never needs the whole list.
 */
export async function readSessionPage(
  actor: Actor,
  projectId: number,
  facts: ProjectFacts,
  after: unknown,
  options: { totals?: boolean; transaction?: Transaction } = {},
): Promise<SessionPage & { totals: SessionTotals | null }> {
  const cursor = readCursor(after, 'number');
  const listed = listedSessionWhere(actor, facts);
  const pid = getSequelize().escape(projectId);
  const listedSql = listed ? `AND t.visibility IN (${listed.visibility.length ? sqlList(listed.visibility) : 'NULL'})` : '';
  const totals: [ReturnType<typeof literal>, string][] = options.totals
    ? [
        [literal(`(SELECT COUNT(*) FROM shop_sessions t WHERE t.project_id = ${pid} ${listedSql})`), 'totalSessions'],
        [literal(`(SELECT COALESCE(SUM(t.minutes_spent), 0) FROM shop_sessions t WHERE t.project_id = ${pid} ${listedSql})`), 'totalMinutes'],
        [literal(`(SELECT COUNT(*) FROM risk_flags f JOIN shop_sessions t ON t.id = f.session_id WHERE t.project_id = ${pid} AND f.status <> 'resolved' ${listedSql})`), 'totalOpenFlags'],
        [literal(`(SELECT COUNT(*) FROM measurement_records r JOIN entries e ON e.id = r.entry_id JOIN shop_sessions t ON t.id = e.session_id WHERE t.project_id = ${pid} ${listedSql})`), 'totalRecords'],
      ]
    : [];
  const rows = await ShopSession.findAll({
    where: { projectId, ...listed, ...afterCursor('position', cursor, 'ASC') },
    attributes: {
      include: [[literal("(SELECT COUNT(*) FROM risk_flags f WHERE f.session_id = `ShopSession`.`id` AND f.status <> 'resolved')"), 'openFlags'], ...totals],
    },
    order: [['position', 'ASC'], ['id', 'ASC']],
    limit: SESSIONS_PER_PAGE + 1,
    transaction: options.transaction,
  });
  const { items, nextCursor } = pageOf(rows, SESSIONS_PER_PAGE, (r) => r.position);
  const openFlags: Record<number, number> = {};
  for (const r of items) {
    const open = Number(r.getDataValue('openFlags' as never));
    if (open) openFlags[r.id] = open;
  }
  const first = rows[0];
  const total = (name: string) => (first ? Number(first.getDataValue(name as never)) : 0);
  return {
    sessions: await toSessionViews(items, options.transaction),
    nextCursor,
    openFlags,
    totals: options.totals ? { sessions: total('totalSessions'), minutes: total('totalMinutes'), openFlags: total('totalOpenFlags'), records: total('totalRecords') } : null,
  };
}

/**
 * One page of a project's sessions as the viewer is shown them (`after`: the last page's `nextCursor`; one
 * that cannot be read is a 400 naming `after`). `transaction`: answer from inside a write's transaction, so a
 * committed write is never reported as failed.
 */
export async function listSessions(actor: Actor, projectId: number, after?: unknown, transaction?: Transaction): Promise<SessionPage & { total: number }> {
  const scope = await authorizeLog(actor, 'view', { projectId }, transaction);
  // Outsiders get only the sessions listed to them; unlisted ones in a published project need their link.
  const { totals, ...page } = await readSessionPage(actor, projectId, scope.facts, after, { totals: true, transaction });
  return { ...page, total: totals!.sessions };
}

export async function getSession(actor: Actor, sessionId: number, transaction?: Transaction): Promise<{ session: SessionView; scope: LogScope }> {
  initModels();
  if (transaction) {
    const scope = await authorizeLog(actor, 'view', { sessionId }, transaction);
    const [session] = await toSessionViews([(await ShopSession.findByPk(sessionId, { transaction }))!], transaction);
    return { session, scope };
  }
  // Outside a transaction the access walk rides along with the session's own read; nothing more is read
  // before the policy has answered.
  const row = await ShopSession.findByPk(sessionId, { attributes: { include: [[literal(walkSubquery('sessionId', '`ShopSession`.`id`', actor)), 'accessWalk']] } });
  rememberWalk('sessionId', sessionId, actor, row ? row.getDataValue('accessWalk' as never) : null);
  const scope = await authorizeLog(actor, 'view', { sessionId });
  const [session] = await toSessionViews([row!]);
  return { session, scope };
}

export async function createSession(actor: Actor, projectId: number, input: unknown): Promise<SessionView> {
  const data = sessionInputSchema.parse(input);
  initModels();
  return withTransaction(async (transaction) => {
    await authorizeLog(actor, 'editLog', { projectId }, transaction);
    // Sessions created at once take turns on the project row; the locking read sees what the others committed.
    await lockProjectRow(projectId, transaction);
    const last = await ShopSession.findOne({ where: { projectId }, attributes: ['position'], order: [['position', 'DESC']], transaction, lock: transaction.LOCK.UPDATE });
    const s = await ShopSession.create({ projectId, position: last ? last.position + 1 : 0, ...data }, { transaction });
    return (await getSession(actor, s.id, transaction)).session;
  });
}

export async function updateSession(actor: Actor, sessionId: number, input: unknown): Promise<SessionView> {
  const data = sessionUpdateSchema.parse(input);
  initModels();
  return withTransaction(async (transaction) => {
    await authorizeLog(actor, 'editLog', { sessionId }, transaction);
    const s = (await ShopSession.findByPk(sessionId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    if (s.version !== data.version) {
      throw new AppError('conflict', 'This session was changed in another tab or on another device since you opened it. Reload to see the saved version, then make your change again.');
    }
    const { version: _v, ...changes } = data;
    s.set(changes);
    s.version = s.version + 1;
    await s.save({ transaction });
    return (await getSession(actor, sessionId, transaction)).session;
  });
}

export async function moveSession(actor: Actor, sessionId: number, input: unknown): Promise<SessionView[]> {
  const { position } = moveSchema.parse(input);
  initModels();
  return withTransaction(async (transaction) => {
    const scope = await authorizeLog(actor, 'editLog', { sessionId }, transaction);
    await lockProjectRow(scope.projectId, transaction);
    const siblings = await ShopSession.findAll({ where: { projectId: scope.projectId }, order: [['position', 'ASC'], ['id', 'ASC']], transaction, lock: transaction.LOCK.UPDATE });
    await placeAt(siblings, siblings.find((s) => s.id === sessionId)!, position, transaction);
    // The log's first page, as the workspace shows it.
    return (await listSessions(actor, scope.projectId, null, transaction)).sessions;
  });
}

export async function deleteSession(actor: Actor, sessionId: number): Promise<void> {
  initModels();
  const keys = await withTransaction(async (transaction) => {
    const scope = await authorizeLog(actor, 'editLog', { sessionId }, transaction);
    await lockProjectRow(scope.projectId, transaction);
    const entryIds = (await Entry.findAll({ where: { sessionId }, attributes: ['id'], transaction })).map((e) => e.id);
    const media = entryIds.length ? await Media.findAll({ where: { entryId: { [Op.in]: entryIds } }, attributes: ['fileKey'], transaction }) : [];
    await ShopSession.destroy({ where: { id: sessionId }, transaction });
    const rest = await ShopSession.findAll({ where: { projectId: scope.projectId }, order: [['position', 'ASC'], ['id', 'ASC']], transaction, lock: transaction.LOCK.UPDATE });
    for (const [i, row] of rest.entries()) if (row.position !== i) await row.update({ position: i }, { transaction });
    return queueFileDeletions(media.map((m) => m.fileKey).filter((k): k is string => !!k), transaction);
  });
  // Queued in the transaction: a failed call (or a crash before it) leaves them to the clean-up.
  await deleteStoredFiles(keys);
}
