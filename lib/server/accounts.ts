import 'server-only';
import { expireTags, PUBLIC_TAG } from './cache-tags';
import bcrypt from 'bcryptjs';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { AccountToken, Comment, Follow, initModels, MentorInvitation, Project, ProjectMembership, User } from '../../db/models';
import { withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import { authorizeSite, type Actor } from '../auth/policy';
import { passwordProblem } from '../auth/password-rules';
import { safeNextPath } from '../auth/safe-redirect';
import {
  addressChangeNoticeMail,
  confirmNewAddressMail,
  passwordChangedMail,
  passwordResetMail,
  signUpAttemptMail,
  verifyAddressMail,
} from '../mail/templates';
import {
  changeEmailSchema,
  changeNameSchema,
  changePasswordSchema,
  deleteAccountSchema,
  accountLinkSchema,
  passwordResetRequestSchema,
  passwordResetSchema,
  resendVerificationSchema,
  signUpSchema,
} from '../validations/user';
import { ACCOUNT_LINK_VALID_FOR, issueAccountLink, useAccountLink, withdrawAccountLinks } from './account-links';
import { countAccountMail } from './account-mail-limits';
import { appUrl } from './app-url';
import { enqueueMail } from './mail';
import { deleteStoredFiles, queueFileDeletions } from './upload-service';
import { PASSWORD_COST } from './users';
import { slugify } from '../slug';
import type { AccountView } from '../types/account';

// Everything a member does to their own account: sign up, verify the address, reset or change the
// password, change name or address, delete the account. Mail goes through the outbox in the action's
// transaction; account mail is limited per address and per client (account-mail-limits.ts).

export type { AccountView };
export type AccountAnswer = { message: string };

const checkMail = (email: string) =>
  `Check your mail: if ${email} can receive mail from us, a message is on its way with a link to continue. It can take a minute; look in the spam folder too.`;

function refusePassword(field: string, problem: string | null): void {
  if (problem) throw new AppError('validation', problem, { [field]: [problem] });
}

async function matchesPassword(userId: number, password: string, transaction?: Transaction): Promise<User> {
  const user = await User.findByPk(userId, { transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!user || user.deletedAt) throw new AppError('unauthenticated', 'Sign in to continue.');
  if (!(await bcrypt.compare(password, user.passwordHash))) {
    throw new AppError('validation', 'That is not your current password.', { currentPassword: ['That is not your current password.'] });
  }
  return user;
}

function verifyUrl(token: string, next: string): string {
  const query = new URLSearchParams({ token });
  if (next !== '/projects') query.set('next', next);
  return appUrl(`/verify-email?${query.toString()}`);
}

/**
 * Sign-up answers the same whether or not the address has an account: a new address gets an unverified
 * account and the link that verifies it; a taken one gets a message telling its owner someone tried.
 */
export async function signUp(input: unknown, client: string): Promise<AccountAnswer & { email: string }> {
  initModels();
  const data = signUpSchema.parse(input);
  refusePassword('password', passwordProblem(data.password, [data.name, data.email]));
  const next = safeNextPath(data.next, '/projects');
  // Hashed on both paths, so the answer takes as long whether or not the address is taken.
  const passwordHash = await bcrypt.hash(data.password, PASSWORD_COST);
  await withTransaction(
    async (transaction) => {
      await countAccountMail(data.email, client, transaction);
      const existing = await User.findOne({ where: { email: data.email }, transaction });
      if (existing) {
        const mail = signUpAttemptMail({ name: existing.name, resetUrl: appUrl(`/forgot-password?${new URLSearchParams({ email: existing.email })}`) });
        await enqueueMail({ to: existing.email, ...mail, kind: 'sign-up-attempt' }, { transaction });
        return;
      }
      const user = await User.create({ email: data.email, name: data.name, handle: await freeHandle(data.name, transaction), passwordHash, siteRole: 'member' }, { transaction });
      const token = await issueAccountLink(user.id, 'verify', user.email, transaction);
      const mail = verifyAddressMail({ name: user.name, url: verifyUrl(token, next), validFor: ACCOUNT_LINK_VALID_FOR.verify });
      await enqueueMail({ to: user.email, ...mail, kind: 'verify-address' }, { transaction });
    },
    { retryOnUnique: true },
  );
  return { message: checkMail(data.email), email: data.email };
}

/** A short public handle from the name, made unique with a number. */
async function freeHandle(name: string, transaction: Transaction): Promise<string> {
  const base = slugify(name, 30) || 'builder';
  for (let n = 1; ; n++) {
    const candidate = n === 1 ? base : `${base}-${n}`;
    if (!(await User.count({ where: { handle: candidate }, transaction }))) return candidate;
  }
}

/** Sends the verification link again to the signed-in member's address. */
export async function resendVerification(actor: Actor, input: unknown, client: string): Promise<AccountAnswer> {
  authorizeSite(actor, 'manageOwnSettings');
  const { next } = resendVerificationSchema.parse(input ?? {});
  initModels();
  return withTransaction(async (transaction) => {
    const user = await User.findByPk(actor.id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user || user.deletedAt) throw new AppError('unauthenticated', 'Sign in to continue.');
    if (user.emailVerifiedAt) throw new AppError('conflict', 'Your address is already verified.');
    await countAccountMail(user.email, client, transaction);
    const token = await issueAccountLink(user.id, 'verify', user.email, transaction);
    const mail = verifyAddressMail({ name: user.name, url: verifyUrl(token, safeNextPath(next, '/projects')), validFor: ACCOUNT_LINK_VALID_FOR.verify });
    await enqueueMail({ to: user.email, ...mail, kind: 'verify-address' }, { transaction });
    return { message: `We sent a new link to ${user.email}. Earlier links no longer work.` };
  });
}

/** Which kind of address link a token is (unchecked: useAccountLink checks the signature). */
function addressLinkPurpose(token: string): 'verify' | 'change-email' {
  try {
    const p = JSON.parse(Buffer.from(token.split('.')[0] ?? '', 'base64url').toString('utf8'))?.p;
    return p === 'change-email' ? 'change-email' : 'verify';
  } catch {
    return 'verify';
  }
}

/**
 * Follows an address link: a new account's address becomes verified, or the account moves to the new
 * address it asked for (which is verified by this very link). Needs no session: the link is the proof.
 */
export async function confirmAddress(input: unknown): Promise<{ email: string; changed: boolean }> {
  const { token } = accountLinkSchema.parse(input);
  initModels();
  const purpose = addressLinkPurpose(token);
  return withTransaction(async (transaction) => {
    const link = await useAccountLink(token, purpose, transaction);
    const user = await User.findByPk(link.userId, { transaction, lock: transaction.LOCK.UPDATE });
    const stale = 'This link was sent for an address the account no longer uses: ask for a new one.';
    if (!user || user.deletedAt) throw new AppError('validation', 'This link is not valid: ask for a new one.', { token: ['This link is not valid.'] });
    if (purpose === 'verify') {
      if (link.email !== user.email) throw new AppError('validation', stale, { token: [stale] });
      if (!user.emailVerifiedAt) user.emailVerifiedAt = new Date();
      await user.save({ transaction });
      return { email: user.email, changed: false };
    }
    const taken = await User.count({ where: { email: link.email, id: { [Op.ne]: user.id } }, transaction });
    if (taken) throw new AppError('conflict', 'That address now belongs to another account, so this account keeps its address.');
    user.email = link.email;
    user.emailVerifiedAt = new Date();
    await user.save({ transaction });
    await withdrawAccountLinks(user.id, ['verify', 'change-email', 'reset'], transaction);
    return { email: user.email, changed: true };
  }, { retryOnUnique: true });
}

/** Asks for a reset link: the same answer whether or not the address has an account. */
export async function requestPasswordReset(input: unknown, client: string): Promise<AccountAnswer> {
  const { email } = passwordResetRequestSchema.parse(input);
  initModels();
  await withTransaction(async (transaction) => {
    await countAccountMail(email, client, transaction);
    const user = await User.findOne({ where: { email, deletedAt: null }, transaction });
    if (!user) return;
    const token = await issueAccountLink(user.id, 'reset', user.email, transaction);
    const mail = passwordResetMail({ name: user.name, url: appUrl(`/reset-password?${new URLSearchParams({ token })}`), validFor: ACCOUNT_LINK_VALID_FOR.reset });
    await enqueueMail({ to: user.email, ...mail, kind: 'password-reset' }, { transaction });
  });
  return { message: checkMail(email) };
}

/** Sets a new password from a reset link: the link works once, and every session of the account ends. */
export async function resetPassword(input: unknown): Promise<{ email: string }> {
  const data = passwordResetSchema.parse(input);
  initModels();
  refusePassword('password', passwordProblem(data.password));
  const passwordHash = await bcrypt.hash(data.password, PASSWORD_COST);
  return withTransaction(async (transaction) => {
    const link = await useAccountLink(data.token, 'reset', transaction);
    const user = await User.findByPk(link.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user || user.deletedAt || link.email !== user.email) {
      throw new AppError('validation', 'This link is not valid: ask for a new one.', { token: ['This link is not valid.'] });
    }
    refusePassword('password', passwordProblem(data.password, [user.name, user.email]));
    user.passwordHash = passwordHash;
    user.sessionVersion += 1;
    // The link reached this address, which proves it is the member's.
    if (!user.emailVerifiedAt) user.emailVerifiedAt = new Date();
    await user.save({ transaction });
    await withdrawAccountLinks(user.id, ['reset'], transaction);
    const mail = passwordChangedMail({ name: user.name, resetUrl: appUrl('/forgot-password') });
    await enqueueMail({ to: user.email, ...mail, kind: 'password-changed' }, { transaction });
    return { email: user.email };
  });
}

export async function getAccount(actor: Actor): Promise<AccountView> {
  authorizeSite(actor, 'manageOwnSettings');
  initModels();
  const [user, pending] = await Promise.all([
    User.findByPk(actor.id),
    AccountToken.findOne({ where: { userId: actor.id, purpose: 'change-email', usedAt: null, expiresAt: { [Op.gt]: new Date() } }, order: [['id', 'DESC']] }),
  ]);
  if (!user || user.deletedAt) throw new AppError('unauthenticated', 'Sign in to continue.');
  return { id: user.id, name: user.name, email: user.email, handle: user.handle, emailVerified: user.emailVerifiedAt != null, pendingEmail: pending?.email ?? null };
}

export async function changeName(actor: Actor, input: unknown): Promise<AccountView> {
  authorizeSite(actor, 'manageOwnSettings');
  const { name } = changeNameSchema.parse(input);
  initModels();
  await User.update({ name }, { where: { id: actor.id, deletedAt: null } });
  // The name is on published pages (author of logs, notes, comments): they are read afresh.
  expireTags(PUBLIC_TAG);
  return getAccount(actor);
}

/** A new password, given the current one; every session ends (the form signs in again with the new one). */
export async function changePassword(actor: Actor, input: unknown): Promise<{ email: string }> {
  authorizeSite(actor, 'manageOwnSettings');
  const data = changePasswordSchema.parse(input);
  initModels();
  const passwordHash = await bcrypt.hash(data.newPassword, PASSWORD_COST);
  return withTransaction(async (transaction) => {
    const user = await matchesPassword(actor.id, data.currentPassword, transaction);
    refusePassword('newPassword', passwordProblem(data.newPassword, [user.name, user.email]));
    user.passwordHash = passwordHash;
    user.sessionVersion += 1;
    await user.save({ transaction });
    await withdrawAccountLinks(user.id, ['reset'], transaction);
    const mail = passwordChangedMail({ name: user.name, resetUrl: appUrl('/forgot-password') });
    await enqueueMail({ to: user.email, ...mail, kind: 'password-changed' }, { transaction });
    return { email: user.email };
  });
}

/**
 * Asks to move the account to another address: nothing changes until the new address follows its link;
 * the old address is told. A new address that already has an account gets no link, with the same answer.
 */
export async function requestEmailChange(actor: Actor, input: unknown, client: string): Promise<AccountAnswer> {
  authorizeSite(actor, 'manageOwnSettings');
  const data = changeEmailSchema.parse(input);
  initModels();
  await withTransaction(async (transaction) => {
    const user = await matchesPassword(actor.id, data.currentPassword, transaction);
    if (data.email === user.email) throw new AppError('validation', 'That is already your address.', { email: ['That is already your address.'] });
    await countAccountMail(data.email, client, transaction);
    await countAccountMail(user.email, client, transaction);
    const notice = addressChangeNoticeMail({ name: user.name, newEmail: data.email, settingsUrl: appUrl('/settings') });
    await enqueueMail({ to: user.email, ...notice, kind: 'address-change-notice' }, { transaction });
    if (await User.count({ where: { email: data.email }, transaction })) return;
    const token = await issueAccountLink(user.id, 'change-email', data.email, transaction);
    const mail = confirmNewAddressMail({ name: user.name, url: appUrl(`/verify-email?${new URLSearchParams({ token })}`), validFor: ACCOUNT_LINK_VALID_FOR['change-email'] });
    await enqueueMail({ to: data.email, ...mail, kind: 'confirm-new-address' }, { transaction });
  });
  return { message: `${checkMail(data.email)} Your account keeps its current address until the new one is confirmed.` };
}

export const FORMER_MEMBER_NAME = 'Former member';

/**
 * Deletes the member's account. `remove`: every project of theirs goes, with its files, and their
 * comments are removed. `keep`: their published projects stay, shown under "Former member", and so do
 * their comments; unpublished projects go either way. Follows, mentor roles, pending invitations, links
 * and sessions end. The row stays, emptied, so a mentor's flags stay on the builder's log and kept
 * logs have an author; nobody can sign in to it again.
 */
export async function deleteAccount(actor: Actor, input: unknown): Promise<void> {
  authorizeSite(actor, 'manageOwnSettings');
  const data = deleteAccountSchema.parse(input);
  const sequelize = initModels();
  const fileKeys = await withTransaction(async (transaction) => {
    const user = await matchesPassword(actor.id, data.currentPassword, transaction);
    if (user.siteRole === 'admin') {
      const admins = await User.count({ where: { siteRole: 'admin', deletedAt: null }, transaction });
      if (admins <= 1) throw new AppError('conflict', 'This is the last admin account: make someone else an admin before deleting it.');
    }
    const projects = await Project.findAll({ where: { ownerId: user.id }, attributes: ['id', 'visibility'], transaction, lock: transaction.LOCK.UPDATE });
    const goes = projects.filter((p) => data.logs === 'remove' || p.visibility !== 'published').map((p) => p.id);
    const keys = goes.length
      ? (
          await sequelize.query<{ fileKey: string }>(
            `SELECT m.file_key AS fileKey FROM media m JOIN entries e ON e.id = m.entry_id JOIN shop_sessions s ON s.id = e.session_id
             WHERE s.project_id IN (:ids) AND m.source = 'upload' AND m.file_key IS NOT NULL`,
            { replacements: { ids: goes }, type: QueryTypes.SELECT, transaction },
          )
        ).map((r) => r.fileKey)
      : [];
    if (goes.length) {
      await ProjectMembership.destroy({ where: { projectId: { [Op.in]: goes } }, transaction });
      await Project.destroy({ where: { id: { [Op.in]: goes } }, transaction });
    }
    if (data.logs === 'remove') {
      await Comment.update({ deletedAt: new Date(), body: '' }, { where: { authorId: user.id, deletedAt: null }, transaction });
    }
    await Follow.destroy({ where: { [Op.or]: [{ userId: user.id }, { builderId: user.id }] }, transaction });
    await ProjectMembership.destroy({ where: { userId: user.id }, transaction });
    await MentorInvitation.update({ revokedAt: new Date() }, { where: { invitedById: user.id, acceptedAt: null, revokedAt: null }, transaction });
    await AccountToken.destroy({ where: { userId: user.id }, transaction });
    user.set({
      name: FORMER_MEMBER_NAME,
      email: `former-${user.id}@deleted.invalid`,
      handle: `former-member-${user.id}`,
      passwordHash: '!deleted',
      siteRole: 'member',
      emailVerifiedAt: null,
      sessionVersion: user.sessionVersion + 1,
      deletedAt: new Date(),
    });
    await user.save({ transaction });
    // Recorded with the rows' deletion: if the service is away or the process dies after the commit, the
    // scheduled clean-up (file-cleanup.ts) finishes the job.
    return queueFileDeletions(keys, transaction);
  });
  expireTags(PUBLIC_TAG);
  await deleteStoredFiles(fileKeys);
}
