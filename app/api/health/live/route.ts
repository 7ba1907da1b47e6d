import { NextResponse } from 'next/server';
import { answerEachRequest } from '@/lib/http/route';
import { authorizePublic } from '@/lib/auth/policy';
import { isStopping } from '@/lib/server/lifecycle';


/** Liveness: this process answers requests. It asks no dependency, so a database outage never gets it restarted. */
export async function GET() {
  await answerEachRequest();
  authorizePublic(null, 'checkHealth');
  return NextResponse.json({ ok: true, alive: true, stopping: isStopping(), uptimeSeconds: Math.round(process.uptime()) }, { headers: { 'cache-control': 'no-store' } });
}
