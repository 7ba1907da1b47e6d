'use client';

import { useActionState, useRef, useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { inviteMentorAction, removeMentorAction, revokeInvitationAction } from '@/lib/actions/mentors';
import type { ActionState } from '@/lib/actions/authed';
import { applyActionErrors, dispatchForm, IDLE } from '@/components/forms/action-state';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { INVITATION_LIFETIME_DAYS, INVITATION_NOTE_MAX, invitationInputSchema, type InvitationFormValues, type InvitationInput } from '@/lib/validations/invitations';
import type { InvitationView, MentorsOverview } from '@/lib/types/flags';
import { formatDate, formatDateTime } from '@/lib/format';

const formOf = (fields: Record<string, string | number>) => {
  const data = new FormData();
  for (const [k, v] of Object.entries(fields)) data.set(k, String(v));
  return data;
};

/**
 * The builder's mentors: who they are, who has been invited, and a form to invite someone by e-mail. The
 * page renders the lists; each action renders them again.
 */
export function MentorManager({ projectId, overview: data }: { projectId: number; overview: MentorsOverview }) {
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const [, startResend] = useTransition();
  const formRef = useRef<HTMLFormElement>(null);

  const { register, handleSubmit, formState, setError, reset } = useForm<InvitationFormValues, unknown, InvitationInput>({
    resolver: zodResolver(invitationInputSchema),
    defaultValues: { email: '', note: '' },
  });
  const { errors } = formState;

  const [, dispatchInvite, isSubmitting] = useActionState<ActionState<InvitationView>, FormData>(async (prev, form) => {
    setMessage(null);
    const result = await inviteMentorAction(prev, form);
    applyActionErrors(result, setError);
    if (!result.ok) {
      if (!result.fieldErrors) setMessage({ kind: 'error', text: result.message ?? 'Not sent.' });
      return result;
    }
    reset({ email: '', note: '' });
    setMessage({ kind: 'success', text: `Invitation sent to ${result.data!.email}. The link works once, for ${INVITATION_LIFETIME_DAYS} days.` });
    return result;
  }, IDLE);
  const invite = handleSubmit(() => dispatchForm(formRef.current!, dispatchInvite));

  function resend(inv: InvitationView) {
    setMessage(null);
    startResend(async () => {
      const result = await inviteMentorAction(IDLE, formOf({ projectId, email: inv.email }));
      setMessage(result.ok ? { kind: 'success', text: `A new invitation went to ${inv.email}; the earlier link no longer works.` } : { kind: 'error', text: result.message ?? 'Not sent.' });
    });
  }

  async function revoke(inv: InvitationView): Promise<string | null> {
    const result = await revokeInvitationAction(IDLE, formOf({ invitationId: inv.id }));
    if (!result.ok) return result.message ?? 'Not withdrawn.';
    setMessage({ kind: 'success', text: `The invitation to ${inv.email} was withdrawn; its link no longer works.` });
    return null;
  }

  async function remove(mentor: MentorsOverview['mentors'][number]): Promise<string | null> {
    const result = await removeMentorAction(IDLE, formOf({ projectId, userId: mentor.id }));
    if (!result.ok && result.status !== 404) return result.message ?? 'Not removed.';
    setMessage({ kind: 'success', text: `${mentor.name} is no longer a mentor of this project. The flags they raised stay in the log.` });
    return null;
  }

  return (
    <div className="space-y-5" data-testid="mentor-manager">
      <p className="text-sm text-graphite-2">
        A mentor is an experienced machinist you trust to look over your work. They see this project even while it is private, and can flag an
        entry, a moment of a clip or a measurement as a risk. You mark each flag as seen and answer it.
      </p>
      {message ? (
        <Notice kind={message.kind} role={message.kind === 'error' ? 'alert' : 'status'}>
          {message.text}
        </Notice>
      ) : null}

      <div className="space-y-2">
        <h3 className="font-semibold">Current mentors</h3>
        {data.mentors.length ? (
          <ul className="divide-y divide-rule rounded-md border border-rule" aria-label="Mentors of this project">
            {data.mentors.map((m) => (
              <li key={m.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
                <span className="min-w-0">
                  <span className="block font-semibold">{m.name}</span>
                  <span className="block break-all text-xs text-graphite-2">
                    {m.email} · mentor since {formatDate(m.since)}
                  </span>
                </span>
                <ConfirmDialog
                  small
                  trigger="Remove"
                  triggerLabel={`Remove ${m.name} as a mentor`}
                  title={`Remove ${m.name} as a mentor?`}
                  body="They will no longer see this project while it is private, nor raise new flags. The flags they raised stay in the log."
                  confirmLabel="Remove mentor"
                  onConfirm={() => remove(m)}
                />
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-graphite-2">No mentors yet.</p>
        )}
      </div>

      {data.invitations.length ? (
        <div className="space-y-2">
          <h3 className="font-semibold">Invitations waiting</h3>
          <ul className="divide-y divide-rule rounded-md border border-rule" aria-label="Invitations not yet accepted">
            {data.invitations.map((inv) => (
              <li key={inv.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2" data-invitation={inv.email}>
                <span className="min-w-0">
                  <span className="block break-all font-semibold">{inv.email}</span>
                  <span className="block text-xs text-graphite-2">
                    {inv.state === 'expired' ? (
                      <>
                        <span aria-hidden="true">⌛ </span>Expired {formatDateTime(inv.expiresAt)}
                      </>
                    ) : (
                      <>
                        <span aria-hidden="true">✉ </span>Waiting · sent {formatDateTime(inv.createdAt)} · works until {formatDateTime(inv.expiresAt)}
                      </>
                    )}
                  </span>
                </span>
                <span className="flex flex-wrap gap-2">
                  <Button type="button" tone="quiet" className="!min-h-10 !px-3" onClick={() => void resend(inv)} aria-label={`Send a new invitation to ${inv.email}`}>
                    Send again
                  </Button>
                  {inv.state === 'pending' ? (
                    <ConfirmDialog
                      small
                      trigger="Withdraw"
                      triggerLabel={`Withdraw the invitation to ${inv.email}`}
                      title="Withdraw this invitation?"
                      body={`The link sent to ${inv.email} will stop working.`}
                      confirmLabel="Withdraw invitation"
                      onConfirm={() => revoke(inv)}
                    />
                  ) : null}
                </span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      <form ref={formRef} onSubmit={invite} noValidate className="space-y-3 rounded-md border border-dashed border-rule p-4" aria-label="Invite a mentor">
        <h3 className="font-semibold">Invite a mentor</h3>
        <input type="hidden" name="projectId" value={projectId} />
        <Field id="invite-email" label="Their e-mail address" hint="They accept by signing in with exactly this address." error={errors.email?.message}>
          <input id="invite-email" type="email" autoComplete="off" className={inputClass} aria-invalid={!!errors.email} aria-describedby={describedBy('invite-email', errors.email?.message, 'hint')} {...register('email')} />
        </Field>
        <Field id="invite-note" label="A few words (optional)" hint={`Put in the e-mail, up to ${INVITATION_NOTE_MAX} characters.`} error={errors.note?.message}>
          <textarea id="invite-note" rows={2} maxLength={INVITATION_NOTE_MAX} className={inputClass} aria-invalid={!!errors.note} aria-describedby={describedBy('invite-note', errors.note?.message, 'hint')} {...register('note')} />
        </Field>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Sending…' : 'Send invitation'}
        </Button>
      </form>
    </div>
  );
}
