import type { Metadata } from 'next';
import { cache } from 'react';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { idOrNotFound, orNotFound } from '@/lib/http/page';
import { loadSessionPage } from '@/lib/server/reading';
import { publicSessionPage } from '@/lib/server/public-reads';
import { SessionView } from '../../../../_reading/session-view';

// The signed-in reader's copy, rendered for each request; a signed-out reader gets app/(open)/open's cached one.
export const instant = false;

type Props = { params: Promise<{ slug: string; sessionId: string }> };

const load = cache(async (slug: string, sessionId: string) => {
  const id = idOrNotFound(sessionId);
  const user = await getCurrentUser();
  const found = user ? await orNotFound(loadSessionPage(user, id)) : await publicSessionPage(id);
  if (!found || found.scope.projectSlug !== slug) notFound();
  return { found, user };
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, sessionId } = await params;
  const { found } = await load(slug, sessionId);
  return { title: `${found.session.title} · ${found.scope.projectTitle}` };
}

export default async function SessionPage({ params }: Props) {
  const { slug, sessionId } = await params;
  const { found, user } = await load(slug, sessionId);
  return <SessionView data={found} user={user} />;
}
