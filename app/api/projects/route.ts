import { route, readJson, created } from '@/lib/http/route';
import { createProject, listMyProjects, listPublishedProjects } from '@/lib/server/projects';
import { projectListQuerySchema } from '@/lib/validations/project';

export const dynamic = 'force-dynamic';

/** ?scope=mine (the signed-in builder's projects) or ?scope=published (the default). */
export const GET = route(async ({ req, user }) => {
  const { scope } = projectListQuerySchema.parse(Object.fromEntries(req.nextUrl.searchParams));
  const projects = scope === 'mine' ? await listMyProjects(user) : await listPublishedProjects(user);
  return { projects };
});

export const POST = route(async ({ req, user }) => {
  const body = await (user ? readJson(req) : Promise.resolve({}));
  return created({ project: await createProject(user, body) });
});
