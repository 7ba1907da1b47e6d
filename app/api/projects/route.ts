import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { CREATE_REQUEST_ID_HEADER, createProjectOnce, listMentoredProjects, listMyProjects, listPublishedProjects } from '@/lib/server/projects';
import { withOpenFlagCounts } from '@/lib/server/flags';
import { projectListQuerySchema } from '@/lib/validations/project';


/**
 * ?scope=mine (the signed-in builder's projects), ?scope=mentored (projects they mentor, with open risk
 * flags counted), a page of 24 at a time (`?after=` the last page's `nextCursor`): { projects, nextCursor };
 * or ?scope=published (the default): the latest 24 published projects, { projects, nextCursor: null }.
 */
export const GET = route(async ({ req, user }) => {
  const { scope, after } = projectListQuerySchema.parse(Object.fromEntries(req.nextUrl.searchParams));
  if (scope === 'mine' || scope === 'mentored') {
    const page = scope === 'mine' ? await listMyProjects(user, after) : await listMentoredProjects(user, after);
    return { projects: await withOpenFlagCounts(page.projects), nextCursor: page.nextCursor };
  }
  return { projects: await listPublishedProjects(user), nextCursor: null };
});

/**
 * Creates a project: 201. An optional client-made `requestId` (in the body, or the `Idempotency-Key`
 * header) makes a repeated submit give the same project back: 200 with the project the first one created.
 */
export const POST = route<Record<string, string>, unknown>({ body: 'member-json' }, async ({ req, user, body }) => {
  const { project, created } = await createProjectOnce(user, body, req.headers.get(CREATE_REQUEST_ID_HEADER));
  return NextResponse.json({ project, created }, { status: created ? 201 : 200 });
});
