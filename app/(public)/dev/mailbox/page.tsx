import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { connection } from 'next/server';
import { CapturedMessage } from '@/components/mail/captured-message';
import { ButtonLink } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { getCurrentUser } from '@/lib/auth/current-user';
import { canUseDevTool } from '@/lib/auth/policy';
import { devMailboxEnabled, listCapturedMail, outboxOverview } from '@/lib/server/dev-mailbox';
import type { OutboxOverview } from '@/lib/types/mail';

// Rendered for each request (it reads the viewer's session); see DEVELOPERS.md "Reading a page".
export const instant = false;

export const metadata: Metadata = { title: 'Dev mailbox', robots: { index: false } };

export default async function DevMailboxPage() {
  await connection();
  const user = await getCurrentUser();
  if (!canUseDevTool(user, 'readDevMailbox', { devToolsEnabled: devMailboxEnabled() })) notFound();

  const [mail, outbox] = await Promise.all([
    listCapturedMail(user),
    outboxOverview(user).catch((err: unknown): string => (err instanceof Error ? err.message : String(err))),
  ]);

  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <h1 className="text-3xl font-bold">Dev mailbox</h1>
        <p className="max-w-3xl text-graphite-2">
          Every e-mail the app sends in development and tests is caught by the local mail service and shown here, newest first. Nothing leaves this
          machine. This page does not exist in a real deployment.
        </p>
        <div className="flex flex-wrap gap-2">
          <ButtonLink href="/dev/mailbox" tone="quiet" prefetch={false}>
            Check again
          </ButtonLink>
        </div>
      </header>

      <OutboxSummary outbox={outbox} />

      <section aria-labelledby="caught-heading" className="space-y-4">
        <h2 id="caught-heading" className="text-xl font-bold">
          Caught messages{mail.available ? ` (${mail.messages.length})` : ''}
        </h2>
        {!mail.available ? (
          <Notice kind="caution" title="The local mail service is out of reach">
            {mail.reason}
          </Notice>
        ) : mail.messages.length === 0 ? (
          <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">No messages yet. Mail the app sends will appear here.</p>
        ) : (
          mail.messages.map((m) => <CapturedMessage key={m.id} message={m} />)
        )}
      </section>
    </div>
  );
}

function OutboxSummary({ outbox }: { outbox: OutboxOverview | string }) {
  if (typeof outbox === 'string') {
    return (
      <Notice kind="caution" title="The outbox could not be read">
        {outbox}
      </Notice>
    );
  }
  return (
    <section aria-labelledby="outbox-heading" className="space-y-3 rounded-lg border border-rule bg-card p-4">
      <h2 id="outbox-heading" className="text-xl font-bold">
        Outbox
      </h2>
      <p className="text-sm">
        <span className="dim">{outbox.pending}</span> {outbox.pending === 1 ? 'message' : 'messages'} waiting to go out · <span className="dim">{outbox.sent}</span> sent ·{' '}
        <span className="dim">{outbox.failed}</span> given up
      </p>
      {outbox.waiting.length ? (
        <ul className="space-y-2 text-sm">
          {outbox.waiting.map((w) => (
            <li key={w.id} className="rounded-md border border-rule bg-paper-2 p-3">
              <p className="font-semibold">
                <span aria-hidden="true">{w.status === 'failed' ? '✕ ' : '↻ '}</span>
                {w.status === 'failed' ? 'Given up: ' : 'Waiting: '}
                {w.subject}
              </p>
              <p className="text-graphite-2">
                To {w.to} · <span className="dim">{w.attempts}</span> {w.attempts === 1 ? 'try' : 'tries'} so far
                {w.status === 'pending' ? (
                  <>
                    {' '}
                    · next try{' '}
                    <time dateTime={w.nextAttemptAt} className="dim">
                      {new Date(w.nextAttemptAt).toLocaleString('en-GB', { timeStyle: 'medium', dateStyle: 'medium' })}
                    </time>
                  </>
                ) : null}
              </p>
              {w.lastError ? <p className="mt-1 break-words text-graphite-2">Last error: {w.lastError}</p> : null}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
