import 'server-only';
import { initModels, Project, ProjectMembership } from '../../db/models';
import { authorizePublic, canOnSite, type Actor } from '../auth/policy';
import type { ViewerCopy, ViewerView } from '../types/viewer';

/**
 * Which copy of a published log's pages suits this member. Everything a member outside a project's circle
 * sees there is what a signed-out reader sees, plus their own controls (account corner, follow buttons,
 * comment form and comment permissions), which the browser asks for: so they are given the copy cached for
 * everyone ('shared'). A builder (any project of their own), a mentor or an admin sees more on some of those
 * pages (edit links, flags to raise, private sessions, hidden comments): their own copy ('own').
 */
export async function viewerCopyOf(userId: number, siteRole: string): Promise<ViewerCopy> {
  if (siteRole === 'admin') return 'own';
  initModels();
  const [owns, mentors] = await Promise.all([
    Project.findOne({ where: { ownerId: userId }, attributes: ['id'] }),
    ProjectMembership.findOne({ where: { userId, role: 'mentor' }, attributes: ['id'] }),
  ]);
  return owns || mentors ? 'own' : 'shared';
}

/** The signed-in member as their browser shows them on a shared copy, or null for a signed-out visitor. */
export async function describeViewer(actor: (Actor & { name: string; handle: string | null }) | null): Promise<ViewerView | null> {
  authorizePublic(actor, 'describeViewer');
  if (!actor) return null;
  return {
    name: actor.name,
    handle: actor.handle,
    verified: actor.emailVerified === true,
    manageUsers: canOnSite(actor, 'manageUsers'),
    copy: await viewerCopyOf(actor.id, actor.siteRole),
  };
}
