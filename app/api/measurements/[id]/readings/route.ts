import { z } from 'zod';
import { route, readJson, created } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { addReading } from '@/lib/server/measurements';

export const dynamic = 'force-dynamic';

type Params = { id: string };
const idOf = (params: Params) => z.object({ id: idSchema('id') }).parse(params).id;

/** { value, unit, instrument, resolution, measuredBy?, measuredAt?, temperatureC?, pass?, note? } → 201 { record }. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  const body = user ? await readJson(req) : {};
  return created({ record: await addReading(user, id, body) });
});
