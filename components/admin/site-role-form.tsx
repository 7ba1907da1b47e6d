'use client';

import { startTransition, useActionState, useState } from 'react';
import { setSiteRoleAction } from '@/lib/actions/users';
import type { ActionState } from '@/lib/actions/authed';

type Role = 'member' | 'admin';

/**
 * The select is controlled: after the action it shows the role the server confirmed (the new one on
 * success, the old one when refused), never the value the form was first rendered with. The action is
 * dispatched from onSubmit, not through the form's action prop: React resets a form after its action,
 * which puts a select back to the option it was first rendered with while the state still says otherwise.
 */
export function SiteRoleForm({ userId, name, siteRole }: { userId: number; name: string; siteRole: Role }) {
  const [saved, setSaved] = useState<Role>(siteRole);
  const [value, setValue] = useState<Role>(siteRole);
  const [state, action, pending] = useActionState<ActionState, FormData>(async (prev, form) => {
    const result = await setSiteRoleAction(prev, form);
    if (result.ok) setSaved(form.get('siteRole') as Role);
    else setValue(saved);
    return result;
  }, { ok: true });
  const id = `role-${userId}`;
  return (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        const data = new FormData(e.currentTarget);
        startTransition(() => action(data));
      }}
      className="flex flex-wrap items-center gap-2"
    >
      <input type="hidden" name="userId" value={userId} />
      <label htmlFor={id} className="sr-only">
        Site role for {name}
      </label>
      <select id={id} name="siteRole" value={value} onChange={(e) => setValue(e.target.value as Role)} className="min-h-11 rounded-md border border-rule bg-card px-2">
        <option value="member">Member</option>
        <option value="admin">Admin</option>
      </select>
      <button
        type="submit"
        disabled={pending || value === saved}
        className="min-h-11 rounded-md border border-rule px-3 text-sm font-semibold hover:bg-paper-2 disabled:cursor-not-allowed disabled:opacity-60"
      >
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
