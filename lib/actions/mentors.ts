'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { authedAction } from './authed';
import { formFields, idField } from './form-data';
import { unauthenticated } from '../errors';
import { acceptInvitation, createInvitation, removeMentor, revokeInvitation } from '../server/invitations';
import type { InvitationView } from '../types/flags';

// The builder's project settings page lists the mentors and the invitations from the server.
const SETTINGS_PAGE = '/projects/[slug]/edit';

/** Invites someone by e-mail (`email`, `note`); inviting the same address again sends a new link. */
export const inviteMentorAction = authedAction<FormData, InvitationView>(async (user, form) => {
  const { projectId: _p, email, note } = formFields(form);
  const projectId = idField({ projectId: _p }, 'projectId');
  const invitation = await createInvitation(user, projectId, { email, ...(note === undefined ? {} : { note }) });
  revalidatePath(SETTINGS_PAGE, 'page');
  return { ok: true, data: invitation };
});

/** Withdraws an invitation that was not accepted yet: its link stops working. */
export const revokeInvitationAction = authedAction<FormData, InvitationView>(async (user, form) => {
  const invitation = await revokeInvitation(user, idField(formFields(form), 'invitationId'));
  revalidatePath(SETTINGS_PAGE, 'page');
  return { ok: true, data: invitation };
});

/** The builder removes a mentor; the flags they raised stay in the log. */
export const removeMentorAction = authedAction<FormData, never>(async (user, form) => {
  const fields = formFields(form);
  await removeMentor(user, idField(fields, 'projectId'), idField(fields, 'userId'));
  revalidatePath(SETTINGS_PAGE, 'page');
});

/** The invited member accepts with the link's token and lands on the project's log. */
export const acceptInvitationAction = authedAction<FormData, never>(async (user, form) => {
  const { token } = formFields(form);
  if (!user) throw unauthenticated('accept this invitation');
  const { project } = await acceptInvitation(user, { token });
  revalidatePath('/projects');
  redirect(`/logs/${project.slug}`);
});
