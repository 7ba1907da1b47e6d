'use client';

import { startTransition } from 'react';
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import type { ActionState } from '@/lib/actions/authed';

/** A form's state before its first submit. */
export const IDLE: ActionState<never> = { ok: true };

/** Puts a server action's per-field messages beside the matching fields of a react-hook-form form. */
export function applyActionErrors<T extends FieldValues>(state: ActionState<unknown>, setError: UseFormSetError<T>): void {
  if (state.ok) return;
  for (const [field, messages] of Object.entries(state.fieldErrors ?? {})) {
    if (field !== '_' && messages[0]) setError(field as Path<T>, { type: 'server', message: messages[0] });
  }
}

/**
 * Dispatches a form's action with the form's own fields (plus any extras) in a transition. Forms dispatch
 * from onSubmit rather than through `<form action>`: React resets a form after its action, which would
 * empty what the member typed when the server refuses it.
 */
export function dispatchForm(form: HTMLFormElement, dispatch: (data: FormData) => void, extra: Record<string, string> = {}): void {
  const data = new FormData(form);
  for (const [k, v] of Object.entries(extra)) data.set(k, v);
  startTransition(() => dispatch(data));
}
