'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useSearchParams } from 'next/navigation';
import Link from 'next/link';
import type { SignUpInput } from '@/lib/validations/user';
import { PASSWORD_MIN_LENGTH, PASSWORD_MAX_BYTES } from '@/lib/validations/user-words';
import { lazyZodResolver } from '@/components/forms/lazy-resolver';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button, ButtonLink } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors, sendJson } from '@/lib/client/api-client';
import { withNext } from './return-path';

const resolver = lazyZodResolver<SignUpInput>(() => import('@/lib/validations/user').then((m) => m.signUpSchema));

export function SignUpForm() {
  const params = useSearchParams();
  const next = params.get('next');
  const [failure, setFailure] = useState<string | null>(null);
  const [sent, setSent] = useState<{ email: string; message: string } | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<SignUpInput>({ resolver });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const res = await sendJson<{ email: string; message: string }>('/api/account', 'POST', { ...values, next: next ?? undefined });
    if (!res.ok) {
      applyServerErrors(res.error, setError);
      setFailure(res.error.message);
      return;
    }
    setSent(res.data);
  });

  if (sent) {
    return (
      <div className="space-y-4" data-testid="sign-up-sent">
        <Notice kind="success" role="status" title="Check your mail">
          {sent.message}
        </Notice>
        <p className="text-sm text-graphite-2">
          The message holds a link that verifies your address. Once it is verified you can comment, follow builders and accept a mentor invitation.
        </p>
        <ButtonLink href={withNext('/sign-in', next, { email: sent.email })} className="w-full">
          Go to sign in
        </ButtonLink>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} onFocusCapture={resolver.preload} method="post" noValidate className="space-y-4" aria-label="Create account">
      {failure ? (
        <Notice kind="error" role="alert" title="Could not create the account">
          {failure}
        </Notice>
      ) : null}
      <Field id="name" label="Your name" hint="Shown on your published logs." error={errors.name?.message}>
        <input id="name" autoComplete="name" autoFocus className={inputClass} aria-invalid={!!errors.name} aria-describedby={describedBy('name', errors.name?.message, 'hint')} {...register('name')} />
      </Field>
      <Field id="email" label="E-mail" hint="We send a link to verify it." error={errors.email?.message}>
        <input id="email" type="email" autoComplete="email" className={inputClass} aria-invalid={!!errors.email} aria-describedby={describedBy('email', errors.email?.message, 'hint')} {...register('email')} />
      </Field>
      <Field
        id="password"
        label="Password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters, at most ${PASSWORD_MAX_BYTES} bytes. A few unrelated words make a strong one; common passwords are refused.`}
        error={errors.password?.message}
      >
        <input id="password" type="password" autoComplete="new-password" className={inputClass} aria-invalid={!!errors.password} aria-describedby={describedBy('password', errors.password?.message, 'hint')} {...register('password')} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? 'Creating…' : 'Create account'}
      </Button>
      <p className="text-center text-sm text-graphite-2">
        Already have an account? <Link href={withNext('/sign-in', next)}>Sign in</Link>
      </p>
    </form>
  );
}
