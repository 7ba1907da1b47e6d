import 'server-only';
import { momentHref } from '@/lib/chapters/moment';
import { literal, Op, type Transaction, type WhereOptions } from 'sequelize';
import { initModels, Entry, MeasurementPair, MeasurementReading, MeasurementRecord, Media, ShopSession, TimeNote, User } from '../../db/models';
import { withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import { canOnProject, type Actor } from '../auth/policy';
import { authorizeLog, type LogScope } from './log-scope';
import { listedSessionWhere, viewableSessionWhere } from './session-listing';
import {
  analysePair, analyseRecord, asEntered, checkNearNominal, checkPairable, isMeasurementError, recordLimits, sameNominal, type RecordInput, type Spec,
} from '../measurements';
import { measurementsCsv } from '../measurements/records-csv';
import {
  measurementInputSchema, measurementUpdateSchema, pairInputSchema, readingUpdateSchema, recordIssues,
  type ReadingData,
} from '../validations/measurements';
import { readingOnceSchema } from '../validations/bench';
import type {
  MeasurementMoment, MeasurementPageData, MeasurementProject, MeasurementView, PairCandidate, PairSideView, PairView, ProjectMeasurements, ReadingView,
} from '../types/measurements';

export type { MeasurementView, PairView, ProjectMeasurements, MeasurementPageData };

type Loaded = MeasurementRecord & { entry?: Entry & { session?: ShopSession }; timeNote?: TimeNote | null; readings?: MeasurementReading[] };

// DECIMAL columns come back from the driver as strings; they go in as fixed five-decimal text.
const num = (s: string | number | null | undefined): number | null => (s === null || s === undefined ? null : Number(s));
const dec = (n: number): string => n.toFixed(5);

const measurementNotFound = () => new AppError('not_found', 'That measurement was not found.');

function specOf(r: MeasurementRecord): Spec {
  switch (r.specType) {
    case 'zone':
      return { type: 'zone', zone: r.specZone ?? '' };
    case 'inchClass':
      return { type: 'inchClass', fitClass: r.specZone ?? '' };
    case 'limits':
      return { type: 'limits', upper: num(r.specUpper) ?? 0, lower: num(r.specLower) ?? 0 };
    case 'plusMinus':
      return { type: 'plusMinus', tolerance: num(r.specTolerance) ?? 0 };
    default:
      return { type: 'general', generalClass: (r.specGeneralClass ?? 'm') as 'f' | 'm' | 'c' | 'v' };
  }
}

function specColumns(spec: Spec) {
  return {
    specType: spec.type,
    // An inch class ("RC4", checked by recordLimits before any write) shares the zone column.
    specZone: spec.type === 'zone' ? spec.zone.trim() : spec.type === 'inchClass' ? spec.fitClass.replace(/[\s-]/g, '').toUpperCase() : null,
    specUpper: spec.type === 'limits' ? dec(spec.upper) : null,
    specLower: spec.type === 'limits' ? dec(spec.lower) : null,
    specTolerance: spec.type === 'plusMinus' ? dec(spec.tolerance) : null,
    specGeneralClass: spec.type === 'general' ? spec.generalClass : null,
  };
}

export function inputOf(r: Loaded): RecordInput {
  return {
    kind: r.kind,
    nominal: Number(r.nominal),
    unit: r.unit,
    spec: specOf(r),
    readings: (r.readings ?? []).map((x) => ({ value: Number(x.value), unit: x.unit, resolution: Number(x.resolution), temperatureC: num(x.temperatureC), pass: x.passNumber })),
  };
}

const recordInclude = (sessionWhere?: WhereOptions) => [
  { model: MeasurementReading, as: 'readings' },
  {
    model: Entry,
    as: 'entry',
    attributes: ['id', 'title', 'sessionId'],
    required: true,
    include: [{ model: ShopSession, as: 'session', attributes: ['id', 'title', 'position', 'projectId'], required: true, ...(sessionWhere ? { where: sessionWhere } : {}) }],
  },
  { model: TimeNote, as: 'timeNote', attributes: ['id', 'mediaId', 'startMs', 'text'] },
];
const recordOrder: [unknown, ...unknown[]][] = [
  [{ model: Entry, as: 'entry' }, { model: ShopSession, as: 'session' }, 'position', 'ASC'],
  [{ model: Entry, as: 'entry' }, 'position', 'ASC'],
  ['id', 'ASC'],
  [{ model: MeasurementReading, as: 'readings' }, 'position', 'ASC'],
  [{ model: MeasurementReading, as: 'readings' }, 'id', 'ASC'],
];

async function loadRecords(where: WhereOptions, sessionWhere?: WhereOptions, transaction?: Transaction, withPairs = false): Promise<Loaded[]> {
  return (await MeasurementRecord.findAll({
    where,
    // The record's pairs as JSON in the same read (see pairsCarried), for the pages that read records.
    ...(withPairs ? { attributes: { include: [[literal(PAIRS_SUBQUERY), 'pairsJson']] } } : {}),
    include: recordInclude(sessionWhere),
    // Sequelize's order typing does not follow nested includes.
    order: recordOrder as never,
    transaction,
  })) as Loaded[];
}

const PAIRS_SUBQUERY =
  "(SELECT JSON_ARRAYAGG(JSON_OBJECT('id', mp.id, 'holeRecordId', mp.hole_record_id, 'shaftRecordId', mp.shaft_record_id, 'createdAt', DATE_FORMAT(mp.created_at, '%Y-%m-%dT%H:%i:%s.000Z'))) FROM measurement_pairs mp WHERE mp.hole_record_id = `MeasurementRecord`.`id` OR mp.shaft_record_id = `MeasurementRecord`.`id`)";

/** The pairs read along with the records (loadRecords' withPairs), in id order, each once. */
function pairsCarried(records: Loaded[]): MeasurementPair[] {
  const byId = new Map<number, MeasurementPair>();
  for (const r of records) {
    const raw = r.getDataValue('pairsJson' as never) as unknown;
    const list = (typeof raw === 'string' ? JSON.parse(raw) : raw) as { id: number; holeRecordId: number; shaftRecordId: number; createdAt: string }[] | null;
    for (const p of list ?? []) byId.set(p.id, { ...p, createdAt: new Date(p.createdAt) } as unknown as MeasurementPair);
  }
  return [...byId.values()].sort((a, b) => a.id - b.id);
}

function momentOf(r: Loaded, project: MeasurementProject): MeasurementMoment | null {
  const n = r.timeNote;
  if (!n) return null;
  return {
    noteId: n.id,
    mediaId: n.mediaId,
    startMs: n.startMs,
    text: n.text,
    href: momentHref(`/logs/${project.slug}/entries/${r.entryId}`, n.mediaId, n.startMs),
  };
}

function toView(r: Loaded, project: MeasurementProject, pairIds: number[]): MeasurementView {
  const input = inputOf(r);
  const analysis = analyseRecord(input);
  const readings: ReadingView[] = (r.readings ?? []).map((x, i) => ({
    id: x.id,
    position: x.position,
    pass: x.passNumber,
    value: Number(x.value),
    valueText: asEntered(Number(x.value), Number(x.resolution)),
    unit: x.unit,
    instrument: x.instrument,
    resolution: Number(x.resolution),
    measuredBy: x.measuredBy,
    measuredAt: x.measuredAt.toISOString(),
    temperatureC: num(x.temperatureC),
    note: x.note,
    version: x.version,
    judgement: analysis.readings[i]!.judgement,
    resolutionCheck: analysis.readings[i]!.resolution,
    temperature: analysis.readings[i]!.temperature,
  }));
  const session = r.entry!.session!;
  return {
    id: r.id,
    project,
    entry: { id: r.entryId, title: r.entry!.title, sessionId: session.id, sessionPosition: session.position, sessionTitle: session.title },
    feature: r.feature,
    kind: r.kind,
    nominal: input.nominal,
    nominalText: asEntered(input.nominal),
    unit: r.unit,
    spec: input.spec,
    timeNoteId: r.timeNoteId ?? null,
    limits: analysis.limits,
    readings,
    verdict: analysis.verdict,
    approach: analysis.approach,
    byPasses: analysis.byPasses,
    moment: momentOf(r, project),
    pairIds,
    version: r.version,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}

const projectOf = (scope: LogScope): MeasurementProject => ({ id: scope.projectId, slug: scope.projectSlug, title: scope.projectTitle, units: scope.units });

async function pairRowsFor(recordIds: number[], transaction?: Transaction): Promise<MeasurementPair[]> {
  if (!recordIds.length) return [];
  return MeasurementPair.findAll({
    where: { [Op.or]: [{ holeRecordId: { [Op.in]: recordIds } }, { shaftRecordId: { [Op.in]: recordIds } }] },
    order: [['id', 'ASC']],
    transaction,
  });
}

function pairIdsByRecord(pairs: MeasurementPair[]): Map<number, number[]> {
  const out = new Map<number, number[]>();
  for (const p of pairs) {
    for (const rid of [p.holeRecordId, p.shaftRecordId]) {
      if (!out.has(rid)) out.set(rid, []);
      out.get(rid)!.push(p.id);
    }
  }
  return out;
}

function sideOf(v: MeasurementView): PairSideView {
  const last = v.readings[v.readings.length - 1];
  return {
    id: v.id,
    entryId: v.entry.id,
    feature: v.feature,
    kind: v.kind,
    nominal: v.nominal,
    nominalText: v.nominalText,
    unit: v.unit,
    limits: v.limits,
    verdict: v.verdict,
    latest: last ? { valueText: last.valueText, unit: last.unit, sizeUm: last.judgement.sizeUm } : null,
  };
}

function toPairView(p: MeasurementPair, byId: Map<number, MeasurementView>): PairView | null {
  const hole = byId.get(p.holeRecordId);
  const shaft = byId.get(p.shaftRecordId);
  if (!hole || !shaft) return null;
  const h = sideOf(hole);
  const s = sideOf(shaft);
  const analysis = analysePair(
    { kind: hole.kind, limits: hole.limits, latestSizeUm: h.latest?.sizeUm ?? null },
    { kind: shaft.kind, limits: shaft.limits, latestSizeUm: s.latest?.sizeUm ?? null },
  );
  return { id: p.id, hole: h, shaft: s, analysis, createdAt: p.createdAt.toISOString() };
}

/**
 * Views of a set of records, with the fits they are part of (partners loaded as needed). A partner in a
 * session the viewer may not see (partnerSessionWhere) is left out, and so is the fit it makes.
 */
async function viewsWithPairs(records: Loaded[], project: MeasurementProject, transaction?: Transaction, partnerSessionWhere?: WhereOptions, carried?: MeasurementPair[]) {
  const own = new Set(records.map((r) => r.id));
  const allPairs = carried ?? (await pairRowsFor([...own], transaction));
  const missing = [...new Set(allPairs.flatMap((p) => [p.holeRecordId, p.shaftRecordId]))].filter((id) => !own.has(id));
  const partners = missing.length
    ? await loadRecords({ id: { [Op.in]: missing } }, { projectId: project.id, ...(partnerSessionWhere ?? {}) }, transaction)
    : [];
  const present = new Set([...own, ...partners.map((r) => r.id)]);
  const pairs = allPairs.filter((p) => present.has(p.holeRecordId) && present.has(p.shaftRecordId));
  const ids = pairIdsByRecord(pairs);
  const byId = new Map<number, MeasurementView>();
  for (const r of [...records, ...partners]) byId.set(r.id, toView(r, project, ids.get(r.id) ?? []));
  const pairViews = pairs.map((p) => toPairView(p, byId)).filter((p): p is PairView => p !== null);
  return { views: records.map((r) => byId.get(r.id)!), pairs: pairViews };
}

async function findRecord(id: number, transaction?: Transaction, lock = false): Promise<MeasurementRecord> {
  initModels();
  const record = await MeasurementRecord.findByPk(id, { transaction, ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}) });
  if (!record) throw measurementNotFound();
  return record;
}

// ── Reading ───────────────────────────────────────────────────────────────────────────────────

export async function listEntryMeasurements(actor: Actor, entryId: number): Promise<MeasurementView[]> {
  initModels();
  const scope = await authorizeLog(actor, 'view', { entryId });
  const records = await loadRecords({ entryId }, undefined, undefined, true);
  return (await viewsWithPairs(records, projectOf(scope), undefined, viewableSessionWhere(actor, scope.facts), pairsCarried(records))).views;
}

export async function listProjectMeasurements(actor: Actor, projectId: number): Promise<ProjectMeasurements> {
  initModels();
  const scope = await authorizeLog(actor, 'view', { projectId });
  const project = projectOf(scope);
  // The table lists what the project's timeline lists; a fit's other half needs only to be viewable.
  const records = await loadRecords({}, { projectId, ...listedSessionWhere(actor, scope.facts) });
  const { views, pairs } = await viewsWithPairs(records, project, undefined, viewableSessionWhere(actor, scope.facts));
  return { project, records: views, pairs, canEdit: canOnProject(actor, 'editLog', scope.facts) };
}

/**
 * The project's records as listProjectMeasurements lists them, one session's at a time (the archive's CSV),
 * so what is held at once does not grow with the project.
 */
export async function* projectMeasurementsBySession(actor: Actor, projectId: number): AsyncGenerator<MeasurementView[]> {
  initModels();
  const scope = await authorizeLog(actor, 'view', { projectId });
  const project = projectOf(scope);
  const listed = listedSessionWhere(actor, scope.facts);
  const sessions = await ShopSession.findAll({ where: { projectId, ...listed }, attributes: ['id'], order: [['position', 'ASC'], ['id', 'ASC']], raw: true });
  for (const { id } of sessions) {
    const records = await loadRecords({}, { projectId, ...listed, id });
    if (records.length) yield (await viewsWithPairs(records, project, undefined, viewableSessionWhere(actor, scope.facts))).views;
  }
}

/** Records of the project that could make a fit with this one and are not yet paired with it. */
async function pairCandidates(record: MeasurementView, transaction?: Transaction): Promise<PairCandidate[]> {
  const others = await loadRecords({ id: { [Op.ne]: record.id }, kind: record.kind === 'outside' ? 'inside' : 'outside' }, { projectId: record.project.id }, transaction);
  const paired = await pairRowsFor([record.id], transaction);
  const taken = new Set(paired.flatMap((p) => [p.holeRecordId, p.shaftRecordId]));
  const out: PairCandidate[] = [];
  for (const r of others) {
    if (taken.has(r.id)) continue;
    const input = inputOf(r);
    const limits = recordLimits(input);
    if (!sameNominal(limits, record.limits)) continue;
    out.push({ id: r.id, feature: r.feature, kind: r.kind, nominalText: asEntered(input.nominal), unit: r.unit, specLabel: limits.label, entryTitle: r.entry!.title });
  }
  return out;
}

/**
 * `transaction`: answer from inside a write's transaction, so a committed write is never reported as failed.
 * `candidates: false` skips the pair candidates (every other record of the project): a write answers with the
 * record alone, so its time inside the transaction does not grow with the project.
 */
export async function getMeasurement(actor: Actor, id: number, transaction?: Transaction, { candidates = true }: { candidates?: boolean } = {}): Promise<MeasurementPageData> {
  const record = await findRecord(id, transaction);
  const scope = await authorizeLog(actor, 'view', { entryId: record.entryId }, transaction);
  const project = projectOf(scope);
  const [loaded] = await loadRecords({ id }, { projectId: project.id }, transaction);
  if (!loaded) throw measurementNotFound();
  const { views, pairs } = await viewsWithPairs([loaded], project, transaction, viewableSessionWhere(actor, scope.facts));
  const canEdit = canOnProject(actor, 'editLog', scope.facts);
  return { record: views[0]!, pairs, canEdit, candidates: canEdit && candidates ? await pairCandidates(views[0]!, transaction) : [] };
}

/** The record as a write answers it, read inside the write's transaction (no pair candidates). */
const writtenRecord = async (actor: Actor, id: number, transaction: Transaction): Promise<MeasurementView> =>
  (await getMeasurement(actor, id, transaction, { candidates: false })).record;

// ── Writing ───────────────────────────────────────────────────────────────────────────────────

async function builderName(actor: Actor, transaction: Transaction): Promise<string> {
  if (!actor) return '';
  const user = await User.findByPk(actor.id, { attributes: ['id', 'name'], transaction });
  return user?.name ?? '';
}

/** A record may point at a moment of one of its own entry's clips, nothing else. */
async function checkMoment(timeNoteId: number, entryId: number, transaction: Transaction): Promise<void> {
  const note = await TimeNote.findByPk(timeNoteId, { attributes: ['id', 'mediaId'], include: [{ model: Media, as: 'media', attributes: ['id', 'entryId'] }], transaction });
  if (!note || note.media?.entryId !== entryId) {
    throw new AppError('validation', 'Please check timeNoteId: pick a moment from one of this entry’s clips.', { timeNoteId: ['Pick a moment from one of this entry’s clips.'] });
  }
}

/**
 * When a reading says nothing of when it was taken: the session's day (at noon UTC, which is that day
 * nearly everywhere) for a session logged afterwards, now for a session held today.
 */
async function sessionDay(entryId: number, transaction: Transaction): Promise<Date> {
  const entry = await Entry.findByPk(entryId, { attributes: ['id', 'sessionId'], include: [{ model: ShopSession, as: 'session', attributes: ['id', 'heldOn'] }], transaction });
  const heldOn = (entry as (Entry & { session?: ShopSession }) | null)?.session?.heldOn;
  const now = new Date();
  if (!heldOn || String(heldOn) === now.toISOString().slice(0, 10)) return now;
  const noon = new Date(`${String(heldOn).slice(0, 10)}T12:00:00Z`);
  return Number.isNaN(noon.getTime()) || noon > now ? now : noon;
}

function readingRow(r: ReadingData, recordId: number, position: number, defaultName: string, defaultAt: Date) {
  return {
    recordId,
    position,
    passNumber: r.pass ?? null,
    value: dec(r.value),
    unit: r.unit,
    instrument: r.instrument,
    resolution: dec(r.resolution),
    measuredBy: r.measuredBy || defaultName,
    measuredAt: r.measuredAt ?? defaultAt,
    temperatureC: r.temperatureC == null ? null : r.temperatureC.toFixed(1),
    note: r.note,
  };
}

function fieldError(field: string, message: string): AppError {
  return new AppError('validation', `Please check ${field}: ${message}`, { [field]: [message] });
}

/** Turns a refusal of the computations into a 400 naming its field. */
function asFieldError(err: unknown): unknown {
  return isMeasurementError(err) ? fieldError(err.field, err.message) : err;
}

/** A new record with all its readings: saved together, or nothing is saved. */
export async function createMeasurement(actor: Actor, entryId: number, input: unknown): Promise<MeasurementView> {
  initModels();
  return withTransaction(async (transaction) => {
    // Who is asking comes before what they sent: an outsider learns nothing from a validation message.
    await authorizeLog(actor, 'editLog', { entryId }, transaction);
    const data = measurementInputSchema.parse(input);
    if (data.timeNoteId != null) await checkMoment(data.timeNoteId, entryId, transaction);
    const name = await builderName(actor, transaction);
    const at = await sessionDay(entryId, transaction);
    const record = await MeasurementRecord.create(
      { entryId, timeNoteId: data.timeNoteId ?? null, feature: data.feature, kind: data.kind, nominal: dec(data.nominal), unit: data.unit, ...specColumns(data.spec) },
      { transaction },
    );
    for (const [i, r] of data.readings.entries()) await MeasurementReading.create(readingRow(r, record.id, i, name, at), { transaction });
    return writtenRecord(actor, record.id, transaction);
  });
}

export async function updateMeasurement(actor: Actor, id: number, input: unknown): Promise<MeasurementView> {
  initModels();
  return withTransaction(async (transaction) => {
    const record = await findRecord(id, transaction, true);
    await authorizeLog(actor, 'editLog', { entryId: record.entryId }, transaction);
    const data = measurementUpdateSchema.parse(input);
    if (record.version !== data.version) {
      throw new AppError('conflict', 'This measurement was changed in another tab or on another device since you opened it. Nothing was saved: reload to see the saved version.');
    }
    const readings = await MeasurementReading.findAll({ where: { recordId: id }, order: [['position', 'ASC'], ['id', 'ASC']], transaction });
    const next = {
      feature: data.feature ?? record.feature,
      kind: data.kind ?? record.kind,
      nominal: data.nominal ?? Number(record.nominal),
      unit: data.unit ?? record.unit,
      spec: data.spec ?? specOf(record),
      timeNoteId: data.timeNoteId === undefined ? (record.timeNoteId ?? null) : data.timeNoteId,
    };
    // The stored readings must still make sense against the changed size: a reading far off is the nominal's fault here.
    const issues = recordIssues({ ...next, readings: readings.map((r) => ({ value: Number(r.value), unit: r.unit })) });
    if (issues.length) {
      const fields: Record<string, string[]> = {};
      for (const issue of issues) {
        const key = issue.path[0] === 'readings' ? 'nominal' : issue.path.join('.');
        const message = issue.path[0] === 'readings' ? `Reading ${Number(issue.path[1]) + 1}: ${issue.message}` : issue.message;
        (fields[key] ??= []).push(message);
      }
      const first = Object.keys(fields)[0]!;
      throw new AppError('validation', `Please check ${Object.keys(fields).join(', ')}: ${fields[first]![0]}`, fields);
    }
    if (next.timeNoteId != null && next.timeNoteId !== record.timeNoteId) await checkMoment(next.timeNoteId, record.entryId, transaction);
    // A record in a fit keeps its kind and nominal size, or the fit would stop making sense.
    const pairs = await pairRowsFor([id], transaction);
    if (pairs.length) {
      if (next.kind !== record.kind) throw fieldError('kind', 'This record is part of a fit: unpair it before changing inside/outside.');
      const limits = recordLimits(next);
      for (const p of pairs) {
        const partner = await MeasurementRecord.findByPk(p.holeRecordId === id ? p.shaftRecordId : p.holeRecordId, { transaction });
        if (partner && !sameNominal(limits, recordLimits({ kind: partner.kind, nominal: Number(partner.nominal), unit: partner.unit, spec: specOf(partner) }))) {
          throw fieldError('nominal', `This record is part of a fit with “${partner.feature}”, which has another nominal size: unpair them before changing the size.`);
        }
      }
    }
    record.set({ feature: next.feature, kind: next.kind, nominal: dec(next.nominal), unit: next.unit, timeNoteId: next.timeNoteId, ...specColumns(next.spec) });
    record.version = record.version + 1;
    await record.save({ transaction });
    return writtenRecord(actor, id, transaction);
  }).catch((err) => {
    throw asFieldError(err);
  });
}

export async function deleteMeasurement(actor: Actor, id: number): Promise<void> {
  initModels();
  await withTransaction(async (transaction) => {
    const record = await findRecord(id, transaction, true);
    await authorizeLog(actor, 'editLog', { entryId: record.entryId }, transaction);
    // Readings and fits go with the record (ON DELETE CASCADE).
    await record.destroy({ transaction });
  });
}

export async function addReading(actor: Actor, recordId: number, input: unknown): Promise<MeasurementView> {
  return (await addReadingOnce(actor, recordId, input)).record;
}

/**
 * A new reading, at most once per `clientId` (the bench view's queued writes send it with every retry): the
 * same id again answers the record with the reading it already saved (`created: false`), never a second one.
 * `recordVersion`, when sent, is the version the reading was judged against: a record changed since (its
 * size, spec or unit edited elsewhere) is a 409 naming `recordVersion` and nothing is saved, so the phone can
 * show both versions and let the builder choose.
 */
export async function addReadingOnce(actor: Actor, recordId: number, input: unknown): Promise<{ record: MeasurementView; created: boolean }> {
  initModels();
  return withTransaction(
    async (transaction) => {
      const record = await findRecord(recordId, transaction, true);
      await authorizeLog(actor, 'editLog', { entryId: record.entryId }, transaction);
      const data = readingOnceSchema.parse(input);
      if (data.clientId) {
        const prior = await MeasurementReading.findOne({ where: { clientId: data.clientId }, attributes: ['id', 'recordId'], transaction, lock: transaction.LOCK.UPDATE });
        if (prior && prior.recordId !== recordId) {
          const message = 'This clientId already names a reading of another record: make a new id for a new reading.';
          throw new AppError('conflict', `Please check clientId: ${message}`, { clientId: [message] });
        }
        if (prior) return { record: await writtenRecord(actor, recordId, transaction), created: false };
      }
      if (data.recordVersion !== undefined && data.recordVersion !== record.version) {
        const message = 'The record was changed after this reading was judged against it. Nothing was saved: look at the record as it is now, then save the reading against it or keep it as a note.';
        throw new AppError('conflict', message, { recordVersion: [message] });
      }
      checkNearNominal(Number(record.nominal), record.unit, data.value, data.unit, 'value');
      // The record's row is locked (before any plain read), so parallel readings take turns; the locking read sees theirs.
      const last = await MeasurementReading.findOne({ where: { recordId }, attributes: ['position'], order: [['position', 'DESC']], transaction, lock: transaction.LOCK.UPDATE });
      const row = readingRow(data, recordId, last ? last.position + 1 : 0, await builderName(actor, transaction), await sessionDay(record.entryId, transaction));
      await MeasurementReading.create({ ...row, clientId: data.clientId ?? null }, { transaction });
      return { record: await writtenRecord(actor, recordId, transaction), created: true };
    },
    // The same clientId sent twice at once: the second runs again and finds the first's reading.
    { retryOnUnique: true },
  ).catch((err) => {
    throw asFieldError(err);
  });
}

async function findReading(id: number, transaction: Transaction): Promise<{ reading: MeasurementReading; record: MeasurementRecord }> {
  initModels();
  const reading = await MeasurementReading.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!reading) throw new AppError('not_found', 'That reading was not found.');
  const record = await findRecord(reading.recordId, transaction);
  return { reading, record };
}

export async function updateReading(actor: Actor, id: number, input: unknown): Promise<MeasurementView> {
  initModels();
  return withTransaction(async (transaction) => {
    const { reading, record } = await findReading(id, transaction);
    await authorizeLog(actor, 'editLog', { entryId: record.entryId }, transaction);
    const data = readingUpdateSchema.parse(input);
    if (reading.version !== data.version) {
      throw new AppError('conflict', 'This reading was changed in another tab or on another device since you opened it. Nothing was saved: reload to see the saved version.');
    }
    const value = data.value ?? Number(reading.value);
    const unit = data.unit ?? reading.unit;
    checkNearNominal(Number(record.nominal), record.unit, value, unit, 'value');
    reading.set({
      value: dec(value),
      unit,
      ...(data.instrument !== undefined ? { instrument: data.instrument } : {}),
      ...(data.resolution !== undefined ? { resolution: dec(data.resolution) } : {}),
      ...(data.measuredBy !== undefined ? { measuredBy: data.measuredBy || reading.measuredBy } : {}),
      ...(data.measuredAt !== undefined ? { measuredAt: data.measuredAt } : {}),
      ...(data.temperatureC !== undefined ? { temperatureC: data.temperatureC == null ? null : data.temperatureC.toFixed(1) } : {}),
      ...(data.pass !== undefined ? { passNumber: data.pass } : {}),
      ...(data.note !== undefined ? { note: data.note } : {}),
    });
    reading.version = reading.version + 1;
    await reading.save({ transaction });
    return writtenRecord(actor, record.id, transaction);
  }).catch((err) => {
    throw asFieldError(err);
  });
}

export async function deleteReading(actor: Actor, id: number): Promise<void> {
  initModels();
  await withTransaction(async (transaction) => {
    const { reading, record } = await findReading(id, transaction);
    await authorizeLog(actor, 'editLog', { entryId: record.entryId }, transaction);
    const count = await MeasurementReading.count({ where: { recordId: record.id }, transaction });
    if (count <= 1) throw new AppError('conflict', 'A record keeps at least one reading: add the corrected reading first, or delete the whole record.');
    await reading.destroy({ transaction });
  });
}

/** Pairs a hole record with a shaft record of the same project and nominal size as a fit. */
export async function createPair(actor: Actor, input: unknown): Promise<PairView> {
  initModels();
  return withTransaction(
    async (transaction) => {
      if (!actor) throw new AppError('unauthenticated', 'Sign in to change this project.');
      const data = pairInputSchema.parse(input);
      if (data.holeRecordId === data.shaftRecordId) throw fieldError('shaftRecordId', 'A fit pairs two different records.');
      const hole = await MeasurementRecord.findByPk(data.holeRecordId, { transaction });
      if (!hole) throw fieldError('holeRecordId', 'There is no measurement record with that id.');
      const holeScope = await authorizeLog(actor, 'editLog', { entryId: hole.entryId }, transaction);
      const shaft = await MeasurementRecord.findByPk(data.shaftRecordId, { transaction });
      if (!shaft) throw fieldError('shaftRecordId', 'There is no measurement record with that id.');
      const shaftScope = await authorizeLog(actor, 'editLog', { entryId: shaft.entryId }, transaction);
      if (holeScope.projectId !== shaftScope.projectId) throw fieldError('shaftRecordId', 'A fit pairs two records of the same project.');
      const side = (r: MeasurementRecord) => ({ kind: r.kind, limits: recordLimits({ kind: r.kind, nominal: Number(r.nominal), unit: r.unit, spec: specOf(r) }) });
      checkPairable(side(hole), side(shaft));
      if (await MeasurementPair.count({ where: { holeRecordId: hole.id, shaftRecordId: shaft.id }, transaction })) {
        throw new AppError('conflict', 'These two records are already paired as a fit.');
      }
      const pair = await MeasurementPair.create({ holeRecordId: hole.id, shaftRecordId: shaft.id }, { transaction });
      return getPair(actor, pair.id, transaction);
    },
    // The same pair made twice at once: the second runs again and is told they are already paired.
    { retryOnUnique: true },
  ).catch((err) => {
    throw asFieldError(err);
  });
}

async function getPair(actor: Actor, pairId: number, transaction?: Transaction): Promise<PairView> {
  const pair = await MeasurementPair.findByPk(pairId, { transaction });
  if (!pair) throw new AppError('not_found', 'That fit was not found.');
  const { pairs } = await getMeasurement(actor, pair.holeRecordId, transaction, { candidates: false });
  return pairs.find((p) => p.id === pairId)!;
}

export async function deletePair(actor: Actor, pairId: number): Promise<void> {
  initModels();
  await withTransaction(async (transaction) => {
    const pair = await MeasurementPair.findByPk(pairId, { transaction });
    if (!pair) throw new AppError('not_found', 'That fit was not found.');
    const hole = await findRecord(pair.holeRecordId, transaction);
    await authorizeLog(actor, 'editLog', { entryId: hole.entryId }, transaction);
    await pair.destroy({ transaction });
  });
}

export async function projectMeasurementsCsv(actor: Actor, projectId: number): Promise<{ filename: string; csv: string }> {
  const { project, records } = await listProjectMeasurements(actor, projectId);
  return { filename: `${project.slug}-measurements.csv`, csv: measurementsCsv(records) };
}

/** How many measurement records a project holds (for a link on its page). */
export async function countProjectMeasurements(actor: Actor, projectId: number): Promise<number> {
  initModels();
  const scope = await authorizeLog(actor, 'view', { projectId });
  return MeasurementRecord.count({
    include: [{ model: Entry, as: 'entry', attributes: [], required: true, include: [{ model: ShopSession, as: 'session', attributes: [], required: true, where: { projectId, ...listedSessionWhere(actor, scope.facts) } }] }],
  });
}
