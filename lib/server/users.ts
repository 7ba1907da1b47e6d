import 'server-only';
import bcrypt from 'bcryptjs';
import { Op } from 'sequelize';
import { initModels, User, SignInAttempt } from '../../db/models';
import { AppError } from '../http/errors';
import type { Actor, SiteRole } from '../auth/policy';
import { slugify } from '../slug';
import { signUpSchema, type SignUpInput } from '../validations/user';

export type UserSummary = { id: number; name: string; email: string; handle: string; siteRole: SiteRole; createdAt: string };

const toSummary = (u: User): UserSummary => ({
  id: u.id,
  name: u.name,
  email: u.email,
  handle: u.handle,
  siteRole: u.siteRole,
  createdAt: u.createdAt.toISOString(),
});

export async function findActor(userId: number): Promise<(NonNullable<Actor> & { name: string; email: string; handle: string }) | null> {
  initModels();
  const u = await User.findByPk(userId, { attributes: ['id', 'siteRole', 'name', 'email', 'handle'] });
  return u ? { id: u.id, siteRole: u.siteRole, name: u.name, email: u.email, handle: u.handle } : null;
}

/** A short public handle from the name, made unique with a number. */
async function freeHandle(name: string): Promise<string> {
  const base = slugify(name, 30) || 'builder';
  for (let n = 1; ; n++) {
    const candidate = n === 1 ? base : `${base}-${n}`;
    if (!(await User.count({ where: { handle: candidate } }))) return candidate;
  }
}

export const PASSWORD_COST = 10;

export async function createUser(input: SignUpInput, siteRole: SiteRole = 'member'): Promise<UserSummary> {
  initModels();
  const data = signUpSchema.parse(input);
  if (await User.count({ where: { email: data.email } })) {
    throw new AppError('conflict', 'An account with that e-mail address already exists. Sign in instead.', {
      email: ['An account with that e-mail address already exists.'],
    });
  }
  const user = await User.create({
    email: data.email,
    name: data.name,
    handle: await freeHandle(data.name),
    passwordHash: await bcrypt.hash(data.password, PASSWORD_COST),
    siteRole,
  });
  return toSummary(user);
}

// Failed attempts allowed in the window before sign-in is refused for a while.
export const SIGN_IN_LIMITS = { windowMs: 15 * 60_000, perAccount: 5, perAddress: 20 } as const;

export class SignInRefused extends Error {}

let dummy: string | undefined;
const dummyHash = () => (dummy ??= bcrypt.hashSync('no account has this password', PASSWORD_COST));

/**
 * Checks an e-mail and password, counting failures per account and per client address;
 * once a limit is reached, even a right password is refused until the window passes.
 */
export async function verifyCredentials(email: string, password: string, address: string): Promise<UserSummary> {
  initModels();
  const since = new Date(Date.now() - SIGN_IN_LIMITS.windowMs);
  const [byAccount, byAddress] = await Promise.all([
    SignInAttempt.count({ where: { scope: 'account', subject: email, createdAt: { [Op.gt]: since } } }),
    SignInAttempt.count({ where: { scope: 'address', subject: address, createdAt: { [Op.gt]: since } } }),
  ]);
  if (byAccount >= SIGN_IN_LIMITS.perAccount || byAddress >= SIGN_IN_LIMITS.perAddress) {
    throw new SignInRefused('Too many failed sign-in attempts. Wait 15 minutes and try again.');
  }
  const user = await User.findOne({ where: { email } });
  // Compare against a dummy hash when there is no such account, so timing does not reveal which e-mails exist.
  const ok = await bcrypt.compare(password, user?.passwordHash ?? dummyHash());
  if (!user || !ok) {
    await SignInAttempt.bulkCreate([
      { scope: 'account', subject: email },
      { scope: 'address', subject: address },
    ]);
    throw new SignInRefused('That e-mail and password do not match an account.');
  }
  await SignInAttempt.destroy({ where: { scope: 'account', subject: email } });
  return toSummary(user);
}

export async function listUsers(): Promise<UserSummary[]> {
  initModels();
  const users = await User.findAll({ order: [['createdAt', 'ASC']] });
  return users.map(toSummary);
}

export async function setSiteRole(userId: number, siteRole: SiteRole): Promise<UserSummary> {
  const sequelize = initModels();
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new AppError('not_found', 'That account was not found.');
    if (user.siteRole === 'admin' && siteRole !== 'admin') {
      const admins = await User.count({ where: { siteRole: 'admin' }, transaction });
      if (admins <= 1) throw new AppError('conflict', 'This is the last admin account: make someone else an admin first.');
    }
    user.siteRole = siteRole;
    await user.save({ transaction });
    return toSummary(user);
  });
}
