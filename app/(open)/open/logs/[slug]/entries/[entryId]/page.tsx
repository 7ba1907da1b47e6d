import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { idOrNotFound } from '@/lib/http/page';
import { publicEntryPage } from '@/lib/server/public-reads';
import { EntryView } from '@/app/(public)/_reading/entry-view';
import { PLACEHOLDER, refusePlaceholder } from '@/app/(public)/_reading/open';

// A signed-out reader's entry page (next.config.mjs rewrites send them here): the copy cached for everyone, a real 404 otherwise.
// The query is not read on the server (the copy is the same for every address): the clip stage reads ?clip
// and #t= in the browser.
export function generateStaticParams() {
  return [{ slug: PLACEHOLDER, entryId: PLACEHOLDER }];
}

type Props = { params: Promise<{ slug: string; entryId: string }> };

async function load(slug: string, entryId: string) {
  refusePlaceholder(slug, entryId);
  const found = await publicEntryPage(idOrNotFound(entryId));
  if (!found || found.scope.projectSlug !== slug) notFound();
  return found;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, entryId } = await params;
  const found = await load(slug, entryId);
  return { title: `${found.entry.title} · ${found.scope.projectTitle}` };
}

export default async function OpenEntryPage({ params }: Props) {
  const { slug, entryId } = await params;
  return <EntryView data={await load(slug, entryId)} user={null} />;
}
