import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { idOrNotFound } from '@/lib/http/page';
import { publicSessionPage } from '@/lib/server/public-reads';
import { SessionView } from '@/app/(public)/_reading/session-view';
import { PLACEHOLDER, refusePlaceholder } from '@/app/(public)/_reading/open';

// A signed-out reader's session page (next.config.mjs rewrites send them here): the copy cached for everyone, a real 404 otherwise.
export function generateStaticParams() {
  return [{ slug: PLACEHOLDER, sessionId: PLACEHOLDER }];
}

type Props = { params: Promise<{ slug: string; sessionId: string }> };

async function load(slug: string, sessionId: string) {
  refusePlaceholder(slug, sessionId);
  const found = await publicSessionPage(idOrNotFound(sessionId));
  if (!found || found.scope.projectSlug !== slug) notFound();
  return found;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, sessionId } = await params;
  const found = await load(slug, sessionId);
  return { title: `${found.session.title} · ${found.scope.projectTitle}` };
}

export default async function OpenSessionPage({ params }: Props) {
  const { slug, sessionId } = await params;
  return <SessionView data={await load(slug, sessionId)} user={null} />;
}
