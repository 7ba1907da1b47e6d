'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { signOut } from 'next-auth/react';
import { sendJson } from '@/lib/client/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

/** Accepting is a POST from a button press: a mail scanner following the link only ever reads the page. */
export function AcceptInvitationButton({ token, projectTitle }: { token: string; projectTitle: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);

  async function accept() {
    setBusy(true);
    setFailure(null);
    const res = await sendJson<{ project: { slug: string } }>('/api/invitations/accept', 'POST', { token });
    if (!res.ok) {
      setBusy(false);
      setFailure(res.error.message);
      return;
    }
    router.push(`/logs/${res.data.project.slug}`);
    router.refresh();
  }

  return (
    <div className="space-y-3">
      {failure ? (
        <Notice kind="error" role="alert" title="Not accepted">
          {failure}
        </Notice>
      ) : null}
      <Button type="button" onClick={() => void accept()} disabled={busy} className="w-full sm:w-auto">
        {busy ? 'Accepting…' : `Accept and mentor “${projectTitle}”`}
      </Button>
    </div>
  );
}

/** Signs out, then brings the visitor to sign-in with the invitation as the page to come back to. */
export function SwitchAccountButton({ returnTo }: { returnTo: string }) {
  return (
    <Button type="button" tone="quiet" onClick={() => void signOut({ callbackUrl: `/sign-in?next=${encodeURIComponent(returnTo)}` })}>
      Sign out and switch account
    </Button>
  );
}
