'use client';

import { useActionState, useRef } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { sessionInputSchema, type SessionInput } from '@/lib/validations/log';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { applyActionErrors, dispatchForm, IDLE } from '@/components/forms/action-state';
import { createSessionAction, updateSessionAction } from '@/lib/actions/sessions';
import type { ActionState } from '@/lib/actions/authed';
import type { SessionView } from '@/lib/types/log';

type FormValues = z.input<typeof sessionInputSchema>;

const today = () => new Date().toISOString().slice(0, 10);

/** Creates a session in a project, or edits one (then it sends the version it was opened at). */
export function SessionForm({ projectId, session, onDone, onCancel }: { projectId: number; session?: SessionView; onDone: (s: SessionView) => void; onCancel?: () => void }) {
  const formRef = useRef<HTMLFormElement>(null);
  const { register, handleSubmit, formState, setError } = useForm<FormValues, unknown, SessionInput>({
    resolver: zodResolver(sessionInputSchema),
    defaultValues: session
      ? { title: session.title, heldOn: session.heldOn, minutesSpent: session.minutesSpent || '', planned: session.planned, done: session.done, nextSteps: session.nextSteps }
      : // Time stays empty (counted as nothing) until the builder says how long it took.
        { title: '', heldOn: today(), minutesSpent: '', planned: '', done: '', nextSteps: '' },
  });
  const { errors } = formState;
  const prefix = session ? `session-${session.id}` : 'new-session';

  // Checked here with the same schema first; the server's refusals land beside the same fields.
  const [state, dispatch, pending] = useActionState<ActionState<SessionView>, FormData>(async (prev, data) => {
    const result = session ? await updateSessionAction(prev, data) : await createSessionAction(prev, data);
    applyActionErrors(result, setError);
    if (result.ok && result.data) onDone(result.data);
    return result;
  }, IDLE);
  const failure = state.ok ? null : state;

  const onSubmit = handleSubmit(() => dispatchForm(formRef.current!, dispatch));

  const text = (name: 'planned' | 'done' | 'nextSteps', label: string, hint: string) => (
    <Field id={`${prefix}-${name}`} label={label} hint={hint} error={errors[name]?.message}>
      <textarea id={`${prefix}-${name}`} rows={2} className={inputClass} aria-invalid={!!errors[name]} aria-describedby={describedBy(`${prefix}-${name}`, errors[name]?.message, 'hint')} {...register(name)} />
    </Field>
  );

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-3" aria-label={session ? `Edit session ${session.title}` : 'New session'}>
      {session ? (
        <>
          <input type="hidden" name="sessionId" value={session.id} />
          <input type="hidden" name="version" value={session.version} />
        </>
      ) : (
        <input type="hidden" name="projectId" value={projectId} />
      )}
      {failure ? (
        <Notice kind="error" role="alert" title={failure.status === 409 ? 'Changed elsewhere' : 'Not saved'}>
          {failure.message}
          {failure.status === 409 ? (
            <button type="button" className="ml-2 font-semibold underline" onClick={() => window.location.reload()}>
              Reload
            </button>
          ) : null}
        </Notice>
      ) : null}
      <Field id={`${prefix}-title`} label="Session title" error={errors.title?.message}>
        <input id={`${prefix}-title`} className={inputClass} placeholder="e.g. Turning the spigot" aria-invalid={!!errors.title} aria-describedby={describedBy(`${prefix}-title`, errors.title?.message)} {...register('title')} />
      </Field>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id={`${prefix}-heldOn`} label="Date" error={errors.heldOn?.message}>
          <input id={`${prefix}-heldOn`} type="date" className={inputClass} aria-invalid={!!errors.heldOn} aria-describedby={describedBy(`${prefix}-heldOn`, errors.heldOn?.message)} {...register('heldOn')} />
        </Field>
        <Field id={`${prefix}-minutesSpent`} label="Time spent (minutes)" hint="At the machines and the bench; leave empty until you know." error={errors.minutesSpent?.message}>
          <input id={`${prefix}-minutesSpent`} type="number" inputMode="numeric" min={0} step={5} className={`${inputClass} dim`} aria-invalid={!!errors.minutesSpent} aria-describedby={describedBy(`${prefix}-minutesSpent`, errors.minutesSpent?.message, 'hint')} {...register('minutesSpent')} />
        </Field>
      </div>
      {text('planned', 'Planned', 'What you meant to do.')}
      {text('done', 'Done', 'What got done, and what went wrong.')}
      {text('nextSteps', 'Next', 'What comes next time.')}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : session ? 'Save session' : 'Add session'}
        </Button>
        {onCancel ? (
          <Button type="button" tone="quiet" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
