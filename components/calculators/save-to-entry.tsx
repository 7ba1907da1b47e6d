'use client';

import Link from 'next/link';
import dynamic from 'next/dynamic';
import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { useSharedCopyViewer } from '@/components/layout/shared-copy-viewer';
import type { CalcRequest } from '@/lib/calculators/pages/url-state';

export type SaveCandidate = {
  /** What the choice says: "The counterbore, with its through hole". */
  title: string;
  request: CalcRequest;
  /** The label the server would give it; shown as the placeholder. */
  defaultLabel: string;
};

type Props = {
  candidates: SaveCandidate[];
  /** This calculator page with its query, for signing in and coming back. */
  returnTo: string;
};

const SavePanel = dynamic(() => import('./save-panel').then((m) => m.SavePanel), {
  loading: () => (
    <p role="status" className="rounded-lg border border-rule bg-card p-4 text-sm text-graphite-2">
      Loading your projects…
    </p>
  ),
});

/**
 * Saves the result shown into one of the builder's entries (project → session → entry). The server
 * recomputes the output from the input, so only the calculator and its input are sent. The page is the
 * same for everyone (prerendered), so it is built for a signed-out visitor and the browser, once it knows
 * a member is signed in, shows them the button.
 */
export function SaveToEntry({ candidates, returnTo }: Props) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const viewer = useSharedCopyViewer();

  if (!viewer) {
    return (
      <p className="min-h-11 text-sm" data-testid="save-sign-in">
        <Link href={`/sign-in?next=${encodeURIComponent(returnTo)}`} className="font-semibold">
          Sign in to save this into your log
        </Link>{' '}
        <span className="text-graphite-2">— it stays with the entry it was worked out for.</span>
      </p>
    );
  }

  return (
    <div className="min-h-11 space-y-3">
      <Button type="button" tone="quiet" aria-expanded={open} aria-controls={panelId} onClick={() => setOpen((o) => !o)} disabled={!candidates.length}>
        <span aria-hidden="true">⤓</span> Save to an entry
      </Button>
      {!candidates.length ? <p className="text-xs text-graphite-2">Nothing to save until the result is worked out.</p> : null}
      {open && candidates.length ? <SavePanel id={panelId} candidates={candidates} /> : null}
    </div>
  );
}
