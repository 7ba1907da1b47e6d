'use server';

import { revalidatePath } from 'next/cache';
import { authedAction } from './authed';
import { formFields, idField, numberField } from './form-data';
import { acknowledgeFlag, createFlag, resolveFlag, updateFlag, withdrawFlag } from '../server/flags';
import { unauthenticated } from '../errors';
import type { FlagView } from '../types/flags';

// Flags show on the entry (the builder's page and the reader's), as markers beside notes and records, and as
// open counts above the log, on the timeline, the session page and the project cards: all rendered on the server.
function revalidateFlagPages(): void {
  revalidatePath('/(app)/projects/[slug]/entries/[entryId]/edit', 'page');
  revalidatePath('/(app)/projects/[slug]/log', 'page');
  revalidatePath('/(app)/projects', 'page');
  revalidatePath('/(public)/logs/[slug]', 'layout');
}

/**
 * What the form's target field names: 'entry', 'note:<id>' or 'record:<id>' (one select), as the API's
 * { target } body. Anything else is passed on as it is, for the schema to refuse by name.
 */
function targetOf(value: FormDataEntryValue | undefined): unknown {
  if (value === undefined || value === '' || value === 'entry') return 'entry';
  const match = typeof value === 'string' ? /^(note|record):(.*)$/.exec(value) : null;
  if (!match) return value;
  return match[1] === 'note' ? { noteId: match[2] } : { recordId: match[2] };
}

/** A mentor raises a flag on an entry, one of its notes or one of its records; the builder is e-mailed. */
export const raiseFlagAction = authedAction<FormData, FlagView>(async (user, form) => {
  const { entryId: _e, target, ...fields } = formFields(form);
  const entryId = idField({ entryId: _e }, 'entryId');
  const flag = await createFlag(user, entryId, { ...fields, target: targetOf(target) });
  revalidateFlagPages();
  return { ok: true, data: flag };
});

/** The mentor changes their own flag, with the version it was opened at (stale or answered: 409). */
export const updateFlagAction = authedAction<FormData, FlagView>(async (user, form) => {
  const { flagId: _f, target: _t, ...fields } = formFields(form);
  const flagId = idField({ flagId: _f }, 'flagId');
  if (!user) throw unauthenticated('change this flag');
  const flag = await updateFlag(user, flagId, { ...fields, version: numberField(fields, 'version') });
  revalidateFlagPages();
  return { ok: true, data: flag };
});

/** The mentor withdraws their own flag while it is unanswered. */
export const withdrawFlagAction = authedAction<FormData, never>(async (user, form) => {
  await withdrawFlag(user, idField(formFields(form), 'flagId'));
  revalidateFlagPages();
});

/** The builder says they have seen the flag ("I’ve seen it"), at the version they saw. */
export const acknowledgeFlagAction = authedAction<FormData, FlagView>(async (user, form) => {
  const fields = formFields(form);
  const flagId = idField(fields, 'flagId');
  if (!user) throw unauthenticated('answer this flag');
  const flag = await acknowledgeFlag(user, flagId, { version: numberField(fields, 'version') });
  revalidateFlagPages();
  return { ok: true, data: flag };
});

/** The builder answers the flag, which resolves it; the mentor is e-mailed the answer. */
export const resolveFlagAction = authedAction<FormData, FlagView>(async (user, form) => {
  const { flagId: _f, ...fields } = formFields(form);
  const flagId = idField({ flagId: _f }, 'flagId');
  if (!user) throw unauthenticated('answer this flag');
  const flag = await resolveFlag(user, flagId, { answer: fields.answer, version: numberField(fields, 'version') });
  revalidateFlagPages();
  return { ok: true, data: flag };
});
