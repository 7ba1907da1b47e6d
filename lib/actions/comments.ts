'use server';

import { revalidatePath } from 'next/cache';
import { authedAction } from './authed';
import { formFields, idField, numberField } from './form-data';
import { createComment, deleteComment, hideComment, unhideComment, updateComment } from '../server/comments';
import type { CommentView } from '../types/comments';

// The entry's comments live in its discussion (paged on the client), which puts the answered comment in
// place; authorizeLog expires the published copy's tags after the commit. Only the moderation queue, a
// list rendered on the server, is rendered again.
const MODERATION_PAGE = '/admin/comments';

/** Optional whole-number fields: left out when empty, so the schema sees "not given" rather than "". */
function optionalNumbers(fields: Record<string, FormDataEntryValue>, names: string[]): Record<string, number | string> {
  const out: Record<string, number | string> = {};
  for (const name of names) {
    const value = numberField(fields, name);
    if (value !== undefined && value !== '') out[name] = value;
  }
  return out;
}

/** A new comment on an entry, a reply (`parentId`) or a question pinned to a clip (`mediaId` + `atMs`). */
export const postCommentAction = authedAction<FormData, CommentView>(async (user, form) => {
  const fields = formFields(form);
  const entryId = idField(fields, 'entryId');
  const comment = await createComment(user, entryId, { body: fields.body, ...optionalNumbers(fields, ['parentId', 'mediaId', 'atMs']) });
  return { ok: true, data: comment };
});

/** The author's change, with the version they opened (stale: 409). */
export const editCommentAction = authedAction<FormData, CommentView>(async (user, form) => {
  const fields = formFields(form);
  const comment = await updateComment(user, idField(fields, 'commentId'), { body: fields.body, version: numberField(fields, 'version') });
  return { ok: true, data: comment };
});

export const deleteCommentAction = authedAction<FormData, never>(async (user, form) => {
  await deleteComment(user, idField(formFields(form), 'commentId'));
});

/** The builder or an admin hides a comment, with the reason readers see (also from the moderation queue). */
export const hideCommentAction = authedAction<FormData, CommentView>(async (user, form) => {
  const fields = formFields(form);
  const comment = await hideComment(user, idField(fields, 'commentId'), { reason: fields.reason });
  revalidatePath(MODERATION_PAGE);
  return { ok: true, data: comment };
});

export const unhideCommentAction = authedAction<FormData, CommentView>(async (user, form) => {
  const comment = await unhideComment(user, idField(formFields(form), 'commentId'));
  revalidatePath(MODERATION_PAGE);
  return { ok: true, data: comment };
});
