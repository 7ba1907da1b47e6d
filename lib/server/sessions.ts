import 'server-only';
import { literal, Op, type Transaction } from 'sequelize';
import { initModels, Entry, Media, ShopSession } from '../../db/models';
import { withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import type { Actor } from '../auth/policy';
import { authorizeLog, rememberWalk, walkSubquery, type LogScope } from './log-scope';
import { listedSessionWhere } from './session-listing';
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

/** `transaction`: answer from inside a write's transaction, so a committed write is never reported as failed. */
export async function listSessions(actor: Actor, projectId: number, transaction?: Transaction): Promise<SessionView[]> {
  const scope = await authorizeLog(actor, 'view', { projectId }, transaction);
  // Outsiders get only the sessions listed to them; unlisted ones in a published project need their link.
  const sessions = await ShopSession.findAll({ where: { projectId, ...listedSessionWhere(actor, scope.facts) }, order: [['position', 'ASC'], ['id', 'ASC']], transaction });
  return toSessionViews(sessions, transaction);
}

export async function getSession(actor: Actor, sessionId: number, transaction?: Transaction): Promise<{ session: SessionView; scope: LogScope }> {
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
    return listSessions(actor, scope.projectId, transaction);
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
