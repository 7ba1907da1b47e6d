'use client';

import { useActionState, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { projectInputSchema, UNIT_OPTIONS, VISIBILITY_OPTIONS, type ProjectFormValues, type ProjectInput } from '@/lib/validations/project';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { applyActionErrors, dispatchForm, IDLE } from '@/components/forms/action-state';
import { createProjectAction, updateProjectAction } from '@/lib/actions/projects';
import type { ActionState } from '@/lib/actions/authed';
import type { ProjectView } from '@/lib/types/project';

type Props = { project?: Pick<ProjectView, 'id' | 'slug' | 'title' | 'summary' | 'units' | 'visibility' | 'version'> };

// A new project's form keeps, for this tab, the key of the attempt it is making and what the last
// attempt created: Back and Create again sends the same key (the server answers with the project it
// already made) and the form says so, instead of silently making a second one.
const ATTEMPT_KEY = 'scribeline:new-project';
type Attempt = { key: string; created?: { slug: string; title: string } };

function readAttempt(): Attempt {
  try {
    const stored = JSON.parse(sessionStorage.getItem(ATTEMPT_KEY) ?? 'null') as Attempt | null;
    if (stored?.key) return stored;
  } catch {
    // Storage off or unreadable: a fresh attempt.
  }
  return { key: crypto.randomUUID() };
}

function writeAttempt(a: Attempt): void {
  try {
    sessionStorage.setItem(ATTEMPT_KEY, JSON.stringify(a));
  } catch {
    // Storage off: the server's key check still holds within this page.
  }
}

export function ProjectForm({ project }: Props) {
  const router = useRouter();
  const formRef = useRef<HTMLFormElement>(null);
  const [again, setAgain] = useState<{ slug: string; title: string } | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<ProjectFormValues, unknown, ProjectInput>({
    resolver: zodResolver(projectInputSchema),
    defaultValues: project
      ? { title: project.title, summary: project.summary, units: project.units, visibility: project.visibility }
      : { title: '', summary: '', units: 'mm', visibility: 'private' },
  });
  const { errors } = formState;

  // The same zod schema checks the fields here first; the server checks them again and its refusals land
  // beside the same fields. A saved edit redirects from the action; a new project hands back its slug.
  const [state, dispatch, pending] = useActionState<ActionState<{ slug: string; title: string; created: boolean }>, FormData>(async (prev, data) => {
    const result = project ? await updateProjectAction(IDLE, data) : await createProjectAction(prev, data);
    applyActionErrors(result, setError);
    if (result.ok && result.data) {
      const { slug, title } = result.data;
      writeAttempt({ key: String(data.get('requestId')), created: { slug, title } });
      // Straight into the new log: the first session is the next thing to do.
      router.push(`/projects/${encodeURIComponent(slug)}/log?created=1`);
    }
    return result;
  }, IDLE);
  const failure = state.ok ? null : { message: state.message ?? 'Not saved.', conflict: state.status === 409 };

  const createNew = (values: ProjectInput, anyway: boolean) => {
    let attempt = readAttempt();
    if (attempt.created) {
      // The same project submitted again (Back, then Create): say so rather than make a twin.
      if (!anyway && attempt.created.title.trim().toLowerCase() === values.title.trim().toLowerCase()) {
        setAgain(attempt.created);
        return;
      }
      attempt = { key: crypto.randomUUID() };
    }
    writeAttempt(attempt);
    setAgain(null);
    dispatchForm(formRef.current!, dispatch, { requestId: attempt.key });
  };

  const onSubmit = handleSubmit((values) => {
    setAgain(null);
    if (!project) return createNew(values, false);
    dispatchForm(formRef.current!, dispatch);
  });

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-5" aria-label={project ? 'Edit project' : 'New project'}>
      {project ? (
        <>
          <input type="hidden" name="projectId" value={project.id} />
          <input type="hidden" name="version" value={project.version} />
        </>
      ) : null}
      {again ? (
        <Notice kind="info" role="alert" title="Already created">
          <p>
            You created “{again.title}” a moment ago. <Link href={`/projects/${encodeURIComponent(again.slug)}/log`}>Open its log</Link>, or make a
            second project with the same title.
          </p>
          <button type="button" className="mt-2 min-h-11 font-semibold underline" onClick={handleSubmit((values) => createNew(values, true))}>
            Create another project anyway
          </button>
        </Notice>
      ) : null}
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
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : project ? 'Save changes' : 'Create project'}
        </Button>
        <Button type="button" tone="quiet" onClick={() => router.back()}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
