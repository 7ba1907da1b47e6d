'use client';

import { useActionState } from 'react';
import { Notice } from '@/components/ui/notice';
import { resendVerificationAction } from '@/lib/actions/account';
import { IDLE } from '@/components/forms/action-state';

/** Shown to a signed-in member whose address is not verified yet, with a way to send the link again. */
export function VerifyAddressNotice({ email }: { email?: string }) {
  const [state, resend, busy] = useActionState(resendVerificationAction, IDLE);
  // The link brings the member back to the page they were on.
  const withNext = (data: FormData) => {
    data.set('next', `${window.location.pathname}${window.location.search}`);
    return resend(data);
  };

  return (
    <div data-testid="verify-address-notice">
      <Notice kind="caution" role="status" title="Verify your e-mail address">
        <p>
          We sent a link to {email ? <strong>{email}</strong> : 'your address'}. Until you follow it you can build your own logs, but not comment, follow or accept a mentor
          invitation.
        </p>
        {state.message ? <p className="mt-1 font-semibold">{state.message}</p> : null}
        <form action={withNext}>
          <button type="submit" className="mt-2 min-h-11 font-semibold underline" disabled={busy}>
            {busy ? 'Sending…' : 'Send the link again'}
          </button>
        </form>
      </Notice>
    </div>
  );
}
