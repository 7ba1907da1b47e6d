import { NextResponse } from 'next/server';
import { QueryTypes } from 'sequelize';
import { initModels } from '@/db/models';

export const dynamic = 'force-dynamic';

/** Ready when the app can reach its database. */
export async function GET() {
  try {
    await initModels().query('SELECT 1 AS ok', { type: QueryTypes.SELECT });
    return NextResponse.json({ ok: true });
  } catch {
    return NextResponse.json({ ok: false, message: 'The database is not reachable.' }, { status: 503 });
  }
}
