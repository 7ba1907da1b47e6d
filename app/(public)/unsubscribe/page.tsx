import type { Metadata } from 'next';
import Link from 'next/link';
import { describeUnsubscribe } from '@/lib/server/follows';
import { AppError } from '@/lib/errors';
import { Notice } from '@/components/ui/notice';
import { Button, ButtonLink } from '@/components/ui/button';
import type { UnsubscribeTarget } from '@/lib/types/following';

// Rendered for each request (it reads the viewer's session); see DEVELOPERS.md "Reading a page".
export const instant = false;

export const metadata: Metadata = { title: 'Stop follow e-mail', robots: { index: false } };

type Props = { searchParams: Promise<{ token?: string | string[]; done?: string }> };

function what(t: UnsubscribeTarget): string {
  return t.kind === 'project' ? `new sessions in “${t.name}”` : `new sessions by ${t.name}`;
}

// Opening the link changes nothing (mail scanners open links); the button below does, by POST.
export default async function UnsubscribePage({ searchParams }: Props) {
  const query = await searchParams;
  const token = typeof query.token === 'string' ? query.token : '';
  let target: UnsubscribeTarget;
  try {
    target = await describeUnsubscribe(token);
  } catch (err) {
    const known = err instanceof AppError || (err as { name?: string })?.name === 'ZodError';
    if (!known) throw err;
    const gone = err instanceof AppError && err.code === 'not_found';
    return (
      <div className="mx-auto max-w-xl space-y-4 py-6">
        <p className="dim text-4xl font-bold text-scribe">{gone ? '404' : '400'}</p>
        <h1 className="text-2xl font-bold">{gone ? 'Nothing to switch off' : 'This link does not work'}</h1>
        <Notice kind="error" title={gone ? 'Not followed any more' : 'Not a valid unsubscribe link'}>
          {gone
            ? 'You no longer follow this, so it sends you no e-mail.'
            : 'The link may have been cut short or changed on its way. Use the link from the e-mail exactly as it is, or switch e-mail off in your settings.'}
        </Notice>
        <div className="flex flex-wrap gap-2">
          <ButtonLink href="/settings">Open your settings</ButtonLink>
          <ButtonLink href="/" tone="quiet">
            Back to the logs
          </ButtonLink>
        </div>
      </div>
    );
  }

  if (query.done && !target.mail) {
    return (
      <div className="mx-auto max-w-xl space-y-4 py-6">
        <h1 className="text-2xl font-bold">E-mail switched off</h1>
        <Notice kind="success" role="status" title="Done">
          You will no longer get e-mail about {what(target)}. You still follow it; unfollow or switch e-mail back on in your settings.
        </Notice>
        {target.alsoMailing ? (
          <Notice kind="info" title="You may still hear of these sessions">
            E-mail is still on because {target.alsoMailing}. Switch that off in your settings if you want no e-mail at all.
          </Notice>
        ) : null}
        <ButtonLink href="/settings">Open your settings</ButtonLink>
      </div>
    );
  }

  return (
    <div className="mx-auto max-w-xl space-y-4 py-6">
      <h1 className="text-2xl font-bold">Stop follow e-mail?</h1>
      {target.mail ? (
        <>
          <p>
            This switches off the e-mail you get about <strong>{what(target)}</strong>. You keep following; nothing else changes.
          </p>
          {target.alsoMailing ? (
            <p className="text-sm text-graphite-2">Note: {target.alsoMailing} with e-mail on, which can still tell you of the same sessions.</p>
          ) : null}
          <form method="post" action="/api/unsubscribe" className="flex flex-wrap gap-2">
            <input type="hidden" name="token" value={token} />
            <Button type="submit">
              <span aria-hidden="true">✉</span> Switch this e-mail off
            </Button>
            <ButtonLink href="/" tone="quiet">
              Keep it on
            </ButtonLink>
          </form>
        </>
      ) : (
        <Notice kind="info" title="Already off">
          E-mail about {what(target)} is already switched off.
        </Notice>
      )}
      <p className="text-sm">
        Manage everything you follow in <Link href="/settings">your settings</Link>.
      </p>
    </div>
  );
}
