'use client';

import { startTransition, useEffect, useState, type ReactNode } from 'react';
import { useRouter } from 'next/navigation';
import dynamic from 'next/dynamic';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Notice } from '@/components/ui/notice';
import { IDLE } from '@/components/forms/action-state';
import { FormLoading } from '@/components/forms/form-loading';
import { acknowledgeFlagAction, withdrawFlagAction } from '@/lib/actions/flags';
import { FLAG_STEP_WORDS, hazardLabel } from '@/lib/validations/flag-words';
import type { FlagView } from '@/lib/types/flags';
import type { FlagTargets } from './flag-form';
import { FlagStatusBadge, FlagStatusMark, SeverityBadge, SEVERITY_TONE, targetText } from './flag-words';
import { formatDate } from '@/lib/format';

type Props = {
  entryId: number;
  /** The entry's flags as the page rendered them on the server (a saved change renders the page again). */
  initialFlags: FlagView[];
  /** builder: mark as seen and answer; reader: the cautions as a follower reads them (mentors also raise flags here). */
  mode: 'builder' | 'reader';
  canFlag: boolean;
  targets: FlagTargets;
};

// The forms (raising, changing and answering a flag) and their validation load when one is opened: a reader
// of the entry never loads them.
const FlagForm = dynamic(() => import('./flag-form').then((m) => m.FlagForm), { loading: FormLoading });
const AnswerForm = dynamic(() => import('./flag-answer-form').then((m) => m.AnswerForm), { loading: FormLoading });

/** A one-field form for an action that names a flag. */
function flagForm(flag: FlagView): FormData {
  const data = new FormData();
  data.set('flagId', String(flag.id));
  data.set('version', String(flag.version));
  return data;
}

/**
 * The entry's risk flags: open ones as a banner on top, answered ones folded away below it. The flags come
 * from the page; every change is a server action that renders the page again (the markers beside notes and
 * records and the open counts too), so nothing is fetched again here.
 */
export function EntryFlags({ entryId, initialFlags: flags, mode, canFlag, targets }: Props) {
  const router = useRouter();
  const [adding, setAdding] = useState(false);
  const [editing, setEditing] = useState<number | null>(null);
  const [answering, setAnswering] = useState<number | null>(null);
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);

  // A link to an answered flag (#flag-12, from a marker or an e-mail) must unfold the list it sits in.
  useEffect(() => {
    function reveal() {
      const match = /^#flag-(\d+)$/.exec(window.location.hash);
      const el = match ? document.getElementById(`flag-${match[1]}`) : null;
      const fold = el?.closest('details');
      if (!el || !fold) return;
      fold.open = true;
      el.scrollIntoView({ block: 'start' });
    }
    reveal();
    window.addEventListener('hashchange', reveal);
    return () => window.removeEventListener('hashchange', reveal);
  }, []);

  const open = flags.filter((f) => f.status !== 'resolved');
  const resolved = flags.filter((f) => f.status === 'resolved');
  if (!flags.length && !canFlag) return null;

  async function acknowledge(flag: FlagView) {
    setMessage(null);
    const state = await acknowledgeFlagAction(IDLE, flagForm(flag));
    if (!state.ok) {
      setMessage({ kind: 'error', text: state.message ?? 'Not saved.' });
      // Changed since the page was drawn: show it as it is now.
      if (state.status === 409) startTransition(() => router.refresh());
      return;
    }
    setMessage({ kind: 'success', text: FLAG_STEP_WORDS.seen.done });
  }

  async function withdraw(flag: FlagView): Promise<string | null> {
    const state = await withdrawFlagAction(IDLE, flagForm(flag));
    if (!state.ok && state.status !== 404) return state.message ?? 'Not withdrawn.';
    setMessage({ kind: 'success', text: 'Your flag was withdrawn.' });
    if (!state.ok) startTransition(() => router.refresh());
    return null;
  }

  return (
    <section aria-labelledby={`flags-${entryId}`} className="space-y-3" data-testid="entry-flags">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id={`flags-${entryId}`} className="flex items-center gap-2 text-xl font-bold">
          Risk flags
          {open.length ? <span className="text-base font-semibold text-scribe">· {open.length} open</span> : null}
        </h2>
        {canFlag && !adding ? (
          <Button type="button" tone="quiet" onClick={() => setAdding(true)}>
            <FlagStatusMark status="open" /> Flag a risk
          </Button>
        ) : null}
      </div>

      {open.length && mode === 'reader' && !canFlag ? (
        <p className="text-sm text-graphite-2">
          A mentor of this project flagged a risk here that the builder has not answered yet. Read it before you try this in your own shop.
        </p>
      ) : null}

      {message ? (
        <Notice kind={message.kind} role={message.kind === 'error' ? 'alert' : 'status'}>
          {message.text}
        </Notice>
      ) : null}

      {adding ? (
        <FlagForm
          entryId={entryId}
          targets={targets}
          onCancel={() => setAdding(false)}
          onDone={() => {
            setAdding(false);
            setMessage({ kind: 'success', text: 'Flag raised. The builder has been e-mailed and must answer it.' });
          }}
        />
      ) : null}

      {open.length ? (
        <ul className="space-y-3" aria-label="Open risk flags">
          {open.map((flag) => (
            <li key={flag.id}>
              {editing === flag.id ? (
                <FlagForm
                  entryId={entryId}
                  flag={flag}
                  targets={targets}
                  onCancel={() => setEditing(null)}
                  onDone={() => {
                    setEditing(null);
                    setMessage({ kind: 'success', text: 'Your flag was changed.' });
                  }}
                />
              ) : (
                <FlagCard flag={flag} mode={mode}>
                  {mode === 'builder' && flag.can.answer ? (
                    <div className="space-y-2 border-t border-rule pt-3">
                      <div className="flex flex-wrap gap-2">
                        {flag.status === 'open' ? (
                          <Button type="button" onClick={() => void acknowledge(flag)}>
                            <FlagStatusMark status="acknowledged" /> {FLAG_STEP_WORDS.seen.button}
                          </Button>
                        ) : null}
                        {answering !== flag.id ? (
                          <Button type="button" tone={flag.status === 'open' ? 'quiet' : 'primary'} onClick={() => setAnswering(flag.id)}>
                            <FlagStatusMark status="resolved" /> {FLAG_STEP_WORDS.answer.button}
                          </Button>
                        ) : null}
                      </div>
                      {flag.status === 'open' ? <p className="text-xs text-graphite-2">{FLAG_STEP_WORDS.hint}</p> : null}
                      {answering === flag.id ? (
                        <AnswerForm
                          flag={flag}
                          onCancel={() => setAnswering(null)}
                          onDone={(f) => {
                            setAnswering(null);
                            setMessage({ kind: 'success', text: `Answered. ${f.mentor.name} has been e-mailed your answer.` });
                          }}
                        />
                      ) : null}
                    </div>
                  ) : null}
                  {flag.can.edit ? (
                    <div className="flex flex-wrap gap-2 border-t border-rule pt-3">
                      <Button type="button" tone="quiet" className="!min-h-10 !px-3" onClick={() => setEditing(flag.id)}>
                        Change
                      </Button>
                      <ConfirmDialog
                        small
                        trigger="Withdraw"
                        triggerLabel="Withdraw this flag"
                        title="Withdraw this flag?"
                        body="It disappears from the entry for the builder and for readers."
                        confirmLabel="Withdraw flag"
                        onConfirm={() => withdraw(flag)}
                      />
                    </div>
                  ) : null}
                </FlagCard>
              )}
            </li>
          ))}
        </ul>
      ) : flags.length || adding ? null : (
        <p className="text-sm text-graphite-2">No risk flags on this entry. If something here could hurt someone or spoil the part, flag it for the builder.</p>
      )}

      {resolved.length ? (
        <details className="rounded-md border border-rule bg-card" data-testid="resolved-flags">
          <summary className="flex min-h-11 cursor-pointer items-center gap-2 px-3 text-sm font-semibold">
            <span className="text-ok">
              <FlagStatusMark status="resolved" />
            </span>
            {resolved.length === 1 ? '1 answered flag' : `${resolved.length} answered flags`}
            {!open.length ? <span className="font-normal text-graphite-2">· none open</span> : null}
          </summary>
          <ul className="space-y-3 border-t border-rule p-3">
            {resolved.map((flag) => (
              <li key={flag.id}>
                <FlagCard flag={flag} mode={mode} />
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </section>
  );
}

function FlagCard({ flag, mode, children }: { flag: FlagView; mode: 'builder' | 'reader'; children?: ReactNode }) {
  const tone = SEVERITY_TONE[flag.severity];
  const resolved = flag.status === 'resolved';
  return (
    <article
      id={`flag-${flag.id}`}
      className={`scroll-mt-24 space-y-3 rounded-lg border border-l-[6px] bg-card p-4 ${resolved ? 'border-rule border-l-ok/60' : `${tone.edge}`}`}
      data-flag-id={flag.id}
      aria-label={`${flag.severity} flag: ${hazardLabel(flag.hazard)}`}
    >
      <header className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <SeverityBadge severity={flag.severity} withMeaning={!resolved && mode === 'builder'} />
        <span className="text-sm font-semibold">{hazardLabel(flag.hazard)}</span>
        <span className="text-sm text-graphite-2">{targetText(flag.target)}</span>
        <span className="ml-auto">
          <FlagStatusBadge status={flag.status} />
        </span>
      </header>
      {flag.target.kind === 'note' ? <p className="border-l-2 border-rule pl-2 text-sm italic text-graphite-2">“{flag.target.text}”</p> : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <p className="text-xs font-semibold uppercase tracking-wide text-graphite-2">The concern</p>
          <p className="whitespace-pre-line break-words text-sm">{flag.concern}</p>
        </div>
        <div className={resolved ? '' : `rounded-md p-2 ${tone.box}`}>
          <p className="text-xs font-semibold uppercase tracking-wide text-graphite-2">What to do instead</p>
          <p className="whitespace-pre-line break-words text-sm font-medium">{flag.instead}</p>
        </div>
      </div>
      <p className="text-xs text-graphite-2">
        Raised by {flag.mentor.name}, mentor, on <time dateTime={flag.createdAt}>{formatDate(flag.createdAt)}</time>
        {flag.acknowledgedAt ? (
          <>
            {' '}
            · seen by the builder <time dateTime={flag.acknowledgedAt}>{formatDate(flag.acknowledgedAt)}</time>
          </>
        ) : null}
      </p>
      {resolved && flag.answer ? (
        <div className="rounded-md border border-ok/40 bg-ok-soft/50 p-3">
          <p className="text-xs font-semibold uppercase tracking-wide text-ok">
            <FlagStatusMark status="resolved" className="mr-1 inline h-3.5 w-3.5 align-[-2px]" />
            The builder’s answer{flag.resolvedAt ? <>, {formatDate(flag.resolvedAt)}</> : null}
          </p>
          <p className="whitespace-pre-line break-words text-sm">{flag.answer}</p>
        </div>
      ) : null}
      {children}
    </article>
  );
}
