import { route } from '@/lib/http/route';
import { deleteProject, getProjectForViewer, updateProject } from '@/lib/server/projects';
import { z } from 'zod';
import { projectIdSchema } from '@/lib/validations/project';


type Params = { id: string };
const idOf = (params: Params) => z.object({ id: projectIdSchema }).parse(params).id;

export const GET = route<Params>(async ({ user, params }) => ({ project: await getProjectForViewer(user, { id: idOf(params) }) }));

export const PATCH = route<Params, unknown>({ auth: 'user', signInTo: 'change this project', body: 'json' }, async ({ user, params, body }) => ({
  project: await updateProject(user, idOf(params), body),
}));

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteProject(user, idOf(params));
  return undefined;
});
