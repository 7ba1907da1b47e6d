'use client';

import { signOut } from 'next-auth/react';

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: '/' })}
      className="min-h-11 rounded-md px-3 text-sm font-semibold text-graphite hover:bg-paper-2"
    >
      Sign out
    </button>
  );
}
