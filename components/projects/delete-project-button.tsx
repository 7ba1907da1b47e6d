'use client';

import { useRouter } from 'next/navigation';
import { useQueryClient } from '@tanstack/react-query';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { postJson } from '@/components/forms/api-client';

export function DeleteProjectButton({ id, title }: { id: number; title: string }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  return (
    <ConfirmDialog
      trigger="Delete project"
      title={`Delete “${title}”?`}
      body="The project and everything logged in it will be removed for good. This cannot be undone."
      confirmLabel="Yes, delete"
      onConfirm={async () => {
        const res = await postJson(`/api/projects/${id}`, 'DELETE');
        if (!res.ok) return res.error.message;
        await queryClient.invalidateQueries({ queryKey: ['projects'] });
        router.push('/projects');
        router.refresh();
        return null;
      }}
    />
  );
}
