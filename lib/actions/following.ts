'use server';

import { revalidatePath } from 'next/cache';
import { authedAction } from './authed';
import { formFields, idField } from './form-data';
import { AppError, unauthenticated } from '../errors';
import {
  builderFollowState, deleteFollow, followBuilder, followProject, projectFollowState, setAllFollowMail, setFollowMail, unfollowBuilder, unfollowProject,
} from '../server/follows';
import type { FollowState } from '../types/following';

// The member's follows are listed on their settings page, rendered on the server.
const SETTINGS_PAGE = '/settings';

type Target = { projectId: number } | { handle: string };

/** What a follow button names: a project (`projectId`) or a builder (`handle`); neither is a 400. */
function targetOf(fields: Record<string, FormDataEntryValue>): Target {
  if (fields.projectId !== undefined) return { projectId: idField(fields, 'projectId') };
  if (typeof fields.handle === 'string') return { handle: fields.handle };
  throw new AppError('validation', 'Say what to follow: a project or a builder.', { projectId: ['Give the project or the builder to follow.'] });
}

/** "true" or "false" from a form; anything else goes to the schema as it came, which names the field. */
function mailOf(fields: Record<string, FormDataEntryValue>): unknown {
  return fields.mail === 'true' ? true : fields.mail === 'false' ? false : fields.mail;
}

/** Follows a project or a builder (again is no change); hands back the button's new state. */
export const followAction = authedAction<FormData, FollowState>(async (user, form) => {
  const target = targetOf(formFields(form));
  const { state } = 'projectId' in target ? await followProject(user, target.projectId) : await followBuilder(user, target.handle);
  revalidatePath(SETTINGS_PAGE);
  return { ok: true, data: state };
});

export const unfollowAction = authedAction<FormData, FollowState>(async (user, form) => {
  const target = targetOf(formFields(form));
  if (!user) throw unauthenticated('unfollow');
  if ('projectId' in target) await unfollowProject(user, target.projectId);
  else await unfollowBuilder(user, target.handle);
  revalidatePath(SETTINGS_PAGE);
  const state = 'projectId' in target ? await projectFollowState(user, target.projectId) : await builderFollowState(user, target.handle);
  return { ok: true, data: state };
});

/** One follow's e-mail switch on the settings page (`followId`, `mail` true or false). */
export const setFollowMailAction = authedAction<FormData, never>(async (user, form) => {
  const fields = formFields(form);
  const followId = idField(fields, 'followId');
  if (!user) throw unauthenticated('change your settings');
  await setFollowMail(user, followId, { mail: mailOf(fields) });
  revalidatePath(SETTINGS_PAGE);
});

/** Every follow's e-mail at once, e.g. "all follow e-mail off". */
export const setAllFollowMailAction = authedAction<FormData, { changed: number }>(async (user, form) => {
  const fields = formFields(form);
  if (!user) throw unauthenticated('change your settings');
  const result = await setAllFollowMail(user, { mail: mailOf(fields) });
  revalidatePath(SETTINGS_PAGE);
  return { ok: true, data: result };
});

/** Unfollows from the settings page, by the follow's own id (someone else's is a 404). */
export const deleteFollowAction = authedAction<FormData, never>(async (user, form) => {
  await deleteFollow(user, idField(formFields(form), 'followId'));
  revalidatePath(SETTINGS_PAGE);
});
