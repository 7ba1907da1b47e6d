import type { Metadata } from 'next';
import { Suspense } from 'react';
import { ForgotPasswordForm } from '@/components/auth/forgot-password-form';

export const metadata: Metadata = { title: 'Forgot your password' };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1 className="mb-1 text-2xl font-bold">Forgot your password?</h1>
      <p className="mb-6 text-sm text-graphite-2">Enter the address of your account and we send a link to choose a new one.</p>
      <Suspense>
        <ForgotPasswordForm />
      </Suspense>
    </>
  );
}
