'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter, useSearchParams } from 'next/navigation';
import Link from 'next/link';
import { signInSchema, type SignInInput } from '@/lib/validations/user';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

/** Only same-site paths may be returned to after signing in. */
export function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/projects';
}

export function SignInForm() {
  const router = useRouter();
  const params = useSearchParams();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const result = await signIn('credentials', { ...values, redirect: false });
    if (!result || result.error) {
      setFailure(result?.error && result.error !== 'CredentialsSignin' ? result.error : 'That e-mail and password do not match an account.');
      return;
    }
    router.push(safeNext(params.get('next')));
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Sign in">
      {params.get('registered') ? (
        <Notice kind="success" role="status" title="Account created">
          Sign in with the e-mail and password you just chose.
        </Notice>
      ) : null}
      {failure ? (
        <Notice kind="error" role="alert" title="Could not sign in">
          {failure}
        </Notice>
      ) : null}
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <input id="email" type="email" autoComplete="email" className={inputClass} aria-invalid={!!errors.email} aria-describedby={describedBy('email', errors.email?.message)} {...register('email')} />
      </Field>
      <Field id="password" label="Password" error={errors.password?.message}>
        <input id="password" type="password" autoComplete="current-password" className={inputClass} aria-invalid={!!errors.password} aria-describedby={describedBy('password', errors.password?.message)} {...register('password')} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
      <p className="text-center text-sm text-graphite-2">
        New here? <Link href="/sign-up">Create an account</Link>
      </p>
    </form>
  );
}
