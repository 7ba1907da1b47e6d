import 'server-only';
import bcrypt from 'bcryptjs';
import { initModels, User } from '../../db/models';
import { reserveSignInAttempt, signInSucceeded, SignInRefused } from './sign-in-limits';
import { AppError } from '../errors';
import type { Actor, SiteRole } from '../auth/policy';

export type UserSummary = { id: number; name: string; email: string; handle: string; siteRole: SiteRole; createdAt: string; sessionVersion: number };

const toSummary = (u: User): UserSummary => ({
  id: u.id,
  name: u.name,
  email: u.email,
  handle: u.handle,
  siteRole: u.siteRole,
  createdAt: u.createdAt.toISOString(),
  sessionVersion: u.sessionVersion,
});

export type ActorRow = NonNullable<Actor> & { emailVerified: boolean; name: string; email: string; handle: string; sessionVersion: number };

/** The acting account as the policy needs it, in one query; a deleted account is no one. */
export async function findActor(userId: number): Promise<ActorRow | null> {
  initModels();
  const u = await User.findByPk(userId, { attributes: ['id', 'siteRole', 'name', 'email', 'handle', 'emailVerifiedAt', 'sessionVersion', 'deletedAt'] });
  if (!u || u.deletedAt) return null;
  return {
    id: u.id,
    siteRole: u.siteRole,
    emailVerified: u.emailVerifiedAt != null,
    name: u.name,
    email: u.email,
    handle: u.handle,
    sessionVersion: u.sessionVersion,
  };
}

export const PASSWORD_COST = 10;

export { SIGN_IN_LIMITS, SignInRefused } from './sign-in-limits';

let dummy: string | undefined;
const dummyHash = () => (dummy ??= bcrypt.hashSync('no account has this password', PASSWORD_COST));

/**
 * Checks an e-mail and password. Each attempt is counted per account and per client address before the
 * password is compared (lib/server/sign-in-limits.ts); past the limits attempts must wait a growing delay.
 */
export async function verifyCredentials(email: string, password: string, address: string): Promise<UserSummary> {
  initModels();
  await reserveSignInAttempt(email, address);
  const user = await User.findOne({ where: { email } });
  // Compare against a dummy hash when there is no such account, so timing does not reveal which e-mails exist.
  const ok = await bcrypt.compare(password, user?.passwordHash ?? dummyHash());
  if (!user || !ok) {
    throw new SignInRefused('That e-mail and password do not match an account.');
  }
  await signInSucceeded(email, address);
  return toSummary(user);
}

export async function setSiteRole(userId: number, siteRole: SiteRole): Promise<UserSummary> {
  const sequelize = initModels();
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user || user.deletedAt) throw new AppError('not_found', 'That account was not found.');
    if (user.siteRole === siteRole) return toSummary(user);
    if (user.siteRole === 'admin' && siteRole !== 'admin') {
      const admins = await User.count({ where: { siteRole: 'admin' }, transaction });
      if (admins <= 1) throw new AppError('conflict', 'This is the last admin account: make someone else an admin first.');
    }
    user.siteRole = siteRole;
    // A new role ends the account's earlier sessions: it signs in again under the new role.
    user.sessionVersion += 1;
    await user.save({ transaction });
    return toSummary(user);
  });
}

/**
 * Signing out ends every session of the account that carries this version (the cookie being signed out
 * and any copy of it); a stale version changes nothing.
 */
export async function endSessions(userId: number, sessionVersion: number): Promise<void> {
  initModels();
  await User.increment('sessionVersion', { by: 1, where: { id: userId, sessionVersion } });
}
