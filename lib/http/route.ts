import 'server-only';
import { connection, NextResponse, type NextRequest } from 'next/server';
import { unstable_rethrow } from 'next/navigation';
import { getUserFromRequest, type CurrentUser } from '../auth/current-user';
import { z } from 'zod';
import { AppError, unauthenticated } from '../errors';
import { toErrorResponse } from './errors';
import { idSchema } from '../validations/log';
import { checkRequestOrigin } from './origin';
import { DEFAULT_MAX_BODY_BYTES, readJsonCapped } from './body';

export type RouteOptions<B = unknown> = {
  /** 'user': answer 401 (saying "Sign in to <signInTo>") before the body is read. Default: anyone; lib/server asks the policy. */
  auth?: 'any' | 'user';
  signInTo?: string;
  /**
   * Read the JSON body before the handler: a zod schema (parsed, 400 naming the fields), 'json' (parsed JSON,
   * unchecked, for lib/server to parse) or 'member-json' (the same, read only from a signed-in caller: anyone
   * else's handler gets `{}`, and lib/server's policy answers them 401 or 404 without their body being read).
   */
  body?: z.ZodType<B> | 'json' | 'member-json';
  /** Largest body accepted, in bytes (413 past it, counted while streaming). Default DEFAULT_MAX_BODY_BYTES. */
  maxBytes?: number;
  /**
   * 'same-origin' (default): a POST/PUT/PATCH/DELETE whose Origin or Sec-Fetch-Site names another site,
   * port or subdomain is refused with 403 before anything else. 'any': for callbacks that carry their own proof.
   */
  origin?: 'same-origin' | 'any';
};

type Ctx<P, B> = { req: NextRequest; user: CurrentUser | null; params: P; body: B };
type Handler<P, B> = (ctx: Ctx<P, B>) => Promise<unknown>;
type RouteFn<P> = (req: NextRequest, context: { params: Promise<P> }) => Promise<NextResponse>;

// The body limit route() was given, for readJson() called inside the handler.
const limits = new WeakMap<Request, number>();

/**
 * Every JSON route handler goes through here: the cross-site check, the session, awaited params (a Promise
 * in Next 16), the body (size, type, schema) and the one error-to-status map. Authorization itself happens
 * in lib/server via the policy module.
 *
 *   export const POST = route({ auth: 'user', body: projectInputSchema }, ({ user, body }) => createProject(user, body));
 */
export function route<P = Record<string, string>>(handler: Handler<P, undefined>): RouteFn<P>;
export function route<P = Record<string, string>, B = undefined>(options: RouteOptions<B>, handler: Handler<P, B>): RouteFn<P>;
export function route<P, B>(a: RouteOptions<B> | Handler<P, B>, b?: Handler<P, B>): RouteFn<P> {
  const options: RouteOptions<B> = typeof a === 'function' ? {} : a;
  const handler = (typeof a === 'function' ? a : b) as Handler<P, B>;
  const maxBytes = options.maxBytes ?? DEFAULT_MAX_BODY_BYTES;
  return async (req: NextRequest, context: { params: Promise<P> }): Promise<NextResponse> => {
    try {
      if (options.origin !== 'any') {
        const verdict = checkRequestOrigin(req);
        if (!verdict.ok) throw new AppError('forbidden', verdict.message);
      }
      limits.set(req, maxBytes);
      const [user, params] = await Promise.all([getUserFromRequest(req), context?.params ?? Promise.resolve({} as P)]);
      if (options.auth === 'user' && !user) throw unauthenticated(options.signInTo);
      let body = undefined as B;
      if (options.body === 'member-json') {
        body = (user ? await readJsonCapped(req, maxBytes) : {}) as B;
      } else if (options.body !== undefined) {
        const json = await readJsonCapped(req, maxBytes);
        body = (options.body === 'json' ? json : options.body.parse(json)) as B;
      }
      const result = await handler({ req, user, params, body });
      return respond(result);
    } catch (err) {
      // Next's own signals (a GET read at build time answers "render me per request") pass through.
      unstable_rethrow(err);
      const { status, body, headers } = toErrorResponse(err);
      return NextResponse.json(body, { status, headers });
    }
  };
}

function respond(result: unknown): NextResponse {
  if (result instanceof NextResponse) return result;
  if (result === undefined) return new NextResponse(null, { status: 204 });
  return NextResponse.json(result);
}

/**
 * Reads a JSON body inside a handler: 415 unless it is declared JSON, 413 past the route's maxBytes
 * (refused unread), 400 (not 500) when it is empty or not JSON.
 */
export async function readJson(req: NextRequest): Promise<unknown> {
  return readJsonCapped(req, limits.get(req) ?? DEFAULT_MAX_BODY_BYTES);
}

export const created = (body: unknown) => NextResponse.json(body, { status: 201 });

/** The `[id]` segment of a route as a positive whole number, or a 400 naming `id`. */
export function idParam(params: { id: string }): number {
  return z.object({ id: idSchema('id') }).parse(params).id;
}

/**
 * For a GET handler that reads nothing from its request (the health checks): answer each request, never a
 * copy prerendered at build. Outside Next (tests calling the handler directly) there is nothing to mark.
 */
export async function answerEachRequest(): Promise<void> {
  try {
    await connection();
  } catch (err) {
    if (err instanceof Error && err.message.includes('outside a request scope')) return;
    throw err;
  }
}
