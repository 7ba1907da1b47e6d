'use client';

import { useState } from 'react';
import { Notice } from '@/components/ui/notice';
import { sendJson } from '@/lib/client/api-client';

/** Shown to a signed-in member whose address is not verified yet, with a way to send the link again. */
export function VerifyAddressNotice({ email }: { email?: string }) {
  const [state, setState] = useState<{ kind: 'idle' | 'busy' } | { kind: 'done' | 'failed'; message: string }>({ kind: 'idle' });

  async function resend() {
    setState({ kind: 'busy' });
    const next = `${window.location.pathname}${window.location.search}`;
    const res = await sendJson<{ message: string }>('/api/me/account/verification', 'POST', { next });
    setState(res.ok ? { kind: 'done', message: res.data.message } : { kind: 'failed', message: res.error.message });
  }

  return (
    <div data-testid="verify-address-notice">
      <Notice kind="caution" role="status" title="Verify your e-mail address">
        <p>
          We sent a link to {email ? <strong>{email}</strong> : 'your address'}. Until you follow it you can build your own logs, but not comment, follow or accept a mentor
          invitation.
        </p>
        {state.kind === 'done' || state.kind === 'failed' ? <p className="mt-1 font-semibold">{state.message}</p> : null}
        <button type="button" className="mt-2 min-h-11 font-semibold underline" onClick={() => void resend()} disabled={state.kind === 'busy'}>
          {state.kind === 'busy' ? 'Sending…' : 'Send the link again'}
        </button>
      </Notice>
    </div>
  );
}
