import 'server-only';
import { createHash } from 'node:crypto';
import { PassThrough, Readable, Transform } from 'node:stream';
import archiver from 'archiver';
import { Op } from 'sequelize';
import {
  initModels, Entry, Media, MeasurementPair, MeasurementReading, MeasurementRecord, Project, ProjectMembership, SavedCalculation, ShopSession, TimeNote,
} from '../../../db/models';
import { authorizeProject, type Actor } from '../../auth/policy';
import { AppError } from '../../errors';
import { factsOf } from '../projects';
import { streamStoredFile } from '../upload-service';
import { projectMeasurementsBySession } from '../measurements';
import { measurementsCsv } from '../../measurements/records-csv';
import { toWebVtt, formatClock } from '../../chapters';
import { renderEntryBody } from '../../rich-text/render';
import { entryMarkdown } from '../../rich-text/markdown';
import { mediaIdFromFileUrl } from '../../media/urls';
import { OPERATIONS } from '../../validations/log';
import {
  ARCHIVE_FORMAT, ARCHIVE_VERSION, DATA_PAIRS_PATH, DATA_PROJECT_PATH, MANIFEST_PATH, sessionDataPath,
  type ArchiveEntry, type ArchiveMedia, type ArchiveProject, type ArchiveSession, type Manifest, type ManifestCounts,
} from './format';

// Writes a whole project as one zip, streamed: one session's rows at a time, one media file at a time
// (each read from the upload service only when the zip is ready for it), so memory stays flat however
// large the project. Every file's size and SHA-256 go into the manifest, written last.

export type ArchivePlan = { projectId: number; slug: string; title: string; filename: string; counts: Pick<ManifestCounts, 'sessions' | 'entries' | 'media'>; mediaBytes: number };

async function loadForExport(actor: Actor, projectId: number) {
  initModels();
  const project = await Project.findByPk(projectId, { include: [{ model: ProjectMembership, as: 'memberships' }] });
  if (!project) throw new AppError('not_found', 'That project was not found.');
  authorizeProject(actor, 'exportProject', factsOf(project));
  return project;
}

/** What an archive of the project will hold, for the page (and the authorization, before any byte is sent). */
export async function planProjectArchive(actor: Actor, projectId: number): Promise<ArchivePlan> {
  const project = await loadForExport(actor, projectId);
  const sessionIds = (await ShopSession.findAll({ where: { projectId }, attributes: ['id'], raw: true })).map((s) => s.id);
  const entryIds = sessionIds.length ? (await Entry.findAll({ where: { sessionId: { [Op.in]: sessionIds } }, attributes: ['id'], raw: true })).map((e) => e.id) : [];
  const media = entryIds.length ? await Media.findAll({ where: { entryId: { [Op.in]: entryIds } }, attributes: ['sizeBytes', 'source'], raw: true }) : [];
  return {
    projectId, slug: project.slug, title: project.title, filename: `${project.slug}-archive.zip`,
    counts: { sessions: sessionIds.length, entries: entryIds.length, media: media.length },
    mediaBytes: media.reduce((sum, m) => sum + (m.source === 'upload' ? (m.sizeBytes ?? 0) : 0), 0),
  };
}

const escapeHtml = (t: string) => t.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const safeName = (name: string) => name.normalize('NFKD').replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^[-.]+/, '').slice(0, 80) || 'file';
const opLabel = (op: string) => OPERATIONS.find((o) => o.value === op)?.label ?? op;
const entryPage = (e: { id: number }) => `entries/e${e.id}.html`;

/** Replaces each image's app address with `to(mediaId)` (a path inside the archive); other images are dropped. */
function rewriteImages(doc: unknown, to: (mediaId: number) => string | null): unknown {
  if (!doc || typeof doc !== 'object') return doc;
  const node = doc as { type?: string; attrs?: Record<string, unknown>; content?: unknown[] };
  const out: Record<string, unknown> = { ...node };
  if (node.type === 'image' && typeof node.attrs?.src === 'string') {
    const id = mediaIdFromFileUrl(node.attrs.src.trim());
    out.attrs = { ...node.attrs, src: id === null ? '' : (to(id) ?? '') };
  }
  if (Array.isArray(node.content)) out.content = node.content.map((c) => rewriteImages(c, to));
  return out;
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

const PAGE_STYLE = `body{font:16px/1.5 system-ui,sans-serif;max-width:60rem;margin:2rem auto;padding:0 1rem;color:#2b2a28;background:#faf8f3}
a{color:#1d3f8f}img,video{max-width:100%;height:auto}.clip{display:grid;gap:1rem;grid-template-columns:minmax(0,2fr) minmax(0,1fr);margin:1.5rem 0}
.notes{margin:0;padding:0;list-style:none}.notes li{margin:.25rem 0}.t{font-family:ui-monospace,monospace}table{border-collapse:collapse}td,th{border:1px solid #ccc;padding:.2rem .5rem}
@media (max-width:40rem){.clip{grid-template-columns:1fr}}`;

function page(title: string, body: string, up = ''): string {
  return `<!doctype html>\n<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(title)}</title>` +
    `<style>${PAGE_STYLE}</style></head><body>${up ? `<p><a href="${up}">← Back to the project</a></p>` : ''}${body}</body></html>\n`;
}

/** The zip as a web stream; throws (before any byte) when the actor may not export the project. */
export async function projectArchiveStream(actor: Actor, projectId: number): Promise<{ filename: string; stream: ReadableStream<Uint8Array> }> {
  const project = await loadForExport(actor, projectId);
  const zip = archiver('zip', { zlib: { level: 6 }, forceZip64: false });
  const out = new PassThrough();
  zip.on('warning', (err) => console.error(`[archive] ${err.message}`));
  zip.on('error', (err) => out.destroy(err));
  zip.pipe(out);
  void writeArchive(actor, project, zip).catch((err) => {
    console.error(`[archive] export of project ${projectId} failed: ${err instanceof Error ? err.message : String(err)}`);
    zip.abort();
    out.destroy(err instanceof Error ? err : new Error(String(err)));
  });
  return { filename: `${project.slug}-archive.zip`, stream: Readable.toWeb(out) as ReadableStream<Uint8Array> };
}

async function writeArchive(actor: Actor, project: Project, zip: archiver.Archiver): Promise<void> {
  const files: Manifest['files'] = [];
  // Resolves when the zip has taken the entry in full, so the next source is opened only then.
  const add = (path: string, source: string | Buffer | Readable, options: { store?: boolean } = {}) =>
    new Promise<void>((resolve, reject) => {
      const hash = createHash('sha256');
      let bytes = 0;
      const counter = new Transform({
        transform(chunk: Buffer, _enc, done) {
          hash.update(chunk);
          bytes += chunk.length;
          done(null, chunk);
        },
      });
      const onEntry = (entry: archiver.EntryData) => {
        if (entry.name !== path) return;
        zip.off('entry', onEntry);
        files.push({ path, bytes, sha256: hash.digest('hex') });
        resolve();
      };
      zip.on('entry', onEntry);
      const input = typeof source === 'string' || Buffer.isBuffer(source) ? Readable.from([Buffer.from(source)]) : source;
      input.on('error', (err) => {
        zip.off('entry', onEntry);
        reject(err);
      });
      zip.append(input.pipe(counter), { name: path, store: options.store, date: new Date() });
    });

  const counts: ManifestCounts = { sessions: 0, entries: 0, media: 0, notes: 0, records: 0, readings: 0, pairs: 0, calculations: 0 };
  const sessionFiles: string[] = [];
  type SessionLine = Pick<ShopSession, 'title' | 'heldOn' | 'minutesSpent' | 'planned' | 'done' | 'nextSteps'>;
  const index: { session: SessionLine; entries: { id: number; title: string; operation: string }[] }[] = [];
  const calculations: unknown[] = [];
  const sessions = await ShopSession.findAll({ where: { projectId: project.id }, order: [['position', 'ASC'], ['id', 'ASC']] });

  for (const [si, session] of sessions.entries()) {
    counts.sessions++;
    const entries = await Entry.findAll({ where: { sessionId: session.id }, order: [['position', 'ASC'], ['id', 'ASC']] });
    const entryIds = entries.map((e) => e.id);
    const [media, records, calcs] = entryIds.length
      ? await Promise.all([
        Media.findAll({ where: { entryId: { [Op.in]: entryIds } }, order: [['kind', 'ASC'], ['position', 'ASC'], ['id', 'ASC']], include: [{ model: TimeNote, as: 'notes' }] }),
        MeasurementRecord.findAll({ where: { entryId: { [Op.in]: entryIds } }, order: [['id', 'ASC']], include: [{ model: MeasurementReading, as: 'readings' }] }),
        SavedCalculation.findAll({ where: { entryId: { [Op.in]: entryIds } }, order: [['position', 'ASC'], ['id', 'ASC']] }),
      ])
      : [[], [], []];
    const mediaFile = new Map<number, string>();
    for (const m of media) if (m.source === 'upload' && m.fileKey) mediaFile.set(m.id, `media/m${m.id}-${safeName(m.name)}`);

    const archived: ArchiveEntry[] = [];
    for (const e of entries) {
      counts.entries++;
      const body = parseJson(e.body);
      const own = media.filter((m) => m.entryId === e.id);
      const archivedMedia: ArchiveMedia[] = own.map((m) => {
        const notes = [...(m.notes ?? [])].sort((a, b) => a.startMs - b.startMs || a.id - b.id);
        counts.media++;
        counts.notes += notes.length;
        return {
          ref: `m${m.id}`, kind: m.kind as 'photo' | 'clip', source: m.source as 'upload' | 'link', file: mediaFile.get(m.id) ?? null,
          url: m.source === 'link' ? m.url : '', name: m.name, mime: m.mime, sizeBytes: m.sizeBytes, width: m.width, height: m.height,
          durationMs: m.durationMs, caption: m.caption ?? '', position: m.position ?? 0,
          notes: notes.map((n) => ({ ref: `n${n.id}`, startMs: n.startMs, endMs: n.endMs, kind: n.kind, text: n.text })),
        };
      });
      const ownRecords = records.filter((r) => r.entryId === e.id);
      const ownCalcs = calcs.filter((c) => c.entryId === e.id);
      counts.records += ownRecords.length;
      counts.calculations += ownCalcs.length;
      archived.push({
        ref: `e${e.id}`, position: e.position, title: e.title, operation: e.operation, body, media: archivedMedia,
        records: ownRecords.map((r) => {
          const readings = [...(r.readings ?? [])].sort((a, b) => a.position - b.position || a.id - b.id);
          counts.readings += readings.length;
          return {
            ref: `r${r.id}`, noteRef: r.timeNoteId ? `n${r.timeNoteId}` : null, feature: r.feature, kind: r.kind, nominal: String(r.nominal), unit: r.unit,
            specType: r.specType, specZone: r.specZone, specUpper: r.specUpper === null ? null : String(r.specUpper), specLower: r.specLower === null ? null : String(r.specLower),
            specTolerance: r.specTolerance === null ? null : String(r.specTolerance), specGeneralClass: r.specGeneralClass,
            readings: readings.map((x) => ({
              position: x.position, passNumber: x.passNumber, value: String(x.value), unit: x.unit, instrument: x.instrument, resolution: String(x.resolution),
              measuredBy: x.measuredBy, measuredAt: new Date(x.measuredAt).toISOString(), temperatureC: x.temperatureC === null ? null : String(x.temperatureC), note: x.note,
            })),
          };
        }),
        calculations: ownCalcs.map((c) => ({ calculator: c.calculator, label: c.label, inputs: parseJson(c.inputs), outputs: parseJson(c.outputs), tablesVersion: c.tablesVersion, position: c.position ?? 0 })),
      });
      for (const c of ownCalcs) calculations.push({ session: session.title, entry: e.title, calculator: c.calculator, label: c.label, inputs: parseJson(c.inputs), outputs: parseJson(c.outputs), tablesVersion: c.tablesVersion, savedAt: c.createdAt.toISOString() });

      // The readable copies: Markdown, the offline page, the clips' notes as WebVTT.
      const relative = (id: number) => (mediaFile.has(id) ? `../${mediaFile.get(id)}` : null);
      const shownBody = rewriteImages(body, relative);
      const imageSrcs = own.filter((m) => mediaFile.has(m.id)).map((m) => relative(m.id)!);
      await add(`markdown/e${e.id}.md`, `# ${e.title}\n\n*${opLabel(e.operation)} · ${session.title} (${session.heldOn})*\n\n${entryMarkdown(shownBody)}`);
      const clipsHtml: string[] = [];
      for (const m of archivedMedia.filter((x) => x.kind === 'clip')) {
        const vtt = `notes/m${m.ref.slice(1)}.vtt`;
        await add(vtt, toWebVtt(m.notes, { durationMs: m.durationMs }));
        const player = m.file
          ? `<video controls preload="metadata" src="../${escapeHtml(m.file)}"><track kind="chapters" default src="../${vtt}"></video>`
          : `<p><a href="${escapeHtml(m.url)}" rel="noopener noreferrer">${escapeHtml(m.name || m.url)}</a> (a clip kept elsewhere)</p>`;
        const list = m.notes.map((n) => `<li><span class="t">${formatClock(n.startMs)}</span> ${escapeHtml(n.text)}</li>`).join('');
        clipsHtml.push(`<section class="clip"><div>${player}${m.caption ? `<p>${escapeHtml(m.caption)}</p>` : ''}</div><div><h3>Notes</h3><ul class="notes">${list || '<li>No notes.</li>'}</ul><p><a href="../${vtt}">Notes as WebVTT</a></p></div></section>`);
      }
      const photos = archivedMedia.filter((x) => x.kind === 'photo' && x.file).map((m) => `<figure><img src="../${escapeHtml(m.file!)}" alt="${escapeHtml(m.caption || m.name)}">${m.caption ? `<figcaption>${escapeHtml(m.caption)}</figcaption>` : ''}</figure>`);
      await add(entryPage(e), page(e.title,
        `<h1>${escapeHtml(e.title)}</h1><p>${escapeHtml(opLabel(e.operation))} · ${escapeHtml(session.title)} (${escapeHtml(session.heldOn)})</p>` +
        `<article>${renderEntryBody(shownBody, { allowedImageUrls: imageSrcs })}</article>${clipsHtml.join('')}${photos.length ? `<h2>Photos</h2>${photos.join('')}` : ''}` +
        `<p><a href="../markdown/e${e.id}.md">This entry as Markdown</a></p>`, '../index.html'));
    }
    // Media bytes, one file at a time, stored as they are (photos and clips are compressed already).
    for (const m of media) {
      const path = mediaFile.get(m.id);
      if (!path) continue;
      const bytes = await streamStoredFile(m.fileKey!);
      await add(path, Readable.fromWeb(bytes as import('node:stream/web').ReadableStream<Uint8Array>), { store: true });
    }
    const data: ArchiveSession = {
      ref: `s${session.id}`, position: si, title: session.title, heldOn: session.heldOn, minutesSpent: session.minutesSpent,
      planned: session.planned, done: session.done, nextSteps: session.nextSteps, entries: archived,
    };
    const dataPath = sessionDataPath(si + 1);
    await add(dataPath, JSON.stringify(data, null, 1));
    sessionFiles.push(dataPath);
    const { title, heldOn, minutesSpent, planned, done, nextSteps } = session;
    index.push({ session: { title, heldOn, minutesSpent, planned, done, nextSteps }, entries: entries.map((e) => ({ id: e.id, title: e.title, operation: e.operation })) });
  }

  const pairs = await MeasurementPair.findAll({
    include: [{ model: MeasurementRecord, as: 'hole', attributes: ['id'], required: true, include: [{ model: Entry, as: 'entry', attributes: [], required: true, include: [{ model: ShopSession, as: 'session', attributes: [], required: true, where: { projectId: project.id } }] }] }],
    order: [['id', 'ASC']],
  });
  counts.pairs = pairs.length;
  await add(DATA_PAIRS_PATH, JSON.stringify(pairs.map((p) => ({ hole: `r${p.holeRecordId}`, shaft: `r${p.shaftRecordId}` }))));
  // The CSV is written as it is read, a session's records at a time.
  async function* csv() {
    yield Buffer.from(`\uFEFF${measurementsCsv([])}`);
    for await (const records of projectMeasurementsBySession(actor, project.id)) yield Buffer.from(measurementsCsv(records, { header: false }));
  }
  await add('measurements/records-and-readings.csv', Readable.from(csv()));
  await add('calculations/calculations.json', JSON.stringify(calculations, null, 2));

  const toc = index.map(({ session, entries }) =>
    `<section><h2>${escapeHtml(session.title)}</h2><p>${escapeHtml(session.heldOn)}${session.minutesSpent ? ` · ${session.minutesSpent} min` : ''}</p>` +
    `${session.planned ? `<p><strong>Planned:</strong> ${escapeHtml(session.planned)}</p>` : ''}${session.done ? `<p><strong>Done:</strong> ${escapeHtml(session.done)}</p>` : ''}${session.nextSteps ? `<p><strong>Next:</strong> ${escapeHtml(session.nextSteps)}</p>` : ''}` +
    `<ol>${entries.map((e) => `<li><a href="${entryPage(e)}">${escapeHtml(e.title)}</a> (${escapeHtml(opLabel(e.operation))})</li>`).join('')}</ol></section>`).join('');
  await add('index.html', page(project.title,
    `<h1>${escapeHtml(project.title)}</h1>${project.summary ? `<p>${escapeHtml(project.summary)}</p>` : ''}${toc}` +
    `<p><a href="measurements/records-and-readings.csv">Measurement records and readings (CSV)</a> · <a href="calculations/calculations.json">Saved calculations (JSON)</a></p>` +
    `<p><small>A Scribeline project archive, format ${ARCHIVE_VERSION}. It reads offline; bring it back into Scribeline from “Bring in an archive” on your projects page.</small></p>`));

  const projectData: ArchiveProject = { title: project.title, summary: project.summary, units: project.units, sessions: sessionFiles };
  await add(DATA_PROJECT_PATH, JSON.stringify(projectData, null, 1));
  const manifest: Manifest = { format: ARCHIVE_FORMAT, version: ARCHIVE_VERSION, createdAt: new Date().toISOString(), project: { title: project.title, slug: project.slug }, counts, files };
  zip.append(JSON.stringify(manifest, null, 1), { name: MANIFEST_PATH });
  await zip.finalize();
}
