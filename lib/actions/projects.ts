'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { z } from 'zod';
import { authedAction } from './authed';
import { formFields, numberField } from './form-data';
import { createProjectOnce, deleteProject, updateProject } from '../server/projects';
import { projectIdSchema } from '../validations/project';
import { unauthenticated } from '../errors';

const idOf = (fields: Record<string, FormDataEntryValue>) => z.object({ projectId: projectIdSchema }).parse({ projectId: fields.projectId }).projectId;

/**
 * The new-project form: title, summary, units, visibility and the tab's attempt key (`requestId`), so a
 * repeated submit gives the project the first one made. Hands back the slug; the form goes to its log.
 */
export const createProjectAction = authedAction<FormData, { slug: string; title: string; created: boolean }>(async (user, form) => {
  const { project, created } = await createProjectOnce(user, formFields(form));
  revalidatePath('/projects');
  return { ok: true, data: { slug: project.slug, title: project.title, created } };
});

/** The project's settings form (with the `version` it was opened at); back to the list when saved. */
export const updateProjectAction = authedAction<FormData, never>(async (user, form) => {
  const fields = formFields(form);
  const id = idOf(fields);
  if (!user) throw unauthenticated('change this project');
  const { projectId: _id, ...changes } = fields;
  const project = await updateProject(user, id, { ...changes, version: numberField(fields, 'version') });
  revalidatePath('/projects');
  redirect(`/projects?saved=${encodeURIComponent(project.slug)}`);
});

export const deleteProjectAction = authedAction<FormData, never>(async (user, form) => {
  await deleteProject(user, idOf(formFields(form)));
  revalidatePath('/projects');
  redirect('/projects');
});
