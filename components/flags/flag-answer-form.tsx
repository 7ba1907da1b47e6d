'use client';

import { useActionState, useRef } from 'react';
import { useRouter } from 'next/navigation';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { inputClass } from '@/components/ui/field';
import { dispatchForm, IDLE } from '@/components/forms/action-state';
import { resolveFlagAction } from '@/lib/actions/flags';
import type { ActionState } from '@/lib/actions/authed';
import { FLAG_ANSWER_MAX, FLAG_STEP_WORDS, flagResolveSchema } from '@/lib/validations/flags';
import type { FlagView } from '@/lib/types/flags';

const answerSchema = flagResolveSchema.pick({ answer: true });

/** The builder's answer, which resolves the flag; sent with the version it was read at (changed since: 409). */
export function AnswerForm({ flag, onDone, onCancel }: { flag: FlagView; onDone: (f: FlagView) => void; onCancel: () => void }) {
  const router = useRouter();
  const formRef = useRef<HTMLFormElement>(null);
  const { register, handleSubmit, formState, setError } = useForm<z.input<typeof answerSchema>, unknown, z.output<typeof answerSchema>>({
    resolver: zodResolver(answerSchema),
    defaultValues: { answer: '' },
  });
  const id = `flag-${flag.id}-answer`;

  // Checked here with the same schema first; the server's refusal shows in the same place.
  const [, dispatch, saving] = useActionState<ActionState<FlagView>, FormData>(async (prev, data) => {
    const result = await resolveFlagAction(prev, data);
    if (!result.ok) {
      setError('answer', { type: 'server', message: result.fieldErrors?.answer?.[0] ?? result.message ?? 'Not saved.' });
      // Changed since the page was drawn: show it as it is now.
      if (result.status === 409) router.refresh();
    } else if (result.data) onDone(result.data);
    return result;
  }, IDLE);
  const error = formState.errors.answer?.message;
  const submit = handleSubmit(() => dispatchForm(formRef.current!, dispatch));

  return (
    <form ref={formRef} onSubmit={submit} noValidate className="space-y-2" aria-label="Answer the flag">
      <input type="hidden" name="flagId" value={flag.id} />
      <input type="hidden" name="version" value={flag.version} />
      <label htmlFor={id} className="text-sm font-semibold">
        Your answer to {flag.mentor.name}
      </label>
      <textarea
        id={id}
        rows={3}
        maxLength={FLAG_ANSWER_MAX}
        className={inputClass}
        aria-invalid={!!error}
        aria-describedby={error ? `${id}-error` : `${id}-hint`}
        autoFocus
        {...register('answer')}
      />
      {error ? (
        <p id={`${id}-error`} className="flex items-center gap-1 text-sm font-medium text-bad" role="alert" data-field-error="answer">
          <span aria-hidden="true">✕</span> {error}
        </p>
      ) : (
        <p id={`${id}-hint`} className="text-xs text-graphite-2">
          What you changed or checked. It is shown with the flag, and e-mailed to the mentor.
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={saving}>
          {saving ? 'Saving…' : FLAG_STEP_WORDS.answer.submit}
        </Button>
        <Button type="button" tone="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
