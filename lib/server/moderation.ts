import 'server-only';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { initModels, Comment, CommentReport, Entry, Project, ShopSession, User } from '../../db/models';
import { AppError, notFound } from '../errors';
import { authorizeSite, type Actor } from '../auth/policy';
import { authorizeLog } from './log-scope';
import { reportCommentSchema, accountSearchSchema, ACCOUNTS_PER_PAGE } from '../validations/moderation';
import type { AccountPage, ModerationItem, ModerationQueue } from '../types/moderation';

/**
 * A member reports a comment to the admins, with a reason. Reporting the same comment again changes
 * nothing (`alreadyReported`); one's own comment cannot be reported (edit or delete it instead).
 */
export async function reportComment(actor: Actor, commentId: number, input: unknown): Promise<{ reported: true; alreadyReported: boolean }> {
  const sequelize = initModels();
  return sequelize.transaction(async (transaction) => {
    const comment = await Comment.findByPk(commentId, { attributes: ['id', 'entryId', 'authorId', 'deletedAt'], transaction });
    if (!comment || comment.deletedAt) throw notFound('That comment');
    await authorizeLog(actor, 'reportComment', { entryId: comment.entryId }, transaction, { authorId: comment.authorId });
    const { reason } = reportCommentSchema.parse(input);
    if (comment.authorId === actor!.id) {
      throw new AppError('validation', 'You cannot report your own comment: edit or delete it instead.', { reason: ['You cannot report your own comment.'] });
    }
    const existing = await CommentReport.findOne({ where: { commentId, reporterId: actor!.id }, transaction });
    if (existing) return { reported: true as const, alreadyReported: true };
    try {
      await CommentReport.create({ commentId, reporterId: actor!.id, reason, dismissedById: null }, { transaction });
    } catch (err) {
      // The same report sent twice at once: the unique key keeps one, the second is "already reported".
      if (err instanceof UniqueConstraintError) return { reported: true as const, alreadyReported: true };
      throw err;
    }
    return { reported: true as const, alreadyReported: false };
  });
}

type Loaded = Comment & {
  author?: User;
  hiddenBy?: User | null;
  entry?: Entry & { session?: ShopSession & { project?: Project } };
  reports?: (CommentReport & { reporter?: User })[];
};

const entryInclude = {
  model: Entry,
  as: 'entry',
  attributes: ['id', 'title'],
  include: [{ model: ShopSession, as: 'session', attributes: ['id'], include: [{ model: Project, as: 'project', attributes: ['id', 'slug', 'title'] }] }],
};

function toItem(c: Loaded): ModerationItem {
  const project = c.entry?.session?.project;
  return {
    commentId: c.id,
    body: c.body,
    authorName: c.author?.name ?? 'A former member',
    createdAt: c.createdAt.toISOString(),
    href: project ? `/logs/${project.slug}/entries/${c.entryId}#comment-${c.id}` : '#',
    where: project ? `${project.title} › ${c.entry?.title ?? ''}` : '',
    reports: (c.reports ?? [])
      .filter((r) => !r.dismissedAt)
      .map((r) => ({ reporterName: r.reporter?.name ?? 'A former member', reason: r.reason, at: r.createdAt.toISOString() })),
    hidden: c.hiddenAt ? { at: c.hiddenAt.toISOString(), byName: c.hiddenBy?.name ?? 'an admin', reason: c.hiddenReason ?? '' } : null,
  };
}

/** The admins' queue: comments with open reports (oldest report first), and the latest hidden comments. */
export async function listModerationQueue(actor: Actor, limit = 50): Promise<ModerationQueue> {
  authorizeSite(actor, 'moderateComments');
  initModels();
  const open = await CommentReport.findAll({
    attributes: ['commentId'],
    where: { dismissedAt: null },
    include: [{ model: Comment, as: 'comment', attributes: [], required: true, where: { hiddenAt: null, deletedAt: null } }],
    order: [['createdAt', 'ASC']],
    raw: true,
  });
  const ids = [...new Set(open.map((r) => r.commentId))].slice(0, limit);
  const [reported, hidden] = await Promise.all([
    ids.length
      ? Comment.findAll({
          where: { id: { [Op.in]: ids } },
          include: [
            { model: User, as: 'author', attributes: ['id', 'name'] },
            { model: CommentReport, as: 'reports', where: { dismissedAt: null }, required: true, include: [{ model: User, as: 'reporter', attributes: ['id', 'name'] }] },
            entryInclude,
          ],
        })
      : Promise.resolve([]),
    Comment.findAll({
      where: { hiddenAt: { [Op.ne]: null }, deletedAt: null },
      include: [{ model: User, as: 'author', attributes: ['id', 'name'] }, { model: User, as: 'hiddenBy', attributes: ['id', 'name'] }, entryInclude],
      order: [['hiddenAt', 'DESC']],
      limit,
    }),
  ]);
  const order = new Map(ids.map((id, i) => [id, i]));
  return {
    reported: (reported as Loaded[]).sort((a, b) => order.get(a.id)! - order.get(b.id)!).map(toItem),
    hidden: (hidden as Loaded[]).map(toItem),
  };
}

/** An admin dismisses every open report of a comment (the comment stays as it is). */
export async function dismissReports(actor: Actor, commentId: number, transaction?: Transaction): Promise<{ dismissed: number }> {
  authorizeSite(actor, 'moderateComments');
  initModels();
  if (!(await Comment.count({ where: { id: commentId }, transaction }))) throw notFound('That comment');
  const [dismissed] = await CommentReport.update({ dismissedAt: new Date(), dismissedById: actor.id }, { where: { commentId, dismissedAt: null }, transaction });
  return { dismissed };
}

/** Accounts for the admins' list: searched by name, e-mail or handle, newest first, a page at a time. */
export async function searchAccounts(actor: Actor, input: unknown): Promise<AccountPage> {
  authorizeSite(actor, 'manageUsers');
  initModels();
  const { q, page } = accountSearchSchema.parse(input);
  const like = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  const where = q ? { [Op.or]: [{ name: { [Op.like]: like } }, { email: { [Op.like]: like } }, { handle: { [Op.like]: like } }] } : {};
  const { rows, count } = await User.findAndCountAll({
    attributes: ['id', 'name', 'email', 'handle', 'siteRole', 'createdAt'],
    where,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: ACCOUNTS_PER_PAGE,
    offset: (page - 1) * ACCOUNTS_PER_PAGE,
  });
  return {
    accounts: rows.map((u) => ({ id: u.id, name: u.name, email: u.email, handle: u.handle, siteRole: u.siteRole, createdAt: u.createdAt.toISOString() })),
    total: count,
    page,
    pages: Math.max(1, Math.ceil(count / ACCOUNTS_PER_PAGE)),
    q,
  };
}
