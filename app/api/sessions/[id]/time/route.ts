import { NextResponse } from 'next/server';
import { route, readJson, idParam } from '@/lib/http/route';
import { addSessionTime } from '@/lib/server/bench';

type Params = { id: string };

/**
 * { clientId, minutes } → 201 { session, created: true }: the minutes are added to the session's time spent;
 * the same clientId again → 200 { session, created: false }, nothing added.
 */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const body = user ? await readJson(req) : {};
  const result = await addSessionTime(user, id, body);
  return NextResponse.json(result, { status: result.created ? 201 : 200 });
});
