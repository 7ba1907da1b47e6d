import 'server-only';
import { literal, Op, QueryTypes, type Transaction } from 'sequelize';
import { initModels, Entry, Media, Project, ShopSession, TimeNote, User } from '../../db/models';
import { getSequelize, withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import type { Actor } from '../auth/policy';
import { authorizeLog, rememberWalk, walkSubquery, type LogScope } from './log-scope';
import { toMediaView } from './media';
import { deleteStoredFiles, queueFileDeletions } from './upload-service';
import { toNoteView } from './notes';
import { entryInputSchema, entryUpdateSchema, moveSchema, type Operation } from '../validations/log';
import { emptyDoc, normalizeEntryBody, RichTextError } from '../rich-text/normalize';
import type { EntrySummary, EntryView } from '../types/log';
import { mediaIdFromFileUrl } from '../media/urls';

type MediaStat = { entryId: number; kind: string; id: number };

/** Photo, clip and note counts for a set of entries, in two grouped reads. */
export async function entryCounts(entryIds: number[], transaction?: Transaction) {
  const counts = new Map<number, { photos: number; clips: number; notes: number }>();
  for (const id of entryIds) counts.set(id, { photos: 0, clips: 0, notes: 0 });
  if (!entryIds.length) return counts;
  const media = (await Media.findAll({ where: { entryId: { [Op.in]: entryIds } }, attributes: ['id', 'entryId', 'kind'], raw: true, transaction })) as unknown as MediaStat[];
  const entryOfMedia = new Map<number, number>();
  for (const m of media) {
    entryOfMedia.set(m.id, m.entryId);
    const c = counts.get(m.entryId)!;
    if (m.kind === 'photo') c.photos++;
    else c.clips++;
  }
  if (media.length) {
    const notes = (await TimeNote.findAll({
      where: { mediaId: { [Op.in]: [...entryOfMedia.keys()] } },
      attributes: ['mediaId'],
      raw: true,
      transaction,
    })) as unknown as { mediaId: number }[];
    for (const n of notes) counts.get(entryOfMedia.get(n.mediaId)!)!.notes++;
  }
  return counts;
}

type MediaStatRow = { id: number; entryId: number; kind: string; url: string; width: number | null; height: number | null; name: string; notes: number };

/**
 * Photo, clip and note counts for a set of entries, and their photos in order (the first stands for a
 * session on the timeline): one grouped read.
 */
export async function entryMediaStats(entryIds: number[], transaction?: Transaction) {
  const counts = new Map<number, { photos: number; clips: number; notes: number }>();
  for (const id of entryIds) counts.set(id, { photos: 0, clips: 0, notes: 0 });
  if (!entryIds.length) return { counts, photos: [] as MediaStatRow[] };
  const rows = await getSequelize().query<MediaStatRow>(
    `SELECT m.id, m.entry_id AS entryId, m.kind, m.url, m.width, m.height, m.name, COUNT(n.id) AS notes
       FROM media m LEFT JOIN time_notes n ON n.media_id = m.id
      WHERE m.entry_id IN (:entryIds) GROUP BY m.id ORDER BY m.position ASC, m.id ASC`,
    { type: QueryTypes.SELECT, replacements: { entryIds }, transaction },
  );
  for (const m of rows) {
    const c = counts.get(m.entryId)!;
    if (m.kind === 'photo') c.photos++;
    else c.clips++;
    c.notes += Number(m.notes);
  }
  return { counts, photos: rows.filter((m) => m.kind === 'photo') };
}

export function toEntrySummary(e: Entry, c: { photos: number; clips: number; notes: number }): EntrySummary {
  return {
    id: e.id,
    sessionId: e.sessionId,
    position: e.position,
    title: e.title,
    operation: e.operation as Operation,
    photoCount: c.photos,
    clipCount: c.clips,
    noteCount: c.notes,
    updatedAt: e.updatedAt.toISOString(),
  };
}

function parseBody(text: string): Record<string, unknown> {
  try {
    return JSON.parse(text) as Record<string, unknown>;
  } catch {
    return emptyDoc();
  }
}

/** The media ids a body's images name by their app address (`/api/media/<id>/file`): the only ones it may show. */
function imageMediaIds(doc: unknown): number[] {
  const ids = new Set<number>();
  const stack: unknown[] = [doc];
  while (stack.length) {
    const node = stack.pop();
    if (!node || typeof node !== 'object') continue;
    const { type, attrs, content } = node as { type?: unknown; attrs?: { src?: unknown }; content?: unknown };
    if (type === 'image' && typeof attrs?.src === 'string') {
      const id = mediaIdFromFileUrl(attrs.src.trim());
      if (id !== null) ids.add(id);
    }
    if (Array.isArray(content)) for (const child of content) stack.push(child);
  }
  return [...ids];
}

/**
 * URLs of the project's own uploaded photos that the body shows: the only images an entry body may show.
 * Only the photos the body names are read, so an autosave's time does not grow with the project's uploads.
 */
async function projectPhotoUrls(projectId: number, doc: unknown, transaction?: Transaction): Promise<string[]> {
  const ids = imageMediaIds(doc);
  if (!ids.length) return [];
  const rows = (await Media.findAll({
    attributes: ['url'],
    where: { kind: 'photo', id: { [Op.in]: ids } },
    include: [{ model: Entry, as: 'entry', attributes: [], required: true, include: [{ model: ShopSession, as: 'session', attributes: [], required: true, where: { projectId } }] }],
    raw: true,
    transaction,
  })) as unknown as { url: string }[];
  return rows.map((r) => r.url);
}

function cleanBody(doc: unknown, allowedImageUrls: string[]): Record<string, unknown> {
  try {
    return normalizeEntryBody(doc, { allowedImageUrls });
  } catch (err) {
    if (err instanceof RichTextError) throw new AppError('validation', `The entry text could not be saved: ${err.message}`, { body: [err.message] });
    throw err;
  }
}

/**
 * Locks the project's row for the rest of the transaction. Every write that hands out or changes positions
 * in a project's log (sessions, entries) takes this lock first, so they take turns and always lock in the
 * same order (project, then its sessions and entries), as publishing does.
 */
export async function lockProjectRow(projectId: number, transaction: Transaction): Promise<void> {
  await Project.findByPk(projectId, { attributes: ['id'], transaction, lock: transaction.LOCK.UPDATE });
}

export type EntryWithScope = { entry: EntryView; scope: LogScope; session: { id: number; title: string; position: number; heldOn: string } };

/** `transaction`: answer from inside a write's transaction, so a committed write is never reported as failed. */
export async function getEntry(actor: Actor, entryId: number, transaction?: Transaction): Promise<EntryWithScope> {
  initModels();
  // Inside a transaction the policy is asked first; outside, the access walk rides along with the entry's own
  // read (one statement) and is remembered for the page's other sections, and nothing is returned before
  // the policy has answered.
  const scopeFirst = transaction ? await authorizeLog(actor, 'view', { entryId }, transaction) : null;
  const found = await Entry.findByPk(entryId, {
    ...(transaction ? {} : { attributes: { include: [[literal(walkSubquery('entryId', '`Entry`.`id`', actor)), 'accessWalk']] } }),
    include: [
      { model: ShopSession, as: 'session', attributes: ['id', 'title', 'position', 'heldOn'] },
      { model: Media, as: 'media', include: [{ model: TimeNote, as: 'notes', include: [{ model: User, as: 'author', attributes: ['id', 'name'] }] }] },
    ],
    order: [
      [{ model: Media, as: 'media' }, 'position', 'ASC'],
      [{ model: Media, as: 'media' }, 'id', 'ASC'],
    ],
    transaction,
  });
  if (!transaction) rememberWalk('entryId', entryId, actor, found ? found.getDataValue('accessWalk' as never) : null);
  const scope = scopeFirst ?? (await authorizeLog(actor, 'view', { entryId }));
  const entry = found!;
  const media = entry.media ?? [];
  const notes = media
    .flatMap((m) => m.notes ?? [])
    .sort((a, b) => a.startMs - b.startMs || a.id - b.id)
    .map((n) => toNoteView(n));
  const view: EntryView = {
    ...toEntrySummary(entry, {
      photos: media.filter((m) => m.kind === 'photo').length,
      clips: media.filter((m) => m.kind === 'clip').length,
      notes: notes.length,
    }),
    body: parseBody(entry.body),
    version: entry.version,
    media: media.map(toMediaView),
    notes,
  };
  const s = entry.session!;
  return { entry: view, scope, session: { id: s.id, title: s.title, position: s.position, heldOn: s.heldOn } };
}

export async function listEntries(actor: Actor, sessionId: number, transaction?: Transaction): Promise<EntrySummary[]> {
  initModels();
  await authorizeLog(actor, 'view', { sessionId }, transaction);
  const entries = await Entry.findAll({ where: { sessionId }, order: [['position', 'ASC'], ['id', 'ASC']], transaction });
  const counts = await entryCounts(entries.map((e) => e.id), transaction);
  return entries.map((e) => toEntrySummary(e, counts.get(e.id)!));
}

export async function createEntry(actor: Actor, sessionId: number, input: unknown): Promise<EntryView> {
  const data = entryInputSchema.parse(input);
  initModels();
  return withTransaction(async (transaction) => {
    const scope = await authorizeLog(actor, 'editLog', { sessionId }, transaction);
    // New entries take turns on the project row, and the locking read of the last position sees what
    // the ones before committed (a plain read would see the snapshot taken before the lock was granted).
    await lockProjectRow(scope.projectId, transaction);
    const body = data.body ? cleanBody(data.body, await projectPhotoUrls(scope.projectId, data.body, transaction)) : emptyDoc();
    const last = await Entry.findOne({ where: { sessionId }, attributes: ['position'], order: [['position', 'DESC']], transaction, lock: transaction.LOCK.UPDATE });
    const entry = await Entry.create({ sessionId, position: last ? last.position + 1 : 0, title: data.title, operation: data.operation, body: JSON.stringify(body) }, { transaction });
    return (await getEntry(actor, entry.id, transaction)).entry;
  });
}

export async function updateEntry(actor: Actor, entryId: number, input: unknown): Promise<EntryView> {
  const data = entryUpdateSchema.parse(input);
  initModels();
  return withTransaction(async (transaction) => {
    const scope = await authorizeLog(actor, 'editLog', { entryId }, transaction);
    const entry = (await Entry.findByPk(entryId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    if (entry.version !== data.version) {
      throw new AppError('conflict', 'This entry was changed in another tab or on another device since you opened it. Your latest edits were not saved: reload to see the saved version.');
    }
    if (data.title !== undefined) entry.title = data.title;
    if (data.operation !== undefined) entry.operation = data.operation;
    if (data.body !== undefined) entry.body = JSON.stringify(cleanBody(data.body, await projectPhotoUrls(scope.projectId, data.body, transaction)));
    entry.version = entry.version + 1;
    await entry.save({ transaction });
    return (await getEntry(actor, entryId, transaction)).entry;
  });
}

/** Puts one row at a new index among its siblings and renumbers them 0..n-1. */
export async function placeAt<T extends { id: number; position: number; save: (o: { transaction: Transaction }) => Promise<unknown> }>(
  siblings: T[],
  moving: T,
  index: number,
  transaction: Transaction,
): Promise<void> {
  const rest = siblings.filter((s) => s.id !== moving.id);
  rest.splice(Math.min(index, rest.length), 0, moving);
  for (const [i, row] of rest.entries()) {
    if (row.position !== i || row === moving) {
      row.position = i;
      await row.save({ transaction });
    }
  }
}

/** Reorders an entry within its session, or moves it to another session of the same project. */
export async function moveEntry(actor: Actor, entryId: number, input: unknown): Promise<EntrySummary[]> {
  const { sessionId: targetId, position } = moveSchema.parse(input);
  initModels();
  return withTransaction(async (transaction) => {
    const scope = await authorizeLog(actor, 'editLog', { entryId }, transaction);
    await lockProjectRow(scope.projectId, transaction);
    const entry = (await Entry.findByPk(entryId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const to = targetId ?? entry.sessionId;
    if (to !== entry.sessionId) {
      const target = await authorizeLog(actor, 'editLog', { sessionId: to }, transaction);
      if (target.projectId !== scope.projectId) {
        throw new AppError('validation', 'An entry can only move to another session of the same project.', { sessionId: ['Pick a session of this project.'] });
      }
    }
    const from = entry.sessionId;
    entry.sessionId = to;
    const siblings = await Entry.findAll({ where: { sessionId: to }, order: [['position', 'ASC'], ['id', 'ASC']], transaction, lock: transaction.LOCK.UPDATE });
    await placeAt(siblings, entry, position, transaction);
    if (from !== to) {
      const left = await Entry.findAll({ where: { sessionId: from }, order: [['position', 'ASC'], ['id', 'ASC']], transaction, lock: transaction.LOCK.UPDATE });
      for (const [i, row] of left.entries()) if (row.position !== i) await row.update({ position: i }, { transaction });
    }
    return listEntries(actor, to, transaction);
  });
}

export async function deleteEntry(actor: Actor, entryId: number): Promise<void> {
  initModels();
  const keys = await withTransaction(async (transaction) => {
    await authorizeLog(actor, 'editLog', { entryId }, transaction);
    const media = await Media.findAll({ where: { entryId }, attributes: ['fileKey'], transaction });
    // Notes and media rows go with the entry (ON DELETE CASCADE).
    await Entry.destroy({ where: { id: entryId }, transaction });
    return queueFileDeletions(media.map((m) => m.fileKey).filter((k): k is string => !!k), transaction);
  });
  // Files go once the rows are gone; a failed call (or a crash before it) leaves them queued for the clean-up.
  await deleteStoredFiles(keys);
}
