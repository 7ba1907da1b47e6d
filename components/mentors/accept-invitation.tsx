'use client';

import { useActionState, useState } from 'react';
import { acceptInvitationAction } from '@/lib/actions/mentors';
import { IDLE } from '@/components/forms/action-state';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

/**
 * Accepting is a POST from a button press: a mail scanner following the link only ever reads the page. The
 * action goes to the project's log when accepted; a refusal comes back as its message.
 */
export function AcceptInvitationButton({ token, projectTitle }: { token: string; projectTitle: string }) {
  const [state, accept, busy] = useActionState(acceptInvitationAction, IDLE);

  return (
    <form action={accept} className="space-y-3">
      <input type="hidden" name="token" value={token} />
      {state.ok ? null : (
        <Notice kind="error" role="alert" title="Not accepted">
          {state.message}
        </Notice>
      )}
      <Button type="submit" disabled={busy} className="w-full sm:w-auto">
        {busy ? 'Accepting…' : `Accept and mentor “${projectTitle}”`}
      </Button>
    </form>
  );
}

/** Signs out, then brings the visitor to sign-in with the invitation as the page to come back to. */
export function SwitchAccountButton({ returnTo }: { returnTo: string }) {
  const [busy, setBusy] = useState(false);
  const [failed, setFailed] = useState(false);
  return (
    <div className="space-y-2">
      <Button
        type="button"
        tone="quiet"
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          setFailed(false);
          try {
            // next-auth's client code loads only when someone switches (as the header's sign-out does).
            const { signOut } = await import('next-auth/react');
            await signOut({ callbackUrl: `/sign-in?next=${encodeURIComponent(returnTo)}` });
          } catch {
            setFailed(true);
            setBusy(false);
          }
        }}
      >
        {busy ? 'Signing out…' : 'Sign out and switch account'}
      </Button>
      {failed ? (
        <p role="alert" className="text-sm font-semibold text-bad">
          ✕ Could not sign out: check the connection, or reload the page, and try again.
        </p>
      ) : null}
    </div>
  );
}
