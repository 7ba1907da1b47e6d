import { route, readJson, created } from '@/lib/http/route';
import { createProject, listMentoredProjects, listMyProjects, listPublishedProjects } from '@/lib/server/projects';
import { withOpenFlagCounts } from '@/lib/server/flags';
import { projectListQuerySchema } from '@/lib/validations/project';

export const dynamic = 'force-dynamic';

/**
 * ?scope=mine (the signed-in builder's projects), ?scope=mentored (projects they mentor, with open risk
 * flags counted) or ?scope=published (the default).
 */
export const GET = route(async ({ req, user }) => {
  const { scope } = projectListQuerySchema.parse(Object.fromEntries(req.nextUrl.searchParams));
  if (scope === 'mine') return { projects: await withOpenFlagCounts(await listMyProjects(user)) };
  if (scope === 'mentored') return { projects: await withOpenFlagCounts(await listMentoredProjects(user)) };
  return { projects: await listPublishedProjects(user) };
});

export const POST = route(async ({ req, user }) => {
  const body = await (user ? readJson(req) : Promise.resolve({}));
  return created({ project: await createProject(user, body) });
});
