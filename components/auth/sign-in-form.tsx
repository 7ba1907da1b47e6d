'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter, useSearchParams } from 'next/navigation';
import Link from 'next/link';
import { signInSchema, type SignInInput } from '@/lib/validations/user';
import { safeNextPath } from '@/lib/auth/safe-redirect';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { loadViewer } from '@/components/layout/shared-copy-viewer';

/** Only paths of this site may be returned to after signing in (the one helper, lib/auth/safe-redirect.ts). */
export function safeNext(next: string | null): string {
  return safeNextPath(next, '/projects');
}

/** A link to another auth page that keeps the return path. */
export function withNext(path: string, next: string | null, extra: Record<string, string> = {}): string {
  const q = new URLSearchParams(extra);
  const target = safeNextPath(next, '');
  if (target) q.set('next', target);
  const s = q.toString();
  return s ? `${path}?${s}` : path;
}

const ARRIVALS: Record<string, { title: string; text: string }> = {
  verified: { title: 'Address verified', text: 'Sign in to carry on.' },
  reset: { title: 'Password changed', text: 'Sign in with your new password. Every device that was signed in has been signed out.' },
  deleted: { title: 'Account deleted', text: 'Your account is gone. Thank you for the time you spent in the shop with us.' },
};

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const next = params.get('next');
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: params.get('email') ?? '', password: '' },
  });
  const { errors, isSubmitting } = formState;
  const arrival = Object.keys(ARRIVALS).find((k) => params.get(k));
  const prefilled = !!params.get('email');

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const result = await signIn('credentials', { ...values, redirect: false });
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
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Sign in">
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
