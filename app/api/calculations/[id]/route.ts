import { route, idParam } from '@/lib/http/route';
import { deleteCalculation } from '@/lib/server/calculations';


type Params = { id: string };

/** Removes a saved calculation from its entry (the builder only). 204. */
export const DELETE = route<Params>(async ({ user, params }) => {
  await deleteCalculation(user, idParam(params));
  return undefined;
});
