import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { initModels, Project, ProjectMembership, RiskFlag, ShopSession, User } from '../../db/models';
import { AppError } from '../http/errors';
import { authorizeProject, authorizePublic, authorizeSite, canOnProject, type Actor, type ProjectFacts } from '../auth/policy';
import { projectInputSchema, projectUpdateSchema, type ProjectInput, type ProjectUpdate } from '../validations/project';
import { slugify } from '../slug';
import { announcePublishedSessions } from './publishing';
import type { ProjectView } from '../types/project';

export type { ProjectView };


const include = [
  { model: User, as: 'owner', attributes: ['id', 'name', 'handle'] },
  { model: ProjectMembership, as: 'memberships', include: [{ model: User, as: 'user', attributes: ['id', 'name'] }] },
];

export function factsOf(p: Project): ProjectFacts {
  return {
    ownerId: p.ownerId,
    visibility: p.visibility,
    mentorIds: (p.memberships ?? []).filter((m) => m.role === 'mentor').map((m) => m.userId),
  };
}

function toView(p: Project, actor: Actor): ProjectView {
  const facts = factsOf(p);
  return {
    id: p.id,
    slug: p.slug,
    title: p.title,
    summary: p.summary,
    units: p.units,
    visibility: p.visibility,
    version: p.version,
    publishedAt: p.publishedAt ? p.publishedAt.toISOString() : null,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
    owner: { id: p.owner!.id, name: p.owner!.name, handle: p.owner!.handle },
    mentors: (p.memberships ?? []).filter((m) => m.role === 'mentor' && m.user).map((m) => ({ id: m.user!.id, name: m.user!.name })),
    can: {
      update: canOnProject(actor, 'update', facts),
      delete: canOnProject(actor, 'delete', facts),
      manageMentors: canOnProject(actor, 'manageMentors', facts),
      editLog: canOnProject(actor, 'editLog', facts),
      publish: canOnProject(actor, 'publish', facts),
      follow: canOnProject(actor, 'follow', facts),
      hideComment: canOnProject(actor, 'hideComment', facts),
      flagRisk: canOnProject(actor, 'flagRisk', facts),
      answerFlag: canOnProject(actor, 'answerFlag', facts),
    },
  };
}

async function loadProject(where: { id: number } | { slug: string }, transaction?: Transaction): Promise<Project | null> {
  initModels();
  return Project.findOne({ where, include, transaction });
}

export async function getProjectForViewer(actor: Actor, where: { id: number } | { slug: string }): Promise<ProjectView> {
  const project = await loadProject(where);
  if (!project) throw new AppError('not_found', 'That project was not found.');
  authorizeProject(actor, 'view', factsOf(project));
  return toView(project, actor);
}

export async function listMyProjects(actor: Actor): Promise<ProjectView[]> {
  authorizeSite(actor, 'listOwnProjects');
  initModels();
  const projects = await Project.findAll({ where: { ownerId: actor.id }, include, order: [['updatedAt', 'DESC']] });
  return projects.map((p) => toView(p, actor));
}

/** Projects where the actor is a mentor. */
export async function listMentoredProjects(actor: Actor): Promise<ProjectView[]> {
  authorizeSite(actor, 'listOwnProjects');
  initModels();
  const ids = (await ProjectMembership.findAll({ where: { userId: actor.id, role: 'mentor' }, attributes: ['projectId'] })).map((m) => m.projectId);
  if (!ids.length) return [];
  const projects = await Project.findAll({ where: { id: { [Op.in]: ids } }, include, order: [['updatedAt', 'DESC']] });
  return projects.map((p) => toView(p, actor));
}

export async function listPublishedProjects(actor: Actor, limit = 24): Promise<ProjectView[]> {
  authorizePublic(actor, 'readPublishedLogs');
  initModels();
  const projects = await Project.findAll({
    where: { visibility: 'published' },
    include,
    order: [['publishedAt', 'DESC'], ['id', 'DESC']],
    limit,
  });
  return projects.map((p) => toView(p, actor));
}

async function freeSlug(title: string, transaction: Transaction): Promise<string> {
  const base = slugify(title, 80) || 'project';
  for (let n = 1; ; n++) {
    const candidate = n === 1 ? base : `${base}-${n}`;
    if (!(await Project.count({ where: { slug: candidate }, transaction }))) return candidate;
  }
}

export async function createProject(actor: Actor, input: unknown): Promise<ProjectView> {
  authorizeSite(actor, 'createProject');
  const data: ProjectInput = projectInputSchema.parse(input);
  const sequelize = initModels();
  const id = await sequelize.transaction(async (transaction) => {
    const project = await Project.create(
      {
        ownerId: actor.id,
        slug: await freeSlug(data.title, transaction),
        title: data.title,
        summary: data.summary,
        units: data.units,
        visibility: data.visibility,
        publishedAt: data.visibility === 'published' ? new Date() : null,
      },
      { transaction },
    );
    return project.id;
  });
  return getProjectForViewer(actor, { id });
}

export async function updateProject(actor: Actor, id: number, input: unknown): Promise<ProjectView> {
  const data: ProjectUpdate = projectUpdateSchema.parse(input);
  const sequelize = initModels();
  await sequelize.transaction(async (transaction) => {
    const project = await Project.findOne({ where: { id }, include, transaction, lock: transaction.LOCK.UPDATE });
    if (!project) throw new AppError('not_found', 'That project was not found.');
    authorizeProject(actor, 'update', factsOf(project));
    if (project.version !== data.version) {
      throw new AppError('conflict', 'This project was changed elsewhere since you opened it. Reload to see the latest version, then make your change again.');
    }
    const { version: _v, ...changes } = data;
    const becomesPublished = changes.visibility === 'published' && project.visibility !== 'published';
    if (becomesPublished) {
      // Its published sessions would go public at once: none may carry an unanswered "stop" flag.
      const stopped = await RiskFlag.count({
        where: { projectId: project.id, severity: 'stop', status: { [Op.ne]: 'resolved' } },
        include: [{ model: ShopSession, as: 'session', attributes: [], where: { visibility: 'published' } }],
        transaction,
      });
      if (stopped > 0) {
        throw new AppError(
          'conflict',
          `A mentor's "stop" flag on a published session is not answered yet (${stopped}). Answer it, or make that session private, before publishing the project.`,
          { visibility: ['Answer the open "stop" flags first.'] },
        );
      }
      project.publishedAt = new Date();
    }
    project.set(changes);
    project.version = project.version + 1;
    await project.save({ transaction });
    // Its published sessions become public now: followers hear of each one not announced before.
    if (becomesPublished) await announcePublishedSessions(project, transaction);
  });
  return getProjectForViewer(actor, { id });
}

export async function deleteProject(actor: Actor, id: number): Promise<void> {
  const sequelize = initModels();
  await sequelize.transaction(async (transaction) => {
    const project = await Project.findOne({ where: { id }, include, transaction, lock: transaction.LOCK.UPDATE });
    if (!project) throw new AppError('not_found', 'That project was not found.');
    authorizeProject(actor, 'delete', factsOf(project));
    await ProjectMembership.destroy({ where: { projectId: id }, transaction });
    await project.destroy({ transaction });
  });
}
