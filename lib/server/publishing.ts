import 'server-only';
import { unansweredStopFlags } from './flags';
import { appUrl } from './app-url';
import { Op, type Transaction } from 'sequelize';
import { initModels, Follow, Project, ShopSession, User } from '../../db/models';
import { AppError } from '../errors';
import { authorizePublic, type Actor } from '../auth/policy';
import { authorizeLog } from './log-scope';
import { enqueueMail } from './mail';
import { getSession } from './sessions';
import { unsubscribeUrl } from './unsubscribe';
import { sessionPublishedMail } from '../mail/templates';
import { sessionVisibilitySchema } from '../validations/following';
import { outgoingMailSchema } from '../validations/mail';
import { formatDay } from '../format';
import type { SessionView } from '../types/log';
import type { PublishedSessionCard } from '../types/following';

// A session is "effectively published" when both it and its project are published. The first time
// that happens (whichever of the two is published last), followers are told once, in the same
// transaction: announcedAt is set and one outbox message per follower is written.


export type VisibilityResult = { session: SessionView; announced: number };

/** The builder sets a session private, unlisted or published. */
export async function setSessionVisibility(actor: Actor, sessionId: number, input: unknown): Promise<VisibilityResult> {
  const data = sessionVisibilitySchema.parse(input);
  const sequelize = initModels();
  const announced = await sequelize.transaction(async (transaction) => {
    const scope = await authorizeLog(actor, 'publish', { sessionId }, transaction);
    // Project row first, then the session: the same order as publishing a project, so the two cannot deadlock.
    const project = (await Project.findByPk(scope.projectId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const session = (await ShopSession.findByPk(sessionId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    if (data.version !== undefined && data.version !== session.version) {
      throw new AppError('conflict', 'This session was changed in another tab or on another device since you opened it. Reload, then set its visibility again.');
    }
    if (data.visibility === 'published' && session.visibility !== 'published') {
      const open = await unansweredStopFlags(sessionId, transaction);
      if (open > 0) {
        const flags = open === 1 ? 'an unanswered “stop” flag' : `${open} unanswered “stop” flags`;
        const message = `This session has ${flags} from a mentor. Answer and resolve ${open === 1 ? 'it' : 'them'} before publishing the session; until then it can be private or unlisted.`;
        throw new AppError('conflict', message, { visibility: [message] });
      }
    }
    session.visibility = data.visibility;
    if (data.visibility === 'published' && !session.publishedAt) session.publishedAt = new Date();
    await session.save({ transaction });
    return project.visibility === 'published' ? announceSessions(project, [session], transaction) : 0;
  });
  return { session: (await getSession(actor, sessionId)).session, announced };
}

/**
 * For a project that has just become published: tells followers of each of its published sessions
 * not announced yet. Call inside the transaction that publishes the project, with its row locked.
 */
export async function announcePublishedSessions(project: Project, transaction: Transaction): Promise<number> {
  initModels();
  const sessions = await ShopSession.findAll({
    where: { projectId: project.id, visibility: 'published', announcedAt: null },
    order: [['position', 'ASC'], ['id', 'ASC']],
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  return announceSessions(project, sessions, transaction);
}

/**
 * Marks each published, not yet announced session as announced and queues one message per member
 * who follows the project or its builder with mail on (never the builder). Returns messages queued.
 */
async function announceSessions(project: Project, sessions: ShopSession[], transaction: Transaction): Promise<number> {
  const due = sessions.filter((s) => s.visibility === 'published' && !s.announcedAt);
  if (!due.length) return 0;
  const builder = (await User.findByPk(project.ownerId, { attributes: ['id', 'name'], transaction }))!;
  const byMember = await mailAudience(project, transaction);
  let queued = 0;
  for (const session of due) {
    session.announcedAt = new Date();
    await session.save({ transaction });
    for (const f of byMember.values()) {
      const content = sessionPublishedMail({
        recipientName: f.user!.name,
        builderName: builder.name,
        projectTitle: project.title,
        sessionTitle: session.title,
        heldOn: formatDay(session.heldOn),
        summary: session.done,
        sessionUrl: appUrl(`/logs/${project.slug}/sessions/${session.id}`),
        unsubscribeUrl: unsubscribeUrl(f.id, f.userId),
        followed: f.projectId ? 'project' : 'builder',
        settingsUrl: appUrl('/settings'),
      });
      const r = await enqueueMail(
        { to: f.user!.email, ...content, kind: 'session-published', dedupeKey: `session-published:${session.id}:${f.userId}` },
        { transaction },
      );
      if (r.queued) queued += 1;
    }
  }
  return queued;
}

/** The first line of what got done, shortened for a list. */
function firstLine(text: string, max = 160): string {
  const line = text.split(/\r?\n/).map((l) => l.trim()).find(Boolean) ?? '';
  return line.length > max ? `${line.slice(0, max - 1).trimEnd()}…` : line;
}

/** Sessions published in published projects, newest first: the home page's list. */
export async function listRecentlyPublishedSessions(actor: Actor, limit = 12): Promise<PublishedSessionCard[]> {
  authorizePublic(actor, 'readPublishedLogs');
  initModels();
  const rows = await ShopSession.findAll({
    where: { visibility: 'published', publishedAt: { [Op.ne]: null } },
    attributes: ['id', 'title', 'heldOn', 'publishedAt', 'done', 'projectId'],
    include: [
      {
        model: Project,
        as: 'project',
        required: true,
        where: { visibility: 'published' },
        attributes: ['id', 'slug', 'title', 'ownerId'],
        include: [{ model: User, as: 'owner', attributes: ['id', 'name', 'handle'] }],
      },
    ],
    order: [['publishedAt', 'DESC'], ['id', 'DESC']],
    limit: Math.max(1, Math.min(50, limit)),
  });
  return rows.map((s) => ({
    id: s.id,
    title: s.title,
    heldOn: s.heldOn,
    publishedAt: s.publishedAt!.toISOString(),
    summary: firstLine(s.done),
    project: { id: s.project!.id, slug: s.project!.slug, title: s.project!.title },
    builder: { id: s.project!.owner!.id, name: s.project!.owner!.name, handle: s.project!.owner!.handle },
  }));
}

/** The members one newly published session of this project would mail: one per member, never the builder. */
async function mailAudience(project: Pick<Project, 'id' | 'ownerId'>, transaction?: Transaction): Promise<Map<number, Follow>> {
  const follows = await Follow.findAll({
    where: { mail: true, userId: { [Op.ne]: project.ownerId }, [Op.or]: [{ projectId: project.id }, { builderId: project.ownerId }] },
    include: [{ model: User, as: 'user', attributes: ['id', 'name', 'email'] }],
    order: [['id', 'ASC']],
    transaction,
  });
  // One message per member; its unsubscribe link switches off the project follow if they have one.
  const byMember = new Map<number, Follow>();
  for (const f of follows) {
    // An address the outbox would refuse must not stop the builder publishing: that member is skipped.
    if (!outgoingMailSchema.shape.to.safeParse(f.user?.email).success) continue;
    const seen = byMember.get(f.userId);
    if (!seen || (f.projectId && !seen.projectId)) byMember.set(f.userId, f);
  }
  return byMember;
}

/** How many members would get an e-mail if a session of this project were published now (the builder's publish control says so first). */
export async function countPublishAudience(actor: Actor, projectId: number): Promise<number> {
  initModels();
  await authorizeLog(actor, 'publish', { projectId });
  const project = await Project.findByPk(projectId, { attributes: ['id', 'ownerId'] });
  return project ? (await mailAudience(project)).size : 0;
}
