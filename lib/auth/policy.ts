// Who may do what: the one place the app decides. Pages, route handlers and server actions all ask here;
// the UI uses the same answers to hide what would be refused.
//
// The rules are one matrix, PERMISSIONS: every action of the product × every relation a person can have
// to what they act on (anonymous, member, follower, mentor, owner, admin). A cell is `true`, `false`, or
// a list of conditions on the target that must all hold (its visibility, who wrote it).
import { forbidden, notFound, unauthenticated } from '../errors';
import type { Visibility } from '../types/visibility';

export type SiteRole = 'member' | 'admin';
export type { Visibility };

/**
 * Who acts. `emailVerified` comes from the account row (findActor); anything but `true` counts as an
 * address not yet verified, which VERIFIED_ONLY actions refuse.
 */
export type Actor = { id: number; siteRole: SiteRole; emailVerified?: boolean } | null;

export const RELATIONS = ['anonymous', 'member', 'follower', 'mentor', 'owner', 'admin'] as const;
export type Relation = (typeof RELATIONS)[number];

/** What the policy needs to know of a project, and optionally of the piece of it acted on. */
export type ProjectFacts = {
  ownerId: number;
  visibility: Visibility;
  mentorIds: readonly number[];
  /** Members known to follow the project or its builder (loaders fill in at least the actor). */
  followerIds?: readonly number[];
  /** The session acted on, if any: its own visibility, capped by the project's. */
  sessionVisibility?: Visibility;
  /** Who wrote the comment or flag acted on, if any. */
  authorId?: number;
};

/**
 * Conditions a cell can require of the target:
 * - visible: not private (the project, and the session if one is named);
 * - published: published (the project, and the session if one is named);
 * - author: the actor wrote the comment or flag acted on.
 */
export type Condition = 'visible' | 'published' | 'author';
export type Cell = boolean | readonly Condition[];
type Row = Record<Relation, Cell>;

const circle = (others: Cell): Row => ({ anonymous: others, member: others, follower: others, mentor: true, owner: true, admin: true });
const only = (...who: Relation[]): Row =>
  Object.fromEntries(RELATIONS.map((r) => [r, who.includes(r)])) as Row;
const signedIn = (cell: Cell, except: Relation[] = []): Row =>
  Object.fromEntries(RELATIONS.map((r) => [r, r === 'anonymous' || except.includes(r) ? false : cell])) as Row;
const everyone: Row = { anonymous: true, member: true, follower: true, mentor: true, owner: true, admin: true };

export const PROJECT_ACTIONS = [
  'view', 'update', 'publish', 'delete', 'manageMentors', 'editLog',
  'follow', 'comment', 'editOwnComment', 'hideComment', 'reportComment', 'flagRisk', 'editOwnFlag', 'answerFlag', 'exportProject',
  'printSheet',
] as const;
export type ProjectAction = (typeof PROJECT_ACTIONS)[number];

// Site actions concern no project: follower, mentor and owner are relations to a project, so for
// these a signed-in member has the member column.
export const SITE_ACTIONS = ['createProject', 'listOwnProjects', 'manageOwnSettings', 'followBuilder', 'acceptInvitation', 'manageUsers', 'moderateComments', 'importProject'] as const;
export type SiteAction = (typeof SITE_ACTIONS)[number];

/** Actions open to everyone, signed in or not; listed so every route still asks the policy. */
export const PUBLIC_ACTIONS = ['useCalculators', 'readPublishedLogs', 'viewProfiles', 'search', 'checkHealth', 'describeViewer'] as const;
export type PublicAction = (typeof PUBLIC_ACTIONS)[number];

export type Action = ProjectAction | SiteAction | PublicAction;

/** The whole product's permissions. */
export const PERMISSIONS: Record<Action, Row> = {
  // Project and its log. Unlisted is open to anyone with the link; private to the builder's circle.
  view: circle(['visible']),
  update: only('owner'),
  publish: only('owner'),
  // Admins may remove a project that breaks the community's rules.
  delete: only('owner', 'admin'),
  manageMentors: only('owner'),
  editLog: only('owner'),
  // Following: anyone signed in who can see it, except its builder.
  follow: signedIn(['visible'], ['owner']),
  // Comments: on published entries only; the author edits or deletes their own; the builder and admins hide.
  comment: signedIn(['published']),
  editOwnComment: signedIn(['visible', 'author']),
  hideComment: only('owner', 'admin'),
  // Anyone signed in who can read a comment may report it to the admins (not their own: the server says so).
  reportComment: signedIn(['visible']),
  // Risk flags: mentors raise them and may change or withdraw their own; the builder answers.
  flagRisk: only('mentor'),
  editOwnFlag: { ...only(), mentor: ['author'] },
  answerFlag: only('owner'),
  // The whole project as one archive (private sessions, every file): the builder's own copy.
  exportProject: only('owner'),
  // A session's shop sheet (limits, saved set-ups, open flags): for the builder's circle, whatever the visibility.
  printSheet: circle(false),
  // Site.
  createProject: signedIn(true),
  listOwnProjects: signedIn(true),
  manageOwnSettings: signedIn(true),
  followBuilder: signedIn(true),
  acceptInvitation: signedIn(true),
  manageUsers: only('admin'),
  // The admins' list of reported and hidden comments, and dismissing reports.
  moderateComments: only('admin'),
  // Bringing an archive back makes a new private project of the member's own.
  importProject: signedIn(true),
  // Public.
  useCalculators: everyone,
  readPublishedLogs: everyone,
  viewProfiles: everyone,
  // Searching across logs: everyone; what it finds is the listing rule (lib/server/search.ts), never more.
  search: everyone,
  // Liveness and readiness for the operator's probes: up or down per dependency, no addresses or errors.
  checkHealth: everyone,
  // Who is signed in, for the islands of a page cached for everyone (null for a signed-out visitor).
  describeViewer: everyone,
};

/**
 * Actions that reach other people (they see the comment, get mail, join a project's circle): they also
 * need an address its owner has verified, checked on top of the matrix for every relation.
 */
export const VERIFIED_ONLY: readonly Action[] = ['comment', 'follow', 'followBuilder', 'acceptInvitation'];

export const VERIFY_FIRST_MESSAGE =
  'Verify your e-mail address first: follow the link we sent you, or send the link again from your settings (/settings).';

/** Whether the actor is signed in with an address not yet verified and the action needs one. */
export function needsVerifiedAddress(actor: Actor, action: Action): boolean {
  return actor !== null && actor.emailVerified !== true && VERIFIED_ONLY.includes(action);
}

function effectiveVisibility(p: ProjectFacts): Visibility {
  const order: Visibility[] = ['private', 'unlisted', 'published'];
  if (!p.sessionVisibility) return p.visibility;
  return order[Math.min(order.indexOf(p.visibility), order.indexOf(p.sessionVisibility))];
}

function holds(cell: Cell, actor: Actor, p: ProjectFacts | null): boolean {
  if (typeof cell === 'boolean') return cell;
  return cell.every((c) => {
    if (!p) return false;
    if (c === 'visible') return effectiveVisibility(p) !== 'private';
    if (c === 'published') return effectiveVisibility(p) === 'published';
    return actor !== null && p.authorId === actor.id;
  });
}

/** The strongest relation an actor has to a project (an admin who owns a project is its owner). */
export function relationTo(actor: Actor, project: ProjectFacts): Relation {
  if (!actor) return 'anonymous';
  if (actor.id === project.ownerId) return 'owner';
  if (actor.siteRole === 'admin') return 'admin';
  if (project.mentorIds.includes(actor.id)) return 'mentor';
  if (project.followerIds?.includes(actor.id)) return 'follower';
  return 'member';
}

function siteRelation(actor: Actor): Relation {
  if (!actor) return 'anonymous';
  return actor.siteRole === 'admin' ? 'admin' : 'member';
}

/**
 * Whether following the project changes what this action allows, so a caller need not look the
 * follow up when it cannot matter (today a follower has a member's rights; following brings mail).
 */
export function followingMatters(action: ProjectAction): boolean {
  return JSON.stringify(PERMISSIONS[action].follower) !== JSON.stringify(PERMISSIONS[action].member);
}

export function canOnProject(actor: Actor, action: ProjectAction, project: ProjectFacts): boolean {
  if (needsVerifiedAddress(actor, action)) return false;
  return holds(PERMISSIONS[action][relationTo(actor, project)], actor, project);
}

export function canOnSite(actor: Actor, action: SiteAction): boolean {
  if (needsVerifiedAddress(actor, action)) return false;
  return holds(PERMISSIONS[action][siteRelation(actor)], actor, null);
}

export function canPublic(actor: Actor, action: PublicAction): boolean {
  return holds(PERMISSIONS[action][siteRelation(actor)], actor, null);
}

export function authorizePublic(actor: Actor, action: PublicAction): void {
  if (!canPublic(actor, action)) throw forbidden();
}

const REFUSALS: Partial<Record<ProjectAction, string>> = {
  delete: 'Only the builder can delete this project.',
  editLog: 'Only the builder can change this log.',
  publish: 'Only the builder can publish or hide this log.',
  manageMentors: 'Only the builder can invite or remove mentors.',
  follow: 'You cannot follow your own project.',
  comment: 'Comments open once the session is published.',
  editOwnComment: 'Only its author can change this comment.',
  hideComment: 'Only the builder or an admin can hide comments.',
  flagRisk: 'Only a mentor of this project can flag a risk.',
  editOwnFlag: 'Only the mentor who raised this flag can change it.',
  answerFlag: 'Only the builder can answer a risk flag.',
  exportProject: 'Only the builder can download this project’s archive.',
  printSheet: 'Shop sheets are for the builder and the project’s mentors.',
};

const SIGN_IN_TO: Partial<Record<ProjectAction, string>> = {
  follow: 'follow this project',
  comment: 'comment',
  editOwnComment: 'change a comment',
  reportComment: 'report a comment',
  exportProject: 'download this project’s archive',
  printSheet: 'print a shop sheet',
};

/**
 * Throws the error a client should see: a private project (or session) is a 404 to whoever may not view
 * it; anything but viewing needs a signed-in actor (401); a visible thing that is not theirs is a 403.
 */
export function authorizeProject(actor: Actor, action: ProjectAction, project: ProjectFacts): void {
  if (canOnProject(actor, action, project)) return;
  if (action !== 'view' && !actor) throw unauthenticated(SIGN_IN_TO[action] ?? 'change this project');
  if (!canOnProject(actor, 'view', project)) throw notFound(project.sessionVisibility ? 'That session' : 'That project');
  if (needsVerifiedAddress(actor, action) && holds(PERMISSIONS[action][relationTo(actor, project)], actor, project)) throw forbidden(VERIFY_FIRST_MESSAGE);
  throw forbidden(REFUSALS[action] ?? 'Only the builder can change this project.');
}

export function authorizeSite(actor: Actor, action: SiteAction): asserts actor is NonNullable<Actor> {
  if (canOnSite(actor, action)) return;
  if (!actor) throw unauthenticated(action === 'createProject' ? 'start a project' : action === 'importProject' ? 'bring in an archive' : 'continue');
  if (needsVerifiedAddress(actor, action)) throw forbidden(VERIFY_FIRST_MESSAGE);
  if (action === 'moderateComments') throw forbidden('Only an admin can review reported comments.');
  throw forbidden(action === 'manageUsers' ? 'Only an admin can manage accounts.' : 'You are not allowed to do that.');
}

/**
 * Local-development tools (the dev mailbox): only where the tools are explicitly switched on, and then
 * only for signed-in admins; to anyone else, and everywhere else, they do not exist (404).
 */
export const DEV_TOOL_ACTIONS = ['readDevMailbox'] as const;
export type DevToolAction = (typeof DEV_TOOL_ACTIONS)[number];
export type DevToolFacts = { devToolsEnabled: boolean };

export function canUseDevTool(actor: Actor, action: DevToolAction, facts: DevToolFacts): boolean {
  return facts.devToolsEnabled && actor?.siteRole === 'admin' && (DEV_TOOL_ACTIONS as readonly string[]).includes(action);
}

export function authorizeDevTool(actor: Actor, action: DevToolAction, facts: DevToolFacts): void {
  if (!canUseDevTool(actor, action, facts)) throw notFound('That page');
}
