import 'server-only';
import { getCurrentUser, type CurrentUser } from '../auth/current-user';
import { fieldErrorsOf, type FieldErrors } from '../errors';
import { toErrorResponse } from '../http/errors';
import { ZodError } from 'zod';
import { headers } from 'next/headers';
import { checkHeadersOrigin } from '../http/origin';

/**
 * status: the HTTP status a route handler would have answered with, for a refusal. data: what a
 * successful action hands back to its form (e.g. the slug to go to), when it does not redirect.
 */
export type ActionState<D = unknown> = { ok: boolean; status?: number; message?: string; fieldErrors?: FieldErrors; data?: D };

/**
 * Server actions are public endpoints: each one goes through here, which loads the session and turns
 * every failure into a state for useActionState. The action itself asks the policy module.
 */
export function authedAction<T, D = unknown>(run: (user: CurrentUser | null, input: T) => Promise<ActionState<D> | void>) {
  return async (_prev: ActionState<D>, input: T): Promise<ActionState<D>> => {
    try {
      // proxy.ts refuses a foreign action POST first; this holds should an action be reached another way.
      const verdict = checkHeadersOrigin('POST', await headers());
      if (!verdict.ok) return { ok: false, status: 403, message: verdict.message };
      const user = await getCurrentUser();
      return (await run(user, input)) ?? { ok: true };
    } catch (err) {
      if (isRedirect(err)) throw err;
      if (err instanceof ZodError) return { ok: false, status: 400, message: 'Please check the highlighted fields.', fieldErrors: fieldErrorsOf(err) };
      const { status, body } = toErrorResponse(err);
      return { ok: false, status, message: body.message, fieldErrors: body.fieldErrors };
    }
  };
}

// next/navigation's redirect() and notFound() work by throwing: let them through.
function isRedirect(err: unknown): boolean {
  const digest = (err as { digest?: unknown })?.digest;
  return typeof digest === 'string' && (digest.startsWith('NEXT_REDIRECT') || digest.startsWith('NEXT_HTTP_ERROR_FALLBACK'));
}
