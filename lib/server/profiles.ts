import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { initModels, Project, User } from '../../db/models';
import { AppError } from '../errors';
import { authorizePublic, canOnSite, type Actor } from '../auth/policy';
import { builderFollowStateOf } from './follows';
import type { BuilderProfile } from '../types/following';

/** Published projects on one page of a profile (newest first; `nextCursor` leads on). */
export const PROFILE_PAGE_SIZE = 24;

type Cursor = { t: string; id: number };

function readCursor(after: unknown): Cursor | null {
  if (typeof after !== 'string' || !after || after.length > 80) return null;
  try {
    const c = JSON.parse(Buffer.from(after, 'base64url').toString('utf8')) as Cursor;
    return typeof c.t === 'string' && !Number.isNaN(Date.parse(c.t)) && Number.isInteger(c.id) && c.id > 0 ? c : null;
  } catch {
    return null;
  }
}

const writeCursor = (c: Cursor) => Buffer.from(JSON.stringify(c)).toString('base64url');

/**
 * A builder's public page: who they are and one page of their published projects, keyset-paged on
 * (published_at, id) newest first, so a builder with thousands of projects costs the same as one with a few.
 * A cursor that cannot be read is a 400 naming `after`.
 */
export async function getBuilderProfile(actor: Actor, handle: string, after?: string | null): Promise<BuilderProfile> {
  authorizePublic(actor, 'viewProfiles');
  const sequelize = initModels();
  const user = typeof handle === 'string' && handle.length <= 40 ? await User.findOne({ where: { handle }, attributes: ['id', 'name', 'handle', 'createdAt'] }) : null;
  if (!user) throw new AppError('not_found', 'That builder was not found.');
  const cursor = after ? readCursor(after) : null;
  if (after && !cursor) throw new AppError('validation', 'That page of projects could not be read.', { after: ['Start again from the first page.'] });
  // The page of projects and the follow state together: neither needs the other.
  const [page, follow] = await Promise.all([
    Project.findAll({
      where: {
        ownerId: user.id,
        visibility: 'published',
        publishedAt: { [Op.ne]: null },
        ...(cursor
          ? { [Op.or]: [{ publishedAt: { [Op.lt]: new Date(cursor.t) } }, { publishedAt: new Date(cursor.t), id: { [Op.lt]: cursor.id } }] }
          : {}),
      },
      attributes: ['id', 'slug', 'title', 'summary', 'units', 'publishedAt'],
      order: [['publishedAt', 'DESC'], ['id', 'DESC']],
      limit: PROFILE_PAGE_SIZE + 1,
    }),
    builderFollowStateOf(actor, user.id),
  ]);
  const projects = page.slice(0, PROFILE_PAGE_SIZE);
  const last = projects[projects.length - 1];
  const nextCursor = page.length > PROFILE_PAGE_SIZE && last ? writeCursor({ t: last.publishedAt!.toISOString(), id: last.id }) : null;
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
    nextCursor,
    follow,
    canFollow: canOnSite(actor, 'followBuilder') && !isSelf,
    isSelf,
  };
}
