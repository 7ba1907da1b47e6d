/**
 * The page benchmark's scale data set, on top of the demo data (run db/seeders/seed.ts first):
 * one big builder with 10,000 published projects and 50,000 published sessions, and one heavy
 * published entry (a clip with 60 notes, 20 measurement records with readings, 150 comments,
 * 3 mentor flags) that the demo's follower follows. Invented people and story, like the demo.
 *
 * Rows go in as multi-row INSERTs in batches. Run again at the same size, it changes nothing;
 * at another size (or half-seeded) it removes the big builder's rows and seeds them again.
 * Writes what the benchmark needs to reach the pages to .data/bench-scale.json.
 *
 * Usage: DB_NAME=scribeline_bench tsx tests/bench/scale-seed.ts   (npm run bench:pages does this)
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import { QueryTypes } from 'sequelize';
import { UTApi, UTFile } from 'uploadthing/server';
import { initModels, User } from '../../db/models';
import { closeSequelize } from '../../db/connection';
import { DEMO_ACCOUNTS } from '../../db/seeders/demo-accounts';
import { guardBenchDatabase } from './guard';

const num = (name: string, fallback: number) => {
  const v = Number(process.env[name] ?? fallback);
  if (!Number.isInteger(v) || v < 1) throw new Error(`${name} must be a positive whole number`);
  return v;
};

/** The sizes asked for; BENCH_PROJECTS / BENCH_SESSIONS make a small set for trying the script out. */
export const SCALE = {
  projects: num('BENCH_PROJECTS', 10_000),
  sessions: num('BENCH_SESSIONS', 50_000),
  heavyProjectSessions: 500,
  notes: 60,
  records: 20,
  readingsPerRecord: 5,
  topLevelComments: 100,
  replies: 50,
  flags: 3,
  readers: 30,
} as const;

const BIG_BUILDER = { name: 'Ossian Vale', email: 'ossian@vale-workshop.test', handle: 'ossian-vale' } as const;
const READER_PREFIX = 'bench-reader-';
const CLIP_MS = 12_000; // db/seeders/media/spigot-turning.mp4
const BATCH = 1_000;
const MANIFEST = path.join(__dirname, '..', '..', '.data', 'bench-scale.json');

type Row = Record<string, unknown>;

async function main(): Promise<void> {
  guardBenchDatabase();
  const sequelize = initModels();
  const qi = sequelize.getQueryInterface();
  const select: Select = <T extends object>(sql: string, replacements: unknown[] = []) => sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
  const insert = async (table: string, rows: Row[]) => {
    for (let i = 0; i < rows.length; i += BATCH) await qi.bulkInsert(table, rows.slice(i, i + BATCH));
  };

  const follower = await User.findOne({ where: { email: DEMO_ACCOUNTS[1].email } });
  const mentor = await User.findOne({ where: { email: DEMO_ACCOUNTS[2].email } });
  if (!follower || !mentor) throw new Error('The demo accounts are missing: run db/seeders/seed.ts first.');

  if (await alreadySeeded(select)) {
    console.log(`Scale data already seeded (${SCALE.projects} projects, ${SCALE.sessions} sessions): kept.`);
  } else {
    const started = Date.now();
    // Half-seeded or another size: start again (projects, sessions and all below them cascade).
    await sequelize.query('DELETE FROM users WHERE email = ? OR handle LIKE ?', { replacements: [BIG_BUILDER.email, `${READER_PREFIX}%`] });

    const now = new Date();
    const stamps = { created_at: now, updated_at: now };
    const hash = await bcrypt.hash('bench-only-not-a-demo-login', 4);
    const builder = await User.create({ name: BIG_BUILDER.name, email: BIG_BUILDER.email, handle: BIG_BUILDER.handle, passwordHash: hash, siteRole: 'member' });
    await insert(
      'users',
      Array.from({ length: SCALE.readers }, (_, i) => {
        const n = String(i + 1).padStart(2, '0');
        return { email: `reader${n}@bench-readers.test`, name: `Bench reader ${n}`, handle: `${READER_PREFIX}${n}`, password_hash: hash, site_role: 'member', ...stamps };
      }),
    );
    const readerIds = (await select<{ id: number }>('SELECT id FROM users WHERE handle LIKE ? ORDER BY id', [`${READER_PREFIX}%`])).map((r) => r.id);

    // Projects: the heavy one first, then the rest; published over the last two years.
    const day = 86_400_000;
    await insert(
      'projects',
      Array.from({ length: SCALE.projects }, (_, i) => {
        const n = String(i + 1).padStart(5, '0');
        const publishedAt = new Date(now.getTime() - ((i * 7919) % 730) * day);
        return {
          owner_id: builder.id,
          slug: i === 0 ? 'steady-rest-for-the-shop-lathe' : `bench-fixture-${n}`,
          title: i === 0 ? 'Three-point steady rest for the shop lathe' : `Fixture plate no. ${n}`,
          summary: i === 0
            ? 'A fabricated steady rest with bronze-tipped fingers, machined in many evenings: the long log the benchmark reads.'
            : `Fixture plate ${n}: faced, drilled on a grid and reamed for dowels.`,
          units: 'mm',
          visibility: 'published',
          published_at: publishedAt,
          version: 1,
          created_at: publishedAt,
          updated_at: publishedAt,
        };
      }),
    );
    const projectIds = (await select<{ id: number }>('SELECT id FROM projects WHERE owner_id = ? ORDER BY id', [builder.id])).map((r) => r.id);
    const heavyProjectId = projectIds[0]!;

    // Sessions: the heavy project gets a long log, the rest are spread evenly over the other projects.
    const heavyCount = Math.min(SCALE.heavyProjectSessions, SCALE.sessions);
    const sessions: Row[] = [];
    const positions = new Map<number, number>();
    for (let i = 0; i < SCALE.sessions; i++) {
      const projectId = i < heavyCount || projectIds.length === 1 ? heavyProjectId : projectIds[1 + ((i - heavyCount) % (projectIds.length - 1))]!;
      const position = positions.get(projectId) ?? 0;
      positions.set(projectId, position + 1);
      const publishedAt = new Date(now.getTime() - ((i * 104_729) % (730 * 24)) * 3_600_000);
      sessions.push({
        project_id: projectId,
        position,
        title: `Session ${position + 1}: ${['facing the blank', 'drilling the grid', 'reaming for dowels', 'deburring', 'fitting the fingers'][i % 5]}`,
        held_on: publishedAt.toISOString().slice(0, 10),
        minutes_spent: 45 + (i % 8) * 15,
        planned: 'Square the stock, then work to the layout lines.',
        done: 'Work went to plan; readings noted in the entries.',
        next_steps: 'Carry on with the next operation.',
        version: 1,
        visibility: 'published',
        published_at: publishedAt,
        announced_at: publishedAt,
        created_at: publishedAt,
        updated_at: publishedAt,
      });
    }
    await insert('shop_sessions', sessions);
    const [heavySession] = await select<{ id: number }>('SELECT id FROM shop_sessions WHERE project_id = ? ORDER BY position DESC LIMIT 1', [heavyProjectId]);
    // The heavy session is the newest one published.
    await sequelize.query('UPDATE shop_sessions SET published_at = ?, announced_at = ? WHERE id = ?', { replacements: [now, now, heavySession!.id] });

    const entryId = await seedHeavyEntry(heavySession!.id, builder.id, readerIds, mentor.id, heavyProjectId, select, insert);
    await insert('project_memberships', [{ project_id: heavyProjectId, user_id: mentor.id, role: 'mentor', ...stamps }]);
    await sequelize.query('DELETE FROM follows WHERE user_id = ? AND project_id = ?', { replacements: [follower.id, heavyProjectId] });
    await insert('follows', [{ user_id: follower.id, project_id: heavyProjectId, builder_id: null, mail: false, ...stamps }]);
    console.log(`Seeded the scale data (${SCALE.projects} projects, ${SCALE.sessions} sessions, heavy entry ${entryId}) in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
  }
  writeManifest(await manifest(select));
}

type Select = <T extends object>(sql: string, replacements?: unknown[]) => Promise<T[]>;
type Insert = (table: string, rows: Row[]) => Promise<void>;

async function alreadySeeded(select: Select): Promise<boolean> {
  const [counts] = await select<{ projects: number; sessions: number }>(
    `SELECT (SELECT COUNT(*) FROM projects p WHERE p.owner_id = u.id) AS projects,
            (SELECT COUNT(*) FROM shop_sessions s JOIN projects p ON p.id = s.project_id WHERE p.owner_id = u.id) AS sessions
       FROM users u WHERE u.email = ?`,
    [BIG_BUILDER.email],
  );
  if (!counts || Number(counts.projects) !== SCALE.projects || Number(counts.sessions) !== SCALE.sessions) return false;
  try {
    const m = await manifest(select);
    // The clip lives in the upload service's folder: if that was wiped, seed again.
    const { ufsUrl } = await new UTApi({ logLevel: 'Error' }).generateSignedURL(m.clipKey, { expiresIn: 60 });
    const res = await fetch(ufsUrl, { method: 'HEAD' });
    return res.ok && m.noteMs.length === SCALE.notes && m.comments === SCALE.topLevelComments + SCALE.replies;
  } catch {
    return false;
  }
}

async function uploadClip(): Promise<{ key: string; url: string; size: number }> {
  const bytes = await readFile(path.join(__dirname, '..', '..', 'db', 'seeders', 'media', 'spigot-turning.mp4'));
  const warn = console.warn;
  console.warn = (...args: unknown[]) => {
    if (!String(args[0]).includes('[uploadthing][deprecated]')) warn(...args);
  };
  try {
    const result = await new UTApi({ logLevel: 'Error' }).uploadFiles(new UTFile([bytes], 'steady-rest-finger.mp4', { type: 'video/mp4' }));
    if (result.error) throw new Error(`Could not upload the benchmark clip: ${result.error.message}`);
    return { key: result.data.key, url: result.data.ufsUrl, size: bytes.length };
  } finally {
    console.warn = warn;
  }
}

async function seedHeavyEntry(sessionId: number, builderId: number, readerIds: number[], mentorId: number, projectId: number, select: Select, insert: Insert): Promise<number> {
  const now = new Date();
  const stamps = { created_at: now, updated_at: now };
  const t = (text: string) => ({ type: 'text', text });
  const p = (text: string) => ({ type: 'paragraph', content: [t(text)] });
  const body = {
    type: 'doc',
    content: [
      { type: 'heading', attrs: { level: 2 }, content: [t('Boring the finger bores')] },
      ...Array.from({ length: 24 }, (_, i) =>
        p(`Pass ${i + 1}: took 0.${(i % 9) + 1} mm off the bore at 240 rpm with the boring bar, flood coolant, checked with the bore gauge before the next cut.`),
      ),
      { type: 'bulletList', content: ['Bar stick-out 60 mm', 'Carbide insert, 0.4 mm radius', 'Feed 0.08 mm/rev'].map((x) => ({ type: 'listItem', content: [p(x)] })) },
    ],
  };
  await insert('entries', [
    { session_id: sessionId, position: 0, title: 'Marking out the finger bores', operation: 'layout', body: JSON.stringify({ type: 'doc', content: [p('Scribed the three bores at 120° on the casting.')] }), version: 1, ...stamps },
    { session_id: sessionId, position: 1, title: 'Boring the finger bores', operation: 'boring', body: JSON.stringify(body), version: 1, ...stamps },
    { session_id: sessionId, position: 2, title: 'Deburring', operation: 'finishing', body: JSON.stringify({ type: 'doc', content: [p('Broke every edge with a fine file.')] }), version: 1, ...stamps },
  ]);
  const [entry] = await select<{ id: number }>('SELECT id FROM entries WHERE session_id = ? AND position = 1', [sessionId]);
  const entryId = entry!.id;

  const clip = await uploadClip();
  await insert('media', [
    { entry_id: entryId, kind: 'clip', source: 'upload', file_key: clip.key, url: clip.url, name: 'steady-rest-finger.mp4', mime: 'video/mp4', size_bytes: clip.size, width: null, height: null, duration_ms: CLIP_MS, caption: 'Boring the second finger bore', position: 0, uploaded_by: builderId, ...stamps },
  ]);
  const [media] = await select<{ id: number }>("SELECT id FROM media WHERE entry_id = ? AND kind = 'clip'", [entryId]);
  const mediaId = media!.id;

  const kinds = ['note', 'measurement', 'caution', 'note'] as const;
  await insert(
    'time_notes',
    Array.from({ length: SCALE.notes }, (_, i) => ({
      media_id: mediaId,
      start_ms: Math.floor(((i + 0.5) * CLIP_MS) / SCALE.notes),
      end_ms: null,
      kind: kinds[i % kinds.length],
      text: `Moment ${i + 1}: ${['the bar enters the bore', 'bore gauge reads 0.02 mm under', 'keep fingers clear of the chuck', 'chip colour changes'][i % 4]}.`,
      author_id: builderId,
      version: 1,
      ...stamps,
    })),
  );
  const noteIds = (await select<{ id: number }>('SELECT id FROM time_notes WHERE media_id = ? ORDER BY start_ms, id', [mediaId])).map((r) => r.id);

  const zones = ['H7', 'k6', 'h6', 'g6', 'H8'];
  await insert(
    'measurement_records',
    Array.from({ length: SCALE.records }, (_, i) => ({
      entry_id: entryId,
      time_note_id: i < 5 ? noteIds[i * 3] : null,
      feature: `Finger bore ${i + 1}`,
      kind: zones[i % zones.length]!.startsWith('H') ? 'inside' : 'outside',
      nominal: String(12 + i * 2),
      unit: 'mm',
      spec_type: 'zone',
      spec_zone: zones[i % zones.length],
      spec_upper: null,
      spec_lower: null,
      spec_tolerance: null,
      spec_general_class: null,
      version: 1,
      ...stamps,
    })),
  );
  const records = await select<{ id: number; nominal: string }>('SELECT id, nominal FROM measurement_records WHERE entry_id = ? ORDER BY id', [entryId]);
  const readings: Row[] = [];
  for (const r of records) {
    for (let k = 0; k < SCALE.readingsPerRecord; k++) {
      readings.push({
        record_id: r.id,
        position: k,
        pass_number: k + 1,
        value: (Number(r.nominal) + 0.05 - k * 0.012).toFixed(3),
        unit: 'mm',
        instrument: k === 0 ? 'caliper' : 'micrometer',
        resolution: k === 0 ? '0.01' : '0.001',
        measured_by: BIG_BUILDER.name,
        measured_at: new Date(now.getTime() - (SCALE.readingsPerRecord - k) * 600_000),
        temperature_c: '20.5',
        note: k === SCALE.readingsPerRecord - 1 ? 'Final reading after the spring pass.' : '',
        version: 1,
        ...stamps,
      });
    }
  }
  await insert('measurement_readings', readings);

  await insert(
    'comments',
    Array.from({ length: SCALE.topLevelComments }, (_, i) => ({
      entry_id: entryId,
      author_id: readerIds[i % readerIds.length],
      parent_id: null,
      media_id: i % 3 === 0 ? mediaId : null,
      at_ms: i % 3 === 0 ? ((i * 977) % (CLIP_MS / 1000)) * 1000 : null,
      body: `Question ${i + 1}: what speed and feed did you use here, and how long was the bar sticking out?`,
      version: 1,
      created_at: new Date(now.getTime() - (SCALE.topLevelComments - i) * 60_000),
      updated_at: now,
    })),
  );
  const topIds = (await select<{ id: number }>('SELECT id FROM comments WHERE entry_id = ? AND parent_id IS NULL ORDER BY id', [entryId])).map((r) => r.id);
  await insert(
    'comments',
    Array.from({ length: SCALE.replies }, (_, i) => ({
      entry_id: entryId,
      author_id: i % 2 === 0 ? builderId : readerIds[(i + 7) % readerIds.length],
      parent_id: topIds[(i * 2) % topIds.length],
      media_id: null,
      at_ms: null,
      body: `Reply ${i + 1}: 240 rpm, 0.08 mm/rev, about 60 mm out of the holder.`,
      version: 1,
      ...stamps,
    })),
  );

  await insert('risk_flags', [
    { project_id: projectId, session_id: sessionId, entry_id: entryId, target_kind: 'entry', note_id: null, record_id: null, mentor_id: mentorId, severity: 'caution', hazard: 'rotating-work', concern: 'Long boring bar near the chuck jaws.', instead: 'Check the jaw clearance by hand before starting the spindle.', status: 'open', ...stamps },
    { project_id: projectId, session_id: sessionId, entry_id: entryId, target_kind: 'note', note_id: noteIds[2], record_id: null, mentor_id: mentorId, severity: 'warning', hazard: 'flying-chips', concern: 'Hot chips leave the bore towards the operator.', instead: 'Wear eye protection and fit the chip guard.', status: 'acknowledged', acknowledged_at: now, ...stamps },
    { project_id: projectId, session_id: sessionId, entry_id: entryId, target_kind: 'measurement', note_id: null, record_id: records[0]!.id, mentor_id: mentorId, severity: 'caution', hazard: 'sharp-edges', concern: 'Bore edge left sharp before gauging.', instead: 'Break the edge before putting the gauge in.', status: 'resolved', acknowledged_at: now, resolved_at: now, answer: 'Edges deburred before every reading since.', ...stamps },
  ]);
  return entryId;
}

type Manifest = {
  builderHandle: string;
  projectSlug: string;
  sessionId: number;
  entryId: number;
  clipKey: string;
  noteMs: number[];
  comments: number;
  scale: typeof SCALE;
};

async function manifest(select: Select): Promise<Manifest> {
  const [row] = await select<{ slug: string; sessionId: number; entryId: number; mediaId: number; fileKey: string }>(
    `SELECT p.slug, s.id AS sessionId, e.id AS entryId, m.id AS mediaId, m.file_key AS fileKey
       FROM users u JOIN projects p ON p.owner_id = u.id JOIN shop_sessions s ON s.project_id = p.id
       JOIN entries e ON e.session_id = s.id JOIN media m ON m.entry_id = e.id AND m.kind = 'clip'
      WHERE u.email = ? ORDER BY p.id LIMIT 1`,
    [BIG_BUILDER.email],
  );
  if (!row) throw new Error('No heavy entry found');
  const notes = await select<{ startMs: number }>('SELECT start_ms AS startMs FROM time_notes WHERE media_id = ? ORDER BY start_ms, id', [row.mediaId]);
  const [c] = await select<{ n: number }>('SELECT COUNT(*) AS n FROM comments WHERE entry_id = ?', [row.entryId]);
  return {
    builderHandle: BIG_BUILDER.handle,
    projectSlug: row.slug,
    sessionId: Number(row.sessionId),
    entryId: Number(row.entryId),
    clipKey: row.fileKey,
    noteMs: notes.map((n) => Number(n.startMs)),
    comments: Number(c?.n ?? 0),
    scale: SCALE,
  };
}

function writeManifest(m: Manifest): void {
  mkdirSync(path.dirname(MANIFEST), { recursive: true });
  writeFileSync(MANIFEST, JSON.stringify(m, null, 2));
}

main()
  .catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exitCode = 1;
  })
  .finally(() => closeSequelize());
