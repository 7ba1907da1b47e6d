import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as searchRoute } from '@/app/api/search/route';
import { PATCH as patchEntryRoute } from '@/app/api/entries/[id]/route';
import { initModels, Comment, Entry, Follow, MeasurementReading, MeasurementRecord, Media, Project, ProjectMembership, ShopSession, TimeNote, User } from '@/db/models';
import type { SearchResult } from '@/lib/types/search';

guardTestDatabase();

// Search through the real route handler and MariaDB's FULLTEXT indexes: ranking, who finds what (a
// stranger, a follower, the builder, a mentor), by-link and hidden content never listed, the fit filter.
// Every row made here carries WORD (unique to the run) and is removed in afterAll.

type U = Awaited<ReturnType<typeof makeUser>>;
type Vis = 'private' | 'unlisted' | 'published';
const stamp = `${Date.now().toString(36)}${process.pid.toString(36)}`;
const WORD = `qzx${stamp}`;
let builder: U, follower: U, stranger: U, mentor: U;
const projectIds: number[] = [];
const ids: Record<string, number> = {};
let position = 0;

const doc = (...paragraphs: string[]) => ({ type: 'doc', content: paragraphs.map((text) => ({ type: 'paragraph', content: [{ type: 'text', text }] })) });

async function find(who: U | null, query: Record<string, string>): Promise<{ status: number; body: SearchResult & { fieldErrors?: Record<string, string[]> } }> {
  const qs = new URLSearchParams(query).toString();
  const res = await searchRoute(request(`/api/search?${qs}`, { cookie: who?.cookie }), params({}));
  return { status: res.status, body: await res.json() };
}
const keys = (r: SearchResult) => r.hits.map((h) => `${h.kind}:${h.id}`);

async function project(visibility: Vis, tag: string) {
  const p = await Project.create({ ownerId: builder.id, slug: `search-${tag}-${stamp}`, title: `Search ${tag}`, summary: '', units: 'mm', visibility, publishedAt: visibility === 'published' ? new Date() : null });
  projectIds.push(p.id);
  await ProjectMembership.create({ projectId: p.id, userId: mentor.id, role: 'mentor' });
  return p;
}
async function session(projectId: number, visibility: Vis, done: string) {
  return ShopSession.create({
    projectId, position: position++, title: `Session ${position}`, heldOn: '2026-11-07', minutesSpent: 60, planned: '', done, nextSteps: '',
    visibility, publishedAt: visibility === 'published' ? new Date() : null, announcedAt: null,
  });
}
async function entry(sessionId: number, title: string, body: string[], operation = 'turning') {
  return Entry.create({ sessionId, position: position++, title, operation, body: JSON.stringify(doc(...body)) });
}
async function record(entryId: number, feature: string, kind: 'inside' | 'outside', nominal: string, zone: string, readings: string[], unit: 'mm' | 'in' = 'mm') {
  const r = await MeasurementRecord.create({ entryId, feature, kind, nominal, unit, specType: 'zone', specZone: zone } as never);
  for (const [i, value] of readings.entries()) {
    await MeasurementReading.create({ recordId: r.id, position: i, passNumber: null, value, unit, instrument: 'micrometer', resolution: unit === 'mm' ? '0.00100' : '0.00010', measuredBy: 'Builder', measuredAt: new Date(), temperatureC: null, note: '' } as never);
  }
  return r;
}

beforeAll(async () => {
  initModels();
  [builder, follower, stranger, mentor] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser()]);
  const open = await project('published', 'open');
  const byLink = await project('unlisted', 'link');
  const bench = await project('private', 'bench');
  await Follow.create({ userId: follower.id, projectId: open.id, builderId: null, mail: true });

  const pub = await session(open.id, 'published', `Faced the casting, then the ${WORD} register.`);
  const privSession = await session(open.id, 'private', `Private day on the ${WORD} plate.`);
  const linkSession = await session(open.id, 'unlisted', `By-link day on the ${WORD} plate.`);
  const linkProjectSession = await session(byLink.id, 'published', `Published session of a by-link project, ${WORD}.`);
  const benchSession = await session(bench.id, 'private', `Bench project ${WORD}.`);
  ids.pubSession = pub.id;
  ids.privSession = privSession.id;
  ids.linkSession = linkSession.id;
  ids.linkProjectSession = linkProjectSession.id;
  ids.benchSession = benchSession.id;

  // Ranking: the word in the title and three times in the body, against once in a longer body.
  const strong = await entry(pub.id, `${WORD} spigot turned`, [`The ${WORD} spigot: roughed the ${WORD}, then finished the ${WORD} to size.`]);
  const weak = await entry(pub.id, 'Chamfers and cleanup', ['Broke every edge with a fine file, deburred the bolt holes and cleaned the chips out of the ways.', `A passing mention of ${WORD} here.`], 'finishing');
  const hostile = await entry(pub.id, 'Odd characters', [`<script>alert(1)</script> & the ${WORD} "quote"`], 'finishing');
  ids.strong = strong.id;
  ids.weak = weak.id;
  ids.hostile = hostile.id;
  ids.privEntry = (await entry(privSession.id, `Private ${WORD} entry`, ['On the bench.'])).id;
  ids.linkEntry = (await entry(linkSession.id, `By-link ${WORD} entry`, ['By link.'])).id;
  ids.linkProjectEntry = (await entry(linkProjectSession.id, `Link project ${WORD} entry`, ['By link.'])).id;
  ids.benchEntry = (await entry(benchSession.id, `Bench ${WORD} entry`, ['Private.'])).id;

  const clip = await Media.create({
    entryId: strong.id, kind: 'clip', source: 'link', fileKey: null, url: 'https://video.example/spigot.mp4', name: 'spigot.mp4',
    mime: 'video/mp4', sizeBytes: null, width: null, height: null, durationMs: 120_000, uploadedBy: builder.id,
  } as never);
  ids.clip = clip.id;
  ids.note = (await TimeNote.create({ mediaId: clip.id, startMs: 83_400, endMs: null, kind: 'note', text: `Taking the ${WORD} skim cut here.`, authorId: builder.id } as never)).id;

  const c = (body: string, extra: Record<string, unknown> = {}) => Comment.create({ entryId: strong.id, authorId: follower.id, parentId: null, mediaId: null, atMs: null, body, ...extra } as never);
  ids.comment = (await c(`How did you measure the ${WORD}?`)).id;
  ids.hiddenComment = (await c(`Rude words about ${WORD}`, { hiddenAt: new Date(), hiddenById: builder.id, hiddenReason: 'Rude.' })).id;
  ids.deletedComment = (await c(`Removed ${WORD}`, { deletedAt: new Date() })).id;

  // Fits: 130 k6 spigots (published inside the limits; one out; one private; one by link), H7 bores at
  // several sizes, an h7 shaft at 120 mm (small letters: a shaft, not a hole), an inch record of 5.125 in.
  const fitEntry = await entry(pub.id, `Fitting the ${WORD} backplate`, ['Spigot to the chuck recess.'], 'fitting');
  // 130 k6: +0.003 / +0.028 mm (ISO 286-2:2010 Table — shafts k, 120–140 mm, IT6 25 µm, ei +3 µm — from memory).
  ids.k6In = (await record(fitEntry.id, `${WORD} spigot`, 'outside', '130.00000', 'k6', ['130.05000', '130.01500'])).id;
  ids.k6Out = (await record(fitEntry.id, `${WORD} second spigot`, 'outside', '130.00000', 'k6', ['130.03500'])).id;
  ids.k6Bench = (await record(ids.privEntry, `${WORD} spigot`, 'outside', '130.00000', 'k6', ['130.01000'])).id;
  ids.k6Link = (await record(ids.linkEntry, `${WORD} spigot`, 'outside', '130.00000', 'k6', ['130.01000'])).id;
  ids.k6Other = (await record(fitEntry.id, `${WORD} collar`, 'outside', '90.00000', 'k6', [])).id;
  ids.h7_120 = (await record(fitEntry.id, `${WORD} finger bore`, 'inside', '120.00000', 'H7', ['120.02000'])).id;
  ids.h7_150 = (await record(fitEntry.id, `${WORD} register bore`, 'inside', '150.00000', 'H7', [])).id;
  ids.h7_160 = (await record(fitEntry.id, `${WORD} big bore`, 'inside', '160.00000', 'H7', [])).id;
  ids.shaft_h7 = (await record(fitEntry.id, `${WORD} arbor`, 'outside', '120.00000', 'h7', [])).id;
  ids.inch = (await record(fitEntry.id, `${WORD} inch bore`, 'inside', '5.12500', 'H7', [], 'in')).id; // 130.175 mm
});

afterAll(async () => {
  await Project.destroy({ where: { id: projectIds } });
  await User.destroy({ where: { id: [builder, follower, stranger, mentor].filter(Boolean).map((u) => u.id) } });
  await closeDb();
});

describe('search: words', () => {
  test('ranked: the entry with the word in its title and three times in its text comes before one mention', async () => {
    const { status, body } = await find(stranger, { q: WORD, kind: 'entry' });
    expect(status).toBe(200);
    expect(body.mode).toBe('words');
    const order = keys(body);
    expect(order.indexOf(`entry:${ids.strong}`)).toBeGreaterThanOrEqual(0);
    expect(order.indexOf(`entry:${ids.strong}`)).toBeLessThan(order.indexOf(`entry:${ids.weak}`));
    expect(body.hits[0]!.score).toBeGreaterThan(body.hits[body.hits.length - 1]!.score);
  });

  test('the matching word is marked in a short, escaped excerpt, and each hit links where it belongs', async () => {
    const { body } = await find(null, { q: WORD });
    const hostile = body.hits.find((h) => h.kind === 'entry' && h.id === ids.hostile)!;
    expect(hostile.excerptHtml).toContain('&lt;script&gt;alert(1)&lt;/script&gt; &amp; the ');
    expect(hostile.excerptHtml).toContain(`<mark>${WORD}</mark>`);
    expect(hostile.excerptHtml).not.toContain('<script>');
    expect(hostile.excerpt.filter((p) => p.mark).map((p) => p.text)).toEqual([WORD]);
    const weak = body.hits.find((h) => h.id === ids.weak && h.kind === 'entry')!;
    expect(weak.excerpt[0]!.text).toBe('…'); // cut before: the word is far into the text
    const note = body.hits.find((h) => h.kind === 'note')!;
    expect(note.id).toBe(ids.note);
    expect(note.href).toBe(`/logs/search-open-${stamp}/entries/${ids.strong}?clip=${ids.clip}#t=83`);
    expect(body.hits.find((h) => h.kind === 'session' && h.id === ids.pubSession)!.href).toBe(`/logs/search-open-${stamp}/sessions/${ids.pubSession}`);
    expect(body.hits.find((h) => h.kind === 'comment')!.href).toBe(`/logs/search-open-${stamp}/entries/${ids.strong}#comment-${ids.comment}`);
    expect(body.hits.find((h) => h.kind === 'record' && h.id === ids.k6In)!.href).toBe(`/logs/search-open-${stamp}/records/${ids.k6In}`);
  });

  test('a prefix finds longer words; short and common words are named as left out', async () => {
    const { body } = await find(null, { q: `${WORD.slice(0, -2)} the M8`, kind: 'entry' });
    expect(keys(body)).toContain(`entry:${ids.strong}`);
    expect(body.ignored).toEqual(expect.arrayContaining(['the', 'm8']));
    const none = await find(null, { q: 'M8 of' });
    expect(none.status).toBe(200);
    expect(none.body.hits).toEqual([]);
    expect(none.body.notice).toMatch(/not indexed/);
  });

  test('filters: the kind and the operation', async () => {
    const turning = await find(null, { q: WORD, operation: 'finishing' });
    expect(new Set(turning.body.hits.map((h) => h.operation))).toEqual(new Set(['Finishing']));
    expect(keys(turning.body)).toEqual(expect.arrayContaining([`entry:${ids.weak}`, `entry:${ids.hostile}`]));
    const notes = await find(null, { q: WORD, kind: 'note' });
    expect(keys(notes.body)).toEqual([`note:${ids.note}`]);
  });
});

describe('search: who finds what', () => {
  const everything = async (who: U | null) => {
    const found = new Set<string>();
    for (let page = 1; page <= 10; page++) {
      const { body } = await find(who, { q: WORD, page: String(page) });
      for (const k of keys(body)) found.add(k);
      if (!body.hasMore) break;
    }
    return found;
  };
  const PUBLIC = () => [`session:${ids.pubSession}`, `entry:${ids.strong}`, `note:${ids.note}`, `comment:${ids.comment}`, `record:${ids.k6In}`];
  const BY_LINK = () => [`session:${ids.linkSession}`, `session:${ids.linkProjectSession}`, `entry:${ids.linkEntry}`, `entry:${ids.linkProjectEntry}`, `record:${ids.k6Link}`];
  const PRIVATE = () => [`session:${ids.privSession}`, `session:${ids.benchSession}`, `entry:${ids.privEntry}`, `entry:${ids.benchEntry}`, `record:${ids.k6Bench}`];
  const NEVER = () => [`comment:${ids.hiddenComment}`, `comment:${ids.deletedComment}`];

  test.each<[string, () => U | null, boolean]>([
    ['signed out', () => null, false],
    ['a stranger', () => stranger, false],
    ['a follower of the project', () => follower, false],
    ['the builder', () => builder, true],
    ['a mentor of the projects', () => mentor, true],
  ])('%s', async (_name, who, circle) => {
    const found = await everything(who());
    for (const k of PUBLIC()) expect(found, k).toContain(k);
    for (const k of NEVER()) expect(found, k).not.toContain(k);
    for (const k of [...BY_LINK(), ...PRIVATE()]) expect(found.has(k), k).toBe(circle);
  });

  test("the builder's own unpublished work is marked as theirs", async () => {
    const { body } = await find(builder, { q: WORD, kind: 'entry' });
    expect(body.hits.find((h) => h.id === ids.benchEntry)!.privateToYou).toBe(true);
    expect(body.hits.find((h) => h.id === ids.strong)!.privateToYou).toBe(false);
  });

  test('a body saved through the API is searched by its new words at once, not its old ones', async () => {
    const fresh = `new${stamp}word`;
    const e = await Entry.findByPk(ids.weak);
    const res = await patchEntryRoute(
      request(`/api/entries/${ids.weak}`, { method: 'PATCH', cookie: builder.cookie, body: { body: doc(`Rewritten with ${fresh}.`), version: e!.version } }),
      params({ id: String(ids.weak) }),
    );
    expect(res.status).toBe(200);
    expect(keys((await find(null, { q: fresh })).body)).toEqual([`entry:${ids.weak}`]);
    expect(keys((await find(null, { q: WORD, kind: 'entry' })).body)).not.toContain(`entry:${ids.weak}`);
  });
});

describe('search: fits', () => {
  test('"k6 spigot 130 mm": the published 130 k6 spigots with their outcome from the measurement engine', async () => {
    const { status, body } = await find(stranger, { q: `k6 spigot 130 mm ${WORD}` });
    expect(status).toBe(200);
    expect(body.mode).toBe('fit');
    expect(body.filters).toEqual(expect.arrayContaining(['k6', '130 mm']));
    const ours = body.hits.filter((h) => [ids.k6In, ids.k6Out, ids.k6Bench, ids.k6Link, ids.k6Other].includes(h.id));
    expect(ours.map((h) => h.id).sort()).toEqual([ids.k6In, ids.k6Out].sort());
    for (const h of body.hits) expect(h.record!.spec).toMatch(/^130 mm k6/);
    const inside = ours.find((h) => h.id === ids.k6In)!.record!;
    // 130 k6 → 130.003 … 130.028 mm; the last reading 130.015 is inside, +15 µm (ISO 286-2:2010, from memory).
    expect(inside.limitsText).toBe('130.003 … 130.028 mm');
    expect(inside.state).toBe('inside');
    expect(inside.deviationUm).toBe(15);
    expect(inside.readings).toBe(2);
    const out = ours.find((h) => h.id === ids.k6Out)!.record!;
    expect(out.state).toBe('over');
    expect(out.verdict).toBe('Outside by 0.007 mm');
    expect(out.deviationUm).toBe(35);
  });

  test('"H7 bores between 100 and 150 mm": holes only, the range inclusive, inches converted', async () => {
    const { body } = await find(null, { q: `H7 bores between 100 and 150 mm ${WORD}` });
    const ours = body.hits.map((h) => h.id).filter((id) => Object.values(ids).includes(id));
    expect(ours.sort((a, b) => a - b)).toEqual([ids.h7_120, ids.h7_150, ids.inch].sort((a, b) => a - b));
    expect(body.hits.every((h) => h.record!.kind === 'inside')).toBe(true);
    // Ordered by size when no words rank them apart: 120, 130.175 (5.125 in × 25.4), 150.
    const order = body.hits.filter((h) => ours.includes(h.id)).map((h) => h.id);
    expect(order).toEqual([ids.h7_120, ids.inch, ids.h7_150]);
  });

  test('the same through the fields: zone, from, to and unit', async () => {
    const { body } = await find(null, { zone: 'H7', min: '5', max: '5.2', unit: 'in' });
    expect(body.hits.map((h) => h.id)).toContain(ids.inch);
    expect(body.hits.map((h) => h.id)).not.toContain(ids.h7_120);
    const shafts = await find(null, { zone: 'h7', min: '120', max: '120' });
    expect(shafts.body.hits.map((h) => h.id)).toContain(ids.shaft_h7);
    expect(shafts.body.hits.map((h) => h.id)).not.toContain(ids.h7_120);
  });

  test('the builder finds their own private 130 k6 record too', async () => {
    const { body } = await find(builder, { q: `130 mm k6 ${WORD}` });
    expect(body.hits.map((h) => h.id)).toEqual(expect.arrayContaining([ids.k6In, ids.k6Out, ids.k6Bench, ids.k6Link]));
  });
});

describe('search: a word in many rows', () => {
  // Each kind ranks a bounded set of candidates (400) before it joins who may see them: when every one of
  // those is private, the published match further down must still be found, and pages must not change.
  const MANY = `wxq${stamp}`;
  let published: number;
  beforeAll(async () => {
    const open = await project('published', 'many-open');
    const bench = await project('private', 'many-bench');
    // Same words, same relevance: ties go to the newer row, so the 420 private ones rank above the published one.
    published = (await session(open.id, 'published', `Indexing plate ${MANY}.`)).id;
    await ShopSession.bulkCreate(Array.from({ length: 420 }, (_, i) => ({
      projectId: bench.id, position: position++, title: `Session ${i}`, heldOn: '2026-11-07', minutesSpent: 60, planned: '', done: `Indexing plate ${MANY}.`, nextSteps: '',
      visibility: 'private' as const, publishedAt: null, announcedAt: null,
    })));
  }, 60_000);

  test('a stranger finds the one published match below 420 private ones', async () => {
    const { body } = await find(stranger, { q: MANY });
    expect(keys(body)).toEqual([`session:${published}`]);
  });

  test('the builder pages through all 421 in rank order, the same as one long list', async () => {
    const seen: string[] = [];
    for (let page = 1; page <= 3; page++) {
      const { body } = await find(builder, { q: MANY, page: String(page) });
      expect(body.hits).toHaveLength(20);
      expect(body.hasMore).toBe(true);
      seen.push(...keys(body));
    }
    const ids = seen.map((k) => Number(k.split(':')[1]));
    // Equal relevance, so newest first: strictly falling ids, no repeats across pages.
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    expect(new Set(ids).size).toBe(60);
  });
});

describe('search: bad input', () => {
  test.each([
    [{ page: '0' }, 'page'],
    [{ page: '11' }, 'page'],
    [{ page: 'two' }, 'page'],
    [{ kind: 'photos' }, 'kind'],
    [{ operation: 'welding' }, 'operation'],
    [{ zone: 'Q7' }, 'zone'], // no letter Q in ISO 286-1:2010 (from memory)
    [{ zone: 'H7/g6/f7' }, 'zone'],
    [{ min: 'abc' }, 'min'],
    [{ min: '150', max: '100' }, 'max'],
    [{ unit: 'ft' }, 'unit'],
    [{ q: 'x'.repeat(201) }, 'q'],
  ])('%o is a 400 naming %s', async (query, field) => {
    const { status, body } = await find(null, { q: WORD, ...query });
    expect(status).toBe(400);
    expect(Object.keys(body.fieldErrors ?? {})).toEqual([field]);
  });
});
