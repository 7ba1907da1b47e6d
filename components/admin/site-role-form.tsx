'use client';

import { useActionState } from 'react';
import { setSiteRoleAction } from '@/lib/actions/users';
import type { ActionState } from '@/lib/actions/authed';

export function SiteRoleForm({ userId, name, siteRole }: { userId: number; name: string; siteRole: 'member' | 'admin' }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(setSiteRoleAction, { ok: true });
  const id = `role-${userId}`;
  return (
    <form action={action} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="userId" value={userId} />
      <label htmlFor={id} className="sr-only">
        Site role for {name}
      </label>
      <select id={id} name="siteRole" defaultValue={siteRole} className="min-h-11 rounded-md border border-rule bg-card px-2">
        <option value="member">Member</option>
        <option value="admin">Admin</option>
      </select>
      <button type="submit" disabled={pending} className="min-h-11 rounded-md border border-rule px-3 text-sm font-semibold hover:bg-paper-2">
        {pending ? 'Saving…' : 'Set role'}
      </button>
      {state.message ? (
        <span role="status" className={`text-sm ${state.ok ? 'text-ok' : 'text-bad'}`}>
          {state.ok ? '✓' : '✕'} {state.message}
        </span>
      ) : null}
    </form>
  );
}
