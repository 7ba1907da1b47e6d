'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useSearchParams } from 'next/navigation';
import Link from 'next/link';
import type { z } from 'zod';
import type { passwordResetRequestSchema } from '@/lib/validations/user';
import { lazyZodResolver } from '@/components/forms/lazy-resolver';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors, sendJson } from '@/lib/client/api-client';

type Input = z.infer<typeof passwordResetRequestSchema>;

const resolver = lazyZodResolver<Input>(() => import('@/lib/validations/user').then((m) => m.passwordResetRequestSchema));

export function ForgotPasswordForm() {
  const params = useSearchParams();
  const [failure, setFailure] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<Input>({
    resolver,
    defaultValues: { email: params.get('email') ?? '' },
  });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const res = await sendJson<{ message: string }>('/api/account/password-reset', 'POST', values);
    if (!res.ok) {
      applyServerErrors(res.error, setError);
      setFailure(res.error.message);
      return;
    }
    setSent(res.data.message);
  });

  if (sent) {
    return (
      <Notice kind="success" role="status" title="Check your mail">
        {sent} The link works once, for an hour.
      </Notice>
    );
  }
  return (
    <form onSubmit={onSubmit} onFocusCapture={resolver.preload} method="post" noValidate className="space-y-4" aria-label="Ask for a password reset link">
      {failure ? (
        <Notice kind="error" role="alert" title="Could not send the link">
          {failure}
        </Notice>
      ) : null}
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <input id="email" type="email" autoComplete="email" autoFocus className={inputClass} aria-invalid={!!errors.email} aria-describedby={describedBy('email', errors.email?.message)} {...register('email')} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? 'Sending…' : 'Send the link'}
      </Button>
      <p className="text-center text-sm text-graphite-2">
        Remembered it? <Link href="/sign-in">Sign in</Link>
      </p>
    </form>
  );
}
