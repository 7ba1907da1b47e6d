'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useRouter, useSearchParams } from 'next/navigation';
import Link from 'next/link';
import { PASSWORD_MIN_LENGTH, PASSWORD_MAX_BYTES } from '@/lib/validations/user-words';
import { lazyZodResolver } from '@/components/forms/lazy-resolver';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors, sendJson } from '@/lib/client/api-client';

type Input = { password: string };

// The token comes from the link; the form checks only the new password.
const resolver = lazyZodResolver<Input>(() => import('@/lib/validations/user').then((m) => m.passwordResetSchema.pick({ password: true })));

export function ResetPasswordForm() {
  const router = useRouter();
  const params = useSearchParams();
  const token = params.get('token') ?? '';
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<Input>({ resolver });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const res = await sendJson<{ email: string }>('/api/account/password-reset/confirm', 'POST', { token, password: values.password });
    if (!res.ok) {
      applyServerErrors(res.error, setError);
      setFailure(res.error.message);
      return;
    }
    router.push(`/sign-in?${new URLSearchParams({ email: res.data.email, reset: '1' })}`);
  });

  if (!token) {
    return (
      <Notice kind="error" role="alert" title="This link is not complete">
        Copy the whole link from the e-mail, or <Link href="/forgot-password">ask for a new one</Link>.
      </Notice>
    );
  }
  return (
    <form onSubmit={onSubmit} onFocusCapture={resolver.preload} method="post" noValidate className="space-y-4" aria-label="Choose a new password">
      {failure ? (
        <Notice kind="error" role="alert" title="Could not change the password">
          {failure} <Link href="/forgot-password">Ask for a new link</Link>
        </Notice>
      ) : null}
      <Field id="password" label="New password" hint={`At least ${PASSWORD_MIN_LENGTH} characters, at most ${PASSWORD_MAX_BYTES} bytes; common passwords are refused.`} error={errors.password?.message}>
        <input id="password" type="password" autoComplete="new-password" autoFocus className={inputClass} aria-invalid={!!errors.password} aria-describedby={describedBy('password', errors.password?.message, 'hint')} {...register('password')} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? 'Saving…' : 'Save the new password'}
      </Button>
    </form>
  );
}
