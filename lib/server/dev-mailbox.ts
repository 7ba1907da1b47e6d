import 'server-only';
import { fn, col, Op } from 'sequelize';
import { initModels, OutboxMessage } from '../../db/models';
import { authorizeDevTool, type Actor } from '../auth/policy';
import type { CapturedMailView, OutboxOverview } from '../types/mail';
import { env } from '../env';

/**
 * The dev mailbox exists only where it is switched on explicitly (SCRIBELINE_DEV_MAILBOX=1: npm start and
 * npm test set it), and even then only signed-in admins see it (the policy's readDevMailbox).
 */
export function devMailboxEnabled(): boolean {
  return env().SCRIBELINE_DEV_MAILBOX;
}

export type CapturedMailList = { available: true; source: string; messages: CapturedMailView[] } | { available: false; reason: string };

// The mail service's JSON: what the mailbox shows, less the kind, which is read from the headers.
type ServiceMessage = Omit<CapturedMailView, 'kind'> & { headers?: Record<string, string> };

/** Messages the local mail service caught, newest first. */
export async function listCapturedMail(actor: Actor): Promise<CapturedMailList> {
  authorizeDevTool(actor, 'readDevMailbox', { devToolsEnabled: devMailboxEnabled() });
  const base = env().MAILBOX_URL;
  let body: { messages?: ServiceMessage[] };
  try {
    const res = await fetch(new URL('/messages', base), { cache: 'no-store', signal: AbortSignal.timeout(3_000) });
    if (!res.ok) return { available: false, reason: `The local mail service at ${base} answered ${res.status}.` };
    body = (await res.json()) as { messages?: ServiceMessage[] };
  } catch {
    return { available: false, reason: `The local mail service at ${base} did not answer. Is it running?` };
  }
  const messages = (body.messages ?? []).map((m) => ({
    id: String(m.id),
    receivedAt: String(m.receivedAt),
    from: String(m.from ?? ''),
    to: String(m.to ?? ''),
    subject: String(m.subject ?? ''),
    text: String(m.text ?? ''),
    html: typeof m.html === 'string' ? m.html : null,
    kind: m.headers?.['x-scribeline-kind'] ?? null,
  }));
  return { available: true, source: base, messages };
}

/** How many outbox rows wait, went out, or were given up, and the ones still waiting. */
export async function outboxOverview(actor: Actor): Promise<OutboxOverview> {
  authorizeDevTool(actor, 'readDevMailbox', { devToolsEnabled: devMailboxEnabled() });
  initModels();
  const counts = (await OutboxMessage.findAll({
    attributes: ['status', [fn('COUNT', col('id')), 'n']],
    group: ['status'],
    raw: true,
  })) as unknown as { status: string; n: number | string }[];
  const count = (status: string) => Number(counts.find((c) => c.status === status)?.n ?? 0);
  const waiting = await OutboxMessage.findAll({
    where: { status: { [Op.in]: ['pending', 'failed'] } },
    order: [['id', 'DESC']],
    limit: 20,
  });
  return {
    pending: count('pending'),
    sent: count('sent'),
    failed: count('failed'),
    waiting: waiting.map((m) => ({
      id: m.id,
      kind: m.kind,
      to: m.toAddress,
      subject: m.subject,
      status: m.status === 'failed' ? 'failed' : 'pending',
      attempts: m.attempts,
      nextAttemptAt: m.nextAttemptAt.toISOString(),
      lastError: m.lastError,
    })),
  };
}
