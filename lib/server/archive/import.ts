import 'server-only';
import { createHash, randomUUID } from 'node:crypto';
import { createWriteStream, openAsBlob } from 'node:fs';
import { mkdtemp, open, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import yauzl from 'yauzl';
import { UTFile } from 'uploadthing/server';
import {
  initModels, Entry, Media, MeasurementPair, MeasurementReading, MeasurementRecord, Project, SavedCalculation, ShopSession, TimeNote,
} from '../../../db/models';
import { withTransaction } from '../../../db/connection';
import { authorizeSite, type Actor } from '../../auth/policy';
import { AppError } from '../../errors';
import { freeSlug } from '../projects';
import { deleteStoredFiles, getUtapi, queueFileDeletions } from '../upload-service';
import { contentRefusal, sniffMedia, SNIFF_BYTES } from '../../media/sniff';
import { maxBytesFor } from '../../media/rules';
import { mediaFileUrl, mediaIdFromFileUrl } from '../../media/urls';
import { normalizeEntryBody, RichTextError } from '../../rich-text/normalize';
import { isCalculatorError, isCalculatorKind, TABLES_VERSION, type CalculatorKind } from '../../calculators';
import { sanitizeInput } from '../../validations/calculations';
import { computeForClient } from '../calculations';
import {
  ARCHIVE_LIMITS, ARCHIVE_VERSION, ARCHIVE_FORMAT, DATA_PAIRS_PATH, DATA_PROJECT_PATH, MANIFEST_PATH, archivePairsSchema, archiveProjectSchema, archiveSessionSchema,
  manifestSchema, unsafePathReason, type ArchiveSession, type Manifest, type ManifestCounts,
} from './format';

// Brings an archive back as a new private project of the signed-in member. Everything is checked before
// anything is kept: the manifest and its version, every path, sizes and the compression ratio (counted
// while reading, not trusted from the zip's headers), every file's SHA-256, the data's shape and counts,
// each media file's content. Media then go to the upload service through the SDK; the rows are written
// in one transaction, and if anything fails after an upload the uploaded files are queued for deletion.

export type ImportLimits = typeof ARCHIVE_LIMITS;
export type ImportResult = { projectId: number; slug: string; title: string; counts: ManifestCounts };

const refuse = (message: string): AppError => new AppError('validation', message, { archive: [message] });
const tooLarge = (message: string): AppError => new AppError('too_large', message, { archive: [message] });

/** Writes the request body to a temporary file, counting bytes as they come (413 past the cap). */
async function saveUpload(body: ReadableStream<Uint8Array> | Readable, into: string, limits: ImportLimits): Promise<number> {
  let bytes = 0;
  const cap = new Transform({
    transform(chunk: Buffer, _enc, done) {
      bytes += chunk.length;
      if (bytes > limits.uploadBytes) done(tooLarge(`The archive is larger than ${Math.round(limits.uploadBytes / 1024 / 1024)} MB, more than one import takes.`));
      else done(null, chunk);
    },
  });
  const source = body instanceof Readable ? body : Readable.fromWeb(body as import('node:stream/web').ReadableStream<Uint8Array>);
  await pipeline(source, cap, createWriteStream(into));
  return bytes;
}

type ZipEntry = yauzl.Entry;

function openZip(file: string): Promise<yauzl.ZipFile> {
  return new Promise((resolve, reject) =>
    yauzl.open(file, { lazyEntries: true, autoClose: false, decodeStrings: false, validateEntrySizes: true }, (err, zip) => (err ? reject(err) : resolve(zip!))),
  );
}

const utf8 = new TextDecoder('utf-8', { fatal: true });

/** Every entry of the zip, each name checked, sizes and ratios and the count capped before anything is inflated. */
async function scanEntries(zip: yauzl.ZipFile, limits: ImportLimits): Promise<Map<string, ZipEntry>> {
  if (zip.entryCount > limits.entries) throw refuse(`The archive holds ${zip.entryCount} files; an archive may hold at most ${limits.entries}.`);
  const entries = new Map<string, ZipEntry>();
  let total = 0;
  await new Promise<void>((resolve, reject) => {
    zip.on('error', (err) => reject(refuse(`The archive is damaged: ${err instanceof Error ? err.message : String(err)}.`)));
    zip.on('end', () => resolve());
    zip.on('entry', (entry: ZipEntry) => {
      let name: string;
      try {
        name = utf8.decode(entry.fileName as unknown as Buffer);
      } catch {
        return reject(refuse('The archive has a file whose name is not UTF-8 text.'));
      }
      const why = unsafePathReason(name);
      if (why) return reject(refuse(`The archive has a file whose path has ${why} (“${name.slice(0, 80)}”): every path must stay inside the archive's folder.`));
      if (name.endsWith('/')) return zip.readEntry();
      if (entries.has(name)) return reject(refuse(`The archive holds “${name}” twice.`));
      total += entry.uncompressedSize;
      if (total > limits.totalBytes) return reject(tooLarge(`The archive unpacks to more than ${Math.round(limits.totalBytes / 1024 / 1024)} MB, more than one import takes.`));
      if (entry.uncompressedSize > limits.ratioFloorBytes && entry.uncompressedSize > entry.compressedSize * limits.ratio) {
        return reject(refuse(`“${name}” unpacks to over ${limits.ratio} times its packed size: that is a zip bomb, not an archive of ours.`));
      }
      entries.set(name, entry);
      zip.readEntry();
    });
    zip.readEntry();
  });
  return entries;
}

function openEntry(zip: yauzl.ZipFile, entry: ZipEntry): Promise<Readable> {
  return new Promise((resolve, reject) => zip.openReadStream(entry, (err, stream) => (err ? reject(refuse(`The archive is damaged: ${err.message}.`)) : resolve(stream!))));
}

/** Streams an entry through a byte counter and a hash (refusing past `cap`), into `sink` or into memory. */
async function readEntry(zip: yauzl.ZipFile, entry: ZipEntry, name: string, cap: number, sink?: string): Promise<{ bytes: number; sha256: string; data?: Buffer }> {
  if (entry.uncompressedSize > cap) throw tooLarge(`“${name}” is larger than an archive's ${name.startsWith('media/') ? 'media files' : 'data files'} may be.`);
  const stream = await openEntry(zip, entry);
  const hash = createHash('sha256');
  const chunks: Buffer[] = [];
  let bytes = 0;
  const counter = new Transform({
    transform(chunk: Buffer, _enc, done) {
      bytes += chunk.length;
      if (bytes > cap || bytes > entry.uncompressedSize) return done(refuse(`“${name}” holds more than its header says: the archive is damaged or hostile.`));
      hash.update(chunk);
      if (!sink) chunks.push(chunk);
      done(null, sink ? chunk : undefined);
    },
  });
  try {
    if (sink) await pipeline(stream, counter, createWriteStream(sink));
    else await pipeline(stream, counter, async function* (src) { for await (const c of src) yield c; });
  } catch (err) {
    if (err instanceof AppError) throw err;
    if (err instanceof Error && /too many bytes|too few bytes/.test(err.message)) throw refuse(`“${name}” holds more or less than its header says: the archive is damaged or hostile.`);
    throw refuse(`“${name}” could not be unpacked: ${err instanceof Error ? err.message : String(err)}.`);
  }
  return { bytes, sha256: hash.digest('hex'), data: sink ? undefined : Buffer.concat(chunks) };
}

function listed(manifest: Manifest, name: string) {
  const file = manifest.files.find((f) => f.path === name);
  if (!file) throw refuse(`The manifest does not list “${name}”.`);
  return file;
}

function checkSum(name: string, got: { bytes: number; sha256: string }, want: { bytes: number; sha256: string }): void {
  if (got.bytes !== want.bytes || got.sha256 !== want.sha256) throw refuse(`“${name}” does not match its checksum in the manifest: the archive is damaged.`);
}

function parseJson(name: string, data: Buffer): unknown {
  try {
    return JSON.parse(data.toString('utf8'));
  } catch {
    throw refuse(`“${name}” is not readable JSON: the archive is damaged.`);
  }
}

function shapeOf<T>(name: string, schema: { safeParse(v: unknown): { success: true; data: T } | { success: false; error: { issues: { path: PropertyKey[]; message: string }[] } } }, value: unknown): T {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw refuse(`“${name}” is not in the archive format: ${issue.path.map(String).join('.') || 'its top level'} — ${issue.message}.`);
}

/** Rewrites each image's app address from the archive's media id to the new one; images of no known photo are dropped. */
function rewriteImages(doc: unknown, to: Map<string, number>): unknown {
  if (!doc || typeof doc !== 'object') return doc;
  const node = doc as { type?: string; attrs?: Record<string, unknown>; content?: unknown[] };
  const out: Record<string, unknown> = { ...node };
  if (node.type === 'image' && typeof node.attrs?.src === 'string') {
    const old = mediaIdFromFileUrl(node.attrs.src.trim());
    const now = old === null ? undefined : to.get(`m${old}`);
    out.attrs = { ...node.attrs, src: now === undefined ? '' : mediaFileUrl(now) };
  }
  if (Array.isArray(node.content)) out.content = node.content.map((c) => rewriteImages(c, to));
  return out;
}

/** Imports an archive (a zip, as a stream) as a new private project of the actor. */
export async function importProjectArchive(actor: Actor, body: ReadableStream<Uint8Array> | Readable | null, options: { limits?: Partial<ImportLimits> } = {}): Promise<ImportResult> {
  authorizeSite(actor, 'importProject');
  if (!body) throw refuse('Choose an archive (.zip) to bring in.');
  const limits: ImportLimits = { ...ARCHIVE_LIMITS, ...options.limits };
  initModels();
  const work = await mkdtemp(path.join(os.tmpdir(), 'scribeline-import-'));
  const uploaded: string[] = [];
  let zip: yauzl.ZipFile | null = null;
  try {
    const zipPath = path.join(work, 'archive.zip');
    await saveUpload(body, zipPath, limits);
    try {
      zip = await openZip(zipPath);
    } catch {
      throw refuse('This file is not a zip archive.');
    }
    const entries = await scanEntries(zip, limits);

    // The manifest and its version.
    const manifestEntry = entries.get(MANIFEST_PATH);
    if (!manifestEntry) throw refuse(`This is not a Scribeline archive: ${MANIFEST_PATH} is missing.`);
    const manifestRaw = parseJson(MANIFEST_PATH, (await readEntry(zip, manifestEntry, MANIFEST_PATH, limits.manifestBytes)).data!);
    const head = manifestRaw as { format?: unknown; version?: unknown } | null;
    if (!head || head.format !== ARCHIVE_FORMAT) throw refuse(`This is not a Scribeline archive: ${MANIFEST_PATH} does not name the format “${ARCHIVE_FORMAT}”.`);
    if (head.version !== ARCHIVE_VERSION) throw refuse(`This archive is format version ${String(head.version)}; this Scribeline reads version ${ARCHIVE_VERSION}.`);
    const manifest = shapeOf(MANIFEST_PATH, manifestSchema, manifestRaw);
    for (const f of manifest.files) {
      const why = unsafePathReason(f.path);
      if (why) throw refuse(`The manifest names a path with ${why}: every path must stay inside the archive's folder.`);
      const entry = entries.get(f.path);
      if (!entry) throw refuse(`The manifest lists “${f.path}”, which is not in the archive.`);
      if (entry.uncompressedSize !== f.bytes) throw refuse(`“${f.path}” is not the size the manifest gives: the archive is damaged.`);
    }

    // The data, each file checked against its sum.
    const readData = async (name: string) => {
      const entry = entries.get(name);
      if (!entry) throw refuse(`The archive has no “${name}”.`);
      const got = await readEntry(zip!, entry, name, limits.dataFileBytes);
      checkSum(name, got, listed(manifest, name));
      return parseJson(name, got.data!);
    };
    const project = shapeOf(DATA_PROJECT_PATH, archiveProjectSchema, await readData(DATA_PROJECT_PATH));
    const sessions: ArchiveSession[] = [];
    for (const name of project.sessions) {
      if (!name.startsWith('data/sessions/')) throw refuse(`“${name}” is not a session data file.`);
      sessions.push(shapeOf(name, archiveSessionSchema, await readData(name)));
    }
    const pairs = shapeOf(DATA_PAIRS_PATH, archivePairsSchema, await readData(DATA_PAIRS_PATH));

    // The counts and references agree with each other and with the manifest.
    const counts: ManifestCounts = { sessions: sessions.length, entries: 0, media: 0, notes: 0, records: 0, readings: 0, pairs: pairs.length, calculations: 0 };
    const recordRefs = new Set<string>();
    const mediaFiles: { ref: string; kind: 'photo' | 'clip'; file: string; name: string }[] = [];
    for (const s of sessions) {
      for (const e of s.entries) {
        counts.entries++;
        const noteRefs = new Set<string>();
        for (const m of e.media) {
          counts.media++;
          counts.notes += m.notes.length;
          for (const n of m.notes) noteRefs.add(n.ref);
          if (m.source === 'upload') {
            if (!m.file || !m.file.startsWith('media/')) throw refuse(`The uploaded ${m.kind} “${m.name}” has no file in the archive's media folder.`);
            listed(manifest, m.file);
            mediaFiles.push({ ref: m.ref, kind: m.kind, file: m.file, name: m.name });
          } else if (!/^https?:\/\//i.test(m.url)) throw refuse(`The linked clip “${m.name}” has no http(s) address.`);
        }
        for (const r of e.records) {
          counts.records++;
          counts.readings += r.readings.length;
          recordRefs.add(r.ref);
          if (r.noteRef && !noteRefs.has(r.noteRef)) throw refuse(`The record “${r.feature}” names a note that is not in its entry.`);
        }
        counts.calculations += e.calculations.length;
      }
    }
    for (const p of pairs) if (!recordRefs.has(p.hole) || !recordRefs.has(p.shaft)) throw refuse('A pair of records names a record that is not in the archive.');
    for (const key of Object.keys(counts) as (keyof ManifestCounts)[]) {
      if (counts[key] !== manifest.counts[key]) throw refuse(`The manifest counts ${manifest.counts[key]} ${key} but the data holds ${counts[key]}: the archive is damaged.`);
    }

    // Media: unpacked one at a time (sum and content checked), then uploaded through the SDK.
    const utapi = getUtapi();
    const keyOf = new Map<string, { key: string; mime: string; size: number }>();
    for (const m of mediaFiles) {
      const sink = path.join(work, `media-${randomUUID()}`);
      const got = await readEntry(zip, entries.get(m.file)!, m.file, maxBytesFor(m.kind), sink);
      checkSum(m.file, got, listed(manifest, m.file));
      const fh = await open(sink, 'r');
      const head = Buffer.alloc(Math.min(SNIFF_BYTES, got.bytes));
      await fh.read(head, 0, head.length, 0);
      await fh.close();
      const sniffed = sniffMedia(head);
      const refusal = contentRefusal(sniffed, m.kind, m.name);
      if (refusal) throw refuse(refusal);
      const blob = await openAsBlob(sink);
      const result = await utapi.uploadFiles(new UTFile([blob], m.name || path.basename(m.file), { type: sniffed!.mime }), { acl: 'private' });
      if (result.error || !result.data) throw new AppError('unavailable', 'The upload service did not take the archive\'s media; nothing was imported. Try again later.');
      uploaded.push(result.data.key);
      keyOf.set(m.ref, { key: result.data.key, mime: sniffed!.mime, size: got.bytes });
      await rm(sink, { force: true });
    }

    // The rows, all in one transaction.
    return await withTransaction(async (transaction) => {
      const slug = await freeSlug(project.title, transaction);
      const row = await Project.create({ ownerId: actor!.id, slug, title: project.title, summary: project.summary, units: project.units, visibility: 'private', publishedAt: null }, { transaction });
      const recordIds = new Map<string, number>();
      for (const [si, s] of sessions.entries()) {
        const session = await ShopSession.create({
          projectId: row.id, position: si, title: s.title, heldOn: s.heldOn, minutesSpent: s.minutesSpent, planned: s.planned, done: s.done, nextSteps: s.nextSteps, visibility: 'private',
        }, { transaction });
        const ordered = [...s.entries].sort((a, b) => a.position - b.position);
        for (const [ei, e] of ordered.entries()) {
          const entry = await Entry.create({ sessionId: session.id, position: ei, title: e.title, operation: e.operation, body: '{"type":"doc","content":[]}' }, { transaction });
          const mediaIds = new Map<string, number>();
          const noteIds = new Map<string, number>();
          const photoUrls: string[] = [];
          for (const m of e.media) {
            const stored = keyOf.get(m.ref);
            const media = await Media.create({
              entryId: entry.id, kind: m.kind, source: m.source, fileKey: stored?.key ?? null, url: stored ? '' : m.url, name: m.name, mime: stored?.mime ?? m.mime,
              sizeBytes: stored?.size ?? m.sizeBytes, width: m.width, height: m.height, durationMs: m.durationMs, caption: m.caption, position: m.position, uploadedBy: actor!.id,
            }, { transaction });
            if (stored) await media.update({ url: mediaFileUrl(media.id) }, { transaction });
            if (stored && m.kind === 'photo') photoUrls.push(mediaFileUrl(media.id));
            mediaIds.set(m.ref, media.id);
            for (const n of m.notes) {
              const note = await TimeNote.create({ mediaId: media.id, startMs: n.startMs, endMs: n.endMs, kind: n.kind as TimeNote['kind'], text: n.text, authorId: actor!.id }, { transaction });
              noteIds.set(n.ref, note.id);
            }
          }
          let body: Record<string, unknown>;
          try {
            body = normalizeEntryBody(rewriteImages(e.body, mediaIds), { allowedImageUrls: photoUrls });
          } catch (err) {
            if (err instanceof RichTextError) throw refuse(`The text of the entry “${e.title}” cannot be restored: ${err.message}`);
            throw err;
          }
          await entry.update({ body: JSON.stringify(body) }, { transaction });
          for (const r of e.records) {
            const record = await MeasurementRecord.create({
              entryId: entry.id, timeNoteId: r.noteRef ? noteIds.get(r.noteRef) ?? null : null, feature: r.feature, kind: r.kind, nominal: r.nominal, unit: r.unit,
              specType: r.specType, specZone: r.specZone, specUpper: r.specUpper, specLower: r.specLower, specTolerance: r.specTolerance, specGeneralClass: r.specGeneralClass,
            }, { transaction });
            recordIds.set(r.ref, record.id);
            for (const x of r.readings) {
              await MeasurementReading.create({
                recordId: record.id, position: x.position, passNumber: x.passNumber, value: x.value, unit: x.unit, instrument: x.instrument, resolution: x.resolution,
                measuredBy: x.measuredBy, measuredAt: new Date(x.measuredAt), temperatureC: x.temperatureC, note: x.note,
              }, { transaction });
            }
          }
          for (const [ci, c] of [...e.calculations].sort((a, b) => a.position - b.position).entries()) {
            if (!isCalculatorKind(c.calculator)) throw refuse(`The saved calculation “${c.label}” is of a kind this Scribeline does not know (“${c.calculator}”).`);
            let input: Record<string, unknown>;
            let output: unknown;
            try {
              input = sanitizeInput(c.calculator as CalculatorKind, (c.inputs ?? {}) as Record<string, unknown>);
              // Outputs are computed here, never taken from a file.
              output = computeForClient(c.calculator as CalculatorKind, input);
            } catch (err) {
              if (err instanceof AppError || isCalculatorError(err)) throw refuse(`The saved calculation “${c.label}” cannot be computed again: ${(err as Error).message}`);
              throw err;
            }
            await SavedCalculation.create({
              entryId: entry.id, calculator: c.calculator, label: c.label, inputs: JSON.stringify(input), outputs: JSON.stringify(output), tablesVersion: TABLES_VERSION, position: ci, createdById: actor!.id,
            }, { transaction });
          }
        }
      }
      for (const p of pairs) await MeasurementPair.create({ holeRecordId: recordIds.get(p.hole)!, shaftRecordId: recordIds.get(p.shaft)! }, { transaction });
      return { projectId: row.id, slug: row.slug, title: row.title, counts };
    });
  } catch (err) {
    if (uploaded.length) {
      // Nothing kept: the uploaded files go through the deletion queue, so a crash here loses none either.
      try {
        await withTransaction((transaction) => queueFileDeletions(uploaded, transaction));
      } catch (queueErr) {
        console.error(`[archive] could not queue ${uploaded.length} uploaded file(s) for deletion: ${queueErr instanceof Error ? queueErr.message : String(queueErr)}`);
      }
      await deleteStoredFiles(uploaded);
    }
    throw err;
  } finally {
    if (zip) zip.close();
    await rm(work, { recursive: true, force: true });
  }
}
