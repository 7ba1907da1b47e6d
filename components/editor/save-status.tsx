'use client';

import type { ReactNode } from 'react';
import { formatTimeOfDay } from '@/lib/format';
import { signInHref } from '@/components/ui/sign-in-link';
import type { SaveState } from './use-entry-autosave';

/** The editor's save chip: where the entry's saving stands, in words, with Retry and "Sign in again" when they help. */
export function SaveStatus({ state, now, onRetry }: { state: SaveState; now: number; onRetry: () => void }) {
  let icon = '';
  let text: ReactNode = '';
  let tone = 'border-rule bg-paper-2 text-graphite-2';
  let retry = false;
  switch (state.kind) {
    case 'clean':
      icon = '✓';
      text = 'No changes yet';
      break;
    case 'pending':
      icon = '✎';
      text = 'Changes not saved yet';
      break;
    case 'saving':
      icon = '↻';
      text = 'Saving…';
      break;
    case 'saved':
      icon = '✓';
      text = `Saved ${formatTimeOfDay(state.at)}`;
      tone = 'border-ok/50 bg-ok-soft text-ok';
      break;
    case 'retrying': {
      const s = Math.max(0, Math.ceil((state.retryAt - now) / 1000));
      icon = '✕';
      text = `Not saved — ${state.message}; retrying${s > 0 ? ` in ${s} s` : '…'}`;
      tone = 'border-bad/50 bg-bad-soft text-bad';
      retry = true;
      break;
    }
    case 'failed':
      icon = '✕';
      text = `Not saved — ${state.message}`;
      tone = 'border-bad/50 bg-bad-soft text-bad';
      retry = true;
      break;
    case 'invalid':
      icon = '✕';
      text = `Not saved — ${state.message}`;
      tone = 'border-bad/50 bg-bad-soft text-bad';
      break;
    case 'conflict':
      icon = '✕';
      text = 'Not saved — changed elsewhere';
      tone = 'border-bad/50 bg-bad-soft text-bad';
      break;
  }
  return (
    // A fixed minimum width: the chip must not hop between rows as its words change while typing.
    <div className="ml-auto flex min-w-52 flex-wrap items-center justify-end gap-2">
      <p role="status" aria-live="polite" className={`inline-flex min-h-8 items-center gap-1.5 rounded-full border px-3 text-sm font-medium ${tone}`} data-save-state={state.kind}>
        <span aria-hidden="true" className={state.kind === 'saving' ? 'inline-block animate-spin motion-reduce:animate-none' : ''}>
          {icon}
        </span>
        {text}
      </p>
      {state.kind === 'failed' && state.signedOut ? (
        // A new tab keeps this page and its unsaved text; sign-in there comes back to this editor.
        <a href={signInHref(`${window.location.pathname}${window.location.search}`)} target="_blank" rel="noopener" className="min-h-10 rounded-md border border-rule bg-card px-3 py-2 text-sm font-semibold">
          Sign in again
        </a>
      ) : null}
      {retry ? (
        <button type="button" onClick={onRetry} className="min-h-10 rounded-md border border-rule bg-card px-3 text-sm font-semibold hover:bg-paper-2">
          Retry now
        </button>
      ) : null}
    </div>
  );
}
