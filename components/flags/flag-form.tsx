'use client';

import { useActionState, useRef } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { FLAG_HAZARD_OPTIONS, FLAG_SEVERITY_OPTIONS, FLAG_TEXT_MAX, flagInputSchema } from '@/lib/validations/flags';
import { formatClock } from '@/lib/chapters';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { dispatchForm, IDLE } from '@/components/forms/action-state';
import { raiseFlagAction, updateFlagAction } from '@/lib/actions/flags';
import type { ActionState } from '@/lib/actions/authed';
import type { FlagView } from '@/lib/types/flags';
import { SeverityIcon, SEVERITY_TONE } from './flag-words';

export type FlagTargets = {
  notes: { id: number; startMs: number; text: string; clipName: string }[];
  records: { id: number; feature: string }[];
};

const formSchema = flagInputSchema.omit({ target: true }).extend({ target: z.string() });
type FormInput = z.input<typeof formSchema>;
type FormOutput = z.output<typeof formSchema>;

const shorten = (s: string, n = 60) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);

/** A mentor raises a flag (choosing what it points at), or changes their own while it is unanswered. */
export function FlagForm({
  entryId,
  flag,
  targets,
  initialTarget = 'entry',
  onDone,
  onCancel,
}: {
  entryId: number;
  flag?: FlagView;
  targets: FlagTargets;
  initialTarget?: string;
  onDone: (flag: FlagView) => void;
  onCancel: () => void;
}) {
  const formRef = useRef<HTMLFormElement>(null);
  const prefix = flag ? `flag-${flag.id}-edit` : `flag-new-${entryId}`;
  const { register, handleSubmit, formState, setError, watch } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(formSchema),
    defaultValues: flag
      ? { target: 'entry', severity: flag.severity, hazard: flag.hazard, concern: flag.concern, instead: flag.instead }
      : // Nothing chosen yet: the mentor must pick a severity and a hazard, never get one by default.
        { target: initialTarget, severity: undefined, hazard: '' as FormInput['hazard'], concern: '', instead: '' },
  });
  const { errors } = formState;
  const chosen = watch('severity');

  // Checked here with the same schema first; the server's refusals land beside the same fields
  // (target.noteId and target.recordId beside the one target choice).
  const [state, dispatch, pending] = useActionState<ActionState<FlagView>, FormData>(async (prev, data) => {
    const result = flag ? await updateFlagAction(prev, data) : await raiseFlagAction(prev, data);
    if (!result.ok) {
      for (const [field, messages] of Object.entries(result.fieldErrors ?? {})) {
        const name = field.startsWith('target') ? 'target' : field;
        if (['target', 'severity', 'hazard', 'concern', 'instead'].includes(name) && messages[0]) {
          setError(name as keyof FormInput, { type: 'server', message: messages[0] });
        }
      }
    } else if (result.data) onDone(result.data);
    return result;
  }, IDLE);
  const failure = state.ok ? null : state;

  const onSubmit = handleSubmit(() => dispatchForm(formRef.current!, dispatch));

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-4 rounded-lg border border-rule bg-card p-4" aria-label={flag ? 'Change your risk flag' : 'Flag a risk'}>
      {flag ? (
        <>
          <input type="hidden" name="flagId" value={flag.id} />
          <input type="hidden" name="version" value={flag.version} />
        </>
      ) : (
        <input type="hidden" name="entryId" value={entryId} />
      )}
      {failure ? (
        <Notice kind="error" role="alert" title={failure.status === 409 ? 'Changed elsewhere' : 'Not saved'}>
          {failure.message}
        </Notice>
      ) : null}

      {!flag ? (
        <Field id={`${prefix}-target`} label="What are you flagging?" hint="The whole entry, one moment of a clip, or one measurement." error={errors.target?.message}>
          <select id={`${prefix}-target`} className={inputClass} aria-invalid={!!errors.target} aria-describedby={describedBy(`${prefix}-target`, errors.target?.message, 'hint')} {...register('target')}>
            <option value="entry">The entry as a whole</option>
            {targets.notes.length ? (
              <optgroup label="A note on a clip">
                {targets.notes.map((n) => (
                  <option key={n.id} value={`note:${n.id}`}>
                    {formatClock(n.startMs)} — {shorten(n.text)}
                  </option>
                ))}
              </optgroup>
            ) : null}
            {targets.records.length ? (
              <optgroup label="A measurement">
                {targets.records.map((r) => (
                  <option key={r.id} value={`record:${r.id}`}>
                    {r.feature}
                  </option>
                ))}
              </optgroup>
            ) : null}
          </select>
        </Field>
      ) : null}

      <fieldset className="space-y-2" aria-describedby={errors.severity ? `${prefix}-severity-error` : undefined}>
        <legend className="text-sm font-semibold">How serious is it?</legend>
        <div className="grid gap-2 sm:grid-cols-3">
          {FLAG_SEVERITY_OPTIONS.map((o) => {
            const tone = SEVERITY_TONE[o.value];
            const active = chosen === o.value;
            return (
              <label
                key={o.value}
                className={`flex min-h-11 cursor-pointer items-start gap-2 rounded-md border-2 p-3 text-sm ${active ? `${tone.edge} ${tone.box}` : 'border-rule'}`}
              >
                <input type="radio" value={o.value} className="mt-1 h-4 w-4" {...register('severity')} />
                <span>
                  <span className={`flex items-center gap-1 font-bold ${tone.text}`}>
                    <SeverityIcon severity={o.value} /> {o.label}
                  </span>
                  <span className="block text-xs text-graphite-2">{o.meaning}</span>
                </span>
              </label>
            );
          })}
        </div>
        {errors.severity ? (
          <p id={`${prefix}-severity-error`} className="flex items-center gap-1 text-sm font-medium text-bad" data-field-error="severity">
            <span aria-hidden="true">✕</span> {errors.severity.message}
          </p>
        ) : null}
      </fieldset>

      <Field id={`${prefix}-hazard`} label="Hazard" error={errors.hazard?.message}>
        <select id={`${prefix}-hazard`} className={inputClass} aria-invalid={!!errors.hazard} aria-describedby={describedBy(`${prefix}-hazard`, errors.hazard?.message)} {...register('hazard')}>
          <option value="" disabled>
            Choose one…
          </option>
          {FLAG_HAZARD_OPTIONS.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </Field>

      <Field id={`${prefix}-concern`} label="What is the concern?" hint={`What could go wrong, and how. Up to ${FLAG_TEXT_MAX} characters.`} error={errors.concern?.message}>
        <textarea id={`${prefix}-concern`} rows={3} maxLength={FLAG_TEXT_MAX} className={inputClass} aria-invalid={!!errors.concern} aria-describedby={describedBy(`${prefix}-concern`, errors.concern?.message, 'hint')} {...register('concern')} />
      </Field>

      <Field id={`${prefix}-instead`} label="What to do instead" hint="The safer way, as you would show it at the machine." error={errors.instead?.message}>
        <textarea id={`${prefix}-instead`} rows={3} maxLength={FLAG_TEXT_MAX} className={inputClass} aria-invalid={!!errors.instead} aria-describedby={describedBy(`${prefix}-instead`, errors.instead?.message, 'hint')} {...register('instead')} />
      </Field>

      {flag?.status === 'acknowledged' ? (
        <p className="text-xs text-graphite-2">The builder has seen this flag; changing it asks them to look again.</p>
      ) : null}

      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : flag ? 'Save changes' : 'Raise the flag'}
        </Button>
        <Button type="button" tone="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
