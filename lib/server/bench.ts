import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { initModels, Project, ShopSession } from '../../db/models';
import { getSequelize, withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import { canOnProject, type Actor } from '../auth/policy';
import { authorizeLog, withReadMemo } from './log-scope';
import { getSession } from './sessions';
import { listEntryMeasurements } from './measurements';
import { sessionNoteSchema, sessionTimeSchema } from '../validations/bench';
import { toBenchRecord } from '../bench/records';
import type { BenchData, BenchSessionLink } from '../types/bench';

/** "What got done" holds this much (sessionInputSchema's own limit). */
const DONE_MAX = 5000;
/** A session is at most a day long (sessionInputSchema's own limit). */
const MINUTES_MAX = 24 * 60;

/**
 * What the bench view of a session needs: its records' inputs in working order (entries in order, then their
 * records), the entry photos and notes go into, and whether this member writes. For the builder's circle
 * (policy `printSheet`, like the shop sheet); writing asks `editLog` again on every write.
 */
export async function loadBench(actor: (NonNullable<Actor> & { name: string }) | null, sessionId: number): Promise<BenchData> {
  initModels();
  return withReadMemo(async () => {
    const scope = await authorizeLog(actor, 'printSheet', { sessionId });
    const { session } = await getSession(actor, sessionId);
    const records = (await Promise.all(session.entries.map((e) => listEntryMeasurements(actor, e.id)))).flat();
    const last = session.entries[session.entries.length - 1];
    return {
      member: { id: actor!.id, name: actor!.name },
      project: { id: scope.projectId, slug: scope.projectSlug, title: scope.projectTitle, units: scope.units },
      session: { id: session.id, title: session.title, position: session.position, heldOn: session.heldOn, minutesSpent: session.minutesSpent },
      records: records.map(toBenchRecord),
      entry: last ? { id: last.id, title: last.title } : null,
      canWrite: canOnProject(actor, 'editLog', scope.facts),
      loadedAt: new Date().toISOString(),
    };
  });
}

/** The member's own sessions, latest first, to open the bench view from its start page. */
export async function listBenchSessions(actor: Actor, limit = 12): Promise<BenchSessionLink[]> {
  initModels();
  if (!actor) return [];
  const rows = await ShopSession.findAll({
    attributes: ['id', 'title', 'heldOn'],
    include: [{ model: Project, as: 'project', attributes: ['id', 'title'], required: true, where: { ownerId: actor.id } }],
    order: [['heldOn', 'DESC'], ['id', 'DESC']],
    limit,
  });
  return rows.map((s) => ({ id: s.id, title: s.title, heldOn: String(s.heldOn), projectTitle: (s as ShopSession & { project?: Project }).project?.title ?? '' }));
}

/**
 * Claims a bench write's id for this session inside the write's transaction (the session row already locked):
 * false when it was applied before (nothing more to do), a 409 naming clientId when the id was used for
 * something else.
 */
async function claimWrite(clientId: string, sessionId: number, userId: number, kind: 'note' | 'time', transaction: Transaction): Promise<boolean> {
  const db = getSequelize();
  const [prior] = await db.query<{ sessionId: number; kind: string }>('SELECT session_id AS sessionId, kind FROM session_writes WHERE client_id = ? FOR UPDATE', {
    replacements: [clientId],
    type: QueryTypes.SELECT,
    transaction,
  });
  if (prior) {
    if (Number(prior.sessionId) === sessionId && prior.kind === kind) return false;
    const message = 'This clientId already names another write: make a new id for a new note or time.';
    throw new AppError('conflict', `Please check clientId: ${message}`, { clientId: [message] });
  }
  await db.query('INSERT INTO session_writes (client_id, session_id, user_id, kind, created_at) VALUES (?, ?, ?, ?, ?)', {
    replacements: [clientId, sessionId, userId, kind, new Date()],
    transaction,
  });
  return true;
}

export type SessionAddition = { session: { id: number; minutesSpent: number; done: string; version: number }; created: boolean };

async function addToSession(
  actor: Actor,
  sessionId: number,
  kind: 'note' | 'time',
  apply: (s: ShopSession) => void,
  clientId: () => string,
): Promise<SessionAddition> {
  initModels();
  return withTransaction(
    async (transaction) => {
      await authorizeLog(actor, 'editLog', { sessionId }, transaction);
      const id = clientId();
      const s = (await ShopSession.findByPk(sessionId, { transaction, lock: transaction.LOCK.UPDATE }))!;
      const created = await claimWrite(id, sessionId, actor!.id, kind, transaction);
      if (created) {
        apply(s);
        s.version = s.version + 1;
        await s.save({ transaction });
      }
      return { session: { id: s.id, minutesSpent: s.minutesSpent, done: s.done, version: s.version }, created };
    },
    // The same id sent twice at once: the second runs again and finds the first's claim.
    { retryOnUnique: true },
  );
}

/**
 * A line added to the session's "What got done" from the bench ("14:05 — first skim, chatter at the
 * jaws"), at most once per clientId.
 */
export function addSessionNote(actor: Actor, sessionId: number, input: unknown): Promise<SessionAddition> {
  let data: ReturnType<typeof sessionNoteSchema.parse>;
  return addToSession(
    actor,
    sessionId,
    'note',
    (s) => {
      const line = data.clock ? `${data.clock} — ${data.text}` : data.text;
      const done = s.done ? `${s.done}\n${line}` : line;
      if (done.length > DONE_MAX) {
        const message = `What got done is nearly full (${DONE_MAX} characters): shorten the note or tidy the session’s notes first.`;
        throw new AppError('validation', `Please check text: ${message}`, { text: [message] });
      }
      s.done = done;
    },
    // Parsed after the policy has answered: an outsider learns nothing from a validation message.
    () => (data = sessionNoteSchema.parse(input)).clientId,
  );
}

/** Minutes from the bench timer added to the session's time spent, at most once per clientId. */
export function addSessionTime(actor: Actor, sessionId: number, input: unknown): Promise<SessionAddition> {
  let data: ReturnType<typeof sessionTimeSchema.parse>;
  return addToSession(
    actor,
    sessionId,
    'time',
    (s) => {
      const total = s.minutesSpent + data.minutes;
      if (total > MINUTES_MAX) {
        const message = `The session already has ${s.minutesSpent} minutes: adding ${data.minutes} would make it longer than a day.`;
        throw new AppError('validation', `Please check minutes: ${message}`, { minutes: [message] });
      }
      s.minutesSpent = total;
    },
    () => (data = sessionTimeSchema.parse(input)).clientId,
  );
}
