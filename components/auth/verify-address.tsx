'use client';

import { useState } from 'react';
import { useRouter, useSearchParams } from 'next/navigation';
import Link from 'next/link';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { sendJson } from '@/lib/client/api-client';
import { safeNextPath } from '@/lib/auth/safe-redirect';
import { withNext } from './return-path';

/** The button behind an e-mailed address link: a new account's address, or an account's new address. */
export function VerifyAddress() {
  const router = useRouter();
  const params = useSearchParams();
  const token = params.get('token') ?? '';
  const next = params.get('next');
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);

  if (!token) {
    return (
      <Notice kind="error" role="alert" title="This link is not complete">
        Copy the whole link from the e-mail, or send a new one from <Link href="/settings">your settings</Link>.
      </Notice>
    );
  }

  async function verify() {
    setBusy(true);
    setFailure(null);
    const res = await sendJson<{ email: string; changed: boolean }>('/api/account/verify', 'POST', { token });
    if (!res.ok) {
      setFailure(res.error.message);
      setBusy(false);
      return;
    }
    // Signed in already: carry on where the link meant to go. Otherwise sign in with the address filled in.
    const session = await fetch('/api/me/account', { headers: { accept: 'application/json' } }).catch(() => null);
    if (session?.ok) {
      router.push(safeNextPath(next, res.data.changed ? '/settings?address=changed' : '/projects'));
      router.refresh();
      return;
    }
    router.push(withNext('/sign-in', next, { email: res.data.email, verified: '1' }));
  }

  return (
    <div className="space-y-4">
      {failure ? (
        <Notice kind="error" role="alert" title="Could not verify">
          {failure} You can send a new link from <Link href="/settings">your settings</Link> once signed in.
        </Notice>
      ) : null}
      <Button type="button" onClick={() => void verify()} disabled={busy} className="w-full">
        {busy ? 'Verifying…' : 'Verify my address'}
      </Button>
    </div>
  );
}
