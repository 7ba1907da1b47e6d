import type { Metadata } from 'next';
import { cache } from 'react';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { idOrNotFound, orNotFound } from '@/lib/http/page';
import { loadEntryPage } from '@/lib/server/reading';
import { publicEntryPage } from '@/lib/server/public-reads';
import { EntryView } from '../../../../_reading/entry-view';

// The signed-in reader's copy, rendered for each request; a signed-out reader gets app/(open)/open's cached one.
// An old ?t=<seconds> link is sent on to the #t= form by proxy.ts before it gets here.
export const instant = false;

type Props = { params: Promise<{ slug: string; entryId: string }>; searchParams: Promise<{ clip?: string }> };

const load = cache(async (slug: string, entryId: string) => {
  const id = idOrNotFound(entryId);
  const user = await getCurrentUser();
  const found = user ? await orNotFound(loadEntryPage(user, id)) : await publicEntryPage(id);
  if (!found || found.scope.projectSlug !== slug) notFound();
  return { found, user };
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, entryId } = await params;
  const { found } = await load(slug, entryId);
  return { title: `${found.entry.title} · ${found.scope.projectTitle}` };
}

export default async function EntryPage({ params, searchParams }: Props) {
  const [{ slug, entryId }, query] = await Promise.all([params, searchParams]);
  const { found, user } = await load(slug, entryId);
  return <EntryView data={found} user={user} clipId={typeof query.clip === 'string' ? query.clip : undefined} />;
}
