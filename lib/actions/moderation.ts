'use server';

import { revalidatePath } from 'next/cache';
import { authedAction } from './authed';
import { formFields, idField } from './form-data';
import { dismissReports, reportComment } from '../server/moderation';
import { unauthenticated } from '../errors';

// The admins' queue is rendered on the server: a report or a dismissal renders it again.
const MODERATION_PAGE = '/admin/comments';

/** A member reports someone else's comment to the admins, with a reason only they see. */
export const reportCommentAction = authedAction<FormData, { alreadyReported: boolean }>(async (user, form) => {
  const fields = formFields(form);
  const commentId = idField(fields, 'commentId');
  if (!user) throw unauthenticated('report a comment');
  const { alreadyReported } = await reportComment(user, commentId, { reason: fields.reason });
  revalidatePath(MODERATION_PAGE);
  return { ok: true, data: { alreadyReported } };
});

/** Admins: the comment stays as it is and its open reports are closed. */
export const dismissReportsAction = authedAction<FormData, { dismissed: number }>(async (user, form) => {
  const result = await dismissReports(user, idField(formFields(form), 'commentId'));
  revalidatePath(MODERATION_PAGE);
  return { ok: true, data: result };
});
