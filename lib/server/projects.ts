import 'server-only';
import { createHash } from 'node:crypto';
import { z } from 'zod';
import { literal, Op, type Transaction, type WhereOptions } from 'sequelize';
import { initModels, Project, ProjectMembership, RiskFlag, ShopSession, User } from '../../db/models';
import { getSequelize, withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import { authorizeProject, authorizePublic, authorizeSite, canOnProject, type Actor, type ProjectFacts } from '../auth/policy';
import { expireAfterCommit } from './log-scope';
import { afterCursor, pageOf, readCursor } from './keyset';
import { projectInputSchema, projectUpdateSchema, type ProjectInput, type ProjectUpdate } from '../validations/project';
import { slugify } from '../slug';
import { announcePublishedSessions } from './publishing';
import { projectFileKeys } from './media';
import { deleteStoredFiles, queueFileDeletions } from './upload-service';
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

/** Projects on one page of "My projects" and "Projects you mentor" (most recently changed first). */
export const OWN_PROJECTS_PER_PAGE = 24;

export type ProjectPage = { projects: ProjectView[]; nextCursor: string | null };

/** One page, keyset on (updated_at, id) newest first: index projects(owner_id, updated_at) for the builder's own. */
async function projectPage(actor: Actor, where: WhereOptions, after: unknown): Promise<ProjectPage> {
  const cursor = readCursor(after, 'time');
  const rows = await Project.findAll({
    where: { [Op.and]: [where, afterCursor('updatedAt', cursor, 'DESC')] },
    include,
    order: [['updatedAt', 'DESC'], ['id', 'DESC']],
    limit: OWN_PROJECTS_PER_PAGE + 1,
  });
  const { items, nextCursor } = pageOf(rows, OWN_PROJECTS_PER_PAGE, (p) => p.updatedAt);
  return { projects: items.map((p) => toView(p, actor)), nextCursor };
}

/** The builder's own projects, a page at a time (`after`: the last page's `nextCursor`; an unreadable one is a 400 naming `after`). */
export async function listMyProjects(actor: Actor, after?: unknown): Promise<ProjectPage> {
  authorizeSite(actor, 'listOwnProjects');
  initModels();
  return projectPage(actor, { ownerId: actor.id }, after);
}

/** Projects where the actor is a mentor, a page at a time. */
export async function listMentoredProjects(actor: Actor, after?: unknown): Promise<ProjectPage> {
  authorizeSite(actor, 'listOwnProjects');
  initModels();
  const mentoring = literal(`(SELECT m.project_id FROM project_memberships m WHERE m.user_id = ${getSequelize().escape(actor.id)} AND m.role = 'mentor')`);
  return projectPage(actor, { id: { [Op.in]: mentoring } }, after);
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

/** The title's slug, or the first free "-2", "-3"… after it. */
export async function freeSlug(title: string, transaction: Transaction): Promise<string> {
  const base = slugify(title, 80) || 'project';
  for (let n = 1; ; n++) {
    const candidate = n === 1 ? base : `${base}-${n}`;
    if (!(await Project.count({ where: { slug: candidate }, transaction }))) return candidate;
  }
}

/**
 * A client-made id for one "create this project" submit (a UUID suits), sent as `requestId` in the body or
 * as the `Idempotency-Key` header: sending the same submit again gives the project the first one made.
 */
export const CREATE_REQUEST_ID_FIELD = 'requestId';
export const CREATE_REQUEST_ID_HEADER = 'Idempotency-Key';
const requestIdSchema = z
  .string({ error: 'The request id must be text.' })
  .trim()
  .min(8, 'The request id needs at least 8 characters (a UUID suits).')
  .max(100, 'Keep the request id under 100 characters.')
  .regex(/^[A-Za-z0-9._:-]+$/, 'The request id may hold only letters, digits and . _ : -');

function requestIdOf(input: unknown, header: string | null | undefined): string | null {
  const fromBody = typeof input === 'object' && input !== null ? (input as Record<string, unknown>)[CREATE_REQUEST_ID_FIELD] : undefined;
  const given = [fromBody, header].filter((v) => v !== undefined && v !== null && v !== '');
  if (!given.length) return null;
  const ids = given.map((v) => {
    const parsed = requestIdSchema.safeParse(v);
    if (!parsed.success) {
      const message = parsed.error.issues[0]?.message ?? 'The request id could not be read.';
      throw new AppError('validation', `Please check requestId: ${message}`, { requestId: [message] });
    }
    return parsed.data;
  });
  if (ids.length === 2 && ids[0] !== ids[1]) {
    const message = `The body's requestId and the ${CREATE_REQUEST_ID_HEADER} header differ; send one of them.`;
    throw new AppError('validation', `Please check requestId: ${message}`, { requestId: [message] });
  }
  return ids[0]!;
}

const requestHash = (data: ProjectInput) => createHash('sha256').update(JSON.stringify([data.title, data.summary, data.units, data.visibility])).digest('hex');

export type ProjectCreated = { project: ProjectView; created: boolean };

/**
 * Creates a project, once per request id. Parallel creates with the same title each get their own slug
 * (the one that loses the race for a slug runs again and picks the next); parallel or repeated creates
 * with the same request id give one project (created: false for the repeats). The same id with a
 * different title, summary, units or visibility is refused (409): it names another submit.
 */
export async function createProjectOnce(actor: Actor, input: unknown, headerRequestId?: string | null): Promise<ProjectCreated> {
  authorizeSite(actor, 'createProject');
  const data: ProjectInput = projectInputSchema.parse(input);
  const requestId = requestIdOf(input, headerRequestId);
  const hash = requestId ? requestHash(data) : null;
  initModels();
  return withTransaction(
    async (transaction) => {
      if (requestId) {
        const earlier = await Project.findOne({ where: { ownerId: actor.id, createRequestId: requestId }, include, transaction });
        if (earlier) {
          if (earlier.createRequestHash !== hash) {
            const message = `This request id already created “${earlier.title}”; a different project needs a new request id (reload the form).`;
            throw new AppError('conflict', message, { requestId: [message] });
          }
          return { project: toView(earlier, actor), created: false };
        }
      }
      const project = await Project.create(
        {
          ownerId: actor.id,
          slug: await freeSlug(data.title, transaction),
          title: data.title,
          summary: data.summary,
          units: data.units,
          visibility: data.visibility,
          publishedAt: data.visibility === 'published' ? new Date() : null,
          createRequestId: requestId,
          createRequestHash: hash,
        },
        { transaction },
      );
      // The answer is read inside the transaction: a project that was created is never reported as failed.
      const made = (await loadProject({ id: project.id }, transaction))!;
      return { project: toView(made, actor), created: true };
    },
    // A slug or request id taken by a parallel create: run again, with a fresh view of what is taken.
    { retryOnUnique: true, retries: 12 },
  );
}

export async function updateProject(actor: Actor, id: number, input: unknown): Promise<ProjectView> {
  const data: ProjectUpdate = projectUpdateSchema.parse(input);
  const sequelize = initModels();
  const saved = await sequelize.transaction(async (transaction) => {
    const project = await Project.findOne({ where: { id }, include, transaction, lock: transaction.LOCK.UPDATE });
    if (!project) throw new AppError('not_found', 'That project was not found.');
    authorizeProject(actor, 'update', factsOf(project));
    expireAfterCommit(transaction, project.id, project.ownerId);
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
    return project;
  });
  // Built from what was written, not a read after the commit: a saved change is never reported as failed.
  return toView(saved, actor);
}

export async function deleteProject(actor: Actor, id: number): Promise<void> {
  const sequelize = initModels();
  const fileKeys = await sequelize.transaction(async (transaction) => {
    const project = await Project.findOne({ where: { id }, include, transaction, lock: transaction.LOCK.UPDATE });
    if (!project) throw new AppError('not_found', 'That project was not found.');
    authorizeProject(actor, 'delete', factsOf(project));
    expireAfterCommit(transaction, project.id, project.ownerId);
    const keys = await projectFileKeys(id, transaction);
    await ProjectMembership.destroy({ where: { projectId: id }, transaction });
    await project.destroy({ transaction });
    return queueFileDeletions(keys, transaction);
  });
  // After the commit, as for a session: a failure (or a crash before it) leaves the files queued for the clean-up.
  await deleteStoredFiles(fileKeys);
}
