import type { Metadata } from 'next';
import { ButtonLink } from '@/components/ui/button';
import { MyProjects } from '@/components/projects/my-projects';
import { MentoredProjects } from '@/components/projects/mentored-projects';
import { Notice } from '@/components/ui/notice';
import { PlusIcon } from '@/components/ui/plus-icon';
import { getCurrentUser } from '@/lib/auth/current-user';
import { listMentoredProjects, listMyProjects } from '@/lib/server/projects';
import { withOpenFlagCounts } from '@/lib/server/flags';

export const metadata: Metadata = { title: 'My projects' };

export default async function MyProjectsPage({ searchParams }: { searchParams: Promise<{ saved?: string }> }) {
  const { saved } = await searchParams;
  // Both lists come with the page: the forms that change them are server actions that revalidate it.
  const user = await getCurrentUser();
  const [mine, mentored] = await Promise.all([
    listMyProjects(user).then(withOpenFlagCounts),
    listMentoredProjects(user).then(withOpenFlagCounts),
  ]);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">My projects</h1>
        <ButtonLink href="/projects/new" className="gap-2">
          <PlusIcon /> New project
        </ButtonLink>
      </div>
      {saved ? (
        <Notice kind="success" role="status" title="Saved">
          Your project was saved.
        </Notice>
      ) : null}
      <MyProjects projects={mine} />
      <MentoredProjects projects={mentored} />
    </div>
  );
}
