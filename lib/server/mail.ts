import 'server-only';
import { randomBytes } from 'node:crypto';
import nodemailer, { type Transporter } from 'nodemailer';
import { Op, QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import { env, type Env } from '../env';

import { initModels, OutboxMessage } from '../../db/models';
import { outgoingMailSchema, type OutgoingMail } from '../validations/mail';

// E-mail leaves through the outbox: an action writes its message in its own transaction, so the
// message exists exactly when the action committed; sendDueMail (run by the worker) delivers it
// and retries with back-off, so an SMTP outage delays mail but never fails the action.

export const MAX_ATTEMPTS = 10;
const FIRST_RETRY_MS = 30_000;
const LONGEST_RETRY_MS = 60 * 60 * 1000;
// While a worker sends a claimed row nobody else takes it; if that worker dies the row is due again after this.
const CLAIM_LEASE_MS = 5 * 60 * 1000;

/** Wait after the n-th failed attempt (n ≥ 1): 30 s, 1 min, 2 min, … doubling, at most 1 h. */
export function retryDelayMs(failedAttempts: number): number {
  const n = Math.max(1, failedAttempts);
  return Math.min(FIRST_RETRY_MS * 2 ** (n - 1), LONGEST_RETRY_MS);
}

type MailSettings = Pick<Env, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_SECURE' | 'SMTP_USER' | 'SMTP_PASSWORD' | 'MAIL_FROM'>;
const mailSettings = (): MailSettings => env();

// One transport per process (and per settings, so a test pointing SMTP_PORT elsewhere gets a fresh one).
const globalForMail = globalThis as unknown as { scribelineMailTransport?: { key: string; transport: Transporter } };

function transportFor(settings: MailSettings): Transporter {
  const key = JSON.stringify([settings.SMTP_HOST, settings.SMTP_PORT, settings.SMTP_SECURE, settings.SMTP_USER ?? '']);
  const cached = globalForMail.scribelineMailTransport;
  if (cached?.key === key) return cached.transport;
  cached?.transport.close();
  const transport = nodemailer.createTransport({
    host: settings.SMTP_HOST,
    port: settings.SMTP_PORT,
    secure: settings.SMTP_SECURE,
    auth: settings.SMTP_USER ? { user: settings.SMTP_USER, pass: settings.SMTP_PASSWORD ?? '' } : undefined,
    // A dead or silent server must not hold the worker for long.
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 20_000,
  });
  globalForMail.scribelineMailTransport = { key, transport };
  return transport;
}

export type EnqueueResult = { queued: true; id: number } | { queued: false; id: null };

/**
 * Puts a message in the outbox inside the caller's transaction: it goes out only if that
 * transaction commits. A message whose dedupeKey is already in the outbox is skipped (queued: false)
 * without disturbing the transaction. Bad input throws a ZodError naming the field.
 */
export async function enqueueMail(message: OutgoingMail, options: { transaction: Transaction }): Promise<EnqueueResult> {
  if (!options?.transaction) throw new Error('enqueueMail needs the transaction of the action that causes the message');
  const m = outgoingMailSchema.parse(message);
  initModels();
  try {
    const row = await OutboxMessage.create(
      {
        kind: m.kind,
        toAddress: m.to,
        subject: m.subject,
        textBody: m.text,
        htmlBody: m.html ?? null,
        dedupeKey: m.dedupeKey ?? null,
        status: 'pending',
        attempts: 0,
        nextAttemptAt: new Date(),
      },
      { transaction: options.transaction },
    );
    return { queued: true, id: row.id };
  } catch (err) {
    // InnoDB undoes only the failed statement; the caller's transaction carries on.
    if (err instanceof UniqueConstraintError && m.dedupeKey) return { queued: false, id: null };
    throw err;
  }
}

export type SendReport = {
  /** Rows taken in this run. */
  claimed: number;
  sent: number;
  /** Failed this time, tried again later. */
  retrying: number;
  /** Failed for the last allowed time: given up. */
  failed: number;
  /** Set when the run could not work at all (database unreachable, bad settings). */
  error?: string;
};

function describeError(err: unknown): string {
  if (err instanceof Error) {
    const code = (err as { code?: unknown; responseCode?: unknown }).code;
    const response = (err as { responseCode?: unknown }).responseCode;
    const prefix = [code, response].filter((v) => v !== undefined && v !== null && v !== '').join(' ');
    return (prefix ? `${prefix}: ${err.message}` : err.message).slice(0, 1000);
  }
  return String(err).slice(0, 1000);
}

function mailDomain(from: string): string {
  const match = /@([^>\s]+)>?\s*$/.exec(from);
  return match ? match[1] : 'scribeline.local';
}

/**
 * Sends up to `limit` pending messages that are due at `now`. Rows are claimed with
 * SELECT … FOR UPDATE SKIP LOCKED, so several workers never take the same row. Never throws.
 */
export async function sendDueMail({ limit = 20, now = new Date() }: { limit?: number; now?: Date } = {}): Promise<SendReport> {
  const report: SendReport = { claimed: 0, sent: 0, retrying: 0, failed: 0 };
  let settings: MailSettings;
  let rows: OutboxMessage[];
  const token = randomBytes(16).toString('hex');
  try {
    settings = mailSettings();
    const sequelize = initModels();
    const take = Math.max(1, Math.min(200, Math.floor(limit)));
    // The claimed rows are read in the claiming transaction, on the primary: read afterwards, they could come
    // from a replica that has not seen the claim yet (or the read could fail), leaving them leased and unsent.
    rows = await sequelize.transaction(async (transaction) => {
      const due = await sequelize.query<{ id: number }>(
        'SELECT id FROM outbox_messages WHERE status = :pending AND next_attempt_at <= :now ORDER BY next_attempt_at, id LIMIT :take FOR UPDATE SKIP LOCKED',
        { replacements: { pending: 'pending', now, take }, type: QueryTypes.SELECT, transaction },
      );
      const claimedIds = due.map((r) => Number(r.id));
      if (!claimedIds.length) return [];
      await OutboxMessage.update(
        { claimToken: token, nextAttemptAt: new Date(now.getTime() + CLAIM_LEASE_MS) },
        { where: { id: { [Op.in]: claimedIds } }, transaction },
      );
      return OutboxMessage.findAll({ where: { id: { [Op.in]: claimedIds }, claimToken: token }, order: [['id', 'ASC']], transaction });
    });
  } catch (err) {
    report.error = describeError(err);
    return report;
  }
  report.claimed = rows.length;
  if (!rows.length) return report;

  let transport: Transporter;
  try {
    transport = transportFor(settings);
  } catch (err) {
    report.error = describeError(err);
    await Promise.all(rows.map((row) => recordFailure(row, token, now, report.error!, report)));
    return report;
  }

  for (const row of rows) {
    try {
      await transport.sendMail({
        from: settings.MAIL_FROM,
        to: row.toAddress,
        subject: row.subject,
        text: row.textBody,
        html: row.htmlBody ?? undefined,
        // Stable per outbox row, so a message sent twice after a crash is recognisably the same one.
        messageId: `<outbox-${row.id}@${mailDomain(settings.MAIL_FROM)}>`,
        headers: { 'X-Scribeline-Kind': row.kind, 'X-Scribeline-Outbox-Id': String(row.id) },
      });
    } catch (err) {
      await recordFailure(row, token, now, describeError(err), report, isPermanent(err));
      continue;
    }
    try {
      await OutboxMessage.update(
        { status: 'sent', sentAt: now, attempts: row.attempts + 1, claimToken: null, lastError: null },
        { where: { id: row.id, claimToken: token } },
      );
      report.sent += 1;
    } catch (err) {
      // Delivered but not marked: the lease runs out and it may go out once more (at least once, never lost).
      report.sent += 1;
      report.error = describeError(err);
    }
  }
  return report;
}

/** A 5xx reply (no such mailbox, refused for good): trying again would get the same answer. */
function isPermanent(err: unknown): boolean {
  const code = (err as { responseCode?: unknown })?.responseCode;
  return typeof code === 'number' && code >= 500 && code < 600;
}

async function recordFailure(row: OutboxMessage, token: string, now: Date, error: string, report: SendReport, permanent = false): Promise<void> {
  const attempts = row.attempts + 1;
  const givingUp = permanent || attempts >= MAX_ATTEMPTS;
  try {
    await OutboxMessage.update(
      {
        attempts,
        status: givingUp ? 'failed' : 'pending',
        nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)),
        claimToken: null,
        lastError: error,
      },
      { where: { id: row.id, claimToken: token } },
    );
  } catch (err) {
    // The lease still runs out, so the row is tried again later.
    report.error = describeError(err);
  }
  if (givingUp) report.failed += 1;
  else report.retrying += 1;
}
