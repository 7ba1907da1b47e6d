'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useId, useRef, useState } from 'react';
import { format } from 'date-fns';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/client/api-client';
import { plural } from '@/lib/format';
import type { ModerationItem } from '@/lib/types/moderation';

const when = (iso: string) => format(new Date(iso), 'd MMM yyyy, HH:mm');

/** One reported comment: its text, who reported it and why, and the two answers — hide it, or dismiss the reports. */
export function ReportedComment({ item }: { item: ModerationItem }) {
  const router = useRouter();
  const reasonId = useId();
  const [hiding, setHiding] = useState(false);
  const [reason, setReason] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ message: string; field?: string } | null>(null);
  const inFlight = useRef(false);

  async function act(run: () => ReturnType<typeof sendJson>) {
    if (inFlight.current) return;
    inFlight.current = true;
    setBusy(true);
    setError(null);
    const res = await run();
    inFlight.current = false;
    setBusy(false);
    if (!res.ok) {
      setError({ message: res.error.message, field: res.error.fieldErrors?.reason?.[0] });
      return;
    }
    router.refresh();
  }

  return (
    <article className="space-y-3 rounded-lg border border-rule bg-card p-4" data-testid={`reported-${item.commentId}`} aria-labelledby={`${reasonId}-head`}>
      <header id={`${reasonId}-head`} className="text-sm text-graphite-2">
        <strong className="text-graphite">{item.authorName}</strong> on <Link href={item.href}>{item.where}</Link> · {when(item.createdAt)}
      </header>
      <blockquote className="whitespace-pre-line break-words border-l-4 border-rule pl-3">{item.body}</blockquote>
      <div>
        <p className="text-sm font-semibold">Reported {item.reports.length === 1 ? 'once' : plural(item.reports.length, 'time')}</p>
        <ul className="mt-1 space-y-1 text-sm">
          {item.reports.map((r, i) => (
            <li key={i}>
              <span className="font-semibold">{r.reporterName}</span>: <span className="break-words">{r.reason}</span>{' '}
              <span className="text-graphite-2">· {when(r.at)}</span>
            </li>
          ))}
        </ul>
      </div>
      {hiding ? (
        <form
          className="space-y-2"
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            void act(() => sendJson(`/api/comments/${item.commentId}/hide`, 'POST', { reason }));
          }}
        >
          <label htmlFor={reasonId} className="block text-sm font-semibold">
            Why it is hidden (everyone reading the entry sees this)
          </label>
          <input
            id={reasonId}
            className={inputClass}
            value={reason}
            maxLength={300}
            onChange={(e) => setReason(e.target.value)}
            aria-invalid={error?.field ? true : undefined}
            aria-describedby={error?.field ? `${reasonId}-error` : undefined}
          />
          {error?.field ? (
            <p id={`${reasonId}-error`} className="text-sm font-medium text-bad">
              ✕ {error.field}
            </p>
          ) : null}
          <div className="flex flex-wrap gap-2">
            <Button type="submit" disabled={busy}>
              {busy ? 'Hiding…' : 'Hide the comment'}
            </Button>
            <Button type="button" tone="quiet" onClick={() => setHiding(false)}>
              Cancel
            </Button>
          </div>
        </form>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button type="button" onClick={() => setHiding(true)}>
            Hide…
          </Button>
          <Button type="button" tone="quiet" disabled={busy} onClick={() => void act(() => sendJson(`/api/admin/comments/${item.commentId}/dismiss`, 'POST'))}>
            {busy ? 'Dismissing…' : 'Dismiss the reports'}
          </Button>
        </div>
      )}
      {error && !error.field ? (
        <Notice kind="error" role="alert">
          {error.message}
        </Notice>
      ) : null}
    </article>
  );
}
