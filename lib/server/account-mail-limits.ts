import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { initModels } from '../../db/models';
import { AppError } from '../errors';

/**
 * Account mail (sign-up, verification, password reset, new address) per address and per client, in
 * fixed one-hour windows, so these forms cannot flood someone's inbox.
 */
export const ACCOUNT_MAIL_LIMITS = { windowMs: 60 * 60 * 1000, perAddress: 3, perClient: 10 } as const;

/**
 * Counts one account message for this address and this client inside the caller's transaction, or
 * refuses with a 429. The upsert locks the counter row until the transaction ends, so two requests at
 * once are counted one after the other; a refusal rolls its own count back.
 */
export async function countAccountMail(address: string, client: string, transaction: Transaction): Promise<void> {
  const sequelize = initModels();
  const windowStart = new Date(Math.floor(Date.now() / ACCOUNT_MAIL_LIMITS.windowMs) * ACCOUNT_MAIL_LIMITS.windowMs);
  const checks: [scope: 'address' | 'client', subject: string, max: number][] = [
    ['address', address.trim().toLowerCase().slice(0, 254), ACCOUNT_MAIL_LIMITS.perAddress],
    ['client', client.slice(0, 254), ACCOUNT_MAIL_LIMITS.perClient],
  ];
  for (const [scope, subject, max] of checks) {
    await sequelize.query(
      'INSERT INTO account_mail_counts (scope, subject, window_start, count) VALUES (?, ?, ?, 1) ON DUPLICATE KEY UPDATE count = count + 1',
      { replacements: [scope, subject, windowStart], transaction },
    );
    const [row] = await sequelize.query<{ count: number }>('SELECT count FROM account_mail_counts WHERE scope = ? AND subject = ? AND window_start = ?', {
      replacements: [scope, subject, windowStart],
      type: QueryTypes.SELECT,
      transaction,
    });
    if (Number(row?.count ?? 0) > max) {
      const opens = new Date(windowStart.getTime() + ACCOUNT_MAIL_LIMITS.windowMs);
      const minutes = Math.max(1, Math.ceil((opens.getTime() - Date.now()) / 60_000));
      throw new AppError(
        'rate_limited',
        scope === 'address'
          ? `Too many e-mails have been asked for this address. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`
          : `Too many account e-mails have been asked from here. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
      );
    }
  }
}
