// The probes walked by permission-matrix.test.ts: one or more per action of the matrix, each calling a
// real route handler or server action as a given person and returning the HTTP status it answered.
import type { NextResponse } from 'next/server';
import { request, params } from '../support/db';
import type { Action, Relation, Visibility } from '@/lib/auth/policy';
import { User } from '@/db/models';
import { GET as listProjects, POST as createProjectRoute } from '@/app/api/projects/route';
import { GET as healthLiveRoute } from '@/app/api/health/live/route';
import { GET as viewerRoute } from '@/app/api/me/viewer/route';
import { GET as readProject, PATCH as patchProject, DELETE as deleteProjectRoute } from '@/app/api/projects/[id]/route';
import { POST as createSessionRoute } from '@/app/api/projects/[id]/sessions/route';
import { GET as readSession } from '@/app/api/sessions/[id]/route';
import { GET as sessionSheetRoute } from '@/app/api/sessions/[id]/sheet/route';
import { POST as benchNoteRoute } from '@/app/api/sessions/[id]/bench-notes/route';
import { POST as benchTimeRoute } from '@/app/api/sessions/[id]/time/route';
import { GET as readEntry, PATCH as patchEntry } from '@/app/api/entries/[id]/route';
import { GET as mediaFileRoute } from '@/app/api/media/[id]/file/route';
import { GET as fitsRoute } from '@/app/api/fits/route';
import { GET as searchRoute } from '@/app/api/search/route';
import { setSiteRoleAction } from '@/lib/actions/users';
import { createProjectAction, deleteProjectAction, updateProjectAction } from '@/lib/actions/projects';
import { createSessionAction, deleteSessionAction, updateSessionAction } from '@/lib/actions/sessions';
import {
  addReadingAction, createMeasurementAction, createPairAction, deleteMeasurementAction, deletePairAction, deleteReadingAction, updateMeasurementAction, updateReadingAction,
} from '@/lib/actions/measurements';
import { acknowledgeFlagAction, raiseFlagAction, resolveFlagAction, updateFlagAction, withdrawFlagAction } from '@/lib/actions/flags';
import { createHash, randomBytes } from 'node:crypto';
import { Project, Comment, RiskFlag, MentorInvitation } from '@/db/models';
import { PATCH as sessionVisibilityRoute } from '@/app/api/sessions/[id]/visibility/route';
import { GET as mentorsOverviewRoute, POST as inviteRoute } from '@/app/api/projects/[id]/invitations/route';
import { DELETE as removeMentorRoute } from '@/app/api/projects/[id]/mentors/[userId]/route';
import { POST as followProjectRoute } from '@/app/api/projects/[id]/follow/route';
import { POST as followBuilderRoute } from '@/app/api/builders/[handle]/follow/route';
import { GET as profileRoute } from '@/app/api/builders/[handle]/route';
import { GET as listCommentsRoute, POST as commentRoute } from '@/app/api/entries/[id]/comments/route';
import { PATCH as editCommentRoute, DELETE as deleteCommentRoute } from '@/app/api/comments/[id]/route';
import { POST as hideCommentRoute } from '@/app/api/comments/[id]/hide/route';
import { GET as listFlagsRoute, POST as flagRoute } from '@/app/api/entries/[id]/flags/route';
import { PATCH as editFlagRoute } from '@/app/api/flags/[id]/route';
import { POST as acknowledgeRoute } from '@/app/api/flags/[id]/acknowledge/route';
import { POST as resolveRoute } from '@/app/api/flags/[id]/resolve/route';
import { GET as myFollowsRoute } from '@/app/api/me/follows/route';
import { POST as acceptRoute } from '@/app/api/invitations/accept/route';
import { GET as listCalculationsRoute, POST as saveCalculationRoute } from '@/app/api/entries/[id]/calculations/route';
import { invitationToken } from '@/lib/server/invitations';
import { POST as reportCommentRoute } from '@/app/api/comments/[id]/report/route';
import { GET as moderationQueueRoute } from '@/app/api/admin/comments/route';
import { POST as dismissReportsRoute } from '@/app/api/admin/comments/[id]/dismiss/route';
import { GET as accountsRoute } from '@/app/api/admin/accounts/route';
import { CommentReport } from '@/db/models';
import { deleteCommentAction, editCommentAction, hideCommentAction, postCommentAction, unhideCommentAction } from '@/lib/actions/comments';
import { dismissReportsAction, reportCommentAction } from '@/lib/actions/moderation';
import { deleteFollowAction, followAction, setAllFollowMailAction, setFollowMailAction, unfollowAction } from '@/lib/actions/following';
import { changeEmailAction, changeNameAction, changePasswordAction, deleteAccountAction, resendVerificationAction } from '@/lib/actions/account';
import { acceptInvitationAction, inviteMentorAction, removeMentorAction, revokeInvitationAction } from '@/lib/actions/mentors';
import { Follow } from '@/db/models';
import { makeUser } from '../support/db';
import archiver from 'archiver';
import { NextRequest } from 'next/server';
import { GET as archiveRoute } from '@/app/api/projects/[id]/archive/route';
import { POST as importArchiveRoute } from '@/app/api/archives/route';

/** The smallest archive import accepts: a manifest, a project without sessions, no pairs. */
async function emptyArchive(): Promise<Buffer> {
  const files: [string, Buffer][] = [
    ['data/project.json', Buffer.from(JSON.stringify({ title: 'Walked archive', summary: '', units: 'mm', sessions: [] }))],
    ['data/pairs.json', Buffer.from('[]')],
  ];
  const manifest = {
    format: 'scribeline-archive', version: 1, createdAt: new Date().toISOString(), project: { title: 'Walked archive', slug: 'walked-archive' },
    counts: { sessions: 0, entries: 0, media: 0, notes: 0, records: 0, readings: 0, pairs: 0, calculations: 0 },
    files: files.map(([path, data]) => ({ path, bytes: data.length, sha256: createHash('sha256').update(data).digest('hex') })),
  };
  const zip = archiver('zip');
  const parts: Buffer[] = [];
  zip.on('data', (c: Buffer) => parts.push(c));
  const done = new Promise((resolve) => zip.on('end', resolve));
  for (const [name, data] of files) zip.append(data, { name });
  zip.append(JSON.stringify(manifest), { name: 'scribeline-archive.json' });
  await zip.finalize();
  await done;
  return Buffer.concat(parts);
}

export type Person = { id: number; email: string; cookie: string };
export type World = Record<Exclude<Relation, 'anonymous'>, Person> & { setCookie(cookie: string | undefined): void };
export type Target = {
  projectId: number;
  projectSlug: string;
  sessionId: number;
  entryId: number;
  projectVisibility: Visibility;
  sessionVisibility: Visibility;
};
/** What a probe made before acting: ids it needs, and who wrote the thing acted on. */
export type Prepared = { authorId?: number; ids?: Record<string, number>; token?: string } | undefined;

export type Probe = {
  action: Action;
  /** The handler or action walked, for the test's name. */
  via: string;
  /** Walk the project's three visibilities (otherwise: a published project). */
  dependsOnVisibility?: boolean;
  /** Walk the session's three visibilities too; the facts then name the session. */
  sessionScoped?: boolean;
  prepare?(w: World, t: Target, rel: Relation): Promise<Prepared>;
  run(w: World, t: Target, who: Person | null, prepared: Prepared): Promise<number>;
  /** Extra checks after the call, e.g. that a refused change left the row alone. */
  check?(w: World, t: Target, prepared: Prepared, allowed: boolean): Promise<void>;
};

type Handler<P> = (req: ReturnType<typeof request>, ctx: { params: Promise<P> }) => Promise<NextResponse | Response>;

/** Calls a route handler as a person and returns the status. */
export async function call<P>(handler: Handler<P>, path: string, who: Person | null, p: P, init: { method?: string; body?: unknown } = {}): Promise<number> {
  const res = await handler(request(path, { method: init.method, body: init.body, cookie: who?.cookie }), params(p));
  return res.status;
}

/** A server action's answer as the status a route would have given. */
export function actionStatus(state: { ok: boolean; status?: number }): number {
  return state.ok ? 200 : (state.status ?? 500);
}

/**
 * Runs a server action and gives its status: a redirect (how a saving action ends) counts as the 2xx of
 * a granted change, like a route's 302.
 */
export async function actionOutcome(run: () => Promise<{ ok: boolean; status?: number }>): Promise<number> {
  try {
    return actionStatus(await run());
  } catch (err) {
    const digest = (err as { digest?: unknown })?.digest;
    if (typeof digest === 'string' && digest.startsWith('NEXT_REDIRECT')) return 200;
    throw err;
  }
}

/** A FormData with these fields, as a form would post it. */
export function formOf(fields: Record<string, string | number>): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, String(v));
  return form;
}

const id = (n: number) => ({ id: String(n) });
let seq = 0;
const unique = () => `${Date.now().toString(36)}${(++seq).toString(36)}${Math.random().toString(36).slice(2, 6)}`;

/** Someone outside the world: a builder to follow, or the owner of a project one is invited to. */
async function stranger(): Promise<{ id: number; handle: string }> {
  const tag = unique();
  const u = await User.create({ email: `probe-${tag}@example.test`, name: `Probe ${tag}`, handle: `probe-${tag}`, passwordHash: 'x', siteRole: 'member' });
  return { id: u.id, handle: u.handle };
}

async function commentBy(authorId: number, t: Target): Promise<Prepared> {
  const c = await Comment.create({ entryId: t.entryId, authorId, parentId: null, mediaId: null, atMs: null, body: 'How deep did you take the last pass?' });
  return { authorId, ids: { commentId: c.id } };
}

async function flagBy(mentorId: number, t: Target): Promise<Prepared> {
  const f = await RiskFlag.create({
    projectId: t.projectId, sessionId: t.sessionId, entryId: t.entryId, targetKind: 'entry', noteId: null, recordId: null, mentorId,
    severity: 'caution', hazard: 'rotating-work', concern: 'Chuck key left in.', instead: 'Take the key out before starting.',
  });
  return { authorId: mentorId, ids: { flagId: f.id } };
}

/** The person acting, or (signed out) someone else, as the author of what is acted on. */
const authorFor = (w: World, rel: Relation) => (rel === 'anonymous' ? w.member : w[rel]);
/** Someone other than the person acting. */
const otherThan = (w: World, rel: Relation) => (rel === 'owner' ? w.member : w.owner);

/** An invitation to the target project, waiting, from its builder. */
async function invitationOn(w: World, t: Target): Promise<Prepared> {
  const inv = await MentorInvitation.create({
    projectId: t.projectId, email: `invitee-${unique()}@example.test`, invitedById: w.owner.id,
    nonceHash: createHash('sha256').update(randomBytes(16)).digest('hex'), expiresAt: new Date(Date.now() + 86_400_000),
  });
  return { ids: { invitationId: inv.id } };
}

/** A follow of someone outside the world by the person acting (a member, when signed out). */
async function followOf(w: World, rel: Relation): Promise<Prepared> {
  const builder = await stranger();
  const f = await Follow.create({ userId: authorFor(w, rel).id, builderId: builder.id, projectId: null, mail: true });
  return { ids: { followId: f.id, builderId: builder.id } };
}

/**
 * An account of its own for a change that ends sessions or the account (a new password, deleting): the
 * world's people must stay signed in for the rest of the walk. Signed out stays signed out.
 */
async function throwaway(rel: Relation, options: { verified?: boolean } = {}): Promise<Prepared> {
  if (rel === 'anonymous') return { ids: {} };
  const u = await makeUser(rel === 'admin' ? 'admin' : 'member', options);
  return { ids: { userId: u.id }, token: u.cookie };
}
async function asThrowaway(w: World, p: Prepared, run: () => Promise<{ ok: boolean; status?: number }>): Promise<number> {
  if (p?.token) w.setCookie(p.token);
  return actionOutcome(run);
}
async function dropThrowaway(p: Prepared): Promise<void> {
  if (p?.ids?.userId) await User.destroy({ where: { id: p.ids.userId } });
}

const dropStranger = async (p: Prepared) => {
  if (p?.ids?.builderId) await User.destroy({ where: { id: p.ids.builderId } });
};

/** The forms' server actions (comments, reports and moderation, follows, account settings, mentors). */
const WRITE_ACTION_PROBES: Probe[] = [
  {
    action: 'comment', via: 'postCommentAction (server action)', dependsOnVisibility: true, sessionScoped: true,
    // The walk's earlier comments by this person move out of the rate window (5 a minute): the limit is not what is walked here.
    prepare: async (w, _t, rel) => {
      if (rel !== 'anonymous') await Comment.sequelize!.query('UPDATE comments SET created_at = created_at - INTERVAL 2 HOUR WHERE author_id = ?', { replacements: [w[rel].id] });
      return undefined;
    },
    run: (_w, t) => actionOutcome(() => postCommentAction({ ok: true }, formOf({ entryId: t.entryId, body: 'Which insert did you use for the finishing pass?' }))),
  },
  {
    action: 'editOwnComment', via: 'editCommentAction (their own)', dependsOnVisibility: true,
    prepare: (w, t, rel) => commentBy(authorFor(w, rel).id, t),
    run: (_w, _t, _who, p) => actionOutcome(() => editCommentAction({ ok: true }, formOf({ commentId: p!.ids!.commentId, body: 'Edited by its author.', version: 1 }))),
  },
  {
    action: 'editOwnComment', via: "editCommentAction (someone else's)", dependsOnVisibility: true,
    prepare: (w, t, rel) => commentBy(otherThan(w, rel).id, t),
    run: (_w, _t, _who, p) => actionOutcome(() => editCommentAction({ ok: true }, formOf({ commentId: p!.ids!.commentId, body: 'Not mine to change.', version: 1 }))),
    async check(_w, _t, p, allowed) {
      const row = await Comment.findByPk(p!.ids!.commentId);
      if ((row?.body === 'Not mine to change.') !== allowed) throw new Error(`expected the text ${allowed ? 'changed' : 'kept'}, found “${row?.body}”`);
    },
  },
  {
    action: 'editOwnComment', via: 'deleteCommentAction (their own)', dependsOnVisibility: true,
    prepare: (w, t, rel) => commentBy(authorFor(w, rel).id, t),
    run: (_w, _t, _who, p) => actionOutcome(() => deleteCommentAction({ ok: true }, formOf({ commentId: p!.ids!.commentId }))),
  },
  {
    action: 'hideComment', via: 'hideCommentAction (server action)', dependsOnVisibility: true,
    prepare: (w, t) => commentBy(w.member.id, t).then((p) => ({ ids: p!.ids })),
    run: (_w, _t, _who, p) => actionOutcome(() => hideCommentAction({ ok: true }, formOf({ commentId: p!.ids!.commentId, reason: 'Off topic for this entry.' }))),
    async check(_w, _t, p, allowed) {
      const row = await Comment.findByPk(p!.ids!.commentId);
      if ((row?.hiddenAt != null) !== allowed) throw new Error(`expected the comment ${allowed ? 'hidden' : 'shown'}`);
    },
  },
  {
    action: 'hideComment', via: 'unhideCommentAction (server action)', dependsOnVisibility: true,
    async prepare(w, t) {
      const p = await commentBy(w.member.id, t);
      await Comment.update({ hiddenAt: new Date(), hiddenById: w.owner.id, hiddenReason: 'Walked hide.' }, { where: { id: p!.ids!.commentId } });
      return { ids: p!.ids };
    },
    run: (_w, _t, _who, p) => actionOutcome(() => unhideCommentAction({ ok: true }, formOf({ commentId: p!.ids!.commentId }))),
  },
  {
    action: 'reportComment', via: "reportCommentAction (someone else's)", dependsOnVisibility: true,
    prepare: (w, t, rel) => commentBy(otherThan(w, rel).id, t).then((p) => ({ ids: p!.ids })),
    run: (_w, _t, _who, p) => actionOutcome(() => reportCommentAction({ ok: true }, formOf({ commentId: p!.ids!.commentId, reason: 'Advice here would leave the chuck key in.' }))),
    async check(_w, _t, p, allowed) {
      const n = await CommentReport.count({ where: { commentId: p!.ids!.commentId } });
      if (n !== (allowed ? 1 : 0)) throw new Error(`expected ${allowed ? 1 : 0} report rows, found ${n}`);
    },
  },
  {
    action: 'moderateComments', via: 'dismissReportsAction (server action)',
    async prepare(w, t) {
      const p = await commentBy(w.owner.id, t);
      await CommentReport.create({ commentId: p!.ids!.commentId, reporterId: w.member.id, reason: 'Walked report.', dismissedById: null });
      return { ids: p!.ids };
    },
    run: (_w, _t, _who, p) => actionOutcome(() => dismissReportsAction({ ok: true }, formOf({ commentId: p!.ids!.commentId }))),
    async check(_w, _t, p, allowed) {
      const open = await CommentReport.count({ where: { commentId: p!.ids!.commentId, dismissedAt: null } });
      if (open !== (allowed ? 0 : 1)) throw new Error(`expected ${allowed ? 0 : 1} open reports, found ${open}`);
    },
  },
  {
    action: 'follow', via: 'followAction (a project)', dependsOnVisibility: true,
    run: (_w, t) => actionOutcome(() => followAction({ ok: true }, formOf({ projectId: t.projectId }))),
  },
  {
    action: 'followBuilder', via: 'followAction (a builder)',
    prepare: async () => {
      const b = await stranger();
      return { ids: { builderId: b.id }, token: b.handle };
    },
    run: (_w, _t, _who, p) => actionOutcome(() => followAction({ ok: true }, formOf({ handle: p!.token! }))),
    check: (_w, _t, p) => dropStranger(p),
  },
  {
    action: 'manageOwnSettings', via: 'unfollowAction (a builder)',
    prepare: (w, _t, rel) => followOf(w, rel).then(async (p) => ({ ...p, token: (await User.findByPk(p!.ids!.builderId))!.handle })),
    run: (_w, _t, _who, p) => actionOutcome(() => unfollowAction({ ok: true }, formOf({ handle: p!.token! }))),
    check: (_w, _t, p) => dropStranger(p),
  },
  {
    action: 'manageOwnSettings', via: 'setFollowMailAction (their own follow)',
    prepare: (w, _t, rel) => followOf(w, rel),
    run: (_w, _t, _who, p) => actionOutcome(() => setFollowMailAction({ ok: true }, formOf({ followId: p!.ids!.followId, mail: 'false' }))),
    async check(_w, _t, p, allowed) {
      const f = await Follow.findByPk(p!.ids!.followId);
      if (f?.mail !== !allowed) throw new Error(`expected the follow's mail ${allowed ? 'off' : 'on'}`);
      await dropStranger(p);
    },
  },
  {
    action: 'manageOwnSettings', via: 'setAllFollowMailAction (server action)',
    run: () => actionOutcome(() => setAllFollowMailAction({ ok: true }, formOf({ mail: 'true' }))),
  },
  {
    action: 'manageOwnSettings', via: 'deleteFollowAction (their own follow)',
    prepare: (w, _t, rel) => followOf(w, rel),
    run: (_w, _t, _who, p) => actionOutcome(() => deleteFollowAction({ ok: true }, formOf({ followId: p!.ids!.followId }))),
    async check(_w, _t, p, allowed) {
      const left = await Follow.count({ where: { id: p!.ids!.followId } });
      if (left !== (allowed ? 0 : 1)) throw new Error(`expected the follow ${allowed ? 'gone' : 'kept'}`);
      await dropStranger(p);
    },
  },
  {
    action: 'manageOwnSettings', via: 'changeNameAction (server action)',
    run: () => actionOutcome(() => changeNameAction({ ok: true }, formOf({ name: `Walked ${unique()}` }))),
  },
  {
    action: 'manageOwnSettings', via: 'changeEmailAction (server action)',
    run: () => actionOutcome(() => changeEmailAction({ ok: true }, formOf({ email: `moved-${unique()}@example.test`, currentPassword: 'integration-pass' }))),
  },
  {
    action: 'manageOwnSettings', via: 'changePasswordAction (an account of its own)',
    prepare: (_w, _t, rel) => throwaway(rel),
    run: (w, _t, _who, p) => asThrowaway(w, p, () => changePasswordAction({ ok: true }, formOf({ currentPassword: 'integration-pass', newPassword: 'tailstock die holder again' }))),
    check: (_w, _t, p) => dropThrowaway(p),
  },
  {
    action: 'manageOwnSettings', via: 'deleteAccountAction (an account of its own)',
    prepare: (_w, _t, rel) => throwaway(rel),
    run: (w, _t, _who, p) => asThrowaway(w, p, () => deleteAccountAction({ ok: true }, formOf({ logs: 'remove', currentPassword: 'integration-pass' }))),
    async check(_w, _t, p, allowed) {
      if (allowed && !(await User.findByPk(p!.ids!.userId))?.deletedAt) throw new Error('expected the account deleted');
      await dropThrowaway(p);
    },
  },
  {
    action: 'manageOwnSettings', via: 'resendVerificationAction (an unverified account of its own)',
    prepare: (_w, _t, rel) => throwaway(rel, { verified: false }),
    run: (w, _t, _who, p) => asThrowaway(w, p, () => resendVerificationAction({ ok: true }, formOf({ next: '/settings' }))),
    check: (_w, _t, p) => dropThrowaway(p),
  },
  {
    action: 'manageMentors', via: 'inviteMentorAction (server action)', dependsOnVisibility: true,
    run: (_w, t) => actionOutcome(() => inviteMentorAction({ ok: true }, formOf({ projectId: t.projectId, email: `invitee-${unique()}@example.test`, note: '' }))),
  },
  {
    action: 'manageMentors', via: 'revokeInvitationAction (server action)', dependsOnVisibility: true,
    prepare: (w, t) => invitationOn(w, t),
    run: (_w, _t, _who, p) => actionOutcome(() => revokeInvitationAction({ ok: true }, formOf({ invitationId: p!.ids!.invitationId }))),
    async check(_w, _t, p, allowed) {
      const inv = await MentorInvitation.findByPk(p!.ids!.invitationId);
      if ((inv?.revokedAt != null) !== allowed) throw new Error(`expected the invitation ${allowed ? 'withdrawn' : 'kept'}`);
    },
  },
  {
    action: 'manageMentors', via: 'removeMentorAction (server action)', dependsOnVisibility: true,
    run: (w, t) => actionOutcome(() => removeMentorAction({ ok: true }, formOf({ projectId: t.projectId, userId: w.mentor.id }))),
  },
  {
    action: 'acceptInvitation', via: 'acceptInvitationAction (server action)',
    async prepare(w, _t, rel) {
      const owner = await stranger();
      const project = await Project.create({ ownerId: owner.id, slug: `probe-${unique()}`, title: 'Invited project', summary: '', units: 'mm', visibility: 'private', publishedAt: null });
      const nonce = randomBytes(32).toString('base64url');
      const inv = await MentorInvitation.create({
        projectId: project.id, email: authorFor(w, rel).email.toLowerCase(), invitedById: owner.id,
        nonceHash: createHash('sha256').update(nonce).digest('hex'), expiresAt: new Date(Date.now() + 86_400_000),
      });
      return { ids: { ownerId: owner.id }, token: invitationToken(inv.id, nonce) };
    },
    run: (_w, _t, _who, p) => actionOutcome(() => acceptInvitationAction({ ok: true }, formOf({ token: p!.token! }))),
    async check(_w, _t, p) {
      await User.destroy({ where: { id: p!.ids!.ownerId } });
    },
  },
];

/** A record on the target's entry (52 mm, g6 outside or H7 inside) with two readings, for the record, reading and fit actions. */
async function recordOn(t: Target, kind: 'outside' | 'inside' = 'outside'): Promise<{ recordId: number; readingId: number }> {
  const { MeasurementRecord, MeasurementReading } = await import('@/db/models');
  const r = await MeasurementRecord.create({
    entryId: t.entryId, timeNoteId: null, feature: kind === 'outside' ? 'Walked spigot' : 'Walked bore', kind, nominal: '52.000', unit: 'mm',
    specType: 'zone', specZone: kind === 'outside' ? 'g6' : 'H7', specUpper: null, specLower: null, specTolerance: null, specGeneralClass: null,
  });
  const reading = (position: number, value: string) => ({
    recordId: r.id, position, passNumber: null, value, unit: 'mm' as const, instrument: 'micrometer', resolution: '0.001',
    measuredBy: 'Walk', measuredAt: new Date(), temperatureC: null, note: '',
  });
  const first = await MeasurementReading.create(reading(0, kind === 'outside' ? '51.985' : '52.012'));
  await MeasurementReading.create(reading(1, kind === 'outside' ? '51.984' : '52.013'));
  return { recordId: r.id, readingId: first.id };
}

const recordsLeft = async (recordId: number) => (await import('@/db/models')).MeasurementRecord.count({ where: { id: recordId } });

/** The measurement and risk-flag forms' server actions. */
const RECORD_AND_FLAG_ACTION_PROBES: Probe[] = [
  {
    action: 'editLog', via: 'createMeasurementAction (server action)', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t) =>
      actionOutcome(() =>
        createMeasurementAction({ ok: true }, formOf({
          entryId: t.entryId, feature: 'Walked spigot', kind: 'outside', nominal: '52', unit: 'mm', 'spec.type': 'zone', 'spec.zone': 'g6',
          'readings.0.value': '51.985', 'readings.0.unit': 'mm', 'readings.0.instrument': 'micrometer', 'readings.0.resolution': '0.001',
        })),
      ),
    async check(_w, t, _p, allowed) {
      // Refused: nothing at all is written, not the record and not a reading.
      const { MeasurementRecord } = await import('@/db/models');
      const n = await MeasurementRecord.count({ where: { entryId: t.entryId } });
      if (n !== (allowed ? 1 : 0)) throw new Error(`expected ${allowed ? 1 : 0} records, found ${n}`);
    },
  },
  {
    action: 'editLog', via: 'updateMeasurementAction (server action)', dependsOnVisibility: true,
    prepare: async (_w, t) => ({ ids: await recordOn(t) }),
    run: (_w, _t, _who, p) => actionOutcome(() => updateMeasurementAction({ ok: true }, formOf({ recordId: p!.ids!.recordId, version: 1, feature: 'Renamed by the walk' }))),
    async check(_w, _t, p, allowed) {
      const { MeasurementRecord } = await import('@/db/models');
      const row = await MeasurementRecord.findByPk(p!.ids!.recordId);
      if ((row?.feature === 'Renamed by the walk') !== allowed) throw new Error(`expected the feature ${allowed ? 'changed' : 'kept'}, found “${row?.feature}”`);
    },
  },
  {
    action: 'editLog', via: 'deleteMeasurementAction (server action)', dependsOnVisibility: true, sessionScoped: true,
    prepare: async (_w, t) => ({ ids: await recordOn(t) }),
    run: (_w, _t, _who, p) => actionOutcome(() => deleteMeasurementAction({ ok: true }, formOf({ recordId: p!.ids!.recordId }))),
    async check(_w, _t, p, allowed) {
      const left = await recordsLeft(p!.ids!.recordId);
      if (left !== (allowed ? 0 : 1)) throw new Error(`expected the record ${allowed ? 'gone' : 'kept'}, found ${left} rows`);
    },
  },
  {
    action: 'editLog', via: 'addReadingAction (server action)', dependsOnVisibility: true, sessionScoped: true,
    prepare: async (_w, t) => ({ ids: await recordOn(t) }),
    run: (_w, _t, _who, p) =>
      actionOutcome(() =>
        addReadingAction({ ok: true }, formOf({ recordId: p!.ids!.recordId, 'readings.0.value': '51.983', 'readings.0.unit': 'mm', 'readings.0.instrument': 'micrometer', 'readings.0.resolution': '0.001' })),
      ),
    async check(_w, _t, p, allowed) {
      const { MeasurementReading } = await import('@/db/models');
      const n = await MeasurementReading.count({ where: { recordId: p!.ids!.recordId } });
      if (n !== (allowed ? 3 : 2)) throw new Error(`expected ${allowed ? 3 : 2} readings, found ${n}`);
    },
  },
  {
    action: 'editLog', via: 'updateReadingAction (server action)', dependsOnVisibility: true,
    prepare: async (_w, t) => ({ ids: await recordOn(t) }),
    run: (_w, _t, _who, p) => actionOutcome(() => updateReadingAction({ ok: true }, formOf({ readingId: p!.ids!.readingId, version: 1, 'readings.0.note': 'Noted by the walk.' }))),
    async check(_w, _t, p, allowed) {
      const { MeasurementReading } = await import('@/db/models');
      const row = await MeasurementReading.findByPk(p!.ids!.readingId);
      if ((row?.note === 'Noted by the walk.') !== allowed) throw new Error(`expected the note ${allowed ? 'changed' : 'kept'}, found “${row?.note}”`);
    },
  },
  {
    action: 'editLog', via: 'deleteReadingAction (server action)', dependsOnVisibility: true,
    prepare: async (_w, t) => ({ ids: await recordOn(t) }),
    run: (_w, _t, _who, p) => actionOutcome(() => deleteReadingAction({ ok: true }, formOf({ readingId: p!.ids!.readingId }))),
  },
  {
    action: 'editLog', via: 'createPairAction (server action)', dependsOnVisibility: true,
    async prepare(_w, t) {
      const shaft = await recordOn(t, 'outside');
      const hole = await recordOn(t, 'inside');
      return { ids: { shaftRecordId: shaft.recordId, holeRecordId: hole.recordId } };
    },
    run: (_w, _t, _who, p) => actionOutcome(() => createPairAction({ ok: true }, formOf({ holeRecordId: p!.ids!.holeRecordId, shaftRecordId: p!.ids!.shaftRecordId }))),
    async check(_w, _t, p, allowed) {
      const { MeasurementPair } = await import('@/db/models');
      const n = await MeasurementPair.count({ where: { holeRecordId: p!.ids!.holeRecordId } });
      if (n !== (allowed ? 1 : 0)) throw new Error(`expected ${allowed ? 1 : 0} fits, found ${n}`);
    },
  },
  {
    action: 'editLog', via: 'deletePairAction (server action)', dependsOnVisibility: true,
    async prepare(_w, t) {
      const { MeasurementPair } = await import('@/db/models');
      const shaft = await recordOn(t, 'outside');
      const hole = await recordOn(t, 'inside');
      const pair = await MeasurementPair.create({ holeRecordId: hole.recordId, shaftRecordId: shaft.recordId });
      return { ids: { pairId: pair.id } };
    },
    run: (_w, _t, _who, p) => actionOutcome(() => deletePairAction({ ok: true }, formOf({ pairId: p!.ids!.pairId }))),
  },
  {
    action: 'flagRisk', via: 'raiseFlagAction (server action)', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t) =>
      actionOutcome(() =>
        raiseFlagAction({ ok: true }, formOf({ entryId: t.entryId, target: 'entry', severity: 'warning', hazard: 'rotating-work', concern: 'The plate may not be seated.', instead: 'Check it against the shoulder first.' })),
      ),
    async check(_w, t, _p, allowed) {
      const n = await RiskFlag.count({ where: { entryId: t.entryId } });
      if (n !== (allowed ? 1 : 0)) throw new Error(`expected ${allowed ? 1 : 0} flags, found ${n}`);
    },
  },
  {
    action: 'editOwnFlag', via: 'updateFlagAction (their own)', dependsOnVisibility: true,
    prepare: (w, t, rel) => flagBy(authorFor(w, rel).id, t),
    run: (_w, _t, _who, p) => actionOutcome(() => updateFlagAction({ ok: true }, formOf({ flagId: p!.ids!.flagId, concern: 'Reworded by the mentor.', version: 1 }))),
  },
  {
    action: 'editOwnFlag', via: "updateFlagAction (someone else's)", dependsOnVisibility: true,
    prepare: (w, t, rel) => flagBy(otherThan(w, rel).id, t),
    run: (_w, _t, _who, p) => actionOutcome(() => updateFlagAction({ ok: true }, formOf({ flagId: p!.ids!.flagId, concern: 'Not mine to change.', version: 1 }))),
    async check(_w, _t, p, allowed) {
      const row = await RiskFlag.findByPk(p!.ids!.flagId);
      if ((row?.concern === 'Not mine to change.') !== allowed) throw new Error(`expected the concern ${allowed ? 'changed' : 'kept'}, found “${row?.concern}”`);
    },
  },
  {
    action: 'editOwnFlag', via: 'withdrawFlagAction (their own)', dependsOnVisibility: true,
    prepare: (w, t, rel) => flagBy(authorFor(w, rel).id, t),
    run: (_w, _t, _who, p) => actionOutcome(() => withdrawFlagAction({ ok: true }, formOf({ flagId: p!.ids!.flagId }))),
    async check(_w, _t, p, allowed) {
      const left = await RiskFlag.count({ where: { id: p!.ids!.flagId } });
      if (left !== (allowed ? 0 : 1)) throw new Error(`expected the flag ${allowed ? 'gone' : 'kept'}, found ${left} rows`);
    },
  },
  {
    action: 'answerFlag', via: 'acknowledgeFlagAction (server action)', dependsOnVisibility: true,
    prepare: (w, t) => flagBy(w.mentor.id, t).then((p) => ({ ids: p!.ids })),
    run: (_w, _t, _who, p) => actionOutcome(() => acknowledgeFlagAction({ ok: true }, formOf({ flagId: p!.ids!.flagId, version: 1 }))),
    async check(_w, _t, p, allowed) {
      const row = await RiskFlag.findByPk(p!.ids!.flagId);
      if ((row?.status === 'acknowledged') !== allowed) throw new Error(`expected the flag ${allowed ? 'seen' : 'open'}, found ${row?.status}`);
    },
  },
  {
    action: 'answerFlag', via: 'resolveFlagAction (server action)', dependsOnVisibility: true,
    prepare: (w, t) => flagBy(w.mentor.id, t).then((p) => ({ ids: p!.ids })),
    run: (_w, _t, _who, p) => actionOutcome(() => resolveFlagAction({ ok: true }, formOf({ flagId: p!.ids!.flagId, answer: 'Seated and checked; key out.', version: 1 }))),
    async check(_w, _t, p, allowed) {
      const row = await RiskFlag.findByPk(p!.ids!.flagId);
      if ((row?.status === 'resolved') !== allowed) throw new Error(`expected the flag ${allowed ? 'answered' : 'unanswered'}, found ${row?.status}`);
    },
  },
];

export const PROBES: Probe[] = [
  // — the project and its log —
  {
    action: 'view', via: 'GET /api/projects/[id]', dependsOnVisibility: true,
    run: (_w, t, who) => call(readProject, `/api/projects/${t.projectId}`, who, id(t.projectId)),
  },
  {
    action: 'view', via: 'GET /api/sessions/[id]', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(readSession, `/api/sessions/${t.sessionId}`, who, id(t.sessionId)),
  },
  {
    action: 'printSheet', via: 'GET /api/sessions/[id]/sheet', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(sessionSheetRoute, `/api/sessions/${t.sessionId}/sheet`, who, id(t.sessionId)),
  },
  {
    action: 'view', via: 'GET /api/entries/[id]', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(readEntry, `/api/entries/${t.entryId}`, who, id(t.entryId)),
  },
  {
    action: 'view', via: 'GET /api/media/[id]/file', dependsOnVisibility: true, sessionScoped: true,
    prepare: async (_w, t) => {
      const { Media } = await import('@/db/models');
      const m = await Media.create({ entryId: t.entryId, kind: 'photo', source: 'upload', fileKey: `probe${unique()}`, url: '', name: 'probe.png', mime: 'image/png', sizeBytes: 1, width: 1, height: 1, durationMs: null, position: 0, uploadedBy: null });
      return { ids: { mediaId: m.id } };
    },
    // Allowed is a 302 to the file's short-lived signed address; counted as the 2xx of a granted view.
    run: async (_w, _t, who, p) => {
      const status = await call(mediaFileRoute, `/api/media/${p!.ids!.mediaId}/file`, who, id(p!.ids!.mediaId));
      return status === 302 ? 200 : status;
    },
  },
  {
    action: 'update', via: 'PATCH /api/projects/[id]', dependsOnVisibility: true,
    run: (_w, t, who) => call(patchProject, `/api/projects/${t.projectId}`, who, id(t.projectId), { method: 'PATCH', body: { summary: 'Changed by the matrix walk.', version: 1 } }),
  },
  {
    action: 'update', via: 'updateProjectAction (server action)', dependsOnVisibility: true,
    run: (_w, t) => actionOutcome(() => updateProjectAction({ ok: true }, formOf({ projectId: t.projectId, summary: 'Changed by the matrix walk.', version: 1 }))),
  },
  {
    action: 'delete', via: 'deleteProjectAction (server action)', dependsOnVisibility: true,
    run: (_w, t) => actionOutcome(() => deleteProjectAction({ ok: true }, formOf({ projectId: t.projectId }))),
    async check(_w, t, _p, allowed) {
      const left = await Project.count({ where: { id: t.projectId } });
      if (left !== (allowed ? 0 : 1)) throw new Error(`expected the project ${allowed ? 'gone' : 'kept'}, found ${left} rows`);
    },
  },
  {
    action: 'delete', via: 'DELETE /api/projects/[id]', dependsOnVisibility: true,
    run: (_w, t, who) => call(deleteProjectRoute, `/api/projects/${t.projectId}`, who, id(t.projectId), { method: 'DELETE' }),
  },
  {
    action: 'editLog', via: 'POST /api/projects/[id]/sessions', dependsOnVisibility: true,
    run: (_w, t, who) =>
      call(createSessionRoute, `/api/projects/${t.projectId}/sessions`, who, id(t.projectId), { method: 'POST', body: { title: 'Walked session', heldOn: '2026-12-01', minutesSpent: 30 } }),
  },
  {
    action: 'editLog', via: 'createSessionAction (server action)', dependsOnVisibility: true,
    run: (_w, t) => actionOutcome(() => createSessionAction({ ok: true }, formOf({ projectId: t.projectId, title: 'Walked session', heldOn: '2026-12-01', minutesSpent: 30 }))),
  },
  {
    action: 'editLog', via: 'updateSessionAction (server action)', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t) => actionOutcome(() => updateSessionAction({ ok: true }, formOf({ sessionId: t.sessionId, version: 1, done: 'Changed by the matrix walk.' }))),
  },
  {
    action: 'editLog', via: 'deleteSessionAction (server action)', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t) => actionOutcome(() => deleteSessionAction({ ok: true }, formOf({ sessionId: t.sessionId }))),
    async check(_w, t, _p, allowed) {
      const { ShopSession } = await import('@/db/models');
      const left = await ShopSession.count({ where: { id: t.sessionId } });
      if (left !== (allowed ? 0 : 1)) throw new Error(`expected the session ${allowed ? 'gone' : 'kept'}, found ${left} rows`);
    },
  },
  {
    action: 'editLog', via: 'POST /api/sessions/[id]/bench-notes', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(benchNoteRoute, `/api/sessions/${t.sessionId}/bench-notes`, who, id(t.sessionId), { method: 'POST', body: { clientId: crypto.randomUUID(), text: 'Noted by the walk', clock: '09:30' } }),
  },
  {
    action: 'editLog', via: 'POST /api/sessions/[id]/time', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(benchTimeRoute, `/api/sessions/${t.sessionId}/time`, who, id(t.sessionId), { method: 'POST', body: { clientId: crypto.randomUUID(), minutes: 5 } }),
  },
  {
    action: 'editLog', via: 'PATCH /api/entries/[id]', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(patchEntry, `/api/entries/${t.entryId}`, who, id(t.entryId), { method: 'PATCH', body: { title: 'Renamed by the walk', version: 1 } }),
  },
  {
    action: 'publish', via: 'PATCH /api/sessions/[id]/visibility', dependsOnVisibility: true,
    run: (_w, t, who) => call(sessionVisibilityRoute, `/api/sessions/${t.sessionId}/visibility`, who, id(t.sessionId), { method: 'PATCH', body: { visibility: 'unlisted' } }),
  },
  {
    action: 'manageMentors', via: 'POST /api/projects/[id]/invitations', dependsOnVisibility: true,
    run: (_w, t, who) => call(inviteRoute, `/api/projects/${t.projectId}/invitations`, who, id(t.projectId), { method: 'POST', body: { email: `invitee-${unique()}@example.test` } }),
  },
  {
    action: 'manageMentors', via: 'GET /api/projects/[id]/invitations', dependsOnVisibility: true,
    run: (_w, t, who) => call(mentorsOverviewRoute, `/api/projects/${t.projectId}/invitations`, who, id(t.projectId)),
  },
  {
    action: 'manageMentors', via: 'DELETE /api/projects/[id]/mentors/[userId]', dependsOnVisibility: true,
    run: (w, t, who) =>
      call(removeMentorRoute, `/api/projects/${t.projectId}/mentors/${w.mentor.id}`, who, { id: String(t.projectId), userId: String(w.mentor.id) }, { method: 'DELETE' }),
  },
  {
    action: 'follow', via: 'POST /api/projects/[id]/follow', dependsOnVisibility: true,
    run: (_w, t, who) => call(followProjectRoute, `/api/projects/${t.projectId}/follow`, who, id(t.projectId), { method: 'POST' }),
  },
  {
    action: 'view', via: 'GET /api/entries/[id]/comments', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(listCommentsRoute, `/api/entries/${t.entryId}/comments`, who, id(t.entryId)),
  },
  {
    action: 'comment', via: 'POST /api/entries/[id]/comments', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(commentRoute, `/api/entries/${t.entryId}/comments`, who, id(t.entryId), { method: 'POST', body: { body: 'Which insert did you use for the finishing pass?' } }),
  },
  {
    action: 'editOwnComment', via: 'PATCH /api/comments/[id] (their own)', dependsOnVisibility: true, sessionScoped: true,
    prepare: (w, t, rel) => commentBy(authorFor(w, rel).id, t),
    run: (_w, _t, who, p) => call(editCommentRoute, `/api/comments/${p!.ids!.commentId}`, who, id(p!.ids!.commentId), { method: 'PATCH', body: { body: 'Edited by its author.', version: 1 } }),
  },
  {
    action: 'editOwnComment', via: "PATCH /api/comments/[id] (someone else's)", dependsOnVisibility: true,
    prepare: (w, t, rel) => commentBy(otherThan(w, rel).id, t),
    run: (_w, _t, who, p) => call(editCommentRoute, `/api/comments/${p!.ids!.commentId}`, who, id(p!.ids!.commentId), { method: 'PATCH', body: { body: 'Not mine to change.', version: 1 } }),
  },
  {
    action: 'editOwnComment', via: 'DELETE /api/comments/[id] (their own)', dependsOnVisibility: true,
    prepare: (w, t, rel) => commentBy(authorFor(w, rel).id, t),
    run: (_w, _t, who, p) => call(deleteCommentRoute, `/api/comments/${p!.ids!.commentId}`, who, id(p!.ids!.commentId), { method: 'DELETE' }),
  },
  {
    action: 'hideComment', via: 'POST /api/comments/[id]/hide', dependsOnVisibility: true, sessionScoped: true,
    prepare: (w, t) => commentBy(w.member.id, t).then((p) => ({ ids: p!.ids })),
    run: (_w, _t, who, p) => call(hideCommentRoute, `/api/comments/${p!.ids!.commentId}/hide`, who, id(p!.ids!.commentId), { method: 'POST', body: { reason: 'Off topic for this entry.' } }),
  },
  {
    action: 'reportComment', via: "POST /api/comments/[id]/report (someone else's)", dependsOnVisibility: true, sessionScoped: true,
    prepare: (w, t, rel) => commentBy(otherThan(w, rel).id, t).then((p) => ({ ids: p!.ids })),
    run: (_w, _t, who, p) => call(reportCommentRoute, `/api/comments/${p!.ids!.commentId}/report`, who, id(p!.ids!.commentId), { method: 'POST', body: { reason: 'Advice here would leave the chuck key in.' } }),
    async check(_w, _t, p, allowed) {
      // A refused report leaves no row behind.
      const n = await CommentReport.count({ where: { commentId: p!.ids!.commentId } });
      if (n !== (allowed ? 1 : 0)) throw new Error(`expected ${allowed ? 1 : 0} report rows, found ${n}`);
    },
  },
  {
    action: 'view', via: 'GET /api/entries/[id]/flags', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(listFlagsRoute, `/api/entries/${t.entryId}/flags`, who, id(t.entryId)),
  },
  {
    action: 'flagRisk', via: 'POST /api/entries/[id]/flags', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) =>
      call(flagRoute, `/api/entries/${t.entryId}/flags`, who, id(t.entryId), {
        method: 'POST',
        body: { target: 'entry', severity: 'warning', hazard: 'rotating-work', concern: 'The plate may not be seated.', instead: 'Check it against the shoulder first.' },
      }),
  },
  {
    action: 'editOwnFlag', via: 'PATCH /api/flags/[id] (their own)', dependsOnVisibility: true,
    prepare: (w, t, rel) => flagBy(authorFor(w, rel).id, t),
    run: (_w, _t, who, p) => call(editFlagRoute, `/api/flags/${p!.ids!.flagId}`, who, id(p!.ids!.flagId), { method: 'PATCH', body: { concern: 'Reworded by the mentor.', version: 1 } }),
  },
  {
    action: 'editOwnFlag', via: "PATCH /api/flags/[id] (someone else's)", dependsOnVisibility: true,
    prepare: (w, t, rel) => flagBy(otherThan(w, rel).id, t),
    run: (_w, _t, who, p) => call(editFlagRoute, `/api/flags/${p!.ids!.flagId}`, who, id(p!.ids!.flagId), { method: 'PATCH', body: { concern: 'Not mine to change.', version: 1 } }),
  },
  {
    action: 'answerFlag', via: 'POST /api/flags/[id]/acknowledge', dependsOnVisibility: true,
    prepare: (w, t) => flagBy(w.mentor.id, t).then((p) => ({ ids: p!.ids })),
    run: (_w, _t, who, p) => call(acknowledgeRoute, `/api/flags/${p!.ids!.flagId}/acknowledge`, who, id(p!.ids!.flagId), { method: 'POST', body: { version: 1 } }),
  },
  {
    action: 'answerFlag', via: 'POST /api/flags/[id]/resolve', dependsOnVisibility: true,
    prepare: (w, t) => flagBy(w.mentor.id, t).then((p) => ({ ids: p!.ids })),
    run: (_w, _t, who, p) => call(resolveRoute, `/api/flags/${p!.ids!.flagId}/resolve`, who, id(p!.ids!.flagId), { method: 'POST', body: { answer: 'Seated and checked; key out.', version: 1 } }),
  },
  {
    action: 'view', via: 'GET /api/entries/[id]/calculations', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(listCalculationsRoute, `/api/entries/${t.entryId}/calculations`, who, id(t.entryId)),
  },
  {
    action: 'editLog', via: 'POST /api/entries/[id]/calculations', dependsOnVisibility: true,
    run: (_w, t, who) =>
      call(saveCalculationRoute, `/api/entries/${t.entryId}/calculations`, who, id(t.entryId), { method: 'POST', body: { kind: 'tap-drill', input: { designation: 'M8x1.25' } } }),
  },
  ...RECORD_AND_FLAG_ACTION_PROBES,
  // — site —
  {
    action: 'manageOwnSettings', via: 'GET /api/me/follows',
    run: (_w, _t, who) => call(myFollowsRoute, '/api/me/follows', who, {}),
  },
  {
    action: 'followBuilder', via: 'POST /api/builders/[handle]/follow',
    prepare: async () => ({ ids: {}, token: (await stranger()).handle }),
    run: (_w, _t, who, p) => call(followBuilderRoute, `/api/builders/${p!.token}/follow`, who, { handle: p!.token! }, { method: 'POST' }),
  },
  {
    action: 'acceptInvitation', via: 'POST /api/invitations/accept',
    async prepare(w, _t, rel) {
      const owner = await stranger();
      const project = await Project.create({ ownerId: owner.id, slug: `probe-${unique()}`, title: 'Invited project', summary: '', units: 'mm', visibility: 'private', publishedAt: null });
      const nonce = randomBytes(32).toString('base64url');
      const inv = await MentorInvitation.create({
        projectId: project.id, email: authorFor(w, rel).email.toLowerCase(), invitedById: owner.id,
        nonceHash: createHash('sha256').update(nonce).digest('hex'), expiresAt: new Date(Date.now() + 86_400_000),
      });
      return { ids: { ownerId: owner.id }, token: invitationToken(inv.id, nonce) };
    },
    run: (_w, _t, who, p) => call(acceptRoute, '/api/invitations/accept', who, {}, { method: 'POST', body: { token: p!.token } }),
    async check(_w, _t, p) {
      await User.destroy({ where: { id: p!.ids!.ownerId } });
    },
  },
  {
    action: 'viewProfiles', via: 'GET /api/builders/[handle]',
    prepare: async () => ({ ids: {}, token: (await stranger()).handle }),
    run: (_w, _t, who, p) => call(profileRoute, `/api/builders/${p!.token}`, who, { handle: p!.token! }),
  },
  {
    action: 'exportProject', via: 'GET /api/projects/[id]/archive?plan=1', dependsOnVisibility: true,
    run: (_w, t, who) => call(archiveRoute, `/api/projects/${t.projectId}/archive?plan=1`, who, id(t.projectId)),
  },
  // — site —
  {
    action: 'importProject', via: 'POST /api/archives',
    async run(_w, _t, who) {
      const req = new NextRequest(new URL('/api/archives', 'http://127.0.0.1:3000'), {
        method: 'POST', body: new Uint8Array(await emptyArchive()), headers: { 'content-type': 'application/zip', ...(who ? { cookie: who.cookie } : {}) },
      });
      const res = await importArchiveRoute(req, { params: Promise.resolve({}) });
      if (res.status === 201) await Project.destroy({ where: { id: ((await res.json()) as { projectId: number }).projectId } });
      return res.status;
    },
  },
  {
    action: 'createProject', via: 'POST /api/projects',
    run: (_w, _t, who) => call(createProjectRoute, '/api/projects', who, {}, { method: 'POST', body: { title: 'Walked project', summary: '', units: 'mm', visibility: 'private' } }),
  },
  {
    action: 'createProject', via: 'createProjectAction (server action)',
    run: () => actionOutcome(() => createProjectAction({ ok: true }, formOf({ title: 'Walked project', summary: '', units: 'mm', visibility: 'private' }))),
  },
  {
    action: 'listOwnProjects', via: 'GET /api/projects?scope=mine',
    run: (_w, _t, who) => call(listProjects, '/api/projects?scope=mine', who, {}),
  },
  {
    action: 'manageUsers', via: 'setSiteRoleAction (server action)',
    async prepare() {
      const u = await User.create({ email: `matrix-${Date.now()}-${Math.random().toString(36).slice(2)}@example.test`, name: 'Walked account', handle: `walk-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`, passwordHash: 'x', siteRole: 'member' });
      return { ids: { userId: u.id } };
    },
    async run(_w, _t, _who, prepared) {
      const form = new FormData();
      form.set('userId', String(prepared!.ids!.userId));
      form.set('siteRole', 'member');
      return actionStatus(await setSiteRoleAction({ ok: true }, form));
    },
    async check(_w, _t, prepared) {
      await User.destroy({ where: { id: prepared!.ids!.userId } });
    },
  },
  {
    action: 'manageUsers', via: 'GET /api/admin/accounts',
    run: (_w, _t, who) => call(accountsRoute, '/api/admin/accounts?q=walk&page=1', who, {}),
  },
  {
    action: 'moderateComments', via: 'GET /api/admin/comments',
    run: (_w, _t, who) => call(moderationQueueRoute, '/api/admin/comments', who, {}),
  },
  {
    action: 'moderateComments', via: 'POST /api/admin/comments/[id]/dismiss',
    async prepare(w, t) {
      const p = await commentBy(w.owner.id, t);
      await CommentReport.create({ commentId: p!.ids!.commentId, reporterId: w.member.id, reason: 'Walked report.', dismissedById: null });
      return { ids: p!.ids };
    },
    run: (_w, _t, who, p) => call(dismissReportsRoute, `/api/admin/comments/${p!.ids!.commentId}/dismiss`, who, id(p!.ids!.commentId), { method: 'POST' }),
    async check(_w, _t, p, allowed) {
      const open = await CommentReport.count({ where: { commentId: p!.ids!.commentId, dismissedAt: null } });
      if (open !== (allowed ? 0 : 1)) throw new Error(`expected ${allowed ? 0 : 1} open reports, found ${open}`);
    },
  },
  ...WRITE_ACTION_PROBES,
  // — public —
  {
    action: 'useCalculators', via: 'GET /api/fits',
    run: (_w, _t, who) => call(fitsRoute, '/api/fits?size=25&fit=H7/g6', who, {}),
  },
  {
    action: 'readPublishedLogs', via: 'GET /api/projects',
    run: (_w, _t, who) => call(listProjects, '/api/projects', who, {}),
  },
  {
    action: 'search', via: 'GET /api/search',
    run: (_w, _t, who) => call(searchRoute, '/api/search?q=walked+spigot', who, {}),
  },
  {
    action: 'checkHealth', via: 'GET /api/health/live',
    run: async () => (await healthLiveRoute()).status,
  },
  {
    action: 'describeViewer', via: 'GET /api/me/viewer',
    run: (_w, _t, who) => call(viewerRoute, '/api/me/viewer', who, {}),
  },
];

