import 'server-only';
import { QueryTypes } from 'sequelize';
import { initModels, Project, User } from '../../db/models';
import { AppError } from '../errors';
import { authorizePublic, canOnSite, type Actor } from '../auth/policy';
import { builderFollowState } from './follows';
import type { BuilderProfile } from '../types/following';

/** A builder's public page: who they are and their published projects. */
export async function getBuilderProfile(actor: Actor, handle: string): Promise<BuilderProfile> {
  authorizePublic(actor, 'viewProfiles');
  const sequelize = initModels();
  const user = typeof handle === 'string' && handle.length <= 40 ? await User.findOne({ where: { handle }, attributes: ['id', 'name', 'handle', 'createdAt'] }) : null;
  if (!user) throw new AppError('not_found', 'That builder was not found.');
  const projects = await Project.findAll({
    where: { ownerId: user.id, visibility: 'published' },
    attributes: ['id', 'slug', 'title', 'summary', 'units', 'publishedAt'],
    order: [['publishedAt', 'DESC'], ['id', 'DESC']],
  });
  const ids = projects.map((p) => p.id);
  // Only sessions that are themselves published count: the profile is a public list.
  const counts = ids.length
    ? await sequelize.query<{ projectId: number; n: number; last: Date | null }>(
        "SELECT project_id AS projectId, COUNT(*) AS n, MAX(published_at) AS last FROM shop_sessions WHERE visibility = 'published' AND project_id IN (:ids) GROUP BY project_id",
        { replacements: { ids }, type: QueryTypes.SELECT },
      )
    : [];
  const byProject = new Map(counts.map((c) => [Number(c.projectId), c]));
  const isSelf = actor?.id === user.id;
  return {
    id: user.id,
    name: user.name,
    handle: user.handle,
    memberSince: user.createdAt.toISOString(),
    projects: projects.map((p) => {
      const c = byProject.get(p.id);
      return {
        id: p.id,
        slug: p.slug,
        title: p.title,
        summary: p.summary,
        units: p.units,
        publishedAt: p.publishedAt ? p.publishedAt.toISOString() : null,
        publishedSessions: c ? Number(c.n) : 0,
        lastPublishedAt: c?.last ? new Date(c.last).toISOString() : null,
      };
    }),
    follow: await builderFollowState(actor, user.handle),
    canFollow: canOnSite(actor, 'followBuilder') && !isSelf,
    isSelf,
  };
}
