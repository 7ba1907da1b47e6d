import { NextResponse } from 'next/server';
import { route, idParam } from '@/lib/http/route';
import { planProjectArchive, projectArchiveStream } from '@/lib/server/archive/export';

type Params = { id: string };

/**
 * The project as one zip archive, streamed (the builder only). `?plan=1` answers what it will hold
 * instead ({ filename, counts, mediaBytes }), so the page can check and show its size before downloading.
 */
export const GET = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  if (req.nextUrl.searchParams.get('plan') === '1') return planProjectArchive(user, id);
  const { filename, stream } = await projectArchiveStream(user, id);
  return new NextResponse(stream, {
    headers: {
      'content-type': 'application/zip',
      'content-disposition': `attachment; filename="${filename}"`,
      'cache-control': 'no-store',
      'x-content-type-options': 'nosniff',
    },
  });
});
