import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { builderFollowState, followBuilder, unfollowBuilder } from '@/lib/server/follows';

type Params = { handle: string };

export const GET = route<Params>(async ({ user, params }) => ({ follow: await builderFollowState(user, params.handle) }));

/** Follows the builder: 201 when new, 200 when already followed; 400 for yourself. */
export const POST = route<Params>(async ({ user, params }) => {
  const { created, state } = await followBuilder(user, params.handle);
  return NextResponse.json({ follow: state }, { status: created ? 201 : 200 });
});

export const DELETE = route<Params>(async ({ user, params }) => {
  await unfollowBuilder(user, params.handle);
  return undefined;
});
