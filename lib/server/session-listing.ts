import 'server-only';
import { canOnProject, type Actor, type ProjectFacts, type Visibility } from '../auth/policy';

const RANK: Record<Visibility, number> = { private: 0, unlisted: 1, published: 2 };

/**
 * Which session visibilities a viewer finds LISTED on a project's pages (timeline, measurements
 * table, CSV, counts). Reaching a session by its link is the policy's business (authorizeLog); a list
 * is stricter: a published project lists only its published sessions, an unlisted one its unlisted
 * and published ones. Whoever may see private sessions (the builder's circle) sees every session.
 * `null` means no filter.
 */
export function listedSessionVisibilities(actor: Actor, facts: ProjectFacts): Visibility[] | null {
  const { sessionVisibility: _s, ...project } = facts;
  if (canOnProject(actor, 'view', { ...project, sessionVisibility: 'private' })) return null;
  return (['unlisted', 'published'] as const).filter(
    (v) => RANK[v] >= RANK[project.visibility] && canOnProject(actor, 'view', { ...project, sessionVisibility: v }),
  );
}

/** A Sequelize where-fragment on shop_sessions for the viewer, or undefined when all are listed. */
export function listedSessionWhere(actor: Actor, facts: ProjectFacts): { visibility: Visibility[] } | undefined {
  const listed = listedSessionVisibilities(actor, facts);
  return listed ? { visibility: listed } : undefined;
}

/** Sessions the viewer may open at all (listed or not): for things reached through a link, like a fit's other half. */
export function viewableSessionWhere(actor: Actor, facts: ProjectFacts): { visibility: Visibility[] } | undefined {
  const { sessionVisibility: _s, ...project } = facts;
  if (canOnProject(actor, 'view', { ...project, sessionVisibility: 'private' })) return undefined;
  return { visibility: (['unlisted', 'published'] as const).filter((v) => canOnProject(actor, 'view', { ...project, sessionVisibility: v })) };
}
