'use client';

import { forgetViewer } from './shared-copy-viewer';

export function SignOutButton() {
  return (
    <button
      type="button"
      // The header is on every page: next-auth's client code loads only when someone signs out.
      onClick={async () => {
        const { signOut } = await import('next-auth/react');
        forgetViewer();
        await signOut({ callbackUrl: '/' });
      }}
      className="min-h-11 rounded-md px-3 text-sm font-semibold text-graphite hover:bg-paper-2"
    >
      Sign out
    </button>
  );
}
