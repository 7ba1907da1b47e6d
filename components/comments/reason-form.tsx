'use client';

import { useActionState, useId, useRef } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { countChars } from '@/lib/validations/comments';
import { Button } from '@/components/ui/button';
import { inputClass } from '@/components/ui/field';
import { applyActionErrors, dispatchForm, IDLE } from '@/components/forms/action-state';
import type { ActionState } from '@/lib/actions/authed';

type ReasonValues = { reason: string };

type Props<D> = {
  /** Names the form for assistive technology, e.g. "Report the comment by Tobias Quill". */
  name: string;
  /** The question above the box, e.g. "Why hide it? Readers see this reason". */
  label: string;
  /** Said after the count, e.g. "e.g. unsafe advice, rude, advertising." */
  after: string;
  max: number;
  /** The schema the server action parses the reason with. */
  schema: z.ZodType<ReasonValues, ReasonValues>;
  action: (prev: ActionState<D>, form: FormData) => Promise<ActionState<D>>;
  /** Hidden fields sent with the reason, e.g. { commentId }. */
  fields: Record<string, string | number>;
  submitLabel: string;
  busyLabel: string;
  danger?: boolean;
  className: string;
  onDone: (state: ActionState<D>) => void;
  onCancel: () => void;
};

/**
 * A reason in a box with its character count, sent to a server action: reporting a comment to the admins,
 * and hiding one (by the builder under the comment, or by an admin from the queue).
 */
export function ReasonForm<D>({ name, label, after, max, schema, action, fields, submitLabel, busyLabel, danger, className, onDone, onCancel }: Props<D>) {
  const id = useId();
  const formRef = useRef<HTMLFormElement>(null);
  const { register, handleSubmit, formState, setError, watch } = useForm<ReasonValues>({ resolver: zodResolver(schema), defaultValues: { reason: '' } });
  const [state, dispatch, pending] = useActionState<ActionState<D>, FormData>(async (prev, data) => {
    const result = await action(prev, data);
    applyActionErrors(result, setError);
    if (result.ok) onDone(result);
    return result;
  }, IDLE);
  const fieldError = formState.errors.reason?.message;
  // A refusal not about the reason (signed out, no longer allowed, already removed) is said below the buttons.
  const failure = !state.ok && !state.fieldErrors?.reason ? state.message : null;
  const onSubmit = handleSubmit(() => dispatchForm(formRef.current!, dispatch));

  return (
    <form ref={formRef} aria-label={name} className={className} noValidate onSubmit={onSubmit}>
      {Object.entries(fields).map(([key, value]) => (
        <input key={key} type="hidden" name={key} value={value} />
      ))}
      <label htmlFor={`${id}-reason`} className="block text-sm font-semibold">
        {label}
      </label>
      <textarea
        id={`${id}-reason`}
        rows={2}
        autoFocus
        maxLength={max}
        className={`${inputClass} resize-y`}
        aria-invalid={!!fieldError}
        aria-describedby={`${id}-reason-hint${fieldError ? ` ${id}-reason-error` : ''}`}
        {...register('reason')}
      />
      <p id={`${id}-reason-hint`} className="dim text-xs text-graphite-2">
        {countChars((watch('reason') ?? '').trim())} / {max} · {after}
      </p>
      {fieldError ? (
        <p id={`${id}-reason-error`} role="alert" className="text-sm font-medium text-bad">
          <span aria-hidden="true">✕ </span>
          {fieldError}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" tone={danger ? 'danger' : 'primary'} disabled={pending}>
          {pending ? busyLabel : submitLabel}
        </Button>
        <Button type="button" tone="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      {failure ? (
        <p role="alert" className="text-sm font-medium text-bad">
          <span aria-hidden="true">✕ </span>
          {failure}
        </p>
      ) : null}
    </form>
  );
}
