import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';

import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ZodError } from 'zod';

import { closeDb, guardTestDatabase } from '@/tests/support/db';
import { initModels, OutboxMessage } from '@/db/models';
import { enqueueMail, MAX_ATTEMPTS, retryDelayMs, sendDueMail } from '@/lib/server/mail';
import { sessionPublishedMail } from '@/lib/mail/templates';
import { startMailService, type CapturedMessage, type MailService } from '@/scripts/mail-service/server';

guardTestDatabase();

// The real path: outbox rows in the test database, nodemailer over SMTP on loopback, the local
// mail service catching what arrives. Addresses carry a per-run tag so other rows never count.
const TAG = `mail-${Date.now().toString(36)}-${process.pid}`;
const address = (name: string) => `${name}.${TAG}@example.test`;
const FROM = 'Scribeline <no-reply@scribeline.test>';

let service: MailService;
let dataDir: string;
let httpPort: number;
const sequelize = initModels();

async function messagesTo(to: string): Promise<CapturedMessage[]> {
  const res = await fetch(`${service.httpUrl}/messages?to=${encodeURIComponent(to)}`);
  expect(res.status).toBe(200);
  return ((await res.json()) as { messages: CapturedMessage[] }).messages;
}

/** Runs the sender until nothing due is left (other files' leftovers included), as the worker would. */
async function drain(now = new Date()) {
  const totals = { claimed: 0, sent: 0, retrying: 0, failed: 0 };
  for (let i = 0; i < 20; i++) {
    const report = await sendDueMail({ limit: 50, now });
    expect(report.error).toBeUndefined();
    totals.claimed += report.claimed;
    totals.sent += report.sent;
    totals.retrying += report.retrying;
    totals.failed += report.failed;
    if (report.claimed === 0) break;
  }
  return totals;
}

function mail(to: string, subject: string, extra: Partial<Parameters<typeof enqueueMail>[0]> = {}) {
  return { to, subject, text: `Plain body of ${subject}`, html: `<p>HTML body of ${subject}</p>`, kind: 'session-published' as const, ...extra };
}

async function rowFor(to: string) {
  const rows = await OutboxMessage.findAll({ where: { toAddress: to } });
  expect(rows).toHaveLength(1);
  return rows[0];
}

beforeAll(async () => {
  dataDir = await mkdtemp(path.join(os.tmpdir(), 'scribeline-mail-'));
  service = await startMailService({ smtpPort: 0, httpPort: 0, dataDir });
  httpPort = Number(new URL(service.httpUrl).port);
  process.env.SMTP_HOST = '127.0.0.1';
  process.env.SMTP_PORT = String(service.smtpPort);
  process.env.SMTP_SECURE = 'false';
  process.env.MAIL_FROM = FROM;
  // Leftovers of an earlier run of this or another file go out first, so they cannot crowd ours.
  await drain();
});

afterAll(async () => {
  await OutboxMessage.destroy({ where: { toAddress: { [Op.like]: `%.${TAG}@example.test` } } });
  await service?.close();
  await closeDb();
  if (dataDir) await rm(dataDir, { recursive: true, force: true });
});

describe('enqueueMail and sendDueMail', () => {
  it('sends nothing when the action that enqueued the message rolls back', async () => {
    const to = address('rollback');
    await expect(
      sequelize.transaction(async (transaction) => {
        await enqueueMail(mail(to, 'Never sent'), { transaction });
        throw new Error('the action failed after queueing its e-mail');
      }),
    ).rejects.toThrow('the action failed');

    await drain();
    expect(await OutboxMessage.count({ where: { toAddress: to } })).toBe(0);
    expect(await messagesTo(to)).toHaveLength(0);
  });

  it('holds a message until its transaction commits, then delivers it with the right content', async () => {
    const to = address('committed');
    let id = 0;
    await sequelize.transaction(async (transaction) => {
      const result = await enqueueMail(mail(to, 'Session four: cutting the change gear', { text: 'Thirty-six teeth, module 1.5.' }), { transaction });
      expect(result.queued).toBe(true);
      id = result.id!;
      // Another connection (the worker) neither sees nor takes the uncommitted row.
      await drain();
      expect(await messagesTo(to)).toHaveLength(0);
    });

    const totals = await drain();
    expect(totals.sent).toBeGreaterThanOrEqual(1);
    const [caught, ...more] = await messagesTo(to);
    expect(more).toHaveLength(0);
    expect(caught.envelope.to).toEqual([to]);
    expect(caught.to).toBe(to);
    expect(caught.from).toContain('no-reply@scribeline.test');
    expect(caught.subject).toBe('Session four: cutting the change gear');
    expect(caught.text.trim()).toBe('Thirty-six teeth, module 1.5.');
    expect(caught.html).toContain('<p>HTML body of Session four: cutting the change gear</p>');
    expect(caught.headers['x-scribeline-kind']).toBe('session-published');
    expect(caught.messageId).toBe(`<outbox-${id}@scribeline.test>`);

    const row = await rowFor(to);
    expect(row.status).toBe('sent');
    expect(row.attempts).toBe(1);
    expect(row.sentAt).toBeInstanceOf(Date);
    expect(row.claimToken).toBeNull();

    // Sent rows are never sent again.
    await drain(new Date(Date.now() + 24 * 3600_000));
    expect(await messagesTo(to)).toHaveLength(1);
  });

  it('keeps one message per dedupe key, without spoiling the caller’s transaction', async () => {
    const to = address('dedupe');
    const key = `session-published:${TAG}:42`;
    const first = await sequelize.transaction((transaction) => enqueueMail(mail(to, 'Once only', { dedupeKey: key }), { transaction }));
    expect(first.queued).toBe(true);

    const other = address('dedupe-other');
    const second = await sequelize.transaction(async (transaction) => {
      const again = await enqueueMail(mail(to, 'Once only', { dedupeKey: key }), { transaction });
      // The transaction carries on after the skipped duplicate.
      await enqueueMail(mail(other, 'Written after the duplicate'), { transaction });
      return again;
    });
    expect(second).toEqual({ queued: false, id: null });

    await drain();
    expect(await OutboxMessage.count({ where: { dedupeKey: key } })).toBe(1);
    expect(await messagesTo(to)).toHaveLength(1);
    expect(await messagesTo(other)).toHaveLength(1);
  });

  it('delivers each message once when two senders run at the same time', async () => {
    const addresses = [1, 2, 3, 4, 5, 6].map((n) => address(`parallel-${n}`));
    await sequelize.transaction(async (transaction) => {
      for (const to of addresses) await enqueueMail(mail(to, 'One of six'), { transaction });
    });
    const [a, b] = await Promise.all([sendDueMail({ limit: 50 }), sendDueMail({ limit: 50 })]);
    expect(a.error).toBeUndefined();
    expect(b.error).toBeUndefined();
    await drain();
    for (const to of addresses) expect(await messagesTo(to)).toHaveLength(1);
  });

  it('escapes what users typed in an HTML body', async () => {
    const to = address('escape');
    const content = sessionPublishedMail({
      recipientName: 'Reader <img src=x onerror=alert(1)>',
      builderName: 'Edda & "Co"',
      projectTitle: '<script>alert("plate")</script>',
      sessionTitle: 'Boring the register',
      heldOn: 'Sat 3 Oct 2026',
      sessionUrl: 'http://127.0.0.1:3000/logs/plate/sessions/1',
      unsubscribeUrl: 'http://127.0.0.1:3000/unsubscribe?t=abc&p=1',
    });
    await sequelize.transaction((transaction) => enqueueMail({ to, ...content, kind: 'session-published' }, { transaction }));
    await drain();
    const [caught] = await messagesTo(to);
    expect(caught.html).not.toContain('<script');
    expect(caught.html).not.toContain('<img');
    expect(caught.html).toContain('&lt;script&gt;alert(&quot;plate&quot;)&lt;/script&gt;');
    expect(caught.html).toContain('Edda &amp; &quot;Co&quot;');
    // The plain-text part is text: it carries the title as typed.
    expect(caught.text).toContain('<script>alert("plate")</script>');
  });

  it('refuses a bad message and a missing transaction, naming what is wrong', async () => {
    const error = await sequelize
      .transaction((transaction) => enqueueMail(mail('not an address', 'Bad'), { transaction }))
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ZodError);
    expect((error as ZodError).issues.map((i) => i.path.join('.'))).toContain('to');

    const header = await sequelize
      .transaction((transaction) => enqueueMail(mail(address('header'), 'Line one\nBcc: someone@example.test'), { transaction }))
      .catch((e: unknown) => e);
    expect(header).toBeInstanceOf(ZodError);
    expect((header as ZodError).issues.map((i) => i.path.join('.'))).toContain('subject');

    await expect(enqueueMail(mail(address('no-tx'), 'No transaction'), undefined as never)).rejects.toThrow(/transaction/);
    expect(await OutboxMessage.count({ where: { toAddress: { [Op.in]: [address('header'), address('no-tx')] } } })).toBe(0);
  });
});

describe('when the SMTP service is down', () => {
  it('keeps the message, backs off, and delivers it once the service is back', async () => {
    const to = address('outage');
    const smtpPort = service.smtpPort;
    await service.close();

    await sequelize.transaction((transaction) => enqueueMail(mail(to, 'Sent after the outage'), { transaction }));
    const now = new Date();
    const report = await sendDueMail({ limit: 50, now });
    expect(report.error).toBeUndefined();
    expect(report.retrying).toBeGreaterThanOrEqual(1);

    let row = await rowFor(to);
    expect(row.status).toBe('pending');
    expect(row.attempts).toBe(1);
    expect(row.lastError).toMatch(/ECONNREFUSED|ECONNECTION/);
    // First retry after 30 s (our back-off rule: 30 s doubling, at most 1 h).
    expect(row.nextAttemptAt.getTime()).toBe(now.getTime() + 30_000);

    // Not due yet: a run a moment later leaves it alone.
    await sendDueMail({ limit: 50, now: new Date(now.getTime() + 29_000) });
    row = await rowFor(to);
    expect(row.attempts).toBe(1);

    service = await startMailService({ smtpPort, httpPort, dataDir });
    expect(service.smtpPort).toBe(smtpPort);
    await drain(new Date(now.getTime() + 31_000));

    const caught = await messagesTo(to);
    expect(caught).toHaveLength(1);
    expect(caught[0].subject).toBe('Sent after the outage');
    row = await rowFor(to);
    expect(row.status).toBe('sent');
    expect(row.attempts).toBe(2);
    expect(row.lastError).toBeNull();
  });

  it('gives a message up at once when the server refuses the address for good (5xx), and sends the rest', async () => {
    // The local mail service refuses the reserved .invalid domain with 550, as for a mailbox that does not exist.
    const bounced = `nobody.${TAG}@bounce.invalid`;
    const fine = address('beside-a-bounce');
    await sequelize.transaction(async (transaction) => {
      await enqueueMail(mail(bounced, 'Refused for good'), { transaction });
      await enqueueMail(mail(fine, 'Delivered beside a bounce'), { transaction });
    });
    try {
      await drain();
      const row = await rowFor(bounced);
      expect(row.status).toBe('failed');
      expect(row.attempts).toBe(1);
      expect(row.lastError).toMatch(/550/);
      expect((await rowFor(fine)).status).toBe('sent');
      expect(await messagesTo(fine)).toHaveLength(1);
    } finally {
      await OutboxMessage.destroy({ where: { toAddress: bounced } });
    }
  });

  it('gives a message up after the last allowed attempt', async () => {
    const to = address('given-up');
    await sequelize.transaction((transaction) => enqueueMail(mail(to, 'Never gets through'), { transaction }));
    await OutboxMessage.update({ attempts: MAX_ATTEMPTS - 1 }, { where: { toAddress: to } });
    await service.close();
    try {
      await drain();
      const row = await rowFor(to);
      expect(row.status).toBe('failed');
      expect(row.attempts).toBe(MAX_ATTEMPTS);
    } finally {
      service = await startMailService({ smtpPort: Number(process.env.SMTP_PORT), httpPort, dataDir });
    }
    // A given-up row stays given up.
    await drain(new Date(Date.now() + 48 * 3600_000));
    expect(await messagesTo(to)).toHaveLength(0);
  });

  it('waits 30 s after the first failure, doubling up to an hour (our rule)', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8, 9].map(retryDelayMs)).toEqual([30, 60, 120, 240, 480, 960, 1920, 3600, 3600].map((s) => s * 1000));
  });
});
