import { route, created, idParam } from '@/lib/http/route';
import { listEntryCalculations, saveCalculation } from '@/lib/server/calculations';


type Params = { id: string };

/** The entry's saved calculations: { calculations: SavedCalculationView[], tablesVersion }. */
export const GET = route<Params>(async ({ user, params }) => listEntryCalculations(user, idParam(params)));

/**
 * { kind, input, label? } → 201 { calculation }. The output is computed here from the input with
 * the current tables; an output sent along is ignored.
 */
export const POST = route<Params, unknown>({ body: 'member-json' }, async ({ user, params, body }) => {
  const id = idParam(params);
  // Signed out: let the policy answer 401 before anything is read.
  return created({ calculation: await saveCalculation(user, id, body) });
});
