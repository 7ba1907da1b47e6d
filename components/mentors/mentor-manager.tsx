'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { format } from 'date-fns';
import { applyServerErrors, getJson, sendJson } from '@/lib/client/api-client';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { INVITATION_LIFETIME_DAYS, INVITATION_NOTE_MAX, invitationInputSchema, type InvitationFormValues, type InvitationInput } from '@/lib/validations/invitations';
import type { InvitationView, MentorsOverview } from '@/lib/types/flags';

const when = (iso: string) => format(new Date(iso), 'd MMM yyyy, HH:mm');

/** The builder's mentors: who they are, who has been invited, and a form to invite someone by e-mail. */
export function MentorManager({ projectId, initial }: { projectId: number; initial: MentorsOverview }) {
  const queryClient = useQueryClient();
  const queryKey = ['mentors', projectId];
  const { data = initial } = useQuery({
    queryKey,
    queryFn: () => getJson<MentorsOverview>(`/api/projects/${projectId}/invitations`),
    initialData: initial,
  });
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const refresh = () => queryClient.invalidateQueries({ queryKey });

  const { register, handleSubmit, formState, setError, reset } = useForm<InvitationFormValues, unknown, InvitationInput>({
    resolver: zodResolver(invitationInputSchema),
    defaultValues: { email: '', note: '' },
  });
  const { errors, isSubmitting } = formState;

  const invite = handleSubmit(async (values) => {
    setMessage(null);
    const res = await sendJson<{ invitation: InvitationView }>(`/api/projects/${projectId}/invitations`, 'POST', values);
    if (!res.ok) {
      applyServerErrors(res.error, setError);
      if (!res.error.fieldErrors) setMessage({ kind: 'error', text: res.error.message });
      return;
    }
    reset({ email: '', note: '' });
    setMessage({ kind: 'success', text: `Invitation sent to ${res.data.invitation.email}. The link works once, for ${INVITATION_LIFETIME_DAYS} days.` });
    await refresh();
  });

  async function resend(inv: InvitationView) {
    setMessage(null);
    const res = await sendJson<{ invitation: InvitationView }>(`/api/projects/${projectId}/invitations`, 'POST', { email: inv.email });
    setMessage(res.ok ? { kind: 'success', text: `A new invitation went to ${inv.email}; the earlier link no longer works.` } : { kind: 'error', text: res.error.message });
    await refresh();
  }

  async function revoke(inv: InvitationView): Promise<string | null> {
    const res = await sendJson(`/api/invitations/${inv.id}`, 'DELETE');
    if (!res.ok) return res.error.message;
    setMessage({ kind: 'success', text: `The invitation to ${inv.email} was withdrawn; its link no longer works.` });
    await refresh();
    return null;
  }

  async function remove(mentor: MentorsOverview['mentors'][number]): Promise<string | null> {
    const res = await sendJson(`/api/projects/${projectId}/mentors/${mentor.id}`, 'DELETE');
    if (!res.ok && res.error.status !== 404) return res.error.message;
    setMessage({ kind: 'success', text: `${mentor.name} is no longer a mentor of this project. The flags they raised stay in the log.` });
    await refresh();
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
                    {m.email} · mentor since {format(new Date(m.since), 'd MMM yyyy')}
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
                        <span aria-hidden="true">⌛ </span>Expired {when(inv.expiresAt)}
                      </>
                    ) : (
                      <>
                        <span aria-hidden="true">✉ </span>Waiting · sent {when(inv.createdAt)} · works until {when(inv.expiresAt)}
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

      <form onSubmit={invite} noValidate className="space-y-3 rounded-md border border-dashed border-rule p-4" aria-label="Invite a mentor">
        <h3 className="font-semibold">Invite a mentor</h3>
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
