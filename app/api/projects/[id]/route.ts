import { route, readJson } from '@/lib/http/route';
import { deleteProject, getProjectForViewer, updateProject } from '@/lib/server/projects';
import { z } from 'zod';
import { projectIdSchema } from '@/lib/validations/project';
import { unauthenticated } from '@/lib/errors';


type Params = { id: string };
const idOf = (params: Params) => z.object({ id: projectIdSchema }).parse(params).id;

export const GET = route<Params>(async ({ user, params }) => ({ project: await getProjectForViewer(user, { id: idOf(params) }) }));

export const PATCH = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  if (!user) throw unauthenticated('change this project');
  return { project: await updateProject(user, id, await readJson(req)) };
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteProject(user, idOf(params));
  return undefined;
});
