import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { publicProjectPage } from '@/lib/server/public-reads';
import { ProjectView } from '@/app/(public)/_reading/project-view';
import { PLACEHOLDER, refusePlaceholder } from '@/app/(public)/_reading/open';

// A signed-out reader's /logs/<slug> (next.config.mjs rewrites send them here): no session read, the copy cached for everyone
// (lib/server/public-reads.ts), so a missing or private log is a real 404 decided before anything is sent.
export function generateStaticParams() {
  return [{ slug: PLACEHOLDER }];
}

type Props = { params: Promise<{ slug: string }> };

async function load(slug: string) {
  refusePlaceholder(slug);
  const found = await publicProjectPage(slug);
  if (!found) notFound();
  return found;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const found = await load((await params).slug);
  return { title: found.project.title, robots: found.project.visibility === 'published' ? undefined : { index: false } };
}

export default async function OpenProjectPage({ params }: Props) {
  return <ProjectView data={await load((await params).slug)} user={null} />;
}
