// Who may do what: the one place the app decides. Pages, route handlers and server actions all ask here;
// the UI uses the same answers to hide what would be refused.
import { AppError, forbidden, notFound, unauthenticated } from '../http/errors';

export type SiteRole = 'member' | 'admin';
export type Visibility = 'private' | 'unlisted' | 'published';

export type Actor = { id: number; siteRole: SiteRole } | null;

/** What the policy needs to know of a project. */
export type ProjectFacts = {
  ownerId: number;
  visibility: Visibility;
  mentorIds: readonly number[];
};

// editLog: add, change, reorder or delete the project's sessions, entries, media and timestamped notes.
export const PROJECT_ACTIONS = ['view', 'update', 'delete', 'manageMentors', 'editLog'] as const;
export type ProjectAction = (typeof PROJECT_ACTIONS)[number];

export const SITE_ACTIONS = ['createProject', 'listOwnProjects', 'manageUsers'] as const;
export type SiteAction = (typeof SITE_ACTIONS)[number];

/** Actions open to everyone, signed in or not; listed so every route still asks the policy. */
export const PUBLIC_ACTIONS = ['useCalculators', 'readPublishedLogs'] as const;
export type PublicAction = (typeof PUBLIC_ACTIONS)[number];

export function canPublic(_actor: Actor, action: PublicAction): boolean {
  return (PUBLIC_ACTIONS as readonly string[]).includes(action);
}

export function authorizePublic(actor: Actor, action: PublicAction): void {
  if (!canPublic(actor, action)) throw forbidden();
}

/**
 * Local-development tools (the dev mailbox): open to anyone, signed in or not, but only where the
 * tools are switched on; elsewhere they do not exist (404).
 */
export const DEV_TOOL_ACTIONS = ['readDevMailbox'] as const;
export type DevToolAction = (typeof DEV_TOOL_ACTIONS)[number];
export type DevToolFacts = { devToolsEnabled: boolean };

export function canUseDevTool(_actor: Actor, action: DevToolAction, facts: DevToolFacts): boolean {
  return facts.devToolsEnabled && (DEV_TOOL_ACTIONS as readonly string[]).includes(action);
}

export function authorizeDevTool(actor: Actor, action: DevToolAction, facts: DevToolFacts): void {
  if (!canUseDevTool(actor, action, facts)) throw notFound('That page');
}

export type ProjectRelation = 'anonymous' | 'member' | 'mentor' | 'owner' | 'admin';

/** The strongest relation an actor has to a project (an admin who owns a project is its owner). */
export function relationTo(actor: Actor, project: ProjectFacts): ProjectRelation {
  if (!actor) return 'anonymous';
  if (actor.id === project.ownerId) return 'owner';
  if (actor.siteRole === 'admin') return 'admin';
  if (project.mentorIds.includes(actor.id)) return 'mentor';
  return 'member';
}

const PROJECT_RULES: Record<ProjectAction, (r: ProjectRelation, p: ProjectFacts) => boolean> = {
  // Unlisted and published projects are open to anyone with the link; private ones to the builder's circle.
  view: (r, p) => p.visibility !== 'private' || r === 'owner' || r === 'mentor' || r === 'admin',
  update: (r) => r === 'owner',
  // Admins may remove a project that breaks the community's rules.
  delete: (r) => r === 'owner' || r === 'admin',
  manageMentors: (r) => r === 'owner',
  editLog: (r) => r === 'owner',
};

export function canOnProject(actor: Actor, action: ProjectAction, project: ProjectFacts): boolean {
  return PROJECT_RULES[action](relationTo(actor, project), project);
}

export function canOnSite(actor: Actor, action: SiteAction): boolean {
  if (!actor) return false;
  if (action === 'manageUsers') return actor.siteRole === 'admin';
  return true;
}

/**
 * Throws the error a client should see: a private project is a 404 to whoever may not view it;
 * changing anything needs a signed-in actor (401); a visible project that is not theirs is a 403.
 */
export function authorizeProject(actor: Actor, action: ProjectAction, project: ProjectFacts): void {
  if (canOnProject(actor, action, project)) return;
  if (action !== 'view' && !actor) throw unauthenticated('change this project');
  if (!canOnProject(actor, 'view', project)) throw notFound('That project');
  throw forbidden(action === 'delete' ? 'Only the builder can delete this project.' : action === 'editLog' ? 'Only the builder can change this log.' : 'Only the builder can change this project.');
}

export function authorizeSite(actor: Actor, action: SiteAction): asserts actor is NonNullable<Actor> {
  if (canOnSite(actor, action)) return;
  if (!actor) throw unauthenticated(action === 'createProject' ? 'start a project' : 'continue');
  throw forbidden(action === 'manageUsers' ? 'Only an admin can manage accounts.' : 'You are not allowed to do that.');
}

export function isAppError(e: unknown): e is AppError {
  return e instanceof AppError;
}
