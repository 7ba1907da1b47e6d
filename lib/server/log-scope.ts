import 'server-only';
import type { Transaction } from 'sequelize';
import { Op } from 'sequelize';
import { initModels, Project, ProjectMembership, ShopSession, Entry, Media, TimeNote, Follow } from '../../db/models';
import { AppError } from '../http/errors';
import { authorizeProject, followingMatters, type Actor, type ProjectAction, type ProjectFacts, type Visibility } from '../auth/policy';

/** Where a piece of the log sits, and the facts the policy needs about its project. */
export type LogScope = {
  projectId: number;
  projectSlug: string;
  projectTitle: string;
  units: 'mm' | 'in';
  sessionId?: number;
  entryId?: number;
  mediaId?: number;
  facts: ProjectFacts;
};

type Target = { projectId: number } | { sessionId: number } | { entryId: number } | { mediaId: number } | { noteId: number };

const NAMES: Record<string, string> = { projectId: 'project', sessionId: 'session', entryId: 'entry', mediaId: 'photo or clip', noteId: 'note' };

/**
 * Walks up from a note, media, entry or session to its project, then asks the policy.
 * Missing anything on the way is a 404; so is a private project the actor may not see.
 */
export async function authorizeLog(
  actor: Actor,
  action: ProjectAction,
  target: Target,
  transaction?: Transaction,
  /** Facts of the piece acted on that the walk cannot know, e.g. the author of a comment or flag. */
  extra?: Pick<ProjectFacts, 'authorId'>,
): Promise<LogScope> {
  initModels();
  const notFound = () => new AppError('not_found', `That ${NAMES[Object.keys(target)[0]]} was not found.`);
  const scope: Partial<LogScope> = {};
  let { projectId, sessionId, entryId, mediaId } = target as Partial<Record<string, number>>;
  let sessionVisibility: Visibility | undefined;
  if ('noteId' in target) {
    const note = await TimeNote.findByPk(target.noteId, { attributes: ['id', 'mediaId'], transaction });
    if (!note) throw notFound();
    mediaId = note.mediaId;
  }
  if (mediaId !== undefined) {
    const media = await Media.findByPk(mediaId, { attributes: ['id', 'entryId'], transaction });
    if (!media) throw notFound();
    scope.mediaId = media.id;
    entryId = media.entryId;
  }
  if (entryId !== undefined) {
    const entry = await Entry.findByPk(entryId, { attributes: ['id', 'sessionId'], transaction });
    if (!entry) throw notFound();
    scope.entryId = entry.id;
    sessionId = entry.sessionId;
  }
  if (sessionId !== undefined) {
    const session = await ShopSession.findByPk(sessionId, { attributes: ['id', 'projectId', 'visibility'], transaction });
    if (!session) throw notFound();
    scope.sessionId = session.id;
    sessionVisibility = session.visibility;
    projectId = session.projectId;
  }
  const project = await Project.findByPk(projectId!, {
    attributes: ['id', 'slug', 'title', 'units', 'ownerId', 'visibility'],
    include: [{ model: ProjectMembership, as: 'memberships', attributes: ['userId', 'role'] }],
    transaction,
  });
  if (!project) throw notFound();
  const facts: ProjectFacts = {
    ownerId: project.ownerId,
    visibility: project.visibility,
    mentorIds: (project.memberships ?? []).filter((m) => m.role === 'mentor').map((m) => m.userId),
    followerIds: followingMatters(action) && (await actorFollows(actor, project.id, project.ownerId, transaction)) ? [actor!.id] : [],
    ...(sessionVisibility ? { sessionVisibility } : {}),
  };
  authorizeProject(actor, action, { ...facts, ...(extra ?? {}) });
  return { ...scope, projectId: project.id, projectSlug: project.slug, projectTitle: project.title, units: project.units, facts };
}

/** Whether the actor follows the project or its builder: the policy's follower relation. */
export async function actorFollows(actor: Actor, projectId: number, ownerId: number, transaction?: Transaction): Promise<boolean> {
  if (!actor) return false;
  initModels();
  const n = await Follow.count({ where: { userId: actor.id, [Op.or]: [{ projectId }, { builderId: ownerId }] }, transaction });
  return n > 0;
}
