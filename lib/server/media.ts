import 'server-only';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { imageSize } from 'image-size';
import { initModels, Entry, Media, ShopSession } from '../../db/models';
import { withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import type { Actor } from '../auth/policy';
import { authorizeLog } from './log-scope';
import { findActor } from './users';
import { clipLinkSchema, linkName, LINK_MAX_LENGTH, mediaUpdateSchema } from '../validations/media';
import { contentRefusal, sniffMedia } from '../media/sniff';
import { displaySize, durationRefusal, maxBytesFor, sizeRefusal } from '../media/rules';
import type { MediaView } from '../types/log';
import { mediaFileUrl, SIGNED_URL_SECONDS } from '../media/urls';
import { FILE_KEY_PATTERN } from './upload-callback';
import { deleteStoredFiles, queueFileDeletions, readStoredFile, signedFileUrl } from './upload-service';

export function toMediaView(m: Media): MediaView {
  return {
    id: m.id,
    entryId: m.entryId,
    kind: m.kind,
    source: m.source,
    // An upload is only ever shown through the app's file route, never by the service's own address.
    url: m.source === 'upload' ? mediaFileUrl(m.id) : m.url,
    name: m.name,
    mime: m.mime,
    sizeBytes: m.sizeBytes,
    width: m.width,
    height: m.height,
    durationMs: m.durationMs,
    caption: m.caption,
    position: m.position,
  };
}

// ---- stored files ------------------------------------------------------------------

/** The stored files of every upload in a project, read inside the transaction that deletes it. */
export async function projectFileKeys(projectId: number, transaction: Transaction): Promise<string[]> {
  const rows = (await Media.findAll({
    attributes: ['fileKey'],
    where: { source: 'upload', fileKey: { [Op.ne]: null } },
    include: [{ model: Entry, as: 'entry', attributes: [], required: true, include: [{ model: ShopSession, as: 'session', attributes: [], required: true, where: { projectId } }] }],
    raw: true,
    transaction,
  })) as unknown as { fileKey: string }[];
  return rows.map((r) => r.fileKey);
}

// ---- reading -----------------------------------------------------------------------

const ORDER: [string, string][] = [
  ['kind', 'DESC'], // photos before clips
  ['position', 'ASC'],
  ['id', 'ASC'],
];

export async function listEntryMedia(actor: Actor, entryId: number): Promise<MediaView[]> {
  initModels();
  await authorizeLog(actor, 'view', { entryId });
  const rows = await Media.findAll({ where: { entryId }, order: ORDER });
  return rows.map(toMediaView);
}

export async function getMedia(actor: Actor, id: number): Promise<MediaView> {
  initModels();
  await authorizeLog(actor, 'view', { mediaId: id });
  const m = await Media.findByPk(id);
  if (!m) throw new AppError('not_found', 'That photo or clip was not found.');
  return toMediaView(m);
}

/**
 * Where the viewer may fetch an uploaded file's bytes: a short-lived signed URL on the upload service,
 * after the policy let them see the entry. Links and unknown ids are 404s.
 */
export async function signedMediaUrl(actor: Actor, id: number): Promise<string> {
  initModels();
  await authorizeLog(actor, 'view', { mediaId: id });
  const m = await Media.findByPk(id, { attributes: ['id', 'kind', 'source', 'fileKey'] });
  if (!m || m.source !== 'upload' || !m.fileKey) throw new AppError('not_found', 'That photo or clip was not found.');
  return signedFileUrl(m.fileKey, SIGNED_URL_SECONDS[m.kind]);
}

// ---- positions ---------------------------------------------------------------------

/**
 * Locks the entry so two additions or moves in it cannot pick the same position. The reads that follow
 * lock too: a plain read would see the transaction's first snapshot, taken before the wait for this lock.
 */
async function lockEntry(entryId: number, transaction: Transaction): Promise<void> {
  const entry = await Entry.findByPk(entryId, { attributes: ['id'], transaction, lock: transaction.LOCK.UPDATE });
  if (!entry) throw new AppError('not_found', 'That entry was not found.');
}

async function nextPosition(entryId: number, kind: 'photo' | 'clip', transaction: Transaction): Promise<number> {
  const last = await Media.findOne({ where: { entryId, kind }, attributes: ['id', 'position'], order: [['position', 'DESC']], transaction, lock: transaction.LOCK.UPDATE });
  return last ? last.position + 1 : 0;
}

/** Writes 0..n-1 in the given order, touching only rows whose position changes. */
async function renumber(rows: Media[], transaction: Transaction): Promise<void> {
  for (const [i, row] of rows.entries()) {
    if (row.position !== i) await row.update({ position: i }, { transaction });
  }
}

const siblingsOf = (m: Pick<Media, 'entryId' | 'kind'>, transaction: Transaction) =>
  Media.findAll({ where: { entryId: m.entryId, kind: m.kind }, order: [['position', 'ASC'], ['id', 'ASC']], transaction, lock: transaction.LOCK.UPDATE });

// ---- writing -----------------------------------------------------------------------

export async function addClipLink(actor: Actor, entryId: number, input: unknown): Promise<MediaView> {
  const data = clipLinkSchema.parse(input);
  // Escaping (spaces, non-ASCII letters) can make the stored form longer than what was typed.
  const href = new URL(data.url).href;
  if (href.length > LINK_MAX_LENGTH) {
    const message = `Please check url: written out as a web address the link is ${href.length} characters; keep it under ${LINK_MAX_LENGTH}.`;
    throw new AppError('validation', message, { url: [message] });
  }
  initModels();
  const created = await withTransaction(async (transaction) => {
    await authorizeLog(actor, 'editLog', { entryId }, transaction);
    await lockEntry(entryId, transaction);
    return Media.create(
      {
        entryId,
        kind: 'clip',
        source: 'link',
        fileKey: null,
        url: href,
        name: (data.name || linkName(data.url)).slice(0, 255),
        mime: null,
        sizeBytes: null,
        width: null,
        height: null,
        durationMs: null,
        position: await nextPosition(entryId, 'clip', transaction),
        uploadedBy: actor?.id ?? null,
      },
      { transaction },
    );
  });
  return toMediaView(created);
}

/** Changes the caption and/or moves the item within its entry's photos (or clips); position counts from 0. */
export async function updateMedia(actor: Actor, id: number, input: unknown): Promise<MediaView> {
  const data = mediaUpdateSchema.parse(input);
  initModels();
  const updated = await withTransaction(async (transaction) => {
    const scope = await authorizeLog(actor, 'editLog', { mediaId: id }, transaction);
    await lockEntry(scope.entryId!, transaction);
    const m = await Media.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!m) throw new AppError('not_found', 'That photo or clip was not found.');
    if (data.caption !== undefined && data.caption !== m.caption) await m.update({ caption: data.caption }, { transaction });
    if (data.position !== undefined) {
      const others = (await siblingsOf(m, transaction)).filter((s) => s.id !== m.id);
      others.splice(Math.min(data.position, others.length), 0, m);
      await renumber(others, transaction);
    }
    return m;
  });
  return toMediaView(updated);
}

/** Removes the row (its notes go with it, by the database's cascade), then the stored file. */
export async function deleteMedia(actor: Actor, id: number): Promise<void> {
  initModels();
  const fileKey = await withTransaction(async (transaction) => {
    const scope = await authorizeLog(actor, 'editLog', { mediaId: id }, transaction);
    await lockEntry(scope.entryId!, transaction);
    const m = await Media.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!m) throw new AppError('not_found', 'That photo or clip was not found.');
    const key = m.source === 'upload' ? m.fileKey : null;
    await m.destroy({ transaction });
    await renumber(await siblingsOf(m, transaction), transaction);
    if (key) await queueFileDeletions([key], transaction);
    return key;
  });
  // After the commit: a failed delete stays queued for the clean-up, never a row without its file.
  if (fileKey) await deleteStoredFiles([fileKey]);
}

// ---- accepting an upload -------------------------------------------------------------

export type UploadedFile = { key: string; name: string; size: number; type: string; ufsUrl: string };
export type UploadMetadata = { userId: number; entryId: number; durationMs: number | null; clientId?: string | null; caption?: string };
/** What the uploader gets back for each file (the upload SDK's serverData). */
export type UploadOutcome = { ok: true; media: MediaView } | { ok: false; message: string };

class Refusal extends Error {}

const CLIP_HEAD_BYTES = 64 * 1024;

// A photo is read whole (it is at most 20 MB); a clip only as far as its signature.
const storedBytes = (file: UploadedFile, kind: 'photo' | 'clip'): Promise<Uint8Array> =>
  kind === 'photo' ? readStoredFile(file.key, { maxBytes: maxBytesFor('photo') + 1 }) : readStoredFile(file.key, { maxBytes: CLIP_HEAD_BYTES, head: true });

type Inspected = { mime: string; width: number | null; height: number | null };

async function inspect(file: UploadedFile, kind: 'photo' | 'clip', durationMs: number | null): Promise<Inspected> {
  // The service reports what it stored, so this checks the real size, not the one the browser declared.
  const tooBig = sizeRefusal(kind, file.name, file.size);
  if (tooBig) throw new Refusal(tooBig);
  const bytes = await storedBytes(file, kind);
  const sniffed = sniffMedia(bytes);
  const wrongType = contentRefusal(sniffed, kind, file.name);
  if (wrongType || !sniffed) throw new Refusal(wrongType ?? `“${file.name}” could not be read.`);
  if (kind === 'clip') {
    if (durationMs !== null) {
      const implausible = durationRefusal(file.name, file.size, durationMs);
      if (implausible) throw new Refusal(implausible);
    }
    return { mime: sniffed.mime, width: null, height: null };
  }
  let measured: ReturnType<typeof imageSize>;
  try {
    measured = imageSize(bytes);
  } catch {
    throw new Refusal(`“${file.name}” looks like a ${sniffed.label} but its picture cannot be read; the file may be damaged.`);
  }
  if (!measured.width || !measured.height) throw new Refusal(`“${file.name}” has no width or height; the file may be damaged.`);
  const shown = displaySize(measured.width, measured.height, measured.orientation);
  return { mime: sniffed.mime, ...shown };
}

/** The row already recorded for a file key, as the uploader's answer; a callback delivered twice gets the same one. */
async function recorded(fileKey: string): Promise<UploadOutcome | null> {
  const row = await Media.findOne({ where: { fileKey } });
  return row ? { ok: true, media: toMediaView(row) } : null;
}

/** The photo or clip a bench write with this clientId already made, if its member sent it to this entry. */
async function sentBefore(meta: UploadMetadata): Promise<UploadOutcome | null> {
  const row = await Media.findOne({ where: { clientId: meta.clientId! } });
  if (!row) return null;
  if (row.uploadedBy !== meta.userId || row.entryId !== meta.entryId) return { ok: false, message: 'This clientId already names another photo or clip: make a new id for a new one.' };
  return { ok: true, media: toMediaView(row) };
}

/**
 * Runs when a file has fully arrived at the upload service: checks what it really is, then records it.
 * A refused or failed file is deleted again, so nothing is left half-stored; the reason goes back to the uploader.
 * A file that a row already points to is never deleted (a callback delivered twice, or twice at once).
 */
export async function acceptUploadedFile(kind: 'photo' | 'clip', meta: UploadMetadata, file: UploadedFile): Promise<UploadOutcome> {
  initModels();
  if (!FILE_KEY_PATTERN.test(file.key)) return { ok: false, message: 'The upload service named an invalid file.' };
  const already = await recorded(file.key);
  if (already) return already;
  // Sent again from the bench view's queue (its first answer was lost): the row it made stands, this copy goes.
  const before = meta.clientId ? await sentBefore(meta) : null;
  if (before) {
    await deleteStoredFiles([file.key]);
    return before;
  }
  let created: Media;
  try {
    const inspected = await inspect(file, kind, meta.durationMs);
    const actor = await findActor(meta.userId);
    created = await withTransaction(async (transaction) => {
      // Asked again: the entry may have gone, or the builder changed, while the bytes were on their way.
      await authorizeLog(actor, 'editLog', { entryId: meta.entryId }, transaction);
      await lockEntry(meta.entryId, transaction);
      const row = await Media.create(
        {
          entryId: meta.entryId,
          kind,
          source: 'upload',
          fileKey: file.key,
          url: '',
          name: file.name.slice(0, 255),
          mime: inspected.mime,
          sizeBytes: file.size,
          width: inspected.width,
          height: inspected.height,
          durationMs: kind === 'clip' ? meta.durationMs : null,
          position: await nextPosition(meta.entryId, kind, transaction),
          uploadedBy: meta.userId,
          clientId: meta.clientId ?? null,
          caption: meta.caption ?? '',
        },
        { transaction },
      );
      // Bodies and pages embed the app's own address, which needs the new id.
      await row.update({ url: mediaFileUrl(row.id) }, { transaction });
      return row;
    });
  } catch (err) {
    // The same file recorded meanwhile by another delivery of this callback: that row stands, and so does its file.
    if (err instanceof UniqueConstraintError) {
      const other = await recorded(file.key).catch(() => null);
      if (other) return other;
      const twin = meta.clientId ? await sentBefore(meta).catch(() => null) : null;
      if (twin) {
        await deleteStoredFiles([file.key]);
        return twin;
      }
    }
    if (!(await recorded(file.key).catch(() => null))) await deleteStoredFiles([file.key]);
    if (err instanceof Refusal || err instanceof AppError) return { ok: false, message: err.message };
    console.error(`[scribeline] could not record upload ${file.key}`, err);
    return { ok: false, message: `“${file.name}” arrived but could not be saved. Please try again.` };
  }
  // Committed: from here on nothing may report failure or delete the file.
  return { ok: true, media: toMediaView(created) };
}
