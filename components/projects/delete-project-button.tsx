'use client';

import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { deleteProjectAction } from '@/lib/actions/projects';
import { IDLE } from '@/components/forms/action-state';

export function DeleteProjectButton({ id, title }: { id: number; title: string }) {
  return (
    <ConfirmDialog
      trigger="Delete project"
      title={`Delete “${title}”?`}
      body="The project and everything logged in it will be removed for good. This cannot be undone."
      confirmLabel="Yes, delete"
      onConfirm={async () => {
        const data = new FormData();
        data.set('projectId', String(id));
        // On success the action redirects to the list; a refusal comes back as its message.
        const state = await deleteProjectAction(IDLE, data);
        return state.ok ? null : (state.message ?? 'Not deleted.');
      }}
    />
  );
}
