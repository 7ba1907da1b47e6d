'use client';

import { useState } from 'react';
import { getJson } from '@/lib/client/api-client';
import type { SessionView } from '@/lib/types/log';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SessionTimeline } from './session-timeline';

type Page = { sessions: SessionView[]; nextCursor: string | null; openFlags: Record<number, number> };

/**
 * The sessions after the first page of a project's timeline: the page renders the first page on the server
 * and hands over its `nextCursor`; "Show more sessions" reads the next page (GET /api/projects/[id]/sessions,
 * keyset-paged) and adds it below, numbered on from `shown`.
 */
export function MoreSessions({
  projectId,
  projectSlug,
  nextCursor,
  shown,
  showVisibility = false,
}: {
  projectId: number;
  projectSlug: string;
  /** The first page's `nextCursor`; nothing is shown when it is null. */
  nextCursor: string | null;
  /** How many sessions the page above already shows. */
  shown: number;
  showVisibility?: boolean;
}) {
  const [pages, setPages] = useState<Page[]>([]);
  const [cursor, setCursor] = useState(nextCursor);
  const [loading, setLoading] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function loadMore() {
    if (!cursor) return;
    setLoading(true);
    setError(null);
    try {
      const page = await getJson<Page>(`/api/projects/${projectId}/sessions?after=${encodeURIComponent(cursor)}`);
      setPages((old) => [...old, page]);
      setCursor(page.nextCursor);
    } catch (err) {
      setError(err instanceof Error ? err.message : 'The sessions could not be loaded.');
    } finally {
      setLoading(false);
    }
  }

  // Each page is numbered on from the sessions shown before it.
  const firsts = pages.map((_, i) => shown + 1 + pages.slice(0, i).reduce((n, p) => n + p.sessions.length, 0));
  return (
    <div className="space-y-6">
      {pages.map((p, i) => (
        <SessionTimeline key={i} projectSlug={projectSlug} sessions={p.sessions} openFlags={p.openFlags} firstNumber={firsts[i]} showVisibility={showVisibility} />
      ))}
      {error ? (
        <div role="alert">
          <Notice kind="error" title="Could not load more sessions">
            {error}
          </Notice>
        </div>
      ) : null}
      {cursor ? (
        <div className="flex justify-center">
          <Button type="button" tone="quiet" onClick={loadMore} disabled={loading}>
            {loading ? 'Loading more sessions…' : 'Show more sessions'}
          </Button>
        </div>
      ) : null}
    </div>
  );
}
