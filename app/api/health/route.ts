import { NextResponse } from 'next/server';
import { answerEachRequest } from '@/lib/http/route';
import { authorizePublic } from '@/lib/auth/policy';
import { readiness } from '@/lib/server/health';


/**
 * Readiness: 200 when this server can do its work (the database answers and it is not stopping), else 503
 * with Retry-After. The body names each dependency up or down: database, uploads (the upload service),
 * smtp (the mail server). Liveness, which never asks a dependency, is GET /api/health/live.
 */
export async function GET() {
  await answerEachRequest();
  // Open to everyone; asked like every route. No session is read: that would need the database.
  authorizePublic(null, 'checkHealth');
  const r = await readiness();
  return NextResponse.json(
    { ok: r.ready, ...r },
    { status: r.ready ? 200 : 503, headers: { 'cache-control': 'no-store', ...(r.ready ? {} : { 'retry-after': '5' }) } },
  );
}
