'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { SignInResponse } from 'next-auth/react';
import { useRouter, useSearchParams } from 'next/navigation';
import Link from 'next/link';
import type { SignInInput } from '@/lib/validations/user';
import { lazyZodResolver } from '@/components/forms/lazy-resolver';
import { safeNext, withNext } from './return-path';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { loadViewer } from '@/components/layout/shared-copy-viewer';

const ARRIVALS: Record<string, { title: string; text: string }> = {
  verified: { title: 'Address verified', text: 'Sign in to carry on.' },
  reset: { title: 'Password changed', text: 'Sign in with your new password. Every device that was signed in has been signed out.' },
  deleted: { title: 'Account deleted', text: 'Your account is gone. Thank you for the time you spent in the shop with us.' },
};

const resolver = lazyZodResolver<SignInInput>(() => import('@/lib/validations/user').then((m) => m.signInSchema));
// next-auth's browser half (it asks for the form token, then posts the credentials) is wanted only on submit.
const loadAuth = () => import('next-auth/react');
const preload = () => {
  resolver.preload();
  void loadAuth().catch(() => undefined);
};

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const next = params.get('next');
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({
    resolver,
    defaultValues: { email: params.get('email') ?? '', password: '' },
  });
  const { errors, isSubmitting } = formState;
  const arrival = Object.keys(ARRIVALS).find((k) => params.get(k));
  const prefilled = !!params.get('email');

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    let result: SignInResponse | undefined;
    try {
      const { signIn } = await loadAuth();
      result = await signIn('credentials', { ...values, redirect: false });
    } catch {
      setFailure('Could not reach Scribeline: check the connection, or reload the page, and try again.');
      return;
    }
    if (!result || result.error) {
      setFailure(result?.error && result.error !== 'CredentialsSignin' ? result.error : 'That e-mail and password do not match an account.');
      return;
    }
    // Sets the scribeline-copy cookie before the next page is read, so it is the copy that suits this member.
    await loadViewer(true);
    router.push(safeNext(next));
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} onFocusCapture={preload} method="post" noValidate className="space-y-4" aria-label="Sign in">
      {arrival ? (
        <Notice kind="success" role="status" title={ARRIVALS[arrival].title}>
          {ARRIVALS[arrival].text}
        </Notice>
      ) : null}
      {failure ? (
        <Notice kind="error" role="alert" title="Could not sign in">
          {failure}
        </Notice>
      ) : null}
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <input
          id="email"
          type="email"
          autoComplete="email"
          autoFocus={!prefilled}
          className={inputClass}
          aria-invalid={!!errors.email}
          aria-describedby={describedBy('email', errors.email?.message)}
          {...register('email')}
        />
      </Field>
      <Field id="password" label="Password" error={errors.password?.message}>
        <input
          id="password"
          type="password"
          autoComplete="current-password"
          autoFocus={prefilled}
          className={inputClass}
          aria-invalid={!!errors.password}
          aria-describedby={describedBy('password', errors.password?.message)}
          {...register('password')}
        />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
      <p className="flex flex-wrap justify-between gap-2 text-sm text-graphite-2">
        <Link href={withNext('/forgot-password', null)}>Forgot your password?</Link>
        <span>
          New here? <Link href={withNext('/sign-up', next)}>Create an account</Link>
        </span>
      </p>
    </form>
  );
}
