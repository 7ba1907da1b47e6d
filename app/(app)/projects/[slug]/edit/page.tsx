import type { Metadata } from 'next';
import { ProjectForm } from '@/components/projects/project-form';
import { DeleteProjectButton } from '@/components/projects/delete-project-button';
import { getCurrentUser } from '@/lib/auth/current-user';
import { getProjectForViewer } from '@/lib/server/projects';
import { orNotFound } from '@/lib/http/page';
import { Notice } from '@/components/ui/notice';
import { MentorManager } from '@/components/mentors/mentor-manager';
import { DownloadArchive } from '@/components/archive/download-archive';
import { listMentorsOverview } from '@/lib/server/invitations';

export const metadata: Metadata = { title: 'Edit project' };

export default async function EditProjectPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const user = await getCurrentUser();
  const project = await orNotFound(getProjectForViewer(user, { slug }));
  if (!project.can.update && !project.can.delete) {
    return (
      <Notice kind="error" title="Not yours to change">
        Only the builder can edit this project.
      </Notice>
    );
  }
  return (
    <div className="mx-auto max-w-2xl space-y-4">
      <h1 className="text-2xl font-bold">Edit project</h1>
      {project.can.update ? (
        <div className="rounded-xl border border-rule bg-card p-5 sm:p-6">
          <ProjectForm project={project} />
        </div>
      ) : null}
      {project.can.manageMentors ? (
        <section className="rounded-xl border border-rule bg-card p-5 sm:p-6" aria-labelledby="mentors" id="mentors-section">
          <h2 id="mentors" className="mb-2 text-lg font-bold">
            Mentors
          </h2>
          <MentorManager projectId={project.id} overview={await listMentorsOverview(user, project.id)} />
        </section>
      ) : null}
      {project.can.update ? (
        <section className="rounded-xl border border-rule bg-card p-5 sm:p-6" aria-labelledby="archive">
          <h2 id="archive" className="mb-2 text-lg font-bold">
            Archive
          </h2>
          <DownloadArchive projectId={project.id} />
        </section>
      ) : null}
      {project.can.delete ? (
        <section className="rounded-xl border border-bad/40 p-5" aria-labelledby="danger">
          <h2 id="danger" className="font-bold">
            Remove this project
          </h2>
          <p className="mb-3 mt-1 text-sm text-graphite-2">Deletes the project and its log for everyone.</p>
          <DeleteProjectButton id={project.id} title={project.title} />
        </section>
      ) : null}
    </div>
  );
}
