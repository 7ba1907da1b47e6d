import type { Metadata } from 'next';
import { ProjectForm } from '@/components/projects/project-form';

export const metadata: Metadata = { title: 'New project' };

export default function NewProjectPage() {
  return (
    <div className="mx-auto max-w-2xl space-y-4">
      <h1 className="text-2xl font-bold">Start a project</h1>
      <p className="text-graphite-2">A project is one part or job, logged over as many shop sessions as it takes.</p>
      <div className="rounded-xl border border-rule bg-card p-5 sm:p-6">
        <ProjectForm />
      </div>
    </div>
  );
}
