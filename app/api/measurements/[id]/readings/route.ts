import { NextResponse } from 'next/server';
import { route, idParam } from '@/lib/http/route';
import { addReadingOnce } from '@/lib/server/measurements';

type Params = { id: string };

/**
 * { value, unit, instrument, resolution, measuredBy?, measuredAt?, temperatureC?, pass?, note?, clientId?, recordVersion? }
 * → 201 { record, created: true }; the same clientId again → 200 { record, created: false } (nothing added);
 * a recordVersion the record has moved past → 409 naming recordVersion.
 */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  const { record, created } = await addReadingOnce(user, id, body);
  return NextResponse.json({ record, created }, { status: created ? 201 : 200 });
});
