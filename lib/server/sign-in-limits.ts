import 'server-only';
import { Op } from 'sequelize';
import { initModels, SignInAttempt } from '../../db/models';
import { withTransaction } from '../../db/connection';

/**
 * Sign-in attempts are counted per account (its e-mail) and per client address. Up to the limit they
 * are free; past it each further attempt must wait a delay that doubles per attempt (2 s, 4 s, 8 s …
 * at most 15 minutes), so a guesser is slowed to a crawl while the real owner, whose right password
 * is still accepted once the wait is over, is never locked out for long. A run is forgotten after
 * an hour without attempts on it; a successful sign-in clears the account's run.
 */
export const SIGN_IN_LIMITS = {
  perAccount: 5,
  perAddress: 20,
  firstDelayMs: 2_000,
  maxDelayMs: 15 * 60_000,
  forgetAfterMs: 60 * 60_000,
} as const;

export class SignInRefused extends Error {}

type Scope = 'account' | 'address';
type Subject = { scope: Scope; subject: string; limit: number };

/** The wait after an attempt that brought a run to `failures`. */
export function delayAfter(failures: number, limit: number): number {
  if (failures < limit) return 0;
  return Math.min(SIGN_IN_LIMITS.firstDelayMs * 2 ** Math.min(failures - limit, 30), SIGN_IN_LIMITS.maxDelayMs);
}

function waitWords(ms: number): string {
  const s = Math.ceil(ms / 1000);
  if (s < 90) return `${s} second${s === 1 ? '' : 's'}`;
  const m = Math.ceil(s / 60);
  return `${m} minute${m === 1 ? '' : 's'}`;
}

const subjects = (email: string, address: string): Subject[] => [
  { scope: 'account', subject: email.slice(0, 254), limit: SIGN_IN_LIMITS.perAccount },
  { scope: 'address', subject: address.slice(0, 254), limit: SIGN_IN_LIMITS.perAddress },
];

/**
 * Takes one attempt for this account and address before the password is checked: under a row lock the
 * attempt is counted as a failure (undone by signInSucceeded), or refused when a wait is still running.
 * So N parallel guesses are counted one after another and at most the limit of them are checked.
 */
export async function reserveSignInAttempt(email: string, address: string): Promise<void> {
  initModels();
  const list = subjects(email, address);
  const now = new Date();
  // The rows exist before the locking read (INSERT IGNORE: a parallel request may have made them).
  await SignInAttempt.bulkCreate(
    list.map(({ scope, subject }) => ({ scope, subject, failures: 0, lastAttemptAt: now, nextAllowedAt: now })),
    { ignoreDuplicates: true },
  );
  const waitMs = await withTransaction(async (transaction) => {
    const rows = await SignInAttempt.findAll({
      where: { [Op.or]: list.map(({ scope, subject }) => ({ scope, subject })) },
      // Always account before address: one lock order for every request, so no deadlock between them.
      order: [
        ['scope', 'ASC'],
        ['subject', 'ASC'],
      ],
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    const at = Date.now();
    let wait = 0;
    for (const row of rows) {
      if (at - row.lastAttemptAt.getTime() > SIGN_IN_LIMITS.forgetAfterMs) row.failures = 0;
      if (row.failures > 0) wait = Math.max(wait, row.nextAllowedAt.getTime() - at);
    }
    if (wait > 0) return wait;
    for (const row of rows) {
      const limit = list.find((s) => s.scope === row.scope)!.limit;
      row.failures += 1;
      row.lastAttemptAt = new Date(at);
      row.nextAllowedAt = new Date(at + delayAfter(row.failures, limit));
      await row.save({ transaction });
    }
    return 0;
  });
  if (waitMs > 0) {
    throw new SignInRefused(`Too many failed sign-in attempts. Wait ${waitWords(waitMs)} and try again.`);
  }
}

/** The password was right: the account's run is over, and this attempt no longer counts against the address. */
export async function signInSucceeded(email: string, address: string): Promise<void> {
  initModels();
  const [account, client] = subjects(email, address);
  const now = new Date();
  await SignInAttempt.update({ failures: 0, nextAllowedAt: now }, { where: { scope: account.scope, subject: account.subject } });
  await SignInAttempt.decrement('failures', { by: 1, where: { scope: client.scope, subject: client.subject, failures: { [Op.gt]: 0 } } });
}
