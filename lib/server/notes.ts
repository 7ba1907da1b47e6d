import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { initModels, Media, TimeNote, User } from '../../db/models';
import { getSequelize, withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import type { Actor } from '../auth/policy';
import { authorizeLog } from './log-scope';
import { afterCursor, pageOf, readCursor, readLimit } from './keyset';
import type { NoteView } from '../types/log';
import { noteChangeSchema, noteCreateSchema, noteImportSchema, CAPTION_FILE_MAX_BYTES, NOTES_PER_CLIP_MAX, type NoteCreateInput } from '../validations/notes';
import { formatClock, parseCaptionFile, toTimestampList, toWebVtt, type CaptionProblem } from '../chapters';

export type { NoteView };

export function toNoteView(n: TimeNote & { author?: User }): NoteView {
  return {
    id: n.id,
    mediaId: n.mediaId,
    startMs: n.startMs,
    endMs: n.endMs ?? null,
    kind: n.kind,
    text: n.text,
    author: n.author ? { id: n.author.id, name: n.author.name } : null,
    version: n.version,
    createdAt: n.createdAt.toISOString(),
  };
}

const authorInclude = [{ model: User, as: 'author', attributes: ['id', 'name'] }];
const timeOrder: [string, string][] = [
  ['startMs', 'ASC'],
  ['id', 'ASC'],
];

/** The clip a note pins to; a photo has no moments to pin to. */
async function loadClip(mediaId: number, transaction?: Transaction): Promise<Media> {
  const media = await Media.findByPk(mediaId, { transaction });
  if (!media) throw new AppError('not_found', 'That photo or clip was not found.');
  if (media.kind !== 'clip') {
    throw new AppError('validation', 'Notes pin to a moment of a clip, and this is a photo.', { mediaId: ['Notes can only be added to a clip, not a photo.'] });
  }
  return media;
}

/** Times past the clip's end are refused when its length is known (link clips may not know it). */
function checkWithinClip(media: Media, startMs: number, endMs: number | null | undefined): void {
  if (media.durationMs == null) return;
  const fields: Record<string, string[]> = {};
  const end = formatClock(media.durationMs);
  if (startMs > media.durationMs) fields.startMs = [`The start time is past the end of the clip (${end}).`];
  if (endMs != null && endMs > media.durationMs) fields.endMs = [`The end time is past the end of the clip (${end}).`];
  const named = Object.keys(fields);
  if (named.length) throw new AppError('validation', `Please check ${named.join(', ')}: ${Object.values(fields)[0][0]}`, fields);
}

async function viewOf(id: number, transaction?: Transaction): Promise<NoteView> {
  const note = await TimeNote.findByPk(id, { include: authorInclude, transaction });
  if (!note) throw new AppError('not_found', 'That note was not found.');
  return toNoteView(note);
}

/**
 * A clip's notes in time order, a page at a time: keyset on (start_ms, id) (index time_notes(media_id,
 * start_ms)). A page holds `limit` notes (1 to NOTES_PER_CLIP_MAX, all of them by default: a clip holds no
 * more than that, so one page is the whole list); `after` is the last page's `nextCursor`, and a cursor or
 * limit that cannot be read is a 400 naming it.
 */
export async function listClipNotes(actor: Actor, mediaId: number, paging: { after?: unknown; limit?: unknown } = {}): Promise<{ notes: NoteView[]; nextCursor: string | null }> {
  initModels();
  await authorizeLog(actor, 'view', { mediaId });
  const cursor = readCursor(paging.after, 'number');
  const limit = readLimit(paging.limit, NOTES_PER_CLIP_MAX, NOTES_PER_CLIP_MAX);
  const rows = await TimeNote.findAll({ where: { mediaId, ...afterCursor('startMs', cursor, 'ASC') }, include: authorInclude, order: timeOrder, limit: limit + 1 });
  const { items, nextCursor } = pageOf(rows, limit, (n) => n.startMs);
  return { notes: items.map(toNoteView), nextCursor };
}

/**
 * Refuses notes past NOTES_PER_CLIP_MAX on a clip. The clip's row is locked first so notes added at once take
 * turns, and the count is a locking read (a plain one would see the snapshot from before the lock).
 */
async function checkRoomForNotes(mediaId: number, adding: number, transaction: Transaction, field: string): Promise<void> {
  await Media.findByPk(mediaId, { attributes: ['id'], transaction, lock: transaction.LOCK.UPDATE });
  const [row] = await getSequelize().query<{ n: number }>('SELECT COUNT(*) AS n FROM time_notes WHERE media_id = :mediaId LOCK IN SHARE MODE', {
    replacements: { mediaId },
    type: QueryTypes.SELECT,
    transaction,
  });
  const has = Number(row?.n ?? 0);
  if (has + adding > NOTES_PER_CLIP_MAX) {
    const room = Math.max(0, NOTES_PER_CLIP_MAX - has);
    const message = room
      ? `A clip holds at most ${NOTES_PER_CLIP_MAX} notes; this one has ${has}, so there is room for ${room} more.`
      : `A clip holds at most ${NOTES_PER_CLIP_MAX} notes, and this one is full. Delete a note, or put the next ones on another clip.`;
    throw new AppError('validation', `Please check ${field}: ${message}`, { [field]: [message] });
  }
}

export async function createNote(actor: Actor, mediaId: number, input: unknown): Promise<NoteView> {
  initModels();
  return withTransaction(async (transaction) => {
    // Who is asking comes before what they sent: an outsider learns nothing from a validation message.
    await authorizeLog(actor, 'editLog', { mediaId }, transaction);
    const media = await loadClip(mediaId, transaction);
    const data: NoteCreateInput = noteCreateSchema.parse(input);
    checkWithinClip(media, data.startMs, data.endMs);
    await checkRoomForNotes(mediaId, 1, transaction, 'startMs');
    const note = await TimeNote.create(
      { mediaId, startMs: data.startMs, endMs: data.endMs ?? null, kind: data.kind, text: data.text, authorId: actor!.id },
      { transaction },
    );
    return viewOf(note.id, transaction);
  });
}

export async function updateNote(actor: Actor, noteId: number, input: unknown): Promise<NoteView> {
  initModels();
  return withTransaction(async (transaction) => {
    await authorizeLog(actor, 'editLog', { noteId }, transaction);
    const data = noteChangeSchema.parse(input);
    const note = await TimeNote.findByPk(noteId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!note) throw new AppError('not_found', 'That note was not found.');
    if (note.version !== data.version) {
      throw new AppError('conflict', 'This note was changed elsewhere since you opened it. Reload the notes to see the latest version, then make your change again.');
    }
    const startMs = data.startMs ?? note.startMs;
    const endMs = data.endMs === undefined ? note.endMs : data.endMs;
    if (endMs != null && endMs <= startMs) {
      throw new AppError('validation', 'Please check endMs: The end time must come after the start time.', { endMs: ['The end time must come after the start time.'] });
    }
    checkWithinClip(await loadClip(note.mediaId, transaction), startMs, endMs);
    note.set({ startMs, endMs, ...(data.kind ? { kind: data.kind } : {}), ...(data.text !== undefined ? { text: data.text } : {}) });
    note.version = note.version + 1;
    await note.save({ transaction });
    return viewOf(note.id, transaction);
  });
}

export async function deleteNote(actor: Actor, noteId: number): Promise<void> {
  initModels();
  await withTransaction(async (transaction) => {
    await authorizeLog(actor, 'editLog', { noteId }, transaction);
    await TimeNote.destroy({ where: { id: noteId }, transaction });
  });
}

/** problemsNotListed: how many more lines could not be read beyond those listed. */
export type ImportResult = { created: NoteView[]; problems: CaptionProblem[]; problemsNotListed: number };

/** A problem list can run to thousands of lines for a file that is not captions at all; the first ones say enough. */
const PROBLEMS_SHOWN = 100;

/**
 * Reads a WebVTT or SRT file into notes on a clip, in one transaction: every readable cue becomes a note,
 * every line that could not be read is reported; when no cue at all is readable, nothing is saved (400).
 */
export async function importNotes(actor: Actor, mediaId: number, fileName: unknown, text: unknown): Promise<ImportResult> {
  initModels();
  return withTransaction(async (transaction) => {
    await authorizeLog(actor, 'editLog', { mediaId }, transaction);
    const media = await loadClip(mediaId, transaction);
    const file = noteImportSchema.parse({ fileName, text });
    if (Buffer.byteLength(file.text, 'utf8') > CAPTION_FILE_MAX_BYTES) {
      throw new AppError('validation', 'The file is larger than 1 MB; a chapter or caption file is far smaller. Check that you picked the right file.', {
        text: ['The file is larger than 1 MB.'],
      });
    }
    const parsed = parseCaptionFile(file.fileName, file.text);
    const problems: CaptionProblem[] = [...parsed.problems];
    const rows: { startMs: number; endMs: number | null; text: string }[] = [];
    for (const cue of parsed.cues) {
      let endMs: number | null = cue.endMs;
      // A last chapter often runs to a rounded-up end: keep it inside the clip rather than refuse it.
      if (media.durationMs != null && endMs > media.durationMs) endMs = cue.startMs < media.durationMs ? media.durationMs : null;
      const check = noteCreateSchema.safeParse({ startMs: cue.startMs, endMs, kind: 'note', text: cue.text });
      if (!check.success) {
        problems.push({ line: cue.line, reason: check.error.issues[0]?.message ?? 'The cue could not be used as a note.' });
        continue;
      }
      if (media.durationMs != null && cue.startMs > media.durationMs) {
        problems.push({ line: cue.line, reason: `The cue starts after the end of the clip (${formatClock(media.durationMs)}).` });
        continue;
      }
      rows.push({ startMs: check.data.startMs, endMs: check.data.endMs ?? null, text: check.data.text });
    }
    problems.sort((a, b) => a.line - b.line);
    if (!rows.length) {
      const lines = problems.slice(0, 20).map((p) => `Line ${p.line}: ${p.reason}`);
      throw new AppError(
        'validation',
        problems.length
          ? `Nothing was imported: no cue in ${file.fileName} could be read. ${lines[0]}`
          : `Nothing was imported: ${file.fileName} holds no cues. Use a WebVTT (.vtt) or SRT (.srt) file.`,
        { text: lines.length ? lines : ['The file holds no cues.'] },
      );
    }
    await checkRoomForNotes(mediaId, rows.length, transaction, 'text');
    const made = await TimeNote.bulkCreate(
      rows.map((r) => ({ ...r, mediaId, kind: 'note' as const, authorId: actor!.id })),
      { transaction },
    );
    const created = await TimeNote.findAll({ where: { id: made.map((m) => m.id) }, include: authorInclude, order: timeOrder, transaction });
    return { created: created.map(toNoteView), problems: problems.slice(0, PROBLEMS_SHOWN), problemsNotListed: Math.max(0, problems.length - PROBLEMS_SHOWN) };
  });
}

export type ChaptersFile = { fileName: string; contentType: string; body: string };

/** A clip's notes as a WebVTT chapters file or a plain list, named after the clip. */
export async function exportChapters(actor: Actor, mediaId: number, format: 'vtt' | 'txt'): Promise<ChaptersFile> {
  initModels();
  await authorizeLog(actor, 'view', { mediaId });
  const media = await loadClip(mediaId);
  const notes = await TimeNote.findAll({ where: { mediaId }, attributes: ['id', 'startMs', 'endMs', 'text'], order: timeOrder });
  const base = media.name.replace(/\.[a-z0-9]{2,5}$/i, '').trim() || 'clip';
  return format === 'vtt'
    ? { fileName: `${base}-chapters.vtt`, contentType: 'text/vtt; charset=utf-8', body: toWebVtt(notes, { durationMs: media.durationMs }) }
    : { fileName: `${base}-chapters.txt`, contentType: 'text/plain; charset=utf-8', body: toTimestampList(notes) + (notes.length ? '\n' : '') };
}
