import { NextResponse } from 'next/server';
import { route, idParam } from '@/lib/http/route';
import { AppError } from '@/lib/errors';
import { listProjectMeasurements, projectMeasurementsCsv } from '@/lib/server/measurements';


type Params = { id: string };

/**
 * Every measurement record of the project, judged: { project, records, pairs, canEdit }.
 * ?format=csv answers a CSV file instead (one row per reading, both units).
 */
export const GET = route<Params>(async ({ req, user, params }) => {
  const id = idParam(params);
  const format = req.nextUrl.searchParams.get('format') ?? 'json';
  if (format === 'csv') {
    const { filename, csv } = await projectMeasurementsCsv(user, id);
    // The byte-order mark lets spreadsheets read µm and °C as UTF-8.
    return new NextResponse(`\uFEFF${csv}`, {
      headers: {
        'content-type': 'text/csv; charset=utf-8; header=present',
        'content-disposition': `attachment; filename="${filename}"`,
        'cache-control': 'no-store',
      },
    });
  }
  if (format !== 'json') throw new AppError('validation', 'Please check format: it must be json or csv.', { format: ['The format must be json or csv.'] });
  return listProjectMeasurements(user, id);
});
