'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import Link from 'next/link';
import { signUpSchema, type SignUpInput } from '@/lib/validations/user';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors, postJson } from '@/components/forms/api-client';

export function SignUpForm() {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<SignUpInput>({ resolver: zodResolver(signUpSchema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const res = await postJson('/api/account', 'POST', values);
    if (!res.ok) {
      applyServerErrors(res.error, setError);
      setFailure(res.error.message);
      return;
    }
    router.push(`/sign-in?registered=1&next=${encodeURIComponent('/projects')}`);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Create account">
      {failure ? (
        <Notice kind="error" role="alert" title="Could not create the account">
          {failure}
        </Notice>
      ) : null}
      <Field id="name" label="Your name" hint="Shown on your published logs." error={errors.name?.message}>
        <input id="name" autoComplete="name" className={inputClass} aria-invalid={!!errors.name} aria-describedby={describedBy('name', errors.name?.message, 'hint')} {...register('name')} />
      </Field>
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <input id="email" type="email" autoComplete="email" className={inputClass} aria-invalid={!!errors.email} aria-describedby={describedBy('email', errors.email?.message)} {...register('email')} />
      </Field>
      <Field id="password" label="Password" hint="At least 10 characters." error={errors.password?.message}>
        <input id="password" type="password" autoComplete="new-password" className={inputClass} aria-invalid={!!errors.password} aria-describedby={describedBy('password', errors.password?.message, 'hint')} {...register('password')} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? 'Creating…' : 'Create account'}
      </Button>
      <p className="text-center text-sm text-graphite-2">
        Already have an account? <Link href="/sign-in">Sign in</Link>
      </p>
    </form>
  );
}
