import { route, readJson, created, idParam } from '@/lib/http/route';
import { addReading } from '@/lib/server/measurements';


type Params = { id: string };

/** { value, unit, instrument, resolution, measuredBy?, measuredAt?, temperatureC?, pass?, note? } → 201 { record }. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const body = user ? await readJson(req) : {};
  return created({ record: await addReading(user, id, body) });
});
