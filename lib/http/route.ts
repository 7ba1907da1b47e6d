import 'server-only';
import { NextResponse, type NextRequest } from 'next/server';
import { getUserFromRequest, type CurrentUser } from '../auth/current-user';
import { z } from 'zod';
import { AppError, toErrorResponse } from './errors';
import { idSchema } from '../validations/log';

type Ctx<P> = { req: NextRequest; user: CurrentUser | null; params: P };

/**
 * Every JSON route handler goes through here: the session, awaited params (a Promise in Next 16),
 * and the one error-to-status map. Authorization itself happens in lib/server via the policy module.
 */
export function route<P = Record<string, string>>(handler: (ctx: Ctx<P>) => Promise<unknown>) {
  return async (req: NextRequest, context: { params: Promise<P> }): Promise<NextResponse> => {
    try {
      const [user, params] = await Promise.all([getUserFromRequest(req), context?.params ?? Promise.resolve({} as P)]);
      const result = await handler({ req, user, params });
      if (result instanceof NextResponse) return result;
      if (result === undefined) return new NextResponse(null, { status: 204 });
      return NextResponse.json(result);
    } catch (err) {
      const { status, body } = toErrorResponse(err);
      return NextResponse.json(body, { status });
    }
  };
}

/** Reads a JSON body, answering 400 (not 500) when it is not JSON. */
export async function readJson(req: NextRequest): Promise<unknown> {
  const text = await req.text();
  if (!text.trim()) throw new AppError('validation', 'The request body is empty: send a JSON object.');
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError('validation', 'The request body is not valid JSON.');
  }
}

export const created = (body: unknown) => NextResponse.json(body, { status: 201 });

/** The `[id]` segment of a route as a positive whole number, or a 400 naming `id`. */
export function idParam(params: { id: string }): number {
  return z.object({ id: idSchema('id') }).parse(params).id;
}
