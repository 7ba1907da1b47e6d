import 'server-only';
import { fn, col, Op, type Transaction } from 'sequelize';
import { initModels, Entry, Media, MeasurementRecord, RiskFlag, TimeNote, User } from '../../db/models';
import { withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import { canOnProject, type Actor, type ProjectFacts } from '../auth/policy';
import { authorizeLog, type LogScope } from './log-scope';
import { enqueueMail } from './mail';
import { appUrl } from './invitations';
import { flagAnsweredMail, flagRaisedMail } from '../mail/templates';
import { formatClock } from '../chapters';
import {
  flagAcknowledgeSchema,
  flagInputSchema,
  flagResolveSchema,
  flagUpdateSchema,
  hazardLabel,
  severityLabel,
  severityMeaning,
} from '../validations/flags';
import type { FlagTargetView, FlagView, OpenFlagCounts } from '../types/flags';

// A mentor's risk flag moves open → acknowledged (the builder has seen it) → resolved (the builder answered).
// Until it is resolved the mentor may change or withdraw it; a change after acknowledgement asks the builder
// to look again, so it goes back to open.

const include = [
  { model: User, as: 'mentor', attributes: ['id', 'name', 'email'] },
  { model: Entry, as: 'entry', attributes: ['id', 'title'] },
  { model: TimeNote, as: 'note', attributes: ['id', 'mediaId', 'startMs', 'text'] },
  { model: MeasurementRecord, as: 'record', attributes: ['id', 'feature'] },
];

type Loaded = RiskFlag & { entry?: Entry; note?: TimeNote | null; record?: MeasurementRecord | null; mentor?: User };

function targetOf(f: Loaded): FlagTargetView {
  if (f.targetKind === 'note' && f.note) return { kind: 'note', noteId: f.note.id, mediaId: f.note.mediaId, startMs: f.note.startMs, text: f.note.text };
  if (f.targetKind === 'measurement' && f.record) return { kind: 'measurement', recordId: f.record.id, feature: f.record.feature };
  return { kind: 'entry' };
}

function toFlagView(f: Loaded, actor: Actor, facts: ProjectFacts): FlagView {
  const unresolved = f.status !== 'resolved';
  return {
    id: f.id,
    projectId: f.projectId,
    sessionId: f.sessionId,
    entryId: f.entryId,
    entryTitle: f.entry?.title ?? '',
    target: targetOf(f),
    mentor: { id: f.mentorId, name: f.mentor?.name ?? 'A former mentor' },
    severity: f.severity,
    hazard: f.hazard,
    concern: f.concern,
    instead: f.instead,
    status: f.status,
    acknowledgedAt: f.acknowledgedAt ? f.acknowledgedAt.toISOString() : null,
    resolvedAt: f.resolvedAt ? f.resolvedAt.toISOString() : null,
    answer: f.answer ?? null,
    version: f.version,
    createdAt: f.createdAt.toISOString(),
    updatedAt: f.updatedAt.toISOString(),
    can: {
      edit: unresolved && canOnProject(actor, 'editOwnFlag', { ...facts, authorId: f.mentorId }),
      answer: unresolved && canOnProject(actor, 'answerFlag', facts),
    },
  };
}

/** "Turning the spigot — note at 0:42": how a flag's target reads in a message (the template quotes it). */
function describeTarget(f: Loaded): string {
  const entry = f.entry?.title ?? 'an entry';
  if (f.targetKind === 'note' && f.note) return `${entry} — note at ${formatClock(f.note.startMs)}`;
  if (f.targetKind === 'measurement' && f.record) return `${entry} — measurement: ${f.record.feature}`;
  return entry;
}

async function loadFlag(id: number, transaction?: Transaction, lock = false): Promise<Loaded> {
  const flag = (await RiskFlag.findByPk(id, { transaction, ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}) })) as Loaded | null;
  if (!flag) throw new AppError('not_found', 'That risk flag was not found.');
  return flag;
}

async function viewOf(id: number, actor: Actor, facts: ProjectFacts, transaction?: Transaction): Promise<FlagView> {
  const flag = (await RiskFlag.findByPk(id, { include, transaction })) as Loaded | null;
  if (!flag) throw new AppError('not_found', 'That risk flag was not found.');
  return toFlagView(flag, actor, facts);
}

const stale = () =>
  new AppError('conflict', 'This flag was changed since you opened it. Reload to see the latest version, then make your change again.');
const answered = () => new AppError('conflict', 'This flag has already been answered; raise a new flag if the concern remains.');

/** Every flag on an entry (on the entry itself, its notes and its measurement records), oldest first. */
export async function listEntryFlags(actor: Actor, entryId: number): Promise<FlagView[]> {
  initModels();
  const scope = await authorizeLog(actor, 'view', { entryId });
  const flags = (await RiskFlag.findAll({ where: { entryId }, include, order: [['createdAt', 'ASC'], ['id', 'ASC']] })) as Loaded[];
  return flags.map((f) => toFlagView(f, actor, scope.facts));
}

/** Where the builder answers a flag. */
const builderFlagUrl = (scope: LogScope, f: RiskFlag) => appUrl(`/projects/${scope.projectSlug}/entries/${f.entryId}/edit#flag-${f.id}`);
/** Where the mentor reads the answer. */
const readerFlagUrl = (scope: LogScope, f: RiskFlag) => appUrl(`/logs/${scope.projectSlug}/entries/${f.entryId}#flag-${f.id}`);

/** A mentor flags the entry, one of its notes or one of its measurement records; the builder is e-mailed. */
export async function createFlag(actor: Actor, entryId: number, input: unknown): Promise<FlagView> {
  initModels();
  return withTransaction(async (transaction) => {
    // Who is asking comes before what they sent: an outsider learns nothing from a validation message.
    const scope = await authorizeLog(actor, 'flagRisk', { entryId }, transaction);
    const data = flagInputSchema.parse(input);
    let noteId: number | null = null;
    let recordId: number | null = null;
    if (typeof data.target === 'object' && 'noteId' in data.target) {
      const note = await TimeNote.findByPk(data.target.noteId, {
        attributes: ['id'],
        include: [{ model: Media, as: 'media', attributes: ['id'], where: { entryId }, required: true }],
        transaction,
      });
      if (!note) {
        throw new AppError('validation', 'Please check target.noteId: that note is not on this entry’s clips.', {
          'target.noteId': ['That note is not on this entry’s clips.'],
        });
      }
      noteId = note.id;
    } else if (typeof data.target === 'object' && 'recordId' in data.target) {
      const record = await MeasurementRecord.findOne({ where: { id: data.target.recordId, entryId }, attributes: ['id'], transaction });
      if (!record) {
        throw new AppError('validation', 'Please check target.recordId: that measurement is not on this entry.', {
          'target.recordId': ['That measurement is not on this entry.'],
        });
      }
      recordId = record.id;
    }
    const flag = await RiskFlag.create(
      {
        projectId: scope.projectId,
        sessionId: scope.sessionId!,
        entryId,
        targetKind: noteId ? 'note' : recordId ? 'measurement' : 'entry',
        noteId,
        recordId,
        mentorId: actor!.id,
        severity: data.severity,
        hazard: data.hazard,
        concern: data.concern,
        instead: data.instead,
      },
      { transaction },
    );
    const full = (await RiskFlag.findByPk(flag.id, { include, transaction })) as Loaded;
    const builder = await User.findByPk(scope.facts.ownerId, { attributes: ['id', 'name', 'email'], transaction });
    if (builder) {
      const mail = flagRaisedMail({
        builderName: builder.name,
        mentorName: full.mentor?.name ?? 'A mentor',
        projectTitle: scope.projectTitle,
        flaggedItem: describeTarget(full),
        severity: severityLabel(full.severity),
        severityMeaning: severityMeaning(full.severity),
        hazard: hazardLabel(full.hazard),
        concern: full.concern,
        instead: full.instead,
        flagUrl: builderFlagUrl(scope, full),
      });
      await enqueueMail({ to: builder.email, ...mail, kind: 'flag-raised' }, { transaction });
    }
    return toFlagView(full, actor, scope.facts);
  });
}

/** The mentor who raised a flag changes it while it is unanswered. */
export async function updateFlag(actor: Actor, flagId: number, input: unknown): Promise<FlagView> {
  initModels();
  return withTransaction(async (transaction) => {
    const flag = await loadFlag(flagId, transaction, true);
    const scope = await authorizeLog(actor, 'editOwnFlag', { entryId: flag.entryId }, transaction, { authorId: flag.mentorId });
    const data = flagUpdateSchema.parse(input);
    if (flag.status === 'resolved') throw answered();
    if (flag.version !== data.version) throw stale();
    const { version: _v, ...changes } = data;
    const changed = (Object.keys(changes) as (keyof typeof changes)[]).some((k) => changes[k] !== undefined && changes[k] !== flag[k]);
    flag.set(changes);
    if (changed && flag.status === 'acknowledged') {
      flag.status = 'open';
      flag.acknowledgedAt = null;
    }
    flag.version = flag.version + 1;
    await flag.save({ transaction });
    return viewOf(flag.id, actor, scope.facts, transaction);
  });
}

/** The mentor who raised a flag withdraws it while it is unanswered. */
export async function withdrawFlag(actor: Actor, flagId: number): Promise<void> {
  initModels();
  await withTransaction(async (transaction) => {
    const flag = await loadFlag(flagId, transaction, true);
    await authorizeLog(actor, 'editOwnFlag', { entryId: flag.entryId }, transaction, { authorId: flag.mentorId });
    if (flag.status === 'resolved') throw answered();
    await flag.destroy({ transaction });
  });
}

/** The builder says they have seen the flag. Acknowledging twice changes nothing. */
export async function acknowledgeFlag(actor: Actor, flagId: number, input: unknown = {}): Promise<FlagView> {
  initModels();
  return withTransaction(async (transaction) => {
    const flag = await loadFlag(flagId, transaction, true);
    const scope = await authorizeLog(actor, 'answerFlag', { entryId: flag.entryId }, transaction);
    const data = flagAcknowledgeSchema.parse(input);
    if (flag.status === 'resolved') throw answered();
    if (data.version !== undefined && data.version !== flag.version) throw stale();
    if (flag.status === 'open') {
      flag.status = 'acknowledged';
      flag.acknowledgedAt = new Date();
      flag.version = flag.version + 1;
      await flag.save({ transaction });
    }
    return viewOf(flag.id, actor, scope.facts, transaction);
  });
}

/** The builder answers the flag, which resolves it; the mentor is e-mailed the answer in the same transaction. */
export async function resolveFlag(actor: Actor, flagId: number, input: unknown): Promise<FlagView> {
  initModels();
  return withTransaction(async (transaction) => {
    const flag = await loadFlag(flagId, transaction, true);
    const scope = await authorizeLog(actor, 'answerFlag', { entryId: flag.entryId }, transaction);
    const data = flagResolveSchema.parse(input);
    if (flag.status === 'resolved') throw answered();
    if (flag.version !== data.version) throw stale();
    const now = new Date();
    flag.status = 'resolved';
    flag.answer = data.answer;
    flag.resolvedAt = now;
    flag.acknowledgedAt = flag.acknowledgedAt ?? now;
    flag.version = flag.version + 1;
    await flag.save({ transaction });

    const full = (await RiskFlag.findByPk(flag.id, { include, transaction })) as Loaded;
    const builder = await User.findByPk(scope.facts.ownerId, { attributes: ['id', 'name'], transaction });
    if (full.mentor) {
      const mail = flagAnsweredMail({
        mentorName: full.mentor.name,
        builderName: builder?.name ?? 'The builder',
        projectTitle: scope.projectTitle,
        flaggedItem: describeTarget(full),
        flagHeading: `${severityLabel(full.severity)} · ${hazardLabel(full.hazard)}`,
        flagText: `${full.concern}\n\nInstead: ${full.instead}`,
        answerText: data.answer,
        flagUrl: readerFlagUrl(scope, full),
      });
      await enqueueMail({ to: full.mentor.email, ...mail, kind: 'flag-answered', dedupeKey: `flag-answered:${full.id}` }, { transaction });
    }
    return toFlagView(full, actor, scope.facts);
  });
}

/**
 * Open (not yet resolved) flags of a project, in all and per session. Pass the sessions the viewer may see,
 * so a count never reveals a session kept from them.
 */
export async function openFlagCounts(projectId: number, visibleSessionIds?: number[]): Promise<OpenFlagCounts> {
  initModels();
  if (visibleSessionIds && !visibleSessionIds.length) return { total: 0, bySession: {} };
  const rows = (await RiskFlag.findAll({
    attributes: ['sessionId', [fn('COUNT', col('id')), 'n']],
    where: {
      projectId,
      status: { [Op.ne]: 'resolved' },
      ...(visibleSessionIds ? { sessionId: { [Op.in]: visibleSessionIds } } : {}),
    },
    group: ['sessionId'],
    raw: true,
  })) as unknown as { sessionId: number; n: number | string }[];
  const bySession: Record<number, number> = {};
  let total = 0;
  for (const r of rows) {
    bySession[Number(r.sessionId)] = Number(r.n);
    total += Number(r.n);
  }
  return { total, bySession };
}

/** Open flags per project, for lists of projects the viewer builds or mentors (who see every session). */
export async function openFlagCountsByProject(projectIds: number[]): Promise<Map<number, number>> {
  initModels();
  const out = new Map<number, number>();
  if (!projectIds.length) return out;
  const rows = (await RiskFlag.findAll({
    attributes: ['projectId', [fn('COUNT', col('id')), 'n']],
    where: { projectId: { [Op.in]: projectIds }, status: { [Op.ne]: 'resolved' } },
    group: ['projectId'],
    raw: true,
  })) as unknown as { projectId: number; n: number | string }[];
  for (const r of rows) out.set(Number(r.projectId), Number(r.n));
  return out;
}

/** Unanswered "stop" flags on a session: while there are any, the session must not be published. */
export async function unansweredStopFlags(sessionId: number, transaction?: Transaction): Promise<number> {
  initModels();
  return RiskFlag.count({ where: { sessionId, severity: 'stop', status: { [Op.ne]: 'resolved' } }, transaction });
}

/** Adds each project's open flag count, for lists only its builder or mentors read (they see every session). */
export async function withOpenFlagCounts<T extends { id: number }>(projects: T[]): Promise<(T & { openFlags: number })[]> {
  const counts = await openFlagCountsByProject(projects.map((p) => p.id));
  return projects.map((p) => ({ ...p, openFlags: counts.get(p.id) ?? 0 }));
}

/**
 * The project's open flags, newest first, for the builder's log header and the mentor's overview. Only flags on
 * sessions the viewer may see: pass those session ids.
 */
export async function listOpenProjectFlags(actor: Actor, projectId: number, visibleSessionIds: number[]): Promise<FlagView[]> {
  initModels();
  const scope = await authorizeLog(actor, 'view', { projectId });
  if (!visibleSessionIds.length) return [];
  const flags = (await RiskFlag.findAll({
    where: { projectId, status: { [Op.ne]: 'resolved' }, sessionId: { [Op.in]: visibleSessionIds } },
    include,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
  })) as Loaded[];
  return flags.map((f) => toFlagView(f, actor, scope.facts));
}
