'use client';

import { useEffect, useState, useTransition } from 'react';
import Link from 'next/link';
import { followAction, unfollowAction } from '@/lib/actions/following';
import { IDLE } from '@/components/forms/action-state';
import { Button, ButtonLink } from '@/components/ui/button';
import { plural } from '@/lib/format';
import type { FollowState } from '@/lib/types/following';
import { getJson } from '@/lib/client/api-client';
import { loadViewer, viewerCopyCookie } from '@/components/layout/shared-copy-viewer';

/** What is followed: a project by its id, or a builder by their handle. */
type Target = { projectId: number } | { handle: string };

type Props = {
  target: Target;
  /** What is followed, as the button says it: "this project", "Edda Renwick". */
  what: string;
  initial: FollowState;
  signedIn: boolean;
  /** From the policy: false for your own project or profile. */
  canFollow: boolean;
  /** Where sign-in should come back to. */
  returnTo: string;
  /**
   * The page is the copy cached for everyone (built signed out): a signed-in member's browser asks for
   * their own follow state and whether they may follow.
   */
  shared?: boolean;
};

/** Follow or unfollow a project or a builder; signed out, a link to sign in and come back. */
export function FollowButton({ target, what, initial, signedIn: builtSignedIn, canFollow: builtCanFollow, returnTo, shared = false }: Props) {
  const [state, setState] = useState(initial);
  const [{ signedIn, canFollow }, setViewer] = useState({ signedIn: builtSignedIn, canFollow: builtCanFollow });
  const projectId = 'projectId' in target ? target.projectId : null;
  const handle = 'handle' in target ? target.handle : null;
  useEffect(() => {
    if (!shared || !viewerCopyCookie()) return;
    let live = true;
    const url = projectId !== null ? `/api/projects/${projectId}/follow` : `/api/builders/${encodeURIComponent(handle ?? '')}/follow`;
    void Promise.all([loadViewer(), getJson<{ follow: FollowState }>(url).catch(() => null)]).then(([viewer, mine]) => {
      if (!live || !viewer || !mine) return;
      setState(mine.follow);
      // Following needs a verified address; a builder cannot follow themselves (their own project is
      // never a shared copy for them: they get their own).
      setViewer({ signedIn: true, canFollow: viewer.verified && (handle === null || handle !== viewer.handle) });
    });
    return () => {
      live = false;
    };
  }, [shared, projectId, handle]);
  const [busy, startBusy] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const count = <span className="text-sm text-graphite-2">{plural(state.followers, 'follower')}</span>;

  if (!signedIn) {
    return (
      <div className="flex flex-wrap items-center gap-3" data-testid="follow">
        <ButtonLink href={`/sign-in?next=${encodeURIComponent(returnTo)}`} tone="quiet">
          <span aria-hidden="true">☆</span> Sign in to follow {what}
        </ButtonLink>
        {count}
      </div>
    );
  }
  if (!canFollow) return <div data-testid="follow">{count}</div>;

  function toggle() {
    setError(null);
    const data = new FormData();
    if ('projectId' in target) data.set('projectId', String(target.projectId));
    else data.set('handle', target.handle);
    startBusy(async () => {
      // The action answers with the state after the change: the count includes everyone else's follows too.
      const result = await (state.following ? unfollowAction : followAction)(IDLE, data);
      if (!result.ok || !result.data) return setError(result.message ?? 'Not changed.');
      setState(result.data);
    });
  }

  return (
    <div className="space-y-1" data-testid="follow">
      <div className="flex flex-wrap items-center gap-3">
        {state.following ? (
          <>
            <span className="inline-flex min-h-11 items-center gap-1 rounded-md border border-ok/60 bg-ok-soft px-3 text-sm font-semibold text-ok" role="status">
              <span aria-hidden="true">✓</span> Following {what}
            </span>
            <Button type="button" tone="quiet" onClick={toggle} disabled={busy}>
              {busy ? 'Unfollowing…' : 'Unfollow'}
            </Button>
          </>
        ) : (
          <Button type="button" onClick={toggle} disabled={busy}>
            <span aria-hidden="true">☆</span> {busy ? 'Following…' : `Follow ${what}`}
          </Button>
        )}
        {count}
      </div>
      {state.following ? (
        <p className="text-xs text-graphite-2">
          E-mail when a session is published: <strong>{state.mail ? 'on' : 'off'}</strong> ·{' '}
          <Link href="/settings">change in your settings</Link>
        </p>
      ) : null}
      {error ? (
        <p className="text-sm font-medium text-bad" role="alert">
          <span aria-hidden="true">✕</span> {error}
        </p>
      ) : null}
    </div>
  );
}
