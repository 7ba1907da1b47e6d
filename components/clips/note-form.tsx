'use client';

import { useEffect, useId, useRef, useState, type FormEvent, type KeyboardEvent } from 'react';
import { formatClock, parseClock } from '@/lib/chapters';
import { NOTE_KIND_OPTIONS, NOTE_TEXT_MAX, type NoteKind } from '@/lib/validations/log-words';
import { Button } from '@/components/ui/button';
import { inputClass } from '@/components/ui/field';
import { KIND_HINT, KIND_TONE, NoteKindIcon } from './note-kind';

export type NoteDraft = { startMs: number; endMs: number | null; kind: NoteKind; text: string };
export type SaveOutcome = { ok: true } | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

type Props = {
  mode: 'new' | 'edit';
  initial: NoteDraft;
  /** Where the playhead is now, for "until now". */
  nowMs: number;
  durationMs: number | null;
  onSave: (draft: NoteDraft) => Promise<SaveOutcome>;
  onCancel: () => void;
};

type Errors = Partial<Record<'at' | 'until' | 'text' | 'kind' | 'form', string>>;

// The server names fields as the API does; the form names them as the builder reads them.
const SERVER_FIELD: Record<string, keyof Errors> = { startMs: 'at', endMs: 'until', text: 'text', kind: 'kind' };

export function NoteForm({ mode, initial, nowMs, durationMs, onSave, onCancel }: Props) {
  const id = useId();
  const [kind, setKind] = useState<NoteKind>(initial.kind);
  const [text, setText] = useState(initial.text);
  const [at, setAt] = useState(formatClockPrecise(initial.startMs));
  const [until, setUntil] = useState(initial.endMs == null ? '' : formatClockPrecise(initial.endMs));
  const [errors, setErrors] = useState<Errors>({});
  const [saving, setSaving] = useState(false);
  const textRef = useRef<HTMLTextAreaElement>(null);
  const formRef = useRef<HTMLFormElement>(null);

  useEffect(() => {
    textRef.current?.focus();
  }, []);

  function check(): { draft: NoteDraft } | { errors: Errors } {
    const found: Errors = {};
    const startMs = parseClock(at);
    const endMs = until.trim() ? parseClock(until) : null;
    if (startMs === null) found.at = 'Give the time as m:ss, for example 3:41.';
    else if (durationMs != null && startMs > durationMs) found.at = `The clip ends at ${formatClock(durationMs)}.`;
    if (until.trim() && endMs === null) found.until = 'Give the time as m:ss, for example 3:55, or leave it empty.';
    else if (endMs !== null && startMs !== null && endMs <= startMs) found.until = 'The end time must come after the start time.';
    else if (endMs !== null && durationMs != null && endMs > durationMs) found.until = `The clip ends at ${formatClock(durationMs)}.`;
    if (!text.trim()) found.text = 'Write the note.';
    else if (text.trim().length > NOTE_TEXT_MAX) found.text = `Keep the note under ${NOTE_TEXT_MAX} characters.`;
    if (Object.keys(found).length) return { errors: found };
    return { draft: { startMs: startMs!, endMs, kind, text: text.trim() } };
  }

  async function submit(e?: FormEvent) {
    e?.preventDefault();
    if (saving) return;
    const result = check();
    if ('errors' in result) {
      setErrors(result.errors);
      return;
    }
    setErrors({});
    setSaving(true);
    const outcome = await onSave(result.draft);
    setSaving(false);
    if (!outcome.ok) {
      const next: Errors = { form: outcome.message };
      for (const [field, messages] of Object.entries(outcome.fieldErrors ?? {})) {
        const key = SERVER_FIELD[field];
        if (key && messages[0]) next[key] = messages[0];
      }
      setErrors(next);
    }
  }

  function onKeyDown(e: KeyboardEvent<HTMLFormElement>) {
    if (e.key === 'Escape') {
      e.preventDefault();
      onCancel();
    }
  }

  function onTextKeyDown(e: KeyboardEvent<HTMLTextAreaElement>) {
    // Enter is a new line on every keyboard (a phone's included); Ctrl/⌘+Enter saves, like the button.
    // Not while an input method is composing a character.
    if (e.key === 'Enter' && (e.ctrlKey || e.metaKey) && !e.nativeEvent.isComposing) {
      e.preventDefault();
      void submit();
    }
  }

  const err = (k: keyof Errors) => (errors[k] ? `${id}-${k}-error` : undefined);
  const errorLine = (k: keyof Errors) =>
    errors[k] ? (
      <p id={`${id}-${k}-error`} className="flex items-center gap-1 text-sm font-medium text-bad">
        <span aria-hidden="true">✕</span> {errors[k]}
      </p>
    ) : null;

  return (
    <form
      ref={formRef}
      onSubmit={submit}
      onKeyDown={onKeyDown}
      noValidate
      aria-label={mode === 'new' ? `New note at ${formatClock(initial.startMs)}` : 'Edit note'}
      className="@container space-y-3 rounded-lg border-2 border-dye/50 bg-card p-3 sm:p-4"
    >
      {errors.form ? (
        <p role="alert" className="flex items-start gap-2 rounded-md border border-bad/50 bg-bad-soft px-3 py-2 text-sm text-bad">
          <span aria-hidden="true">✕</span>
          <span>{errors.form}</span>
        </p>
      ) : null}

      <fieldset>
        <legend className="mb-1 text-sm font-semibold">Kind</legend>
        <div className="grid grid-cols-2 gap-2 @lg:grid-cols-4">
          {NOTE_KIND_OPTIONS.map((o) => (
            <label
              key={o.value}
              title={KIND_HINT[o.value]}
              className="flex min-h-12 cursor-pointer items-center gap-2 rounded-full border-2 border-rule bg-paper px-3 text-sm font-semibold has-[:checked]:border-dye has-[:checked]:bg-dye-soft has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-dye-2"
            >
              <input type="radio" name={`${id}-kind`} value={o.value} checked={kind === o.value} onChange={() => setKind(o.value)} className="sr-only" />
              <span className={KIND_TONE[o.value]}>
                <NoteKindIcon kind={o.value} />
              </span>
              <span>{o.label}</span>
              {kind === o.value ? (
                <span aria-hidden="true" className="ml-auto text-dye">
                  ✓
                </span>
              ) : null}
            </label>
          ))}
        </div>
        {errorLine('kind')}
      </fieldset>

      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-text`} className="text-sm font-semibold">
          {mode === 'new' ? 'What is happening here' : 'Note'}
        </label>
        <textarea
          id={`${id}-text`}
          ref={textRef}
          rows={2}
          value={text}
          onChange={(e) => setText(e.target.value)}
          onKeyDown={onTextKeyDown}
          className={inputClass}
          aria-invalid={!!errors.text}
          aria-describedby={err('text') ?? `${id}-text-hint`}
          maxLength={NOTE_TEXT_MAX + 200}
        />
        {errors.text ? errorLine('text') : (
          <p id={`${id}-text-hint`} className="text-xs text-graphite-2">
            Enter starts a new line · Save note below, or Ctrl+Enter (⌘+Enter on a Mac) · Esc cancels
          </p>
        )}
      </div>

      <div className="grid gap-3 @lg:grid-cols-2">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-at`} className="text-sm font-semibold">
            At
          </label>
          <input
            id={`${id}-at`}
            value={at}
            onChange={(e) => setAt(e.target.value)}
            className={`${inputClass} dim`}
            inputMode="decimal"
            autoComplete="off"
            aria-invalid={!!errors.at}
            aria-describedby={err('at')}
          />
          {errorLine('at')}
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-until`} className="text-sm font-semibold">
            Until <span className="font-normal text-graphite-2">(optional)</span>
          </label>
          <div className="flex gap-2">
            <input
              id={`${id}-until`}
              value={until}
              onChange={(e) => setUntil(e.target.value)}
              placeholder="m:ss"
              className={`${inputClass} dim`}
              inputMode="decimal"
              autoComplete="off"
              aria-invalid={!!errors.until}
              aria-describedby={err('until')}
            />
            <Button type="button" tone="quiet" className="shrink-0 whitespace-nowrap" onClick={() => setUntil(formatClockPrecise(nowMs))}>
              Now <span className="dim">{formatClock(nowMs)}</span>
            </Button>
          </div>
          {errorLine('until')}
        </div>
      </div>

      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={saving} className="min-w-28">
          {saving ? 'Saving…' : mode === 'new' ? 'Save note' : 'Save changes'}
        </Button>
        <Button type="button" tone="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** m:ss, with tenths when the moment is not on a whole second, so editing a note never moves it. */
function formatClockPrecise(ms: number): string {
  const rest = ms % 1000;
  if (!rest) return formatClock(ms);
  return `${formatClock(ms)}.${String(rest).padStart(3, '0').replace(/0+$/, '')}`;
}
