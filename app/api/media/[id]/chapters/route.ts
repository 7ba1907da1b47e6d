import { NextResponse } from 'next/server';
import { route, idParam } from '@/lib/http/route';
import { chaptersQuerySchema } from '@/lib/validations/notes';
import { exportChapters } from '@/lib/server/notes';


type Params = { id: string };

/** An ASCII name for old clients, and the full name in RFC 6266 / RFC 5987 form. */
function disposition(kind: 'attachment' | 'inline', fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\/]/g, '_');
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName.replace(/[/\\]/g, '_'))}`;
}

/** ?format=vtt (a WebVTT chapters file, downloaded) or ?format=txt (the plain list, shown). */
export const GET = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
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
