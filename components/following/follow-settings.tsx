'use client';

import { useState, useTransition } from 'react';
import Link from 'next/link';
import { deleteFollowAction, setAllFollowMailAction, setFollowMailAction } from '@/lib/actions/following';
import type { ActionState } from '@/lib/actions/authed';
import { IDLE } from '@/components/forms/action-state';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { FollowView } from '@/lib/types/following';

const formOf = (fields: Record<string, string | number | boolean>) => {
  const data = new FormData();
  for (const [k, v] of Object.entries(fields)) data.set(k, String(v));
  return data;
};

function nameOf(f: FollowView): string {
  if (f.kind === 'builder') return f.builder?.name ?? 'A builder';
  return f.project?.title ?? 'A project its builder has made private';
}

/**
 * The member's follows (rendered by the settings page), each with its e-mail switch and an unfollow; and
 * "all e-mail off". Each action renders the page again, so the list is fresh when the message says what changed.
 */
export function FollowSettings({ follows }: { follows: FollowView[] }) {
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const [busy, startBusy] = useTransition();
  const anyMail = follows.some((f) => f.mail);

  function run(call: () => Promise<ActionState<unknown>>, done: string) {
    setMessage(null);
    startBusy(async () => {
      const state = await call();
      setMessage(state.ok ? { kind: 'success', text: done } : { kind: 'error', text: state.message ?? 'Not changed.' });
    });
  }

  if (!follows.length) {
    return (
      <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">
        You follow nothing yet. Open a <Link href="/">published build log</Link> or a builder’s profile and press “Follow”.
      </p>
    );
  }

  return (
    <div className="space-y-3">
      {message ? (
        <Notice kind={message.kind} role={message.kind === 'error' ? 'alert' : 'status'}>
          {message.text}
        </Notice>
      ) : null}
      <ul className="divide-y divide-rule rounded-xl border border-rule bg-card" aria-label="Your follows">
        {follows.map((f) => {
          const name = nameOf(f);
          const href = f.kind === 'builder' ? `/builders/${f.builder?.handle}` : f.project?.title ? `/logs/${f.project.slug}` : null;
          const switchId = `follow-mail-${f.id}`;
          return (
            <li key={f.id} className="flex flex-col gap-3 p-4 sm:flex-row sm:items-center sm:justify-between" data-testid={`follow-row-${f.id}`}>
              <div className="min-w-0">
                <p className="text-xs font-semibold uppercase tracking-wide text-graphite-2">{f.kind === 'builder' ? 'Builder' : 'Project'}</p>
                <p className="font-semibold">{href ? <Link href={href}>{name}</Link> : <span className="text-graphite-2">{name}</span>}</p>
                {f.kind === 'project' && f.project?.builderName ? <p className="text-sm text-graphite-2">by {f.project.builderName}</p> : null}
              </div>
              <div className="flex flex-wrap items-center gap-2">
                <button
                  id={switchId}
                  type="button"
                  role="switch"
                  aria-checked={f.mail}
                  aria-label={`E-mail for ${name}`}
                  disabled={busy}
                  onClick={() => run(() => setFollowMailAction(IDLE, formOf({ followId: f.id, mail: !f.mail })), `E-mail for “${name}” is now ${f.mail ? 'off' : 'on'}.`)}
                  className={`inline-flex min-h-11 items-center gap-2 rounded-md border px-3 text-sm font-semibold ${
                    f.mail ? 'border-ok/60 bg-ok-soft text-ok' : 'border-rule bg-paper text-graphite-2'
                  }`}
                >
                  <span aria-hidden="true" className={`relative inline-block h-5 w-9 rounded-full border ${f.mail ? 'border-ok bg-ok' : 'border-graphite-2/50 bg-paper-2'}`}>
                    <span className={`absolute top-0.5 h-3.5 w-3.5 rounded-full bg-card shadow transition-all ${f.mail ? 'left-[18px]' : 'left-0.5'}`} />
                  </span>
                  E-mail {f.mail ? 'on' : 'off'}
                </button>
                <Button
                  type="button"
                  tone="quiet"
                  disabled={busy}
                  aria-label={`Unfollow ${name}`}
                  onClick={() => run(() => deleteFollowAction(IDLE, formOf({ followId: f.id })), `You no longer follow “${name}”.`)}
                >
                  Unfollow
                </Button>
              </div>
            </li>
          );
        })}
      </ul>
      <div className="flex flex-wrap items-center gap-3">
        <Button
          type="button"
          tone="quiet"
          disabled={busy || !anyMail}
          onClick={() => run(() => setAllFollowMailAction(IDLE, formOf({ mail: false })), 'All follow e-mail is off. You still follow everything listed.')}
        >
          <span aria-hidden="true">✉</span> Switch all follow e-mail off
        </Button>
        {!anyMail ? <span className="text-sm text-graphite-2">All follow e-mail is off.</span> : null}
      </div>
    </div>
  );
}
