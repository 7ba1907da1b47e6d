'use server';

import { revalidatePath } from 'next/cache';
import { authedAction } from './authed';
import { formFields, idField, numberField } from './form-data';
import { createSession, deleteSession, updateSession } from '../server/sessions';
import { unauthenticated } from '../errors';
import type { SessionView } from '../types/log';

// The builder's log page lists the sessions from the server: a saved change renders it again.
const LOG_PAGE = '/projects/[slug]/log';

/** The new-session form of a project's log. Hands back the session, for the form's words. */
export const createSessionAction = authedAction<FormData, SessionView>(async (user, form) => {
  const { projectId: _p, ...fields } = formFields(form);
  const projectId = idField({ projectId: _p }, 'projectId');
  if (!user) throw unauthenticated('log a session');
  const session = await createSession(user, projectId, fields);
  revalidatePath(LOG_PAGE, 'page');
  return { ok: true, data: session, message: `Session “${session.title}” added.` };
});

/** A session's edit form, with the version it was opened at (stale: 409). */
export const updateSessionAction = authedAction<FormData, SessionView>(async (user, form) => {
  const { sessionId: _s, ...fields } = formFields(form);
  const sessionId = idField({ sessionId: _s }, 'sessionId');
  if (!user) throw unauthenticated('change this session');
  const session = await updateSession(user, sessionId, { ...fields, version: numberField(fields, 'version') });
  revalidatePath(LOG_PAGE, 'page');
  return { ok: true, data: session, message: `Session “${session.title}” saved.` };
});

export const deleteSessionAction = authedAction<FormData, never>(async (user, form) => {
  await deleteSession(user, idField(formFields(form), 'sessionId'));
  revalidatePath(LOG_PAGE, 'page');
});
