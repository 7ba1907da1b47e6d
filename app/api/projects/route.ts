import { NextResponse } from 'next/server';
import { route, readJson } from '@/lib/http/route';
import { CREATE_REQUEST_ID_HEADER, createProjectOnce, listMentoredProjects, listMyProjects, listPublishedProjects } from '@/lib/server/projects';
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

/**
 * Creates a project: 201. An optional client-made `requestId` (in the body, or the `Idempotency-Key`
 * header) makes a repeated submit give the same project back: 200 with the project the first one created.
 */
export const POST = route(async ({ req, user }) => {
  const body = await (user ? readJson(req) : Promise.resolve({}));
  const { project, created } = await createProjectOnce(user, body, req.headers.get(CREATE_REQUEST_ID_HEADER));
  return NextResponse.json({ project, created }, { status: created ? 201 : 200 });
});
