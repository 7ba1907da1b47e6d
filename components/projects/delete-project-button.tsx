'use client';

import { useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '@/components/ui/button';
import { postJson } from '@/components/forms/api-client';

/** Deleting asks first, in a real dialog that traps focus and closes with Escape. */
export function DeleteProjectButton({ id, title }: { id: number; title: string }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const router = useRouter();
  const queryClient = useQueryClient();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function confirmDelete() {
    setBusy(true);
    setError(null);
    const res = await postJson(`/api/projects/${id}`, 'DELETE');
    setBusy(false);
    if (!res.ok) {
      setError(res.error.message);
      return;
    }
    dialog.current?.close();
    await queryClient.invalidateQueries({ queryKey: ['projects'] });
    router.push('/projects');
    router.refresh();
  }

  return (
    <>
      <Button type="button" tone="danger" onClick={() => dialog.current?.showModal()}>
        Delete project
      </Button>
      <dialog ref={dialog} aria-labelledby="delete-title" className="m-auto max-w-md rounded-lg border border-rule bg-card p-6 text-graphite backdrop:bg-black/50">
        <h2 id="delete-title" className="text-lg font-bold">
          Delete “{title}”?
        </h2>
        <p className="mt-2 text-sm text-graphite-2">The project and everything logged in it will be removed for good. This cannot be undone.</p>
        {error ? <p className="mt-2 text-sm font-semibold text-bad">✕ {error}</p> : null}
        <div className="mt-5 flex flex-wrap justify-end gap-2">
          <Button type="button" tone="quiet" onClick={() => dialog.current?.close()} autoFocus>
            Keep it
          </Button>
          <Button type="button" tone="danger" onClick={confirmDelete} disabled={busy}>
            {busy ? 'Deleting…' : 'Yes, delete'}
          </Button>
        </div>
      </dialog>
    </>
  );
}
