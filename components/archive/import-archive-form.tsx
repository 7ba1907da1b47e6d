'use client';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

type Step = { kind: 'idle' } | { kind: 'sending'; percent: number } | { kind: 'restoring' } | { kind: 'error'; message: string };

/** "Bring in an archive": sends the zip with upload progress, then waits while the server checks and restores it. */
export function ImportArchiveForm() {
  const router = useRouter();
  const [step, setStep] = useState<Step>({ kind: 'idle' });
  const busy = step.kind === 'sending' || step.kind === 'restoring';

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const file = (event.currentTarget.elements.namedItem('archive') as HTMLInputElement).files?.[0];
    if (!file) return setStep({ kind: 'error', message: 'Choose an archive (.zip) to bring in.' });
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/archives');
    xhr.setRequestHeader('content-type', 'application/zip');
    xhr.responseType = 'json';
    xhr.upload.addEventListener('progress', (e) => {
      if (e.lengthComputable) setStep(e.loaded >= e.total ? { kind: 'restoring' } : { kind: 'sending', percent: Math.floor((e.loaded / e.total) * 100) });
    });
    xhr.upload.addEventListener('load', () => setStep({ kind: 'restoring' }));
    xhr.addEventListener('load', () => {
      const body = (xhr.response ?? {}) as { slug?: string; message?: string };
      if (xhr.status === 201 && body.slug) router.push(`/projects/${body.slug}/log?imported=1`);
      else setStep({ kind: 'error', message: body.message ?? `The archive was not brought in (${xhr.status}).` });
    });
    xhr.addEventListener('error', () => setStep({ kind: 'error', message: 'The archive could not be sent: check your connection and try again.' }));
    setStep({ kind: 'sending', percent: 0 });
    xhr.send(file);
  }

  return (
    <form onSubmit={submit} className="space-y-3" aria-describedby="import-status" data-testid="import-archive">
      <label className="block text-sm font-medium" htmlFor="archive-file">
        Archive file (.zip, from &ldquo;Download archive&rdquo;)
      </label>
      <input
        id="archive-file"
        name="archive"
        type="file"
        accept=".zip,application/zip"
        required
        disabled={busy}
        onChange={() => setStep({ kind: 'idle' })}
        className="block w-full max-w-full text-sm file:mr-3 file:min-h-11 file:rounded-md file:border file:border-rule file:bg-card file:px-4 file:font-semibold"
      />
      <Button type="submit" disabled={busy}>
        {busy ? 'Bringing it in…' : 'Bring in an archive'}
      </Button>
      <div id="import-status" aria-live="polite">
        {step.kind === 'sending' ? (
          <p className="text-sm">
            Step 1 of 2: sending the archive… <progress max={100} value={step.percent} aria-label="Sending the archive" /> {step.percent} %
          </p>
        ) : null}
        {step.kind === 'restoring' ? <p className="text-sm" role="status">
            Step 2 of 2: checking the archive and restoring the project, its media and records… <progress aria-label="Restoring the project" />
          </p> : null}
        {step.kind === 'error' ? (
          <Notice kind="error" title="Not brought in" role="alert">
            {step.message} Nothing from it was kept.
          </Notice>
        ) : null}
      </div>
    </form>
  );
}
