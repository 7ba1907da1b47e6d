import type { Metadata } from 'next';
import Link from 'next/link';
import { cache } from 'react';
import { getCurrentUser } from '@/lib/auth/current-user';
import { loadBench } from '@/lib/server/bench';
import { idOrNotFound, orNotFound } from '@/lib/http/page';
import { AppError } from '@/lib/errors';
import { Notice } from '@/components/ui/notice';
import { BenchView } from '@/components/bench/bench-view';

// Reads the session (the bench is for the builder's circle): rendered per request.
export const instant = false;

type Props = { params: Promise<{ sessionId: string }> };

// Once per request, for the title and the page. A refusal other than "not there" is shown, not thrown.
const load = cache(async (sessionId: string) => {
  const id = idOrNotFound(sessionId);
  const user = await getCurrentUser();
  try {
    return { data: await orNotFound(loadBench(user, id)), refusal: null };
  } catch (err) {
    if (err instanceof AppError && err.code === 'forbidden') return { data: null, refusal: err };
    throw err;
  }
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { sessionId } = await params;
  const { data } = await load(sessionId);
  return { title: data ? `At the bench · ${data.session.title}` : 'At the bench', robots: { index: false } };
}

export default async function BenchPage({ params }: Props) {
  const { sessionId } = await params;
  const { data, refusal } = await load(sessionId);
  if (!data) {
    return (
      <div className="space-y-4">
        <h1 className="text-2xl font-bold">At the bench</h1>
        <Notice kind="error" title="Not your bench">
          {refusal?.message} <Link href="/bench">Your sessions</Link>.
        </Notice>
      </div>
    );
  }
  return <BenchView data={data} signInHref={`/sign-in?next=${encodeURIComponent(`/bench/${data.session.id}`)}`} />;
}
