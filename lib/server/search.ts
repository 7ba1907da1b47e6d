import 'server-only';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../db/connection';
import { initModels, MeasurementReading, MeasurementRecord } from '../../db/models';
import { authorizePublic, type Actor, type Visibility } from '../auth/policy';
import { validationError } from '../errors';
import { listedSessionVisibilities } from './session-listing';
import { inputOf } from './measurements';
import { momentHref } from '../chapters/moment';
import { analyseRecord, asEntered, deviationText, sizeText, verdictShort, type LengthUnit } from '../measurements';
import { excerptHtml, excerptOf } from '../search/excerpt';
import { readSearchQuery, type FeatureKind } from '../search/query';
import { OPERATIONS } from '../validations/log';
import { SEARCH_PAGE_SIZE, searchQuerySchema, type SearchKind, type SearchQuery } from '../validations/search';
import type { SearchHit, SearchRecordOutcome, SearchResult } from '../types/search';

export type { SearchResult };

// ── What the index can take ─────────────────────────────────────────────────────────────────────
// InnoDB leaves out words shorter than innodb_ft_min_token_size and its stopwords; asking for one with
// "+" in boolean mode would find nothing, so such words are dropped here and named to the reader.
type IndexLimits = { min: number; max: number; stopwords: Set<string> };
let indexLimits: Promise<IndexLimits> | null = null;

function readIndexLimits(): Promise<IndexLimits> {
  indexLimits ??= (async () => {
    const sequelize = getSequelize();
    const [sizes] = await sequelize.query<{ min: number; max: number; enabled: number }>(
      'SELECT @@innodb_ft_min_token_size AS min, @@innodb_ft_max_token_size AS max, @@innodb_ft_enable_stopword AS enabled',
      { type: QueryTypes.SELECT },
    );
    const words = sizes!.enabled
      ? await sequelize.query<{ value: string }>('SELECT value FROM INFORMATION_SCHEMA.INNODB_FT_DEFAULT_STOPWORD', { type: QueryTypes.SELECT })
      : [];
    return { min: Number(sizes!.min), max: Number(sizes!.max), stopwords: new Set(words.map((w) => w.value.toLowerCase())) };
  })().catch((err) => {
    indexLimits = null;
    throw err;
  });
  return indexLimits;
}

function indexable(word: string, limits: IndexLimits): boolean {
  const length = [...word].length;
  return length >= limits.min && length <= limits.max && !limits.stopwords.has(word);
}

/** A boolean-mode query: every word required, each also as the start of a longer word ("bore" finds "bores"). */
function booleanQuery(words: string[], phrases: string[][]): string {
  return [...words.map((w) => `+${w}*`), ...phrases.map((p) => `+"${p.join(' ')}"`)].join(' ');
}

// ── Who finds what ──────────────────────────────────────────────────────────────────────────────
// A search is a list across every log, so it follows the listing rule (listedSessionWhere): readers find a
// published project's published sessions and what is in them; a by-link project is not listed anywhere, so
// nothing of it is found except by its builder's circle (owner, mentors), who find all their own work.
const PUBLIC_SQL = "(p.visibility = 'published' AND s.visibility = 'published')";
const CIRCLE_SQL =
  "(p.owner_id = :actorId OR EXISTS (SELECT 1 FROM project_memberships pm WHERE pm.project_id = p.id AND pm.user_id = :actorId AND pm.role = 'mentor'))";

function visibleSql(actor: Actor): string {
  return actor ? `(${PUBLIC_SQL} OR ${CIRCLE_SQL})` : PUBLIC_SQL;
}

type Facts = { ownerId: number; projectVisibility: Visibility; sessionVisibility: Visibility; mentor: number };

/** The policy's word on each row the SQL let through (the same rule, asked of the one policy module). */
function findable(actor: Actor, f: Facts): { ok: boolean; circle: boolean } {
  const facts = { ownerId: f.ownerId, visibility: f.projectVisibility, mentorIds: actor && f.mentor ? [actor.id] : [] };
  const listed = listedSessionVisibilities(actor, facts);
  if (listed === null) return { ok: true, circle: true };
  return { ok: f.projectVisibility === 'published' && f.sessionVisibility === 'published' && listed.includes('published'), circle: false };
}

const FACT_COLUMNS = (actor: Actor) =>
  `p.owner_id AS ownerId, p.visibility AS projectVisibility, s.visibility AS sessionVisibility, ${
    actor ? "EXISTS (SELECT 1 FROM project_memberships pm2 WHERE pm2.project_id = p.id AND pm2.user_id = :actorId AND pm2.role = 'mentor')" : '0'
  } AS mentor`;

// ── The five kinds ──────────────────────────────────────────────────────────────────────────────
type Source = {
  kind: SearchKind;
  match: string;
  /** The indexed table and its alias, which `from` starts with (the candidates are ranked on it alone). */
  table: string;
  alias: string;
  /** The joins to the session and project that decide who may see a match. */
  joins: string;
  from: string;
  where?: string;
  /** Whether an operation filter applies (sessions have none). */
  hasOperation: boolean;
};

const ENTRY_JOIN = 'JOIN shop_sessions s ON s.id = e.session_id JOIN projects p ON p.id = s.project_id';
const source = (s: Omit<Source, 'from'>): Source => ({ ...s, from: `${s.table} ${s.alias} ${s.joins}` });
const SOURCES: Source[] = [
  source({ kind: 'entry', match: 'MATCH(e.title, e.body_text)', table: 'entries', alias: 'e', joins: ENTRY_JOIN, hasOperation: true }),
  source({ kind: 'session', match: 'MATCH(s.title, s.planned, s.done, s.next_steps)', table: 'shop_sessions', alias: 's', joins: 'JOIN projects p ON p.id = s.project_id', hasOperation: false }),
  source({ kind: 'note', match: 'MATCH(n.text)', table: 'time_notes', alias: 'n', joins: `JOIN media m ON m.id = n.media_id JOIN entries e ON e.id = m.entry_id ${ENTRY_JOIN}`, hasOperation: true }),
  // Hidden and deleted comments are never found, by anyone.
  source({ kind: 'comment', match: 'MATCH(c.body)', table: 'comments', alias: 'c', joins: `JOIN entries e ON e.id = c.entry_id ${ENTRY_JOIN}`, where: 'c.hidden_at IS NULL AND c.deleted_at IS NULL', hasOperation: true }),
  source({ kind: 'record', match: 'MATCH(r.feature, r.spec_zone)', table: 'measurement_records', alias: 'r', joins: `JOIN entries e ON e.id = r.entry_id ${ENTRY_JOIN}`, hasOperation: true }),
];
const ID_OF: Record<SearchKind, string> = { entry: 'e.id', session: 's.id', note: 'n.id', comment: 'c.id', record: 'r.id' };

type Ranked = { kind: SearchKind; id: number; score: number };

type Row = Facts & {
  id: number; slug: string; projectTitle: string; sessionId: number; sessionTitle: string; sessionPosition: number;
  entryId: number | null; entryTitle: string | null; operation: string | null; text: string; title: string | null;
  mediaId: number | null; startMs: number | null; atMs: number | null; commentMediaId: number | null;
};

const DETAIL: Record<SearchKind, { columns: string; from: string }> = {
  entry: { columns: 'e.id, e.id AS entryId, e.title AS entryTitle, e.operation, e.body_text AS text, e.title', from: SOURCES[0]!.from },
  session: {
    columns: "s.id, NULL AS entryId, NULL AS entryTitle, NULL AS operation, CONCAT_WS('\\n', s.planned, s.done, s.next_steps) AS text, s.title",
    from: SOURCES[1]!.from,
  },
  note: { columns: 'n.id, e.id AS entryId, e.title AS entryTitle, e.operation, n.text, NULL AS title, n.media_id AS mediaId, n.start_ms AS startMs', from: SOURCES[2]!.from },
  comment: {
    columns: 'c.id, e.id AS entryId, e.title AS entryTitle, e.operation, c.body AS text, NULL AS title, c.media_id AS commentMediaId, c.at_ms AS atMs',
    from: SOURCES[3]!.from,
  },
  record: { columns: "r.id, e.id AS entryId, e.title AS entryTitle, e.operation, CONCAT_WS(' ', r.feature, r.spec_zone) AS text, r.feature AS title", from: SOURCES[4]!.from },
};

const OPERATION_LABEL = new Map<string, string>(OPERATIONS.map((o) => [o.value, o.label]));

async function details(actor: Actor, ranked: Ranked[]): Promise<Map<string, Row>> {
  const sequelize = getSequelize();
  const out = new Map<string, Row>();
  const kinds = [...new Set(ranked.map((r) => r.kind))];
  await Promise.all(
    kinds.map(async (kind) => {
      const ids = ranked.filter((r) => r.kind === kind).map((r) => r.id);
      const rows = await sequelize.query<Row>(
        `SELECT ${DETAIL[kind].columns}, p.slug, p.title AS projectTitle, s.id AS sessionId, s.title AS sessionTitle, s.position AS sessionPosition, ${FACT_COLUMNS(actor)}
         FROM ${DETAIL[kind].from} WHERE ${ID_OF[kind]} IN (:ids)`,
        { replacements: { ids, actorId: actor?.id ?? 0 }, type: QueryTypes.SELECT },
      );
      for (const row of rows) out.set(`${kind}:${row.id}`, row);
    }),
  );
  return out;
}

function hrefOf(kind: SearchKind, row: Row): string {
  const log = `/logs/${row.slug}`;
  if (kind === 'session') return `${log}/sessions/${row.sessionId}`;
  if (kind === 'record') return `${log}/records/${row.id}`;
  const entry = `${log}/entries/${row.entryId}`;
  if (kind === 'note') return momentHref(entry, row.mediaId, row.startMs ?? 0);
  if (kind === 'comment') return `${entry}#comment-${row.id}`;
  return entry;
}

const KIND_TITLE: Record<SearchKind, string> = { entry: 'Entry', session: 'Session', note: 'Clip note', comment: 'Comment', record: 'Measurement' };

function titleOf(kind: SearchKind, row: Row): string {
  if (kind === 'note') return `Clip note in “${row.entryTitle}”`;
  if (kind === 'comment') return `Comment on “${row.entryTitle}”`;
  return row.title ?? KIND_TITLE[kind];
}

function contextOf(kind: SearchKind, row: Row): string {
  const session = `Session ${row.sessionPosition + 1}: ${row.sessionTitle}`;
  return kind === 'session' || !row.entryTitle ? `${row.projectTitle} · ${session}` : `${row.projectTitle} · ${session} · ${row.entryTitle}`;
}

async function recordOutcomes(ids: number[]): Promise<Map<number, SearchRecordOutcome>> {
  const out = new Map<number, SearchRecordOutcome>();
  if (!ids.length) return out;
  const records = await MeasurementRecord.findAll({
    where: { id: ids },
    include: [{ model: MeasurementReading, as: 'readings' }],
    order: [['id', 'ASC'], [{ model: MeasurementReading, as: 'readings' }, 'position', 'ASC'], [{ model: MeasurementReading, as: 'readings' }, 'id', 'ASC']],
  });
  for (const r of records) {
    const input = inputOf(r as Parameters<typeof inputOf>[0]);
    const a = analyseRecord(input);
    const unit: LengthUnit = r.unit;
    const last = a.readings[a.readings.length - 1];
    const lower = a.limits.nominalUm + a.limits.lowerUm;
    const upper = a.limits.nominalUm + a.limits.upperUm;
    out.set(r.id, {
      feature: r.feature,
      kind: r.kind,
      spec: `${asEntered(input.nominal)} ${unit} ${a.limits.label}`,
      limitsText: `${sizeText(lower, unit)} … ${sizeText(upper, unit)} ${unit}`,
      state: a.verdict.state,
      verdict: verdictShort(a.verdict, unit),
      deviationUm: last ? last.judgement.deviationUm : null,
      deviationText: last ? `${deviationText(last.judgement.deviationUm, unit)} ${unit}` : null,
      readings: a.readings.length,
    });
  }
  return out;
}

async function toHits(actor: Actor, ranked: Ranked[], terms: string[]): Promise<SearchHit[]> {
  if (!ranked.length) return [];
  const rows = await details(actor, ranked);
  const outcomes = await recordOutcomes(ranked.filter((r) => r.kind === 'record').map((r) => r.id));
  const hits: SearchHit[] = [];
  for (const r of ranked) {
    const row = rows.get(`${r.kind}:${r.id}`);
    if (!row) continue;
    const seen = findable(actor, row);
    if (!seen.ok) continue;
    const excerpt = excerptOf(row.text ?? '', terms);
    hits.push({
      kind: r.kind,
      id: r.id,
      title: titleOf(r.kind, row),
      context: contextOf(r.kind, row),
      href: hrefOf(r.kind, row),
      projectTitle: row.projectTitle,
      operation: row.operation ? (OPERATION_LABEL.get(row.operation) ?? row.operation) : null,
      excerpt,
      excerptHtml: excerptHtml(excerpt),
      score: Math.round(r.score * 1000) / 1000,
      privateToYou: seen.circle && !(row.projectVisibility === 'published' && row.sessionVisibility === 'published'),
      ...(r.kind === 'record' && outcomes.has(r.id) ? { record: outcomes.get(r.id)! } : {}),
    });
  }
  return hits;
}

// ── Words ───────────────────────────────────────────────────────────────────────────────────────
// A word in most of a big site's rows (50,000 sessions) is slow mostly in the joins that decide who may see
// each match: so each kind first ranks a bounded set of candidates on its own full-text index, then joins
// only those. Exact, not approximate: a kind whose candidates ran out before it had filled the page, while
// its index holds more matches than the bound, is asked again without the bound.
const CANDIDATES = 400;

const byRank = (a: Ranked, b: Ranked) => b.score - a.score || (a.kind < b.kind ? -1 : a.kind > b.kind ? 1 : 0) || b.id - a.id;

async function searchWords(actor: Actor, query: SearchQuery, against: string, offset: number): Promise<{ ranked: Ranked[]; hasMore: boolean }> {
  const take = offset + SEARCH_PAGE_SIZE + 1;
  const cap = Math.max(CANDIDATES, take * 2);
  const sources = SOURCES.filter((s) => (!query.kind || s.kind === query.kind) && (!query.operation || s.hasOperation));
  if (!sources.length) return { ranked: [], hasMore: false };
  const replacements = { against, actorId: actor?.id ?? 0, operation: query.operation ?? null };
  const filters = (s: Source) => [visibleSql(actor), s.where, query.operation && s.hasOperation ? 'e.operation = :operation' : null].filter(Boolean);
  const bounded = (s: Source) =>
    `(SELECT '${s.kind}' AS kind, ${ID_OF[s.kind]} AS id, cand.score
      FROM (SELECT ${s.alias}.id, ${s.match} AGAINST (:against IN BOOLEAN MODE) AS score FROM ${s.table} ${s.alias}
            WHERE ${s.match} AGAINST (:against IN BOOLEAN MODE) ORDER BY score DESC, ${s.alias}.id DESC LIMIT ${cap}) cand
      JOIN ${s.table} ${s.alias} ON ${s.alias}.id = cand.id ${s.joins}
      WHERE ${filters(s).join(' AND ')} ORDER BY cand.score DESC, ${ID_OF[s.kind]} DESC LIMIT ${take})`;
  const whole = (s: Source) =>
    `(SELECT '${s.kind}' AS kind, ${ID_OF[s.kind]} AS id, ${s.match} AGAINST (:against IN BOOLEAN MODE) AS score
      FROM ${s.from} WHERE ${[`${s.match} AGAINST (:against IN BOOLEAN MODE)`, ...filters(s)].join(' AND ')} ORDER BY score DESC, id DESC LIMIT ${take})`;
  const run = async (parts: string[]) =>
    (await getSequelize().query<Ranked>(parts.join(' UNION ALL '), { replacements, type: QueryTypes.SELECT }))
      .map((r) => ({ kind: r.kind, id: Number(r.id), score: Number(r.score) }));

  let rows = await run(sources.map(bounded));
  const short = sources.filter((s) => rows.filter((r) => r.kind === s.kind).length < take);
  if (short.length) {
    // How many matches each short kind's index holds, counted up to one past the bound (cheap: no ranking, no joins).
    const [counts] = await getSequelize().query<Record<string, number>>(
      `SELECT ${short.map((s) => `(SELECT COUNT(*) FROM (SELECT 1 FROM ${s.table} ${s.alias} WHERE ${s.match} AGAINST (:against IN BOOLEAN MODE) LIMIT ${cap + 1}) x) AS ${s.kind}`).join(', ')}`,
      { replacements, type: QueryTypes.SELECT },
    );
    const again = short.filter((s) => Number(counts![s.kind]) > cap);
    if (again.length) {
      const redo = new Set(again.map((s) => s.kind));
      rows = [...rows.filter((r) => !redo.has(r.kind)), ...(await run(again.map(whole)))];
    }
  }
  const page = rows.sort(byRank).slice(offset, offset + SEARCH_PAGE_SIZE + 1);
  return { ranked: page.slice(0, SEARCH_PAGE_SIZE), hasMore: page.length > SEARCH_PAGE_SIZE };
}

// ── Fits ────────────────────────────────────────────────────────────────────────────────────────
type FitFilter = { zones: string[]; inchClasses: string[]; minMm: number | null; maxMm: number | null; kind: FeatureKind | null };

async function searchFit(actor: Actor, query: SearchQuery, fit: FitFilter, against: string | null, offset: number): Promise<{ ranked: Ranked[]; hasMore: boolean }> {
  const where = [visibleSql(actor)];
  const specs: string[] = [];
  // Zones are case-sensitive (H7 is a hole, h7 a shaft) while the column's collation is not: compare bytes too.
  if (fit.zones.length) specs.push("(r.spec_type = 'zone' AND r.spec_zone IN (:zones) AND BINARY r.spec_zone IN (:zones))");
  if (fit.inchClasses.length) specs.push("(r.spec_type = 'inchClass' AND r.spec_zone IN (:inchClasses))");
  if (specs.length) where.push(`(${specs.join(' OR ')})`);
  // Nominal sizes compared in mm (25.4 mm to the inch), with half a micrometre either way for the conversion.
  const nominalMm = "(CASE WHEN r.unit = 'in' THEN r.nominal * 25.4 ELSE r.nominal END)";
  if (fit.minMm !== null) where.push(`${nominalMm} >= :minMm - 0.0005`);
  if (fit.maxMm !== null) where.push(`${nominalMm} <= :maxMm + 0.0005`);
  if (fit.kind) where.push('r.kind = :kind');
  if (query.operation) where.push('e.operation = :operation');
  // The other words rank the records (feature names) without excluding any.
  const score = against ? 'MATCH(r.feature, r.spec_zone) AGAINST (:against IN NATURAL LANGUAGE MODE)' : '0';
  const rows = await getSequelize().query<Ranked>(
    `SELECT 'record' AS kind, r.id, ${score} AS score FROM ${SOURCES[4]!.from}
     WHERE ${where.join(' AND ')} ORDER BY score DESC, ${nominalMm} ASC, r.id DESC LIMIT ${SEARCH_PAGE_SIZE + 1} OFFSET ${offset}`,
    {
      replacements: {
        zones: fit.zones.length ? fit.zones : [''], inchClasses: fit.inchClasses.length ? fit.inchClasses : [''],
        minMm: fit.minMm, maxMm: fit.maxMm, kind: fit.kind, operation: query.operation ?? null, against: against ?? '', actorId: actor?.id ?? 0,
      },
      type: QueryTypes.SELECT,
    },
  );
  return { ranked: rows.slice(0, SEARCH_PAGE_SIZE).map((r) => ({ kind: 'record', id: Number(r.id), score: Number(r.score) })), hasMore: rows.length > SEARCH_PAGE_SIZE };
}

const toMm = (n: number, unit: 'mm' | 'in') => (unit === 'in' ? n * 25.4 : n);
const sizeWords = (min: number | null, max: number | null, unit: 'mm' | 'in') =>
  min !== null && max !== null ? (min === max ? `${min} ${unit}` : `${min}–${max} ${unit}`) : min !== null ? `from ${min} ${unit}` : `up to ${max} ${unit}`;

/**
 * Search across every log the viewer may list: published sessions, entries, clip notes, comments and
 * measurement records, plus the viewer's own and mentored work. Words go through the FULLTEXT indexes
 * (boolean mode, ranked); a zone, fit, inch class or size range makes it a search of measurement records.
 */
export async function search(actor: Actor, input: unknown): Promise<SearchResult> {
  authorizePublic(actor, 'search');
  // Refused fields as an AppError, so the page shows them beside their boxes as the route answers them (400).
  const parsed = searchQuerySchema.safeParse(input);
  if (!parsed.success) throw validationError(parsed.error);
  const query = parsed.data;
  initModels();
  const read = readSearchQuery(query.q);
  const limits = await readIndexLimits();
  const typed = [...read.words, ...read.phrases.flat()];
  const words = read.words.filter((w) => indexable(w, limits));
  const phrases = read.phrases.map((p) => p.filter((w) => indexable(w, limits))).filter((p) => p.length);
  const ignored = [...new Set(typed.filter((w) => !indexable(w, limits)))];
  const offset = (query.page - 1) * SEARCH_PAGE_SIZE;

  const zones = [...new Set([...(query.zone?.zones ?? []), ...read.zones])];
  const inchClasses = [...new Set([...(query.zone?.inchClasses ?? []), ...read.inchClasses])];
  const fieldRange = query.min !== undefined || query.max !== undefined;
  const minMm = fieldRange ? (query.min !== undefined ? toMm(query.min, query.unit) : null) : read.size ? toMm(read.size.min, read.size.unit) : null;
  const maxMm = fieldRange ? (query.max !== undefined ? toMm(query.max, query.unit) : null) : read.size ? toMm(read.size.max, read.size.unit) : null;
  const isFit = zones.length > 0 || inchClasses.length > 0 || minMm !== null || maxMm !== null;
  const base = { page: query.page, words: [...words, ...phrases.map((p) => p.join(' '))], ignored };

  if (isFit) {
    if (query.kind && query.kind !== 'record') {
      return { ...base, mode: 'fit', hits: [], hasMore: false, filters: [], notice: 'A zone, fit or size finds measurements: choose “Measurements” or all kinds.' };
    }
    const filters = [
      ...zones, ...inchClasses,
      ...(read.kind ? [read.kind === 'inside' ? 'inside (bores, holes)' : 'outside (spigots, shafts)'] : []),
      ...(minMm !== null || maxMm !== null
        ? [fieldRange ? sizeWords(query.min ?? null, query.max ?? null, query.unit) : sizeWords(read.size!.min, read.size!.max, read.size!.unit)]
        : []),
      ...(query.operation ? [OPERATION_LABEL.get(query.operation)!] : []),
    ];
    const against = words.length || phrases.length ? [...words, ...phrases.flat()].join(' ') : null;
    const { ranked, hasMore } = await searchFit(actor, query, { zones, inchClasses, minMm, maxMm, kind: read.kind }, against, offset);
    return { ...base, mode: 'fit', hits: await toHits(actor, ranked, [...words, ...phrases.flat(), ...zones, ...inchClasses]), hasMore, filters, notice: null };
  }

  if (!words.length && !phrases.length) {
    const notice = query.q
      ? `Nothing to look for: words of fewer than ${limits.min} letters and very common words are not indexed${ignored.length ? ` (${ignored.join(', ')})` : ''}. Add a longer word, or a zone and size such as “k6 130 mm”.`
      : null;
    return { ...base, mode: 'words', hits: [], hasMore: false, filters: [], notice };
  }
  const { ranked, hasMore } = await searchWords(actor, query, booleanQuery(words, phrases), offset);
  const filters = [...(query.kind ? [KIND_TITLE[query.kind]] : []), ...(query.operation ? [OPERATION_LABEL.get(query.operation)!] : [])];
  return { ...base, mode: 'words', hits: await toHits(actor, ranked, [...words, ...phrases.flat()]), hasMore, filters, notice: null };
}
