import type { Metadata } from 'next';
import type { ReactNode } from 'react';
import Link from 'next/link';
import { getCurrentUser } from '@/lib/auth/current-user';
import { checkInvitation, formatExpiry } from '@/lib/server/invitations';
import { AcceptInvitationButton, SwitchAccountButton } from '@/components/mentors/accept-invitation';
import { ButtonLink } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SAFETY_LINE } from '@/lib/mail/templates';

// Rendered for each request (it reads the viewer's session); see DEVELOPERS.md "Reading a page".
export const instant = false;

export const metadata: Metadata = { title: 'Mentor invitation', robots: { index: false } };

type Props = { searchParams: Promise<{ token?: string | string[] }> };

export default async function AcceptInvitationPage({ searchParams }: Props) {
  const raw = (await searchParams).token;
  const token = typeof raw === 'string' ? raw : '';
  const user = await getCurrentUser();
  const check = await checkInvitation(user, token);
  const here = `/invitations/accept?token=${encodeURIComponent(token)}`;

  if (check.reason === 'invalid') {
    return (
      <Frame>
        <h1 className="text-2xl font-bold">This invitation link does not work</h1>
        <Notice kind="error" title="Not a valid invitation">
          The link may be cut short or changed. Open it again from the e-mail, copying the whole link, or ask the builder to send a new one.
        </Notice>
      </Frame>
    );
  }

  const { project, builderName, maskedEmail } = check;
  const expires = formatExpiry(new Date(check.expiresAt));
  const heading = (
    <header className="space-y-1">
      <p className="text-sm font-semibold uppercase tracking-wide text-graphite-2">Mentor invitation</p>
      <h1 className="text-2xl font-bold">{project.title}</h1>
      <p className="text-sm text-graphite-2">
        {builderName} asks you to mentor this build. The invitation is for <strong className="text-graphite">{maskedEmail}</strong>.
      </p>
    </header>
  );

  return (
    <Frame>
      {heading}
      {check.reason === 'accepted' ? (
        <Notice kind="info" title="This invitation was already used">
          Each invitation link works once. If you accepted it, you mentor this project already: <Link href={`/logs/${project.slug}`}>open the project</Link>.
          Otherwise ask {builderName} for a new one.
        </Notice>
      ) : check.reason === 'revoked' ? (
        <Notice kind="error" title="The builder withdrew this invitation">
          Ask {builderName} for a new one if you should mentor this project.
        </Notice>
      ) : check.reason === 'expired' ? (
        <Notice kind="error" title="This invitation has expired">
          It expired on {expires}; ask {builderName} for a new one.
        </Notice>
      ) : check.reason === 'signed-out' ? (
        <div className="space-y-3">
          <p>
            Sign in with <strong>{maskedEmail}</strong> to accept. No account yet? Create one with that address, then come back to this link.
          </p>
          <div className="flex flex-wrap gap-2">
            <ButtonLink href={`/sign-in?next=${encodeURIComponent(here)}`}>Sign in to accept</ButtonLink>
            <ButtonLink href={`/sign-up?next=${encodeURIComponent(here)}`} tone="quiet">
              Create an account
            </ButtonLink>
          </div>
          <p className="text-xs text-graphite-2">The link works until {expires}.</p>
        </div>
      ) : check.reason === 'wrong-account' ? (
        <div className="space-y-3">
          <Notice kind="error" role="alert" title="Signed in with another address">
            This invitation is for <strong>{maskedEmail}</strong>, and you are signed in as <strong>{user?.email}</strong>. Only the invited address
            can accept it: sign out, then sign in with {maskedEmail}.
          </Notice>
          <SwitchAccountButton returnTo={here} />
        </div>
      ) : check.reason === 'builder' ? (
        <Notice kind="error" title="This is your own project">
          The builder cannot mentor their own project. Send this invitation to the person you meant to ask.
        </Notice>
      ) : (
        <div className="space-y-4">
          {check.reason === 'already-mentor' ? (
            <Notice kind="info" title="You already mentor this project">
              Accepting again changes nothing but uses up this link.
            </Notice>
          ) : null}
          {project.summary ? <p className="line-clamp-4 whitespace-pre-line text-graphite-2">{project.summary}</p> : null}
          <div className="rounded-md border border-rule bg-paper-2/50 p-4 text-sm">
            <p className="font-semibold">As a mentor you can</p>
            <ul className="mt-1 list-disc space-y-1 pl-5">
              <li>read the whole log, even while it is private;</li>
              <li>flag an entry, a moment of a clip or a measurement as a risk, saying what to do instead;</li>
              <li>see {builderName}’s answer, and get an e-mail when a flag is answered.</li>
            </ul>
          </div>
          <AcceptInvitationButton token={token} projectTitle={project.title} />
          <p className="text-xs text-graphite-2">The link works once, until {expires}.</p>
        </div>
      )}
      <p className="border-t border-rule pt-3 text-xs text-graphite-2">
        <span aria-hidden="true">⚠ </span>
        {SAFETY_LINE}
      </p>
    </Frame>
  );
}

function Frame({ children }: { children: ReactNode }) {
  return <div className="mx-auto max-w-xl space-y-4 rounded-xl border border-rule bg-card p-5 sm:p-6">{children}</div>;
}
