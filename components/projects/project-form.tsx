'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useQueryClient } from '@tanstack/react-query';
import { projectInputSchema, UNIT_OPTIONS, VISIBILITY_OPTIONS, type ProjectFormValues, type ProjectInput } from '@/lib/validations/project';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors, postJson } from '@/components/forms/api-client';
import type { ProjectView } from '@/lib/types/project';

type Props = { project?: Pick<ProjectView, 'id' | 'slug' | 'title' | 'summary' | 'units' | 'visibility' | 'version'> };

export function ProjectForm({ project }: Props) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [failure, setFailure] = useState<{ message: string; conflict: boolean } | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<ProjectFormValues, unknown, ProjectInput>({
    resolver: zodResolver(projectInputSchema),
    defaultValues: project
      ? { title: project.title, summary: project.summary, units: project.units, visibility: project.visibility }
      : { title: '', summary: '', units: 'mm', visibility: 'private' },
  });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const res = project
      ? await postJson<{ project: ProjectView }>(`/api/projects/${project.id}`, 'PATCH', { ...values, version: project.version })
      : await postJson<{ project: ProjectView }>('/api/projects', 'POST', values);
    if (!res.ok) {
      applyServerErrors(res.error, setError);
      setFailure({ message: res.error.message, conflict: res.error.status === 409 });
      return;
    }
    await queryClient.invalidateQueries({ queryKey: ['projects'] });
    router.push(`/projects?saved=${encodeURIComponent(res.data.project.slug)}`);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label={project ? 'Edit project' : 'New project'}>
      {failure ? (
        <Notice kind="error" role="alert" title={failure.conflict ? 'Changed elsewhere' : 'Not saved'}>
          <p>{failure.message}</p>
          {failure.conflict ? (
            <button type="button" className="mt-2 font-semibold underline" onClick={() => window.location.reload()}>
              Reload the latest version
            </button>
          ) : null}
        </Notice>
      ) : null}
      <Field id="title" label="Title" hint="What you are making, e.g. “Backplate for the 160 mm chuck”." error={errors.title?.message}>
        <input id="title" className={inputClass} aria-invalid={!!errors.title} aria-describedby={describedBy('title', errors.title?.message, 'hint')} {...register('title')} />
      </Field>
      <Field id="summary" label="Summary" hint="A few lines for readers: the part, the machines, the plan." error={errors.summary?.message}>
        <textarea id="summary" rows={4} className={inputClass} aria-invalid={!!errors.summary} aria-describedby={describedBy('summary', errors.summary?.message, 'hint')} {...register('summary')} />
      </Field>
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">Units for this project</legend>
        <div className="flex flex-wrap gap-2">
          {UNIT_OPTIONS.map((o) => (
            <label key={o.value} className="flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-rule bg-card px-3 has-[:checked]:border-dye has-[:checked]:bg-dye-soft">
              <input type="radio" value={o.value} {...register('units')} />
              {o.label}
            </label>
          ))}
        </div>
        {errors.units ? <p className="text-sm text-bad">✕ {errors.units.message}</p> : null}
      </fieldset>
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">Who can see it</legend>
        <div className="grid gap-2 sm:grid-cols-3">
          {VISIBILITY_OPTIONS.map((o) => (
            <label key={o.value} className="flex min-h-11 cursor-pointer items-start gap-2 rounded-md border border-rule bg-card p-3 has-[:checked]:border-dye has-[:checked]:bg-dye-soft">
              <input type="radio" value={o.value} className="mt-1" {...register('visibility')} />
              <span>
                <span className="block font-semibold">{o.label}</span>
                <span className="block text-xs text-graphite-2">{o.hint}</span>
              </span>
            </label>
          ))}
        </div>
        {errors.visibility ? <p className="text-sm text-bad">✕ {errors.visibility.message}</p> : null}
      </fieldset>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : project ? 'Save changes' : 'Create project'}
        </Button>
        <Button type="button" tone="quiet" onClick={() => router.back()}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
