/**
 * Memory of the project archive's export against its size. `seed` makes two projects in a *_bench database,
 * one ARCHIVE_BENCH_SCALE times the other (default 4): many sessions, entries with bodies, clips with notes,
 * records with readings, and a few hundred small photos and clips uploaded through the upload SDK to the
 * local upload service. `measure <project id>` then streams that project's archive in a fresh process,
 * reading and dropping the bytes as a browser would, and prints its peak RSS and heap beside the archive's
 * size. Run by tests/bench/archive.sh (npm run bench:archive), which starts the database and the upload service.
 *
 * The react-server condition lets lib/server's server-only guard load outside Next.
 */
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import bcrypt from 'bcryptjs';
import { UTApi, UTFile } from 'uploadthing/server';
import { initModels, Entry, Media, MeasurementReading, MeasurementRecord, Project, ShopSession, TimeNote, User } from '../../db/models';
import { closeSequelize } from '../../db/connection';
import { projectArchiveStream } from '../../lib/server/archive/export';
import { guardBenchDatabase } from './guard';

const BUILDER = { name: 'Wenna Tallis', email: 'wenna@tallis-lathe.test', handle: 'wenna-tallis' } as const;
const MEDIA_DIR = path.join(__dirname, '..', '..', 'db', 'seeders', 'media');
const SCALE = Number(process.env.ARCHIVE_BENCH_SCALE ?? 4);

/** One unit of size: 30 sessions of 4 entries, each entry a photo, each session a clip (150 media files). */
const UNIT = { sessions: 30, entriesPerSession: 4, notesPerClip: 20, recordsPerEntry: 2, readingsPerRecord: 4 } as const;

const slugFor = (scale: number) => `archive-bench-${scale}x`;

function paragraph(i: number): string {
  return `Pass ${i}: took 0.05 mm off the diameter at 420 rpm with a fresh edge, checked the size with the micrometer and noted the reading. ` +
    'The work stayed in the jaws by two-thirds of its length; the tailstock centre carried the rest. Chips came off blue and curled.';
}

async function upload(files: { bytes: Buffer<ArrayBuffer>; name: string; type: string }[]): Promise<{ key: string; url: string; size: number }[]> {
  const utapi = new UTApi({ logLevel: 'Error' });
  const out: { key: string; url: string; size: number }[] = [];
  for (let i = 0; i < files.length; i += 25) {
    const batch = files.slice(i, i + 25);
    const results = await utapi.uploadFiles(batch.map((f) => new UTFile([f.bytes], f.name, { type: f.type })), { acl: 'private' });
    for (const r of results) {
      if (r.error) throw new Error(`Could not upload a benchmark file: ${r.error.message}`);
      out.push({ key: r.data.key, url: r.data.ufsUrl, size: r.data.size });
    }
  }
  return out;
}

async function seedProject(ownerId: number, scale: number): Promise<number> {
  const slug = slugFor(scale);
  const sessions = UNIT.sessions * scale;
  const existing = await Project.findOne({ where: { slug } });
  if (existing) {
    const have = await ShopSession.count({ where: { projectId: existing.id } });
    if (have === sessions) return existing.id;
    await existing.destroy();
  }
  const [photo, clip] = await Promise.all([readFile(path.join(MEDIA_DIR, 'spigot-measuring.jpg')), readFile(path.join(MEDIA_DIR, 'spigot-turning.mp4'))]);
  const project = await Project.create({ ownerId, slug, title: `Archive benchmark, ${scale}×`, summary: 'A long log for the archive benchmark.', units: 'mm', visibility: 'private', publishedAt: null });
  for (let s = 0; s < sessions; s++) {
    const session = await ShopSession.create({
      projectId: project.id, position: s, title: `Session ${s + 1}: turning the arbor`, heldOn: '2026-11-02', minutesSpent: 90,
      planned: 'Turn the arbor to size.', done: 'Turned to size.', nextSteps: 'Thread the end.', visibility: 'private', publishedAt: null, announcedAt: null,
    });
    const entries = await Entry.bulkCreate(
      Array.from({ length: UNIT.entriesPerSession }, (_, e) => ({
        sessionId: session.id, position: e, title: `Entry ${e + 1} of session ${s + 1}`, operation: 'turning',
        body: JSON.stringify({ type: 'doc', content: Array.from({ length: 6 }, (_, i) => ({ type: 'paragraph', content: [{ type: 'text', text: paragraph(i) }] })) }),
      })),
      { individualHooks: true },
    );
    const stored = await upload([
      ...entries.map((e) => ({ bytes: photo, name: `photo-${e.id}.jpg`, type: 'image/jpeg' })),
      { bytes: clip, name: `clip-${session.id}.mp4`, type: 'video/mp4' },
    ]);
    const media = await Media.bulkCreate(stored.map((f, i) => {
      const isClip = i === entries.length;
      return {
        entryId: entries[isClip ? 0 : i]!.id, kind: isClip ? 'clip' : 'photo', source: 'upload', fileKey: f.key, url: f.url, name: isClip ? 'arbor.mp4' : 'arbor.jpg',
        mime: isClip ? 'video/mp4' : 'image/jpeg', sizeBytes: f.size, width: isClip ? null : 640, height: isClip ? null : 480, durationMs: isClip ? 12_000 : null,
        caption: isClip ? 'The last passes' : 'The arbor at size', position: isClip ? 0 : 1, uploadedBy: ownerId,
      } as const;
    }));
    const clipRow = media[media.length - 1]!;
    await TimeNote.bulkCreate(Array.from({ length: UNIT.notesPerClip }, (_, n) => ({ mediaId: clipRow.id, startMs: n * 500, endMs: null, kind: 'note' as const, text: `Moment ${n + 1}: the cut at this point`, authorId: ownerId })));
    const records = await MeasurementRecord.bulkCreate(entries.flatMap((e) => Array.from({ length: UNIT.recordsPerEntry }, (_, r) => ({
      entryId: e.id, feature: `Arbor diameter ${r + 1}`, kind: 'outside' as const, nominal: '25', unit: 'mm' as const, specType: 'zone' as const, specZone: 'g6',
      specUpper: null, specLower: null, specTolerance: null, specGeneralClass: null, timeNoteId: null,
    }))));
    await MeasurementReading.bulkCreate(records.flatMap((r) => Array.from({ length: UNIT.readingsPerRecord }, (_, k) => ({
      recordId: r.id, position: k, passNumber: k + 1, value: (24.99 - k * 0.001).toFixed(3), unit: 'mm' as const, instrument: 'micrometer', resolution: '0.001',
      measuredBy: BUILDER.name, measuredAt: new Date('2026-11-02T10:00:00Z'), temperatureC: '20', note: '',
    }))));
  }
  return project.id;
}

async function seed(): Promise<void> {
  initModels();
  const [builder] = await User.findOrCreate({
    where: { email: BUILDER.email },
    defaults: { email: BUILDER.email, name: BUILDER.name, handle: BUILDER.handle, passwordHash: await bcrypt.hash('archive-bench-only', 4), siteRole: 'member', emailVerifiedAt: new Date() },
  });
  const ids: number[] = [];
  for (const scale of [1, SCALE]) {
    const t = performance.now();
    ids.push(await seedProject(builder.id, scale));
    console.error(`seeded ${slugFor(scale)} in ${((performance.now() - t) / 1000).toFixed(1)} s`);
  }
  // The project ids for the shell script, one a line.
  console.log(ids.join('\n'));
}

const mb = (bytes: number) => (bytes / 1024 / 1024).toFixed(1);

async function measure(projectId: number): Promise<void> {
  initModels();
  const project = await Project.findByPk(projectId);
  if (!project) throw new Error(`No project ${projectId}`);
  const [sessions, media] = await Promise.all([
    ShopSession.count({ where: { projectId } }),
    Media.count({ include: [{ model: Entry, as: 'entry', required: true, attributes: [], include: [{ model: ShopSession, as: 'session', required: true, attributes: [], where: { projectId } }] }] }),
  ]);
  global.gc?.();
  const base = process.memoryUsage();
  let peakRss = base.rss;
  let peakHeap = base.heapUsed;
  const sample = () => {
    const m = process.memoryUsage();
    peakRss = Math.max(peakRss, m.rss);
    peakHeap = Math.max(peakHeap, m.heapUsed);
  };
  const timer = setInterval(sample, 5);
  const t = performance.now();
  const { stream } = await projectArchiveStream({ id: project.ownerId, siteRole: 'member', emailVerified: true }, projectId);
  const reader = stream.getReader();
  let bytes = 0;
  let chunks = 0;
  // What the export holds on to (as against garbage not yet collected): the heap right after a full
  // collection, taken every 1 MB of archive.
  let retained = 0;
  let nextGc = 1024 * 1024;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    bytes += value.length;
    if (++chunks % 64 === 0) sample();
    if (bytes >= nextGc && global.gc) {
      nextGc += 1024 * 1024;
      sample();
      global.gc();
      retained = Math.max(retained, process.memoryUsage().heapUsed);
    }
  }
  clearInterval(timer);
  sample();
  const seconds = (performance.now() - t) / 1000;
  // One tab-separated line for the shell script's table.
  console.log([project.slug, sessions, media, mb(bytes), seconds.toFixed(1), mb(base.rss), mb(peakRss), mb(peakRss - base.rss), mb(base.heapUsed), mb(peakHeap), mb(peakHeap - base.heapUsed), mb(retained), mb(retained - base.heapUsed)].join('\t'));
  await closeSequelize();
}

async function main(): Promise<void> {
  guardBenchDatabase();
  const [mode, arg] = process.argv.slice(2);
  if (mode === 'seed') {
    await seed();
    await closeSequelize();
  } else if (mode === 'measure' && arg && /^\d+$/.test(arg)) await measure(Number(arg));
  else throw new Error('Usage: archive.bench.ts seed | measure <project id>');
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
