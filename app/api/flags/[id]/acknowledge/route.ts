import { route, idParam } from '@/lib/http/route';
import { AppError } from '@/lib/errors';
import { acknowledgeFlag } from '@/lib/server/flags';


type Params = { id: string };

/** The builder has seen the flag: optional { version } → { flag }. */
export const POST = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  // The body is optional here: none means "whatever version it is at".
  const text = user ? await req.text() : '';
  let body: unknown = {};
  if (text.trim()) {
    try {
      body = JSON.parse(text);
    } catch {
      throw new AppError('validation', 'The request body is not valid JSON.');
    }
  }
  return { flag: await acknowledgeFlag(user, id, body) };
});
