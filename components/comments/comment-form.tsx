'use client';

import { useEffect, useId, useImperativeHandle, useRef, useState, type FormEvent, type Ref } from 'react';
import { formatClock } from '@/lib/chapters';
import { COMMENT_BODY_MAX, countChars } from '@/lib/validations/comments';
import { Button } from '@/components/ui/button';
import { inputClass } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import type { Playhead } from './entry-discussion';

export type Pin = { mediaId: number; atMs: number };
export type SubmitOutcome = { ok: true } | { ok: false; status: number; message: string; fieldErrors?: Record<string, string[]> };
export type CommentFormHandle = { focusWithPin: () => void };

type Props = {
  /** Names the form for assistive technology, e.g. "New comment", "Reply to Tobias Quill". */
  name: string;
  label: string;
  hint?: string;
  submitLabel: string;
  busyLabel: string;
  initialBody?: string;
  /** Offer pinning to the clip's playhead (new comments on an entry with a clip). */
  playhead?: Playhead | null;
  onSubmit: (body: string, pin: Pin | null) => Promise<SubmitOutcome>;
  onCancel?: () => void;
  autoFocus?: boolean;
  handle?: Ref<CommentFormHandle>;
};

const wholeSecond = (ms: number) => Math.floor(ms / 1000) * 1000;
const maxWords = COMMENT_BODY_MAX.toLocaleString('en-US');

export function CommentForm({ name, label, hint, submitLabel, busyLabel, initialBody = '', playhead, onSubmit, onCancel, autoFocus, handle }: Props) {
  const id = useId();
  const [body, setBody] = useState(initialBody);
  const [pin, setPin] = useState<Pin | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [failure, setFailure] = useState<{ status: number; message: string } | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const textRef = useRef<HTMLTextAreaElement>(null);
  const formRef = useRef<HTMLFormElement>(null);

  const length = countChars(body.trim());
  const over = length > COMMENT_BODY_MAX;
  // Whole seconds, as notes are: the reader lands just before the moment, never after it.
  const nowAt = playhead ? Math.min(wholeSecond(playhead.nowMs), playhead.durationMs ?? Infinity) : null;

  useEffect(() => {
    if (autoFocus) textRef.current?.focus();
  }, [autoFocus]);

  useImperativeHandle(handle, () => ({
    focusWithPin: () => {
      if (playhead && nowAt !== null) setPin({ mediaId: playhead.clipId, atMs: nowAt });
      formRef.current?.scrollIntoView({ behavior: 'smooth', block: 'center' });
      textRef.current?.focus({ preventScroll: true });
    },
  }));

  function check(): string | null {
    if (!body.trim()) return 'Write your comment.';
    if (over) return `Comment must be ${maxWords} characters or fewer.`;
    return null;
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    if (saving) return;
    const problem = check();
    setError(problem);
    setFailure(null);
    setDone(null);
    if (problem) {
      textRef.current?.focus();
      return;
    }
    setSaving(true);
    const outcome = await onSubmit(body.trim(), pin);
    setSaving(false);
    if (outcome.ok) {
      setBody('');
      setPin(null);
      setDone('Posted.');
      return;
    }
    const bodyError = outcome.fieldErrors?.body?.[0];
    if (bodyError) setError(bodyError);
    const other = Object.entries(outcome.fieldErrors ?? {}).find(([f]) => f !== 'body')?.[1]?.[0];
    setFailure({ status: outcome.status, message: other && !outcome.message.includes(other) ? `${outcome.message} ${other}` : outcome.message });
  }

  const described = [error ? `${id}-error` : null, hint ? `${id}-hint` : null, `${id}-count`].filter(Boolean).join(' ');

  return (
    <form ref={formRef} onSubmit={submit} noValidate aria-label={name} className="space-y-3">
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-body`} className="text-sm font-semibold">
          {label}
        </label>
        <textarea
          ref={textRef}
          id={`${id}-body`}
          value={body}
          onChange={(e) => {
            setBody(e.target.value);
            if (error) setError(null);
          }}
          rows={4}
          className={`${inputClass} min-h-28 resize-y`}
          aria-invalid={!!error || over}
          aria-describedby={described}
        />
        <div className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1">
          {error ? (
            <p id={`${id}-error`} className="flex items-center gap-1 text-sm font-medium text-bad">
              <span aria-hidden="true">✕</span> {error}
            </p>
          ) : hint ? (
            <p id={`${id}-hint`} className="text-xs text-graphite-2">
              {hint}
            </p>
          ) : (
            <span />
          )}
          <p id={`${id}-count`} className={`dim text-xs ${over ? 'font-semibold text-bad' : 'text-graphite-2'}`}>
            {over ? <span aria-hidden="true">✕ </span> : null}
            {length.toLocaleString('en-US')} / {maxWords}
            <span className="sr-only"> characters{over ? `, ${(length - COMMENT_BODY_MAX).toLocaleString('en-US')} too many` : ''}</span>
          </p>
        </div>
      </div>

      {playhead && nowAt !== null ? (
        <div className="space-y-1 rounded-md border border-rule bg-paper-2/60 px-3 py-2">
          <label className="flex min-h-11 cursor-pointer items-center gap-3 text-sm font-semibold">
            <input
              type="checkbox"
              className="h-5 w-5 shrink-0 accent-dye"
              checked={pin !== null}
              onChange={(e) => setPin(e.target.checked ? { mediaId: playhead.clipId, atMs: nowAt } : null)}
            />
            <span>
              Tie it to the clip at <span className="dim">{formatClock(pin?.atMs ?? nowAt)}</span>
            </span>
          </label>
          <p className="text-xs text-graphite-2">
            {pin ? 'It will show among the clip’s notes as a reader’s question; a click there plays from this moment.' : 'Pause the clip at the moment you mean, then tick this.'}
          </p>
          {pin && (pin.atMs !== nowAt || pin.mediaId !== playhead.clipId) ? (
            <Button type="button" tone="quiet" onClick={() => setPin({ mediaId: playhead.clipId, atMs: nowAt })}>
              <span>
                Move the pin to <span className="dim">{formatClock(nowAt)}</span>
              </span>
            </Button>
          ) : null}
        </div>
      ) : null}

      {failure ? (
        <div role="alert">
          <Notice kind={failure.status === 429 ? 'caution' : 'error'} title={failure.status === 429 ? 'Posting too fast' : failure.status === 409 ? 'Changed elsewhere' : 'Not posted'}>
            <p>{failure.message}</p>
          </Notice>
        </div>
      ) : null}

      <div className="flex flex-wrap items-center gap-2">
        <Button type="submit" disabled={saving}>
          {saving ? busyLabel : submitLabel}
        </Button>
        {onCancel ? (
          <Button type="button" tone="quiet" onClick={onCancel} disabled={saving}>
            Cancel
          </Button>
        ) : null}
        <span role="status" className="text-sm text-ok">
          {done ? (
            <>
              <span aria-hidden="true">✓ </span>
              {done}
            </>
          ) : null}
        </span>
      </div>
    </form>
  );
}
