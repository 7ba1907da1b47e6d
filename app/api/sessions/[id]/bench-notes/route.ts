import { NextResponse } from 'next/server';
import { route, idParam } from '@/lib/http/route';
import { addSessionNote } from '@/lib/server/bench';

type Params = { id: string };

/**
 * { clientId, text, clock? } → 201 { session, created: true }: the line ("14:05 — text") is added to the session's
 * "What got done"; the same clientId again → 200 { session, created: false }, nothing added.
 */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  const result = await addSessionNote(user, id, body);
  return NextResponse.json(result, { status: result.created ? 201 : 200 });
});
