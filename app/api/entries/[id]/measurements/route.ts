import { route, created, idParam } from '@/lib/http/route';
import { createMeasurement, listEntryMeasurements } from '@/lib/server/measurements';


type Params = { id: string };

/** The entry's measurement records, judged: { records: MeasurementView[] }. */
export const GET = route<Params>(async ({ user, params }) => ({ records: await listEntryMeasurements(user, idParam(params)) }));

/**
 * { feature, kind, nominal, unit, spec, timeNoteId?, readings: [...] } → 201 { record }.
 * The record and every reading are saved together; one bad field and nothing is saved.
 */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  // Signed out: let the policy answer 401 before anything is read.
  return created({ record: await createMeasurement(user, id, body) });
});
