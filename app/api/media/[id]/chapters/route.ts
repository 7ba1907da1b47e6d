import { z } from 'zod';
import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { idSchema } from '@/lib/validations/log';
import { chaptersQuerySchema } from '@/lib/validations/notes';
import { exportChapters } from '@/lib/server/notes';

export const dynamic = 'force-dynamic';

type Params = { id: string };
const idOf = (params: Params) => z.object({ id: idSchema('id') }).parse(params).id;

/** An ASCII name for old clients, and the full name in RFC 6266 / RFC 5987 form. */
function disposition(kind: 'attachment' | 'inline', fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\/]/g, '_');
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName.replace(/[/\\]/g, '_'))}`;
}

/** ?format=vtt (a WebVTT chapters file, downloaded) or ?format=txt (the plain list, shown). */
export const GET = route<Params>(async ({ req, user, params }) => {
  const id = idOf(params);
  const { format } = chaptersQuerySchema.parse({ format: req.nextUrl.searchParams.get('format') ?? undefined });
  const file = await exportChapters(user, id, format);
  return new NextResponse(file.body, {
    headers: {
      'content-type': file.contentType,
      'content-disposition': disposition(format === 'vtt' ? 'attachment' : 'inline', file.fileName),
      'cache-control': 'no-store',
    },
  });
});
