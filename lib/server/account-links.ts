import 'server-only';
import { createHash, createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { AccountToken, initModels } from '../../db/models';
import type { AccountTokenPurpose } from '../../db/models/account-token';
import { AppError } from '../errors';
import { signingSecret } from '../env';

// E-mailed account links: `base64url(JSON {i, n, p}) + '.' + HMAC-SHA256(NEXTAUTH_SECRET, payload)`.
// The row keeps only SHA-256 of the random nonce, so a link needs both the secret and the row; it works
// once (usedAt) until it expires, and a newer link of the same purpose withdraws the older ones.

export const ACCOUNT_LINK_LIFETIME_MS: Record<AccountTokenPurpose, number> = {
  verify: 48 * 60 * 60 * 1000,
  reset: 60 * 60 * 1000,
  'change-email': 24 * 60 * 60 * 1000,
};
export const ACCOUNT_LINK_VALID_FOR: Record<AccountTokenPurpose, string> = { verify: '48 hours', reset: '1 hour', 'change-email': '24 hours' };

const secret = (): string => signingSecret('account links');
const sign = (payload: string) => createHmac('sha256', secret()).update(`account-link:${payload}`).digest('base64url');
const sha256 = (value: string) => createHash('sha256').update(value).digest('hex');

/** A new link for this account and purpose, made in the caller's transaction; earlier unused ones stop working. */
export async function issueAccountLink(userId: number, purpose: AccountTokenPurpose, email: string, transaction: Transaction): Promise<string> {
  initModels();
  const now = new Date();
  await AccountToken.update({ usedAt: now }, { where: { userId, purpose, usedAt: null }, transaction });
  const nonce = randomBytes(24).toString('base64url');
  const row = await AccountToken.create(
    { userId, purpose, email, nonceHash: sha256(nonce), expiresAt: new Date(now.getTime() + ACCOUNT_LINK_LIFETIME_MS[purpose]) },
    { transaction },
  );
  const payload = Buffer.from(JSON.stringify({ i: row.id, n: nonce, p: purpose })).toString('base64url');
  return `${payload}.${sign(payload)}`;
}

const INVALID = 'This link is not valid: ask for a new one.';

/**
 * Uses a link: checks the signature, locks its row, and marks it used, all in the caller's transaction.
 * A forged, withdrawn, used or expired link is a 400 that says which, never a 500.
 */
export async function useAccountLink(token: string, purpose: AccountTokenPurpose, transaction: Transaction): Promise<AccountToken> {
  initModels();
  const [payload, signature, extra] = token.split('.');
  if (!payload || !signature || extra !== undefined) throw new AppError('validation', INVALID, { token: [INVALID] });
  const expected = Buffer.from(sign(payload));
  const given = Buffer.from(signature);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) throw new AppError('validation', INVALID, { token: [INVALID] });
  let parsed: { i?: unknown; n?: unknown; p?: unknown };
  try {
    parsed = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8'));
  } catch {
    throw new AppError('validation', INVALID, { token: [INVALID] });
  }
  if (!Number.isInteger(parsed.i) || typeof parsed.n !== 'string' || parsed.p !== purpose) throw new AppError('validation', INVALID, { token: [INVALID] });
  const row = await AccountToken.findOne({ where: { id: parsed.i as number, purpose }, transaction, lock: transaction.LOCK.UPDATE });
  if (!row) throw new AppError('validation', INVALID, { token: [INVALID] });
  const a = Buffer.from(row.nonceHash);
  const b = Buffer.from(sha256(parsed.n));
  if (a.length !== b.length || !timingSafeEqual(a, b)) throw new AppError('validation', INVALID, { token: [INVALID] });
  if (row.usedAt) {
    const m = 'This link has already been used, or a newer one was sent: ask for a new one if you still need it.';
    throw new AppError('validation', m, { token: [m] });
  }
  if (row.expiresAt.getTime() <= Date.now()) {
    const m = 'This link has expired: ask for a new one.';
    throw new AppError('validation', m, { token: [m] });
  }
  row.usedAt = new Date();
  await row.save({ transaction });
  return row;
}

/** Withdraws every unused link of an account (for some purposes), e.g. after a password reset. */
export async function withdrawAccountLinks(userId: number, purposes: AccountTokenPurpose[], transaction: Transaction): Promise<void> {
  await AccountToken.update({ usedAt: new Date() }, { where: { userId, purpose: { [Op.in]: purposes }, usedAt: null }, transaction });
}
