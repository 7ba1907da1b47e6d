import { NextResponse } from 'next/server';
import { route, idParam } from '@/lib/http/route';
import { addSessionTime } from '@/lib/server/bench';

type Params = { id: string };

/**
 * { clientId, minutes } → 201 { session, created: true }: the minutes are added to the session's time spent;
 * the same clientId again → 200 { session, created: false }, nothing added.
 */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  const result = await addSessionTime(user, id, body);
  return NextResponse.json(result, { status: result.created ? 201 : 200 });
});
