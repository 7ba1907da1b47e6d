import type { Metadata } from 'next';
import { Suspense } from 'react';
import { VerifyAddress } from '@/components/auth/verify-address';

export const metadata: Metadata = { title: 'Verify your address', robots: { index: false } };

// Opening the link only shows this page; the button does the verifying (a POST), so a mail scanner that
// opens links changes nothing.
export default function VerifyEmailPage() {
  return (
    <>
      <h1 className="mb-1 text-2xl font-bold">Verify your e-mail address</h1>
      <p className="mb-6 text-sm text-graphite-2">One step to finish: confirm that this address is yours.</p>
      <Suspense>
        <VerifyAddress />
      </Suspense>
    </>
  );
}
