'use client';

import { useActionState, useRef, useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { signIn, signOut } from 'next-auth/react';
import {
  changeEmailSchema,
  changeNameSchema,
  changePasswordSchema,
  deleteAccountSchema,
  PASSWORD_MAX_BYTES,
  PASSWORD_MIN_LENGTH,
  type ChangeEmailInput,
  type ChangeNameInput,
  type ChangePasswordInput,
  type DeleteAccountInput,
} from '@/lib/validations/user';
import type { AccountView } from '@/lib/types/account';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { applyActionErrors, dispatchForm, IDLE } from '@/components/forms/action-state';
import { changeEmailAction, changeNameAction, changePasswordAction, deleteAccountAction } from '@/lib/actions/account';
import type { ActionState } from '@/lib/actions/authed';

type Outcome = { kind: 'success' | 'error'; text: string } | null;

/** What the form says after its action: the server's message, as a success or a refusal. */
function outcomeOf(state: ActionState<unknown>, success?: string): Outcome {
  if (state === IDLE) return null;
  if (!state.ok) return { kind: 'error', text: state.message ?? 'Not saved.' };
  const text = success ?? state.message;
  return text ? { kind: 'success', text } : null;
}

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-heading`} className="space-y-3 rounded-lg border border-rule bg-card p-4 sm:p-5">
      <h3 id={`${id}-heading`} className="text-lg font-bold">
        {title}
      </h3>
      {children}
    </section>
  );
}

function Said({ outcome }: { outcome: Outcome }) {
  if (!outcome) return null;
  return (
    <Notice kind={outcome.kind} role={outcome.kind === 'error' ? 'alert' : 'status'}>
      {outcome.text}
    </Notice>
  );
}

function NameForm({ account }: { account: AccountView }) {
  const formRef = useRef<HTMLFormElement>(null);
  const { register, handleSubmit, formState, setError } = useForm<ChangeNameInput>({ resolver: zodResolver(changeNameSchema), defaultValues: { name: account.name } });
  const { errors } = formState;
  // The action renders every page again: the new name is in the header at once.
  const [state, dispatch, isSubmitting] = useActionState<ActionState<never>, FormData>(async (prev, data) => {
    const result = await changeNameAction(prev, data);
    applyActionErrors(result, setError);
    return result;
  }, IDLE);
  const outcome = outcomeOf(state);
  const onSubmit = handleSubmit(() => dispatchForm(formRef.current!, dispatch));
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-3" aria-label="Change your name">
      <Said outcome={outcome} />
      <Field id="account-name" label="Your name" hint="Shown on your published logs and comments." error={errors.name?.message}>
        <input id="account-name" autoComplete="name" className={inputClass} aria-invalid={!!errors.name} aria-describedby={describedBy('account-name', errors.name?.message, 'hint')} {...register('name')} />
      </Field>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save the name'}
      </Button>
    </form>
  );
}

function EmailForm({ account }: { account: AccountView }) {
  const formRef = useRef<HTMLFormElement>(null);
  const { register, handleSubmit, formState, setError, reset } = useForm<ChangeEmailInput>({ resolver: zodResolver(changeEmailSchema) });
  const { errors } = formState;
  // The action renders the page again: the address waiting for its link shows.
  const [state, dispatch, isSubmitting] = useActionState<ActionState<never>, FormData>(async (prev, data) => {
    const result = await changeEmailAction(prev, data);
    applyActionErrors(result, setError);
    if (result.ok) reset({ email: '', currentPassword: '' });
    return result;
  }, IDLE);
  const outcome = outcomeOf(state);
  const onSubmit = handleSubmit(() => dispatchForm(formRef.current!, dispatch));
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-3" aria-label="Change your e-mail address">
      <p className="text-sm">
        Now: <strong>{account.email}</strong> {account.emailVerified ? <span className="text-ok">✓ verified</span> : <span className="text-scribe">⚠ not verified yet</span>}
      </p>
      {account.pendingEmail ? (
        <p className="text-sm text-graphite-2" data-testid="pending-email">
          Waiting for <strong>{account.pendingEmail}</strong> to follow its link; until then the address above stays.
        </p>
      ) : null}
      <Said outcome={outcome} />
      <Field id="new-email" label="New e-mail address" hint="We send a link there; the change takes effect when it is followed." error={errors.email?.message}>
        <input id="new-email" type="email" autoComplete="email" className={inputClass} aria-invalid={!!errors.email} aria-describedby={describedBy('new-email', errors.email?.message, 'hint')} {...register('email')} />
      </Field>
      <Field id="email-current-password" label="Your current password" error={errors.currentPassword?.message}>
        <input id="email-current-password" type="password" autoComplete="current-password" className={inputClass} aria-invalid={!!errors.currentPassword} aria-describedby={describedBy('email-current-password', errors.currentPassword?.message)} {...register('currentPassword')} />
      </Field>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Sending…' : 'Send the link to the new address'}
      </Button>
    </form>
  );
}

function PasswordForm() {
  const router = useRouter();
  const formRef = useRef<HTMLFormElement>(null);
  const { register, handleSubmit, formState, setError, reset } = useForm<ChangePasswordInput>({ resolver: zodResolver(changePasswordSchema) });
  const { errors } = formState;
  const [state, dispatch, isSubmitting] = useActionState<ActionState<{ email: string }>, FormData>(async (prev, data) => {
    const result = await changePasswordAction(prev, data);
    applyActionErrors(result, setError);
    if (!result.ok || !result.data) return result;
    // Every session ended, this one too: sign in again here with the new password.
    const again = await signIn('credentials', { email: result.data.email, password: String(data.get('newPassword') ?? ''), redirect: false });
    reset({ currentPassword: '', newPassword: '' });
    if (!again || again.error) {
      router.push(`/sign-in?${new URLSearchParams({ email: result.data.email, reset: '1', next: '/settings' })}`);
      return IDLE;
    }
    router.refresh();
    return result;
  }, IDLE);
  const outcome = outcomeOf(state, 'Password changed. Every other device that was signed in has been signed out.');
  const onSubmit = handleSubmit(() => dispatchForm(formRef.current!, dispatch));
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-3" aria-label="Change your password">
      <Said outcome={outcome} />
      <Field id="current-password" label="Current password" error={errors.currentPassword?.message}>
        <input id="current-password" type="password" autoComplete="current-password" className={inputClass} aria-invalid={!!errors.currentPassword} aria-describedby={describedBy('current-password', errors.currentPassword?.message)} {...register('currentPassword')} />
      </Field>
      <Field id="new-password" label="New password" hint={`At least ${PASSWORD_MIN_LENGTH} characters, at most ${PASSWORD_MAX_BYTES} bytes; common passwords are refused.`} error={errors.newPassword?.message}>
        <input id="new-password" type="password" autoComplete="new-password" className={inputClass} aria-invalid={!!errors.newPassword} aria-describedby={describedBy('new-password', errors.newPassword?.message, 'hint')} {...register('newPassword')} />
      </Field>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Change the password'}
      </Button>
    </form>
  );
}

function DeleteForm() {
  const [open, setOpen] = useState(false);
  const formRef = useRef<HTMLFormElement>(null);
  const { register, handleSubmit, formState, setError } = useForm<DeleteAccountInput>({ resolver: zodResolver(deleteAccountSchema) });
  const { errors } = formState;
  const [state, dispatch, isSubmitting] = useActionState<ActionState<never>, FormData>(async (prev, data) => {
    const result = await deleteAccountAction(prev, data);
    applyActionErrors(result, setError);
    // The account is gone, and with it every session: leave through next-auth's sign-out.
    if (result.ok) await signOut({ callbackUrl: '/sign-in?deleted=1' });
    return result;
  }, IDLE);
  const outcome = state.ok ? null : outcomeOf(state);
  const onSubmit = handleSubmit(() => dispatchForm(formRef.current!, dispatch));
  if (!open) {
    return (
      <div className="space-y-2">
        <p className="text-sm text-graphite-2">Deleting cannot be undone. You choose what happens to your published logs.</p>
        <Button type="button" tone="danger" onClick={() => setOpen(true)}>
          Delete my account…
        </Button>
      </div>
    );
  }
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="space-y-3" aria-label="Delete your account">
      <Said outcome={outcome} />
      <fieldset className="space-y-2" aria-describedby={errors.logs?.message ? 'delete-logs-error' : undefined}>
        <legend className="text-sm font-semibold">Your published logs</legend>
        <label className="flex min-h-11 items-start gap-2 text-sm">
          <input type="radio" value="keep" className="mt-1 h-5 w-5" {...register('logs')} />
          <span>
            <strong>Keep them</strong> for others to learn from, under the name “Former member”, with your comments. Unpublished projects are removed.
          </span>
        </label>
        <label className="flex min-h-11 items-start gap-2 text-sm">
          <input type="radio" value="remove" className="mt-1 h-5 w-5" {...register('logs')} />
          <span>
            <strong>Remove them</strong>: every project, its photos and clips, and your comments go.
          </span>
        </label>
        {errors.logs?.message ? (
          <p id="delete-logs-error" className="text-sm font-medium text-bad">
            <span aria-hidden="true">✕</span> {errors.logs.message}
          </p>
        ) : null}
      </fieldset>
      <p className="text-sm text-graphite-2">Either way your follows, mentor roles and sign-ins end; risk flags you raised as a mentor stay with the builder’s log.</p>
      <Field id="delete-password" label="Your password, to confirm" error={errors.currentPassword?.message}>
        <input id="delete-password" type="password" autoComplete="current-password" className={inputClass} aria-invalid={!!errors.currentPassword} aria-describedby={describedBy('delete-password', errors.currentPassword?.message)} {...register('currentPassword')} />
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" tone="danger" disabled={isSubmitting}>
          {isSubmitting ? 'Deleting…' : 'Delete my account for good'}
        </Button>
        <Button type="button" tone="quiet" onClick={() => setOpen(false)}>
          Keep my account
        </Button>
      </div>
    </form>
  );
}

/** The member's own account: name, address, password, deletion. */
export function AccountSettings({ account }: { account: AccountView }) {
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <Section id="account-name-section" title="Name">
        <NameForm account={account} />
      </Section>
      <Section id="account-email-section" title="E-mail address">
        <EmailForm account={account} />
      </Section>
      <Section id="account-password-section" title="Password">
        <PasswordForm />
      </Section>
      <Section id="account-delete-section" title="Delete the account">
        <DeleteForm />
      </Section>
    </div>
  );
}
