import 'server-only';
import { literal, Op, type Transaction } from 'sequelize';
import { initModels, Comment, Media, User } from '../../db/models';
import { getSequelize, withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import { canOnProject, type Actor, type ProjectFacts } from '../auth/policy';
import { authorizeLog } from './log-scope';
import { pageOf, readCursor } from './keyset';
import { formatClock } from '../chapters';
import type { CommentClosedReason, CommentsPayload, CommentView } from '../types/comments';
import {
  COMMENT_BODY_MAX,
  COMMENT_RATE_LIMITS,
  commentCreateSchema,
  commentHideSchema,
  commentUpdateSchema,
} from '../validations/comments';

export type { CommentView, CommentsPayload };

type Row = Comment & { author?: User };

const authorInclude = [{ model: User, as: 'author', attributes: ['id', 'name'] }];

const commentNotFound = () => new AppError('not_found', 'That comment was not found.');

function fieldError(field: string, message: string): AppError {
  return new AppError('validation', `Please check ${field}: ${message}`, { [field]: [message] });
}

/** One comment as this viewer may see it; the policy decides what they may do with it. */
function toCommentView(c: Row, actor: Actor, facts: ProjectFacts): CommentView {
  const state = c.deletedAt ? 'removed' : c.hiddenAt ? 'hidden' : 'shown';
  const mayHide = canOnProject(actor, 'hideComment', facts);
  const isAuthor = canOnProject(actor, 'editOwnComment', { ...facts, authorId: c.authorId });
  // Hidden text stays in the database; only those who hid it, could hide it, or wrote it still read it.
  const textShown = state === 'shown' || (state === 'hidden' && (mayHide || isAuthor));
  const author = state === 'removed' || !c.author
    ? null
    : { id: c.author.id, name: c.author.name, role: c.authorId === facts.ownerId ? ('builder' as const) : facts.mentorIds.includes(c.authorId) ? ('mentor' as const) : null };
  return {
    id: c.id,
    entryId: c.entryId,
    parentId: c.parentId ?? null,
    mediaId: state === 'removed' ? null : (c.mediaId ?? null),
    atMs: state === 'removed' || c.mediaId == null ? null : (c.atMs ?? null),
    author,
    state,
    body: textShown ? c.body : '',
    hidden:
      state === 'hidden'
        ? { by: c.hiddenById === facts.ownerId ? 'builder' : 'admin', reason: c.hiddenReason ?? '', at: c.hiddenAt!.toISOString(), textShown }
        : null,
    version: c.version,
    createdAt: c.createdAt.toISOString(),
    editedAt: c.editedAt ? c.editedAt.toISOString() : null,
    can: {
      reply: state === 'shown' && c.parentId == null && canOnProject(actor, 'comment', facts),
      edit: state === 'shown' && isAuthor,
      delete: state !== 'removed' && isAuthor,
      // The policy would let them; offering to hide one's own words (rather than edit or delete them) only confuses.
      hide: state === 'shown' && mayHide && actor?.id !== c.authorId,
      unhide: state === 'hidden' && mayHide,
    },
    replies: [],
  };
}

/** Published here means the entry's session and its project are both published: the facts, not a permission. */
function isPublished(facts: ProjectFacts): boolean {
  return facts.visibility === 'published' && (facts.sessionVisibility ?? 'published') === 'published';
}

/**
 * Threads in the order they were written. A removed reply disappears; a removed comment stays as a
 * placeholder only while replies hang from it.
 */
function thread(rows: Row[], actor: Actor, facts: ProjectFacts): CommentView[] {
  const tops: CommentView[] = [];
  const byId = new Map<number, CommentView>();
  for (const row of rows) {
    if (row.parentId != null) continue;
    const view = toCommentView(row, actor, facts);
    tops.push(view);
    byId.set(view.id, view);
  }
  for (const row of rows) {
    if (row.parentId == null || row.deletedAt) continue;
    byId.get(row.parentId)?.replies.push(toCommentView(row, actor, facts));
  }
  return tops.filter((c) => c.state !== 'removed' || c.replies.length > 0);
}

/** Threads on one page of an entry's comments (oldest first; "Show more comments" asks for the next page). */
export const COMMENT_THREADS_PER_PAGE = 30;
/** Replies shown under one thread: a thread is bounded too, however long it runs (the count still includes the rest). */
export const REPLIES_PER_THREAD = 100;

type CommentPage = { rows: Row[]; nextCursor: string | null; count: number };

/**
 * One page of threads, keyset on (created_at, id) over the entry's top-level comments (index
 * comments_entry_parent_created), and at most REPLIES_PER_THREAD replies of each, oldest first: one statement,
 * which also carries the count of what a reader sees (removed ones left out) on every row.
 */
async function readCommentPage(entryId: number, after: unknown, transaction?: Transaction): Promise<CommentPage> {
  const cursor = readCursor(after, 'time');
  const sequelize = getSequelize();
  const entry = sequelize.escape(entryId);
  const keyset = cursor
    ? `AND (t.created_at > ${sequelize.escape(cursor.key)} OR (t.created_at = ${sequelize.escape(cursor.key)} AND t.id > ${sequelize.escape(cursor.id)}))`
    : '';
  // One more thread than the page holds says whether another page follows.
  const pageTops = `SELECT t.id FROM comments t WHERE t.entry_id = ${entry} AND t.parent_id IS NULL ${keyset} ORDER BY t.created_at, t.id LIMIT ${COMMENT_THREADS_PER_PAGE + 1}`;
  const rows = (await Comment.findAll({
    where: {
      entryId,
      id: {
        [Op.in]: literal(`(
          SELECT id FROM (${pageTops}) tops
          UNION ALL
          SELECT id FROM (
            SELECT r.id, ROW_NUMBER() OVER (PARTITION BY r.parent_id ORDER BY r.created_at, r.id) AS n
              FROM comments r JOIN (${pageTops}) p ON p.id = r.parent_id
             WHERE r.deleted_at IS NULL
          ) ranked WHERE ranked.n <= ${REPLIES_PER_THREAD})`),
      },
    },
    attributes: { include: [[literal(`(SELECT COUNT(*) FROM comments k WHERE k.entry_id = ${entry} AND k.deleted_at IS NULL)`), 'shownCount']] },
    include: authorInclude,
    order: [
      ['createdAt', 'ASC'],
      ['id', 'ASC'],
    ],
    transaction,
  })) as Row[];
  const { items, nextCursor } = pageOf(
    rows.filter((r) => r.parentId == null),
    COMMENT_THREADS_PER_PAGE,
    (c) => c.createdAt,
  );
  const shown = new Set(items.map((c) => c.id));
  // Past the last page there is no row to carry the count: ask for it on its own.
  const count = rows.length ? Number(rows[0].getDataValue('shownCount' as never)) : await Comment.count({ where: { entryId, deletedAt: null }, transaction });
  return { rows: [...items, ...rows.filter((r) => r.parentId != null && shown.has(r.parentId))], nextCursor, count };
}

async function payloadFor(actor: Actor, entryId: number, facts: ProjectFacts, after?: unknown, transaction?: Transaction): Promise<CommentsPayload> {
  const page = await readCommentPage(entryId, after, transaction);
  const comments = thread(page.rows, actor, facts);
  const canComment = canOnProject(actor, 'comment', facts);
  const closedReason: CommentClosedReason = canComment
    ? null
    : !isPublished(facts)
      ? 'not-published'
      : !actor
        ? 'sign-in'
        : actor.emailVerified !== true
          ? 'verify'
          : null;
  return {
    entryId,
    comments,
    count: page.count,
    nextCursor: page.nextCursor,
    viewer: actor ? { id: actor.id } : null,
    can: { comment: canComment, closedReason },
    limits: { bodyMax: COMMENT_BODY_MAX, perMinute: COMMENT_RATE_LIMITS[0].max, perHour: COMMENT_RATE_LIMITS[1].max },
  };
}

/**
 * One page of an entry's comments as this viewer may see them: the first without `after`, the next with the
 * page's `nextCursor` (a cursor that cannot be read is a 400 naming `after`).
 */
export async function listEntryComments(actor: Actor, entryId: number, after?: unknown): Promise<CommentsPayload> {
  initModels();
  const scope = await authorizeLog(actor, 'view', { entryId });
  return payloadFor(actor, entryId, scope.facts, after);
}

async function viewById(actor: Actor, id: number, facts: ProjectFacts, transaction: Transaction): Promise<CommentView> {
  const row = (await Comment.findByPk(id, { include: authorInclude, transaction })) as Row | null;
  if (!row) throw commentNotFound();
  return toCommentView(row, actor, facts);
}

function waitInWords(ms: number): string {
  const s = Math.max(1, Math.ceil(ms / 1000));
  if (s < 60) return `in ${s} second${s === 1 ? '' : 's'}`;
  const m = Math.ceil(s / 60);
  return `in ${m} minute${m === 1 ? '' : 's'}`;
}

export const RATE_LIMIT_SUMMARY = `at most ${COMMENT_RATE_LIMITS[0].max} comments a ${COMMENT_RATE_LIMITS[0].per} and ${COMMENT_RATE_LIMITS[1].max} an ${COMMENT_RATE_LIMITS[1].per}`;

/**
 * Counted from the comments table itself (replies and since-deleted comments included), so there is
 * nothing else to keep in step. The member's row is locked first so two posts at once take turns, and the
 * count is a locking read: a plain read would see the snapshot taken before the lock was granted, without
 * the comments that the posts ahead of this one have just committed.
 */
async function checkRateLimit(authorId: number, transaction: Transaction, now = Date.now()): Promise<void> {
  await User.findByPk(authorId, { attributes: ['id'], transaction, lock: transaction.LOCK.UPDATE });
  let retryAt = 0;
  for (const limit of COMMENT_RATE_LIMITS) {
    const since = new Date(now - limit.windowMs);
    const recent = (await Comment.findAll({
      where: { authorId, createdAt: { [Op.gt]: since } },
      attributes: ['createdAt'],
      order: [['createdAt', 'ASC']],
      raw: true,
      transaction,
      lock: transaction.LOCK.SHARE,
    })) as unknown as { createdAt: Date }[];
    if (recent.length < limit.max) continue;
    // Posting opens again once enough of these have aged out of the window.
    const freeing = recent[recent.length - limit.max];
    retryAt = Math.max(retryAt, new Date(freeing.createdAt).getTime() + limit.windowMs);
  }
  if (retryAt > 0) {
    throw new AppError(
      'rate_limited',
      `You are posting faster than comments allow (${RATE_LIMIT_SUMMARY}). You can post again ${waitInWords(retryAt - now)}; your text is still in the box.`,
    );
  }
}

/** A new comment, a reply (parentId) or a comment pinned to a moment of one of the entry's clips (mediaId + atMs). */
export async function createComment(actor: Actor, entryId: number, input: unknown): Promise<CommentView> {
  initModels();
  return withTransaction(async (transaction) => {
    // Who is asking comes before what they sent: an outsider learns nothing from a validation message.
    const scope = await authorizeLog(actor, 'comment', { entryId }, transaction);
    const data = commentCreateSchema.parse(input);
    if (data.parentId != null) {
      const parent = await Comment.findByPk(data.parentId, { attributes: ['id', 'entryId', 'parentId', 'deletedAt', 'hiddenAt'], transaction });
      if (!parent || parent.entryId !== entryId) throw fieldError('parentId', 'The comment you are answering is not on this entry.');
      if (parent.parentId != null) {
        throw fieldError('parentId', 'Replies go one level deep: answer the first comment of this thread instead, and your reply joins the same thread.');
      }
      if (parent.deletedAt) throw fieldError('parentId', 'That comment was removed by its author, so it can no longer be answered.');
      if (parent.hiddenAt) throw fieldError('parentId', 'That comment is hidden, so it can no longer be answered.');
      if (data.mediaId != null) throw fieldError('mediaId', 'A reply belongs to the comment it answers; only a new comment can be pinned to a moment of the clip.');
    }
    if (data.mediaId != null) {
      const media = await Media.findByPk(data.mediaId, { attributes: ['id', 'entryId', 'kind', 'durationMs'], transaction });
      if (!media || media.entryId !== entryId || media.kind !== 'clip') throw fieldError('mediaId', 'Pin the comment to a clip of this entry.');
      if (media.durationMs != null && data.atMs! > media.durationMs) {
        throw fieldError('atMs', `The moment is past the end of the clip (${formatClock(media.durationMs)}).`);
      }
    }
    await checkRateLimit(actor!.id, transaction);
    const row = await Comment.create(
      { entryId, authorId: actor!.id, parentId: data.parentId ?? null, mediaId: data.mediaId ?? null, atMs: data.mediaId != null ? data.atMs! : null, body: data.body },
      { transaction },
    );
    return viewById(actor, row.id, scope.facts, transaction);
  });
}

async function lockComment(id: number, transaction: Transaction): Promise<Comment> {
  const row = await Comment.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!row) throw commentNotFound();
  return row;
}

/** The author changes their text; `version` must be the one they read. */
export async function updateComment(actor: Actor, commentId: number, input: unknown): Promise<CommentView> {
  initModels();
  return withTransaction(async (transaction) => {
    const row = await lockComment(commentId, transaction);
    const scope = await authorizeLog(actor, 'editOwnComment', { entryId: row.entryId }, transaction, { authorId: row.authorId });
    if (row.deletedAt) throw new AppError('not_found', 'That comment was removed.');
    const data = commentUpdateSchema.parse(input);
    if (row.version !== data.version) {
      throw new AppError('conflict', 'This comment was changed elsewhere since you opened it (in another tab, or it was hidden). Reload to see the latest, then make your change again.');
    }
    if (row.hiddenAt) {
      throw new AppError('forbidden', `This comment was hidden by ${row.hiddenById === scope.facts.ownerId ? 'the builder' : 'an admin'}, so it can no longer be changed. You can still delete it.`);
    }
    if (row.body !== data.body) {
      row.set({ body: data.body, editedAt: new Date(), version: row.version + 1 });
      await row.save({ transaction });
    }
    return viewById(actor, row.id, scope.facts, transaction);
  });
}

/** The author deletes their comment: its text goes, the row stays so replies keep their thread. */
export async function deleteComment(actor: Actor, commentId: number): Promise<void> {
  initModels();
  await withTransaction(async (transaction) => {
    const row = await lockComment(commentId, transaction);
    await authorizeLog(actor, 'editOwnComment', { entryId: row.entryId }, transaction, { authorId: row.authorId });
    if (row.deletedAt) return;
    row.set({ deletedAt: new Date(), body: '', version: row.version + 1 });
    await row.save({ transaction });
  });
}

/** The builder or an admin hides a comment, with a reason readers see; the text is kept. */
export async function hideComment(actor: Actor, commentId: number, input: unknown): Promise<CommentView> {
  initModels();
  return withTransaction(async (transaction) => {
    const row = await lockComment(commentId, transaction);
    const scope = await authorizeLog(actor, 'hideComment', { entryId: row.entryId }, transaction);
    const { reason } = commentHideSchema.parse(input);
    if (row.deletedAt) throw new AppError('conflict', 'Its author already removed this comment; there is nothing left to hide.');
    row.set({ hiddenAt: new Date(), hiddenById: actor!.id, hiddenReason: reason, version: row.version + 1 });
    await row.save({ transaction });
    return viewById(actor, row.id, scope.facts, transaction);
  });
}

/** The builder or an admin shows a hidden comment again. */
export async function unhideComment(actor: Actor, commentId: number): Promise<CommentView> {
  initModels();
  return withTransaction(async (transaction) => {
    const row = await lockComment(commentId, transaction);
    const scope = await authorizeLog(actor, 'hideComment', { entryId: row.entryId }, transaction);
    if (row.hiddenAt) {
      row.set({ hiddenAt: null, hiddenById: null, hiddenReason: null, version: row.version + 1 });
      await row.save({ transaction });
    }
    return viewById(actor, row.id, scope.facts, transaction);
  });
}
