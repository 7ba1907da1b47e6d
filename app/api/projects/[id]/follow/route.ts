import { NextResponse } from 'next/server';
import { route, idParam } from '@/lib/http/route';
import { followProject, projectFollowState, unfollowProject } from '@/lib/server/follows';

type Params = { id: string };

/** { following, followId, mail, followers } for the viewer. */
export const GET = route<Params>(async ({ user, params }) => ({ follow: await projectFollowState(user, idParam(params)) }));

/** Follows the project: 201 when new, 200 when already followed. */
export const POST = route<Params>(async ({ user, params }) => {
  const { created, state } = await followProject(user, idParam(params));
  return NextResponse.json({ follow: state }, { status: created ? 201 : 200 });
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await unfollowProject(user, idParam(params));
  return undefined;
});
