import { NextResponse, type NextRequest } from 'next/server';
import { createRouteHandler } from 'uploadthing/next';
import { checkUploadCallback } from '@/lib/server/upload-callback';
import { ourFileRouter } from './core';

// Token, ingest/API URLs, callback URL and dev mode all come from the UPLOADTHING_* environment,
// so the same code talks to the local upload service or the hosted one.
const handlers = createRouteHandler({ router: ourFileRouter });

export const GET = handlers.GET;

/**
 * The SDK answers an upload-complete callback by posting its result, with the API key, to the `origin`
 * named in the callback's body. So a callback is checked here first: its signature, its origin (the
 * configured upload service only) and its file's address; anything else is refused before the SDK sees it.
 */
export async function POST(req: NextRequest): Promise<Response> {
  if (!req.headers.has('uploadthing-hook')) return handlers.POST(req);
  const body = await req.text();
  const refusal = checkUploadCallback(body, req.headers.get('x-uploadthing-signature'), req.headers.get('uploadthing-hook'));
  if (refusal) return NextResponse.json({ error: 'bad_request', message: refusal }, { status: 400 });
  return handlers.POST(new Request(req.url, { method: 'POST', headers: req.headers, body }) as NextRequest);
}
