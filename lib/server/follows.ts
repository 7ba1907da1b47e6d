import 'server-only';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { initModels, Follow, Project, ProjectMembership, User } from '../../db/models';
import { getSequelize, withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import { authorizeSite, canOnProject, type Actor } from '../auth/policy';
import { authorizeLog } from './log-scope';
import { afterCursor, pageOf, readCursor } from './keyset';
import { builderTag, expireTags, projectTag } from './cache-tags';
import { factsOf } from './projects';
import { followMailSchema, handleSchema, unsubscribeSchema } from '../validations/following';
import { readUnsubscribeToken } from './unsubscribe';
import type { FollowState, FollowView, UnsubscribeTarget } from '../types/following';

const followNotFound = () => new AppError('not_found', 'That follow was not found.');

async function stateOf(where: { projectId: number } | { builderId: number }, actor: Actor, transaction?: Transaction): Promise<FollowState> {
  // The count and the viewer's own follow in one read.
  const [column, id] = 'projectId' in where ? ['project_id', where.projectId] : ['builder_id', where.builderId];
  const [row] = await getSequelize().query<{ followers: number; mine: number | null; mail: number | null }>(
    `SELECT COUNT(*) AS followers, MAX(CASE WHEN user_id = :userId THEN id END) AS mine, MAX(CASE WHEN user_id = :userId THEN mail END) AS mail
       FROM follows WHERE ${column} = :id`,
    { type: QueryTypes.SELECT, replacements: { id, userId: actor?.id ?? 0 }, transaction },
  );
  const mine = row?.mine == null ? null : Number(row.mine);
  return { following: mine !== null, followId: mine, mail: mine !== null && Number(row.mail) === 1, followers: Number(row?.followers ?? 0) };
}

/** The follow state of a project whose view the caller has already authorized. */
export function projectFollowStateOf(actor: Actor, projectId: number): Promise<FollowState> {
  return stateOf({ projectId }, actor);
}

/** The follow state of a builder the caller has already found (their public profile). */
export function builderFollowStateOf(actor: Actor, builderId: number): Promise<FollowState> {
  return stateOf({ builderId }, actor);
}

/** The viewer's follow of a project, for its follow button. */
export async function projectFollowState(actor: Actor, projectId: number): Promise<FollowState> {
  await authorizeLog(actor, 'view', { projectId });
  return stateOf({ projectId }, actor);
}

async function builderByHandle(handle: unknown): Promise<User> {
  initModels();
  const parsed = handleSchema.safeParse(handle);
  const user = parsed.success ? await User.findOne({ where: { handle: parsed.data }, attributes: ['id', 'name', 'handle'] }) : null;
  if (!user) throw new AppError('not_found', 'That builder was not found.');
  return user;
}

/** The viewer's follow of a builder. */
export async function builderFollowState(actor: Actor, handle: string): Promise<FollowState> {
  const builder = await builderByHandle(handle);
  return stateOf({ builderId: builder.id }, actor);
}

/**
 * The member's follow of a project or builder, made if missing. The same follow sent several times at once
 * is still one row (unique per member and target): the request that loses the race on the unique key runs
 * again in a fresh transaction and finds the row the winner committed, so every one of them succeeds.
 */
async function ensureFollow(
  target: { projectId: number } | { builderId: number },
  userId: number,
  transaction: Transaction,
): Promise<boolean> {
  const where = { ...target, userId };
  if (await Follow.findOne({ where, attributes: ['id'], transaction })) return false;
  await Follow.create({ projectId: null, builderId: null, ...target, userId, mail: true }, { transaction });
  return true;
}

/** Follows a project (idempotent). `created` tells a new follow from one that existed. */
export async function followProject(actor: Actor, projectId: number): Promise<{ created: boolean; state: FollowState }> {
  initModels();
  return withTransaction(
    async (transaction) => {
      await authorizeLog(actor, 'follow', { projectId }, transaction);
      const created = await ensureFollow({ projectId }, actor!.id, transaction);
      return { created, state: await stateOf({ projectId }, actor, transaction) };
    },
    { retryOnUnique: true },
  );
}

export async function unfollowProject(actor: Actor, projectId: number): Promise<void> {
  authorizeSite(actor, 'manageOwnSettings');
  initModels();
  const removed = await Follow.destroy({ where: { userId: actor.id, projectId } });
  // Nothing to remove: answer as a read would, so a private project's id reveals nothing.
  if (!removed) await authorizeLog(actor, 'view', { projectId });
  // The follower count on the cached public page.
  else expireTags(projectTag(projectId));
}

export async function followBuilder(actor: Actor, handle: string): Promise<{ created: boolean; state: FollowState }> {
  authorizeSite(actor, 'followBuilder');
  const builder = await builderByHandle(handle);
  if (builder.id === actor.id) {
    throw new AppError('validation', 'You cannot follow yourself: your own sessions are already on your projects page.', { handle: ['You cannot follow yourself.'] });
  }
  return withTransaction(
    async (transaction) => {
      const created = await ensureFollow({ builderId: builder.id }, actor.id, transaction);
      // The follower count on the cached public profile.
      transaction.afterCommit(() => expireTags(builderTag(builder.id)));
      return { created, state: await stateOf({ builderId: builder.id }, actor, transaction) };
    },
    { retryOnUnique: true },
  );
}

export async function unfollowBuilder(actor: Actor, handle: string): Promise<void> {
  authorizeSite(actor, 'manageOwnSettings');
  const builder = await builderByHandle(handle);
  if (await Follow.destroy({ where: { userId: actor.id, builderId: builder.id } })) expireTags(builderTag(builder.id));
}

/** Follows on one page of the member's settings (newest first). */
export const FOLLOWS_PER_PAGE = 50;

const followInclude = [
  {
    model: Project,
    as: 'project',
    attributes: ['id', 'slug', 'title', 'ownerId', 'visibility'],
    include: [
      { model: User, as: 'owner', attributes: ['id', 'name'] },
      { model: ProjectMembership, as: 'memberships', attributes: ['userId', 'role'] },
    ],
  },
  { model: User, as: 'builder', attributes: ['id', 'name', 'handle'] },
];

/**
 * What the member follows, newest first, a page at a time: keyset on (created_at, id) (index follows_user_created).
 * `after` is the last page's `nextCursor`; one that cannot be read is a 400 naming `after`.
 */
export async function listMyFollows(actor: Actor, after?: unknown): Promise<{ follows: FollowView[]; nextCursor: string | null }> {
  authorizeSite(actor, 'manageOwnSettings');
  initModels();
  const cursor = readCursor(after, 'time');
  const rows = await Follow.findAll({
    where: { userId: actor.id, ...afterCursor('createdAt', cursor, 'DESC') },
    include: followInclude,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: FOLLOWS_PER_PAGE + 1,
  });
  const { items, nextCursor } = pageOf(rows, FOLLOWS_PER_PAGE, (f) => f.createdAt);
  return { follows: items.map((f) => toFollowView(f, actor)), nextCursor };
}

function toFollowView(f: Follow, actor: Actor): FollowView {
  const p = f.project;
  // A project made private since is no longer shared with the member: keep the row, not its name.
  const visible = p ? canOnProject(actor, 'view', { ...factsOf(p), followerIds: [actor!.id] }) : false;
  return {
    id: f.id,
    kind: f.projectId ? 'project' : 'builder',
    mail: f.mail,
    createdAt: f.createdAt.toISOString(),
    project: p ? { id: p.id, slug: p.slug, title: visible ? p.title : null, builderName: visible ? p.owner?.name ?? null : null } : null,
    builder: f.builder ? { id: f.builder.id, name: f.builder.name, handle: f.builder.handle } : null,
  };
}

async function myFollow(actor: NonNullable<Actor>, followId: number): Promise<Follow> {
  initModels();
  const f = await Follow.findOne({ where: { id: followId, userId: actor.id } });
  // Someone else's follow is "not found" to you, not "forbidden": its existence is none of your business.
  if (!f) throw followNotFound();
  return f;
}

export async function setFollowMail(actor: Actor, followId: number, input: unknown): Promise<FollowView> {
  authorizeSite(actor, 'manageOwnSettings');
  const { mail } = followMailSchema.parse(input);
  const f = await myFollow(actor, followId);
  await f.update({ mail });
  const row = await Follow.findByPk(f.id, { include: followInclude });
  return toFollowView(row!, actor);
}

/** Switches the mail of every follow of the member on or off. Returns how many changed. */
export async function setAllFollowMail(actor: Actor, input: unknown): Promise<{ changed: number }> {
  authorizeSite(actor, 'manageOwnSettings');
  const { mail } = followMailSchema.parse(input);
  initModels();
  const [changed] = await Follow.update({ mail }, { where: { userId: actor.id, mail: !mail } });
  return { changed };
}

export async function deleteFollow(actor: Actor, followId: number): Promise<void> {
  authorizeSite(actor, 'manageOwnSettings');
  const f = await myFollow(actor, followId);
  await f.destroy();
}

// ── Unsubscribe links ─────────────────────────────────────────────────────────────────────────
// The signed token is the credential here (the reader may be signed out, or signed in as someone
// else on a shared computer): it names one follow of one member and can only switch its mail off.

const badLink = () =>
  new AppError('validation', 'This unsubscribe link is not valid: it may have been cut short or changed. Use the link from the e-mail as it is, or switch e-mail off in your settings.', {
    token: ['This link is not valid.'],
  });

async function followOfToken(token: unknown): Promise<Follow> {
  const read = readUnsubscribeToken(token);
  if (!read) throw badLink();
  initModels();
  const f = await Follow.findOne({
    where: { id: read.followId, userId: read.userId },
    include: [
      { model: Project, as: 'project', attributes: ['id', 'title', 'ownerId'] },
      { model: User, as: 'builder', attributes: ['id', 'name'] },
    ],
  });
  if (!f) throw new AppError('not_found', 'You no longer follow this, so there is nothing to switch off. Manage what you follow in your settings.');
  return f;
}

async function describe(f: Follow): Promise<UnsubscribeTarget> {
  // The same sessions can also reach the member through their other follow (project ↔ its builder).
  const ownerId = f.project?.ownerId ?? f.builderId!;
  const others = await Follow.findAll({
    where: {
      userId: f.userId,
      mail: true,
      id: { [Op.ne]: f.id },
      ...(f.projectId ? { builderId: ownerId } : {}),
    },
    include: [
      { model: Project, as: 'project', attributes: ['id', 'title', 'ownerId', 'visibility'] },
      { model: User, as: 'builder', attributes: ['id', 'name'] },
    ],
  });
  const other = others.find((o) => (f.projectId ? o.builderId === ownerId : o.project?.ownerId === ownerId && o.project.visibility !== 'private'));
  return {
    followId: f.id,
    kind: f.projectId ? 'project' : 'builder',
    name: f.projectId ? f.project?.title ?? 'a project' : f.builder?.name ?? 'a builder',
    mail: f.mail,
    alsoMailing: other ? (other.builderId ? `you also follow ${other.builder?.name ?? 'its builder'}` : `you also follow “${other.project?.title}”`) : null,
  };
}

/** What an unsubscribe link would switch off (for the confirmation page; changes nothing). */
export async function describeUnsubscribe(input: unknown): Promise<UnsubscribeTarget> {
  const { token } = unsubscribeSchema.parse({ token: input });
  return describe(await followOfToken(token));
}

/** Switches off the mail of the follow a valid token names. */
export async function applyUnsubscribe(input: unknown): Promise<UnsubscribeTarget> {
  const { token } = unsubscribeSchema.parse(input);
  const f = await followOfToken(token);
  if (f.mail) await f.update({ mail: false });
  return describe(f);
}
