'use client';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

type Plan = { filename: string; counts: { sessions: number; entries: number; media: number }; mediaBytes: number };

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(bytes < 10 * 1024 * 1024 ? 1 : 0)} MB`;

/**
 * "Download archive": asks what the archive will hold first (so a refusal is shown here, not as a failed
 * download), then hands the streamed zip to the browser, whose own download shows its progress.
 */
export function DownloadArchive({ projectId }: { projectId: number }) {
  const [state, setState] = useState<{ kind: 'idle' } | { kind: 'checking' } | { kind: 'started'; plan: Plan } | { kind: 'error'; message: string }>({ kind: 'idle' });
  const url = `/api/projects/${projectId}/archive`;

  async function start() {
    setState({ kind: 'checking' });
    try {
      const res = await fetch(`${url}?plan=1`, { cache: 'no-store' });
      const body = await res.json().catch(() => ({}));
      if (!res.ok) throw new Error(body.message ?? `The archive could not be prepared (${res.status}).`);
      setState({ kind: 'started', plan: body as Plan });
      const link = document.createElement('a');
      link.href = url;
      link.download = (body as Plan).filename;
      document.body.append(link);
      link.click();
      link.remove();
    } catch (err) {
      setState({ kind: 'error', message: err instanceof Error ? err.message : 'The archive could not be prepared.' });
    }
  }

  return (
    <div className="space-y-3" data-testid="download-archive">
      <p className="text-sm text-graphite-2">
        One zip with the whole project: pages that read offline (photos, clips and their notes), each entry as Markdown, every clip&rsquo;s notes as WebVTT,
        the measurement records and readings as CSV, saved calculations as JSON. Bring it back from &ldquo;Bring in an archive&rdquo; on your projects page.
      </p>
      <Button type="button" onClick={start} disabled={state.kind === 'checking'} aria-describedby="archive-status">
        {state.kind === 'checking' ? 'Preparing the archive…' : 'Download archive'}
      </Button>
      <div id="archive-status" aria-live="polite">
        {state.kind === 'started' ? (
          <Notice kind="info" title="Download started">
            {state.plan.counts.sessions} sessions, {state.plan.counts.entries} entries, {state.plan.counts.media} photos and clips (about {mb(state.plan.mediaBytes)} of media).
            Your browser shows the download&rsquo;s progress.
          </Notice>
        ) : null}
        {state.kind === 'error' ? <Notice kind="error" title="No archive" role="alert">{state.message}</Notice> : null}
      </div>
    </div>
  );
}
