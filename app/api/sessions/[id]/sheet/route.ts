import { route, idParam } from '@/lib/http/route';
import { loadSessionSheet } from '@/lib/server/sheets';

type Params = { id: string };

// The shop sheet's data (GET /api/sessions/<id>/sheet?records=3,7): for the builder's circle (policy printSheet).
export const GET = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const url = new URL(req.url);
  return { sheet: await loadSessionSheet(user, id, url.searchParams.getAll('records')) };
});
