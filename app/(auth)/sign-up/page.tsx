import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { SignUpForm } from '@/components/auth/sign-up-form';
import { getCurrentUser } from '@/lib/auth/current-user';

export const metadata: Metadata = { title: 'Create account' };

export default async function SignUpPage() {
  if (await getCurrentUser()) redirect('/projects');
  return (
    <>
      <h1 className="mb-1 text-2xl font-bold">Create your account</h1>
      <p className="mb-6 text-sm text-graphite-2">Free for builders, followers and mentors alike.</p>
      <SignUpForm />
    </>
  );
}
