import type { ReactNode } from 'react';
import { redirect } from 'next/navigation';
import { headers } from 'next/headers';
import { getCurrentUser } from '@/lib/auth/current-user';
import { VerifyAddressNotice } from '@/components/auth/verify-address-notice';
import { SiteFrame } from '@/components/layout/site-frame';

// Rendered for each request (it reads the viewer's session); see DEVELOPERS.md "Reading a page".
export const instant = false;

export default async function SignedInLayout({ children }: { children: ReactNode }) {
  const user = await getCurrentUser();
  if (!user) {
    const path = (await headers()).get('x-scribeline-path') ?? '/projects';
    redirect(`/sign-in?next=${encodeURIComponent(path)}`);
  }
  return (
    <SiteFrame>
      {user.emailVerified ? null : (
        <div className="mb-4">
          <VerifyAddressNotice email={user.email} />
        </div>
      )}
      {children}
    </SiteFrame>
  );
}
