'use client';

import { useActionState, useEffect, useId, useImperativeHandle, useRef, useState, type Ref } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { formatClock } from '@/lib/chapters';
import { COMMENT_BODY_MAX, commentBodySchema, countChars } from '@/lib/validations/comments';
import { Button } from '@/components/ui/button';
import { inputClass } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { applyActionErrors, dispatchForm, IDLE } from '@/components/forms/action-state';
import type { ActionState } from '@/lib/actions/authed';
import type { CommentView } from '@/lib/types/comments';
import type { Playhead } from './entry-discussion';

type Pin = { mediaId: number; atMs: number };
export type CommentFormHandle = { focusWithPin: () => void };

// The body as the server actions parse it (new comment, reply, edit); the ids travel as hidden fields.
const bodySchema = z.object({ body: commentBodySchema });
type BodyValues = z.input<typeof bodySchema>;

type Props = {
  /** Names the form for assistive technology, e.g. "New comment", "Reply to Tobias Quill". */
  name: string;
  label: string;
  hint?: string;
  submitLabel: string;
  busyLabel: string;
  initialBody?: string;
  /** postCommentAction (a new comment or a reply) or editCommentAction. */
  action: (prev: ActionState<CommentView>, form: FormData) => Promise<ActionState<CommentView>>;
  /** Hidden fields: { entryId } for a new comment, { entryId, parentId } for a reply, { commentId, version } for an edit. */
  fields: Record<string, string | number>;
  /** Offer pinning to the clip's playhead (new comments on an entry with a clip). */
  playhead?: Playhead | null;
  /** The saved comment, to put in place; a refusal stays in the form. */
  onDone: (comment: CommentView) => void;
  /** A refusal, after it is shown (an edit refused as stale reloads the list). */
  onRefused?: (state: ActionState<CommentView>) => void;
  onCancel?: () => void;
  autoFocus?: boolean;
  handle?: Ref<CommentFormHandle>;
};

const wholeSecond = (ms: number) => Math.floor(ms / 1000) * 1000;
const maxWords = COMMENT_BODY_MAX.toLocaleString('en-US');

export function CommentForm({ name, label, hint, submitLabel, busyLabel, initialBody = '', action, fields, playhead, onDone, onRefused, onCancel, autoFocus, handle }: Props) {
  const id = useId();
  const [pin, setPin] = useState<Pin | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const textRef = useRef<HTMLTextAreaElement | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  const { register, handleSubmit, formState, setError, reset, watch } = useForm<BodyValues>({ resolver: zodResolver(bodySchema), defaultValues: { body: initialBody } });
  const { ref: bodyRef, ...bodyField } = register('body', { onChange: () => setDone(null) });
  const error = formState.errors.body?.message;

  const [state, dispatch, pending] = useActionState<ActionState<CommentView>, FormData>(async (prev, data) => {
    const result = await action(prev, data);
    applyActionErrors(result, setError);
    if (result.ok && result.data) {
      reset({ body: '' });
      setPin(null);
      setDone('Posted.');
      onDone(result.data);
    } else if (!result.ok) {
      onRefused?.(result);
    }
    return result;
  }, IDLE);
  // Said above the buttons: the message, with what the server said about a field other than the body (a pin, the thread).
  const failure = state.ok
    ? null
    : (() => {
        const other = Object.entries(state.fieldErrors ?? {}).find(([f]) => f !== 'body')?.[1]?.[0];
        const message = state.message ?? 'Not posted.';
        return { status: state.status ?? 500, message: other && !message.includes(other) ? `${message} ${other}` : message };
      })();

  const length = countChars((watch('body') ?? '').trim());
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

  const onSubmit = handleSubmit(() => {
    setDone(null);
    dispatchForm(formRef.current!, dispatch);
  });

  const described = [error ? `${id}-error` : null, hint ? `${id}-hint` : null, `${id}-count`].filter(Boolean).join(' ');

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate aria-label={name} className="space-y-3">
      {Object.entries(fields).map(([key, value]) => (
        <input key={key} type="hidden" name={key} value={value} />
      ))}
      {pin ? (
        <>
          <input type="hidden" name="mediaId" value={pin.mediaId} />
          <input type="hidden" name="atMs" value={pin.atMs} />
        </>
      ) : null}
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-body`} className="text-sm font-semibold">
          {label}
        </label>
        <textarea
          ref={(el) => {
            bodyRef(el);
            textRef.current = el;
          }}
          id={`${id}-body`}
          rows={4}
          className={`${inputClass} min-h-28 resize-y`}
          aria-invalid={!!error || over}
          aria-describedby={described}
          {...bodyField}
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
        <Button type="submit" disabled={pending}>
          {pending ? busyLabel : submitLabel}
        </Button>
        {onCancel ? (
          <Button type="button" tone="quiet" onClick={onCancel} disabled={pending}>
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
