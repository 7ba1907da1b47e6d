// The project archive: the demo project exported and imported as another account, compared field by
// field (media bytes by SHA-256), and hostile archives refused with nothing kept.
import { createHash } from 'node:crypto';
import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { NextRequest } from 'next/server';
import { guardTestDatabase, closeDb, makeUser, params, sessionCookie } from '../support/db';
import { rawZip, unzip } from '../support/zip';
import { initModels, Entry, Media, MeasurementPair, MeasurementReading, MeasurementRecord, Project, SavedCalculation, ShopSession, TimeNote, User } from '@/db/models';
import { GET as archiveRoute } from '@/app/api/projects/[id]/archive/route';
import { POST as importRoute } from '@/app/api/archives/route';
import { importProjectArchive } from '@/lib/server/archive/import';
import { readStoredFile } from '@/lib/server/upload-service';
import { MANIFEST_PATH } from '@/lib/server/archive/format';
import { normalizeEntryBody } from '@/lib/rich-text/normalize';

guardTestDatabase();

type U = { id: number; cookie: string };
let builder: U, other: U;
let demoId = 0;
let zip: Buffer;
const imported: number[] = [];

async function exportAs(who: U | null, id: number): Promise<Response> {
  const req = new NextRequest(new URL(`/api/projects/${id}/archive`, 'http://127.0.0.1:3000'), { headers: who ? { cookie: who.cookie } : {} });
  return archiveRoute(req, params({ id: String(id) }));
}

async function importAs(who: U | null, body: Buffer, type = 'application/zip'): Promise<{ status: number; json: Record<string, unknown> }> {
  const req = new NextRequest(new URL('/api/archives', 'http://127.0.0.1:3000'), {
    method: 'POST', body: new Uint8Array(body), headers: { 'content-type': type, ...(who ? { cookie: who.cookie } : {}) },
  });
  const res = await importRoute(req, params({}));
  const json = (await res.json()) as Record<string, unknown>;
  if (res.status === 201) imported.push(json.projectId as number);
  return { status: res.status, json };
}

const manifestFile = (extra: Record<string, unknown> = {}) => ({
  name: MANIFEST_PATH,
  data: Buffer.from(JSON.stringify({ format: 'scribeline-archive', version: 1, createdAt: new Date().toISOString(), project: { title: 'x', slug: 'x' }, counts: { sessions: 0, entries: 0, media: 0, notes: 0, records: 0, readings: 0, pairs: 0, calculations: 0 }, files: [], ...extra })),
});

const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

/** Everything of a project that an archive carries, with ids replaced by positions. */
async function snapshot(projectId: number) {
  const project = (await Project.findByPk(projectId))!;
  const sessions = await ShopSession.findAll({ where: { projectId }, order: [['position', 'ASC']] });
  const out = { title: project.title, summary: project.summary, units: project.units, sessions: [] as unknown[], pairs: [] as string[] };
  const recordName = new Map<number, string>();
  for (const s of sessions) {
    const entries = await Entry.findAll({ where: { sessionId: s.id }, order: [['position', 'ASC']] });
    const es = [];
    for (const e of entries) {
      const media = await Media.findAll({ where: { entryId: e.id }, order: [['kind', 'ASC'], ['position', 'ASC'], ['id', 'ASC']], include: [{ model: TimeNote, as: 'notes' }] });
      const mediaIndex = new Map(media.map((m, i) => [m.id, i]));
      // Bodies compared in the schema's canonical form (key order and default attributes as the editor's schema writes them).
      const canonical = normalizeEntryBody(JSON.parse(e.body), { allowedImageUrls: media.filter((m) => m.kind === 'photo').map((m) => m.url) });
      const body = JSON.stringify(canonical).replace(/\/api\/media\/(\d+)\/file/g, (_m, id) => `media#${mediaIndex.get(Number(id))}`);
      const records = await MeasurementRecord.findAll({ where: { entryId: e.id }, order: [['id', 'ASC']], include: [{ model: MeasurementReading, as: 'readings' }] });
      records.forEach((r, i) => recordName.set(r.id, `${s.position}/${e.position}/${i}`));
      const calcs = await SavedCalculation.findAll({ where: { entryId: e.id }, order: [['position', 'ASC']] });
      es.push({
        title: e.title, operation: e.operation, body,
        media: await Promise.all(media.map(async (m) => ({
          kind: m.kind, source: m.source, name: m.name, mime: m.mime, sizeBytes: m.sizeBytes, width: m.width, height: m.height, durationMs: m.durationMs, caption: m.caption, position: m.position,
          bytes: m.fileKey ? sha(await readStoredFile(m.fileKey, { maxBytes: 50 * 1024 * 1024 })) : m.url,
          notes: [...(m.notes ?? [])].sort((a, b) => a.startMs - b.startMs || a.id - b.id).map((n) => ({ startMs: n.startMs, endMs: n.endMs, kind: n.kind, text: n.text })),
        }))),
        records: records.map((r) => ({
          feature: r.feature, kind: r.kind, nominal: String(r.nominal), unit: r.unit, specType: r.specType, specZone: r.specZone, specUpper: r.specUpper, specLower: r.specLower,
          specTolerance: r.specTolerance, specGeneralClass: r.specGeneralClass, hasNote: r.timeNoteId !== null,
          readings: [...(r.readings ?? [])].sort((a, b) => a.position - b.position).map((x) => ({
            position: x.position, passNumber: x.passNumber, value: String(x.value), unit: x.unit, instrument: x.instrument, resolution: String(x.resolution),
            measuredBy: x.measuredBy, measuredAt: new Date(x.measuredAt).toISOString(), temperatureC: x.temperatureC, note: x.note,
          })),
        })),
        calculations: calcs.map((c) => ({ calculator: c.calculator, label: c.label, inputs: JSON.parse(c.inputs), outputs: JSON.parse(c.outputs), tablesVersion: c.tablesVersion })),
      });
    }
    out.sessions.push({ title: s.title, heldOn: s.heldOn, minutesSpent: s.minutesSpent, planned: s.planned, done: s.done, nextSteps: s.nextSteps, entries: es });
  }
  const ids = [...recordName.keys()];
  const pairs = ids.length ? await MeasurementPair.findAll({ where: { holeRecordId: { [Op.in]: ids } } }) : [];
  out.pairs = pairs.map((p) => `${recordName.get(p.holeRecordId)}~${recordName.get(p.shaftRecordId)}`).sort();
  return out;
}

beforeAll(async () => {
  initModels();
  const edda = await User.findOne({ where: { email: 'edda@renwick-shop.test' } });
  if (!edda) throw new Error('the demo builder is missing: run through npm test, which seeds the demo');
  builder = { id: edda.id, cookie: await sessionCookie(edda.id, edda.sessionVersion ?? 0) };
  const demo = await Project.findOne({ where: { ownerId: edda.id }, order: [['id', 'ASC']] });
  demoId = demo!.id;
  other = await makeUser();
  const res = await exportAs(builder, demoId);
  expect(res.status).toBe(200);
  zip = Buffer.from(await res.arrayBuffer());
});

afterAll(async () => {
  if (imported.length) await Project.destroy({ where: { id: { [Op.in]: imported } } });
  if (other) await User.destroy({ where: { id: other.id } });
  await closeDb();
});

describe('exporting a project', () => {
  test('only its builder downloads it: signed out 401, another member 403', async () => {
    expect((await exportAs(null, demoId)).status).toBe(401);
    expect((await exportAs(other, demoId)).status).toBe(403);
  });

  test('the zip holds the manifest with sums that match, the offline pages, Markdown, WebVTT, CSV and JSON', async () => {
    const files = await unzip(zip);
    const manifest = JSON.parse(files.get(MANIFEST_PATH)!.toString('utf8'));
    expect(manifest).toMatchObject({ format: 'scribeline-archive', version: 1 });
    expect(manifest.counts.sessions).toBeGreaterThan(0);
    expect(manifest.counts.media).toBeGreaterThan(0);
    for (const f of manifest.files) {
      expect(files.has(f.path), f.path).toBe(true);
      expect(sha(files.get(f.path)!), f.path).toBe(f.sha256);
    }
    const index = files.get('index.html')!.toString('utf8');
    const pages = [...index.matchAll(/href="(entries\/e\d+\.html)"/g)].map((m) => m[1]);
    expect(pages.length).toBe(manifest.counts.entries);
    // Every relative link and source of every page resolves inside the archive.
    for (const p of pages) {
      const html = files.get(p)!.toString('utf8');
      for (const [, ref] of html.matchAll(/(?:src|href)="\.\.\/([^"#?]+)"/g)) expect(files.has(decodeURIComponent(ref)), `${p} → ${ref}`).toBe(true);
    }
    const vtts = [...files.keys()].filter((n) => n.endsWith('.vtt'));
    expect(vtts.length).toBeGreaterThan(0);
    // WebVTT (W3C WebVTT: the file starts with "WEBVTT", cues "00:00:00.000 --> …").
    expect(files.get(vtts[0])!.toString('utf8')).toMatch(/^WEBVTT\n\n1\n\d\d:\d\d:\d\d\.\d{3} --> /);
    expect([...files.keys()].some((n) => n.startsWith('markdown/') && n.endsWith('.md'))).toBe(true);
    expect(files.get('measurements/records-and-readings.csv')!.toString('utf8')).toContain('Lower limit (mm)');
    expect(Array.isArray(JSON.parse(files.get('calculations/calculations.json')!.toString('utf8')))).toBe(true);
  });
});

describe('importing an archive', () => {
  test('the demo project comes back for another account, field by field, media bytes and all', async () => {
    const { status, json } = await importAs(other, zip);
    expect(status, JSON.stringify(json)).toBe(201);
    const copy = (await Project.findByPk(json.projectId as number))!;
    expect(copy.ownerId).toBe(other.id);
    expect(copy.visibility).toBe('private');
    const [a, b] = await Promise.all([snapshot(demoId), snapshot(copy.id)]);
    expect(b).toEqual(a);
  });

  test('signed out is a 401; not a zip is a 415', async () => {
    expect((await importAs(null, zip)).status).toBe(401);
    expect((await importAs(other, zip, 'text/plain')).status).toBe(415);
  });

  const hostile: [string, () => Buffer, number, RegExp][] = [
    ['not a zip at all', () => Buffer.from('PK but not really a zip'), 400, /not a zip/],
    ['no manifest', () => rawZip([{ name: 'index.html', data: Buffer.from('<p>hi</p>') }]), 400, /scribeline-archive\.json is missing/],
    ['another format', () => rawZip([manifestFile({ format: 'something-else' })]), 400, /does not name the format/],
    ['a newer version', () => rawZip([manifestFile({ version: 2 })]), 400, /format version 2/],
    ['a path climbing out', () => rawZip([manifestFile(), { name: 'media/../../etc/passwd', data: Buffer.from('x') }]), 400, /climbs out/],
    ['an absolute path', () => rawZip([manifestFile(), { name: '/etc/cron.d/x', data: Buffer.from('x') }]), 400, /absolute path/],
    ['a backslash', () => rawZip([manifestFile(), { name: 'media\\..\\x', data: Buffer.from('x') }]), 400, /backslash/],
    ['a zip bomb (50 MB of zeros in a few kB)', () => rawZip([manifestFile(), { name: 'data/sessions/0001.json', data: Buffer.alloc(50 * 1024 * 1024), deflate: true }]), 400, /zip bomb/],
    ['a header lying about its size', () => rawZip([{ ...manifestFile(), deflate: true, claimSize: 10 }]), 400, /damaged|more than its header/],
  ];
  test.each(hostile)('%s is refused with a clear message and nothing kept', async (_name, make, status, message) => {
    const before = await Project.count({ where: { ownerId: other.id } });
    const { status: got, json } = await importAs(other, make());
    expect(got).toBe(status);
    expect(String(json.message)).toMatch(message);
    expect(await Project.count({ where: { ownerId: other.id } })).toBe(before);
  });

  test('an archive over the size cap is a 413, counted while reading', async () => {
    await expect(importProjectArchive({ id: other.id, siteRole: 'member', emailVerified: true }, new Blob([new Uint8Array(zip)]).stream(), { limits: { uploadBytes: 1024 } }))
      .rejects.toMatchObject({ code: 'too_large' });
  });

  test('a failure after the media were uploaded keeps no rows and queues the files for deletion', async () => {
    // The demo archive with one saved calculation of an unknown kind: refused inside the transaction.
    const files = await unzip(zip);
    const manifest = JSON.parse(files.get(MANIFEST_PATH)!.toString('utf8'));
    const sessionPath = manifest.files.map((f: { path: string }) => f.path).find((p: string) => p.startsWith('data/sessions/') && JSON.parse(files.get(p)!.toString('utf8')).entries.some((e: { calculations: unknown[] }) => e.calculations.length));
    expect(sessionPath).toBeTruthy();
    const data = JSON.parse(files.get(sessionPath)!.toString('utf8'));
    data.entries.find((e: { calculations: unknown[] }) => e.calculations.length).calculations[0].calculator = 'no-such-calculator';
    const changed = Buffer.from(JSON.stringify(data));
    files.set(sessionPath, changed);
    manifest.files = manifest.files.map((f: { path: string }) => (f.path === sessionPath ? { ...f, bytes: changed.length, sha256: sha(changed) } : f));
    files.set(MANIFEST_PATH, Buffer.from(JSON.stringify(manifest)));
    const before = { projects: await Project.count({ where: { ownerId: other.id } }), media: await Media.count({ where: { uploadedBy: other.id } }) };
    const { status, json } = await importAs(other, rawZip([...files].map(([name, d]) => ({ name, data: d, deflate: true }))));
    expect(status).toBe(400);
    expect(String(json.message)).toMatch(/no-such-calculator/);
    expect(await Project.count({ where: { ownerId: other.id } })).toBe(before.projects);
    expect(await Media.count({ where: { uploadedBy: other.id } })).toBe(before.media);
  });
});
