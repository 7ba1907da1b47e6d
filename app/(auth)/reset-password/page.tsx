import type { Metadata } from 'next';
import { Suspense } from 'react';
import { ResetPasswordForm } from '@/components/auth/reset-password-form';

export const metadata: Metadata = { title: 'Choose a new password', robots: { index: false } };

export default function ResetPasswordPage() {
  return (
    <>
      <h1 className="mb-1 text-2xl font-bold">Choose a new password</h1>
      <p className="mb-6 text-sm text-graphite-2">Every device signed in to your account will be signed out.</p>
      <Suspense>
        <ResetPasswordForm />
      </Suspense>
    </>
  );
}
