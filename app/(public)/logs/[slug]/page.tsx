import type { Metadata } from 'next';
import { cache } from 'react';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { orNotFound } from '@/lib/http/page';
import { loadProjectPage } from '@/lib/server/reading';
import { publicProjectPage } from '@/lib/server/public-reads';
import { ProjectView } from '../../_reading/project-view';

// The signed-in reader's copy, rendered for each request (their controls, what their role lets them see).
// A signed-out reader is sent to the cached copy in app/(open)/open by the rewrites in next.config.mjs.
export const instant = false;

type Props = { params: Promise<{ slug: string }> };

// Once per request (metadata and page).
const load = cache(async (slug: string) => {
  const user = await getCurrentUser();
  const found = user ? await orNotFound(loadProjectPage(user, slug)) : await publicProjectPage(slug);
  if (!found) notFound();
  return { found, user };
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { found } = await load((await params).slug);
  return { title: found.project.title, robots: found.project.visibility === 'published' ? undefined : { index: false } };
}

export default async function ProjectPage({ params }: Props) {
  const { found, user } = await load((await params).slug);
  return <ProjectView data={found} user={user} />;
}
