'use client';
import { useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

type Plan = { filename: string; counts: { sessions: number; entries: number; media: number }; mediaBytes: number };
type State =
  | { kind: 'idle' }
  | { kind: 'checking' }
  | { kind: 'receiving'; plan: Plan; received: number }
  | { kind: 'done'; plan: Plan; bytes: number }
  | { kind: 'stopped' }
  | { kind: 'error'; message: string };

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(bytes < 10 * 1024 * 1024 ? 1 : 0)} MB`;
const holds = (p: Plan) => `${p.counts.sessions} sessions, ${p.counts.entries} entries, ${p.counts.media} photos and clips`;

/** Hands a finished file to the browser's own download (Chromium keeps a large blob on disk, not in memory). */
function saveFile(blob: Blob, filename: string) {
  const href = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = href;
  link.download = filename;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(href), 60_000);
}

/**
 * "Download archive": asks what the archive will hold first (so a refusal is shown here, not as a failed
 * download), then reads the streamed zip itself, showing how much has arrived against the media it carries,
 * and saves it when it is complete. A failure midway is said here; nothing partial is saved.
 */
export function DownloadArchive({ projectId }: { projectId: number }) {
  const [state, setState] = useState<State>({ kind: 'idle' });
  const abort = useRef<AbortController | null>(null);
  const url = `/api/projects/${projectId}/archive`;
  const busy = state.kind === 'checking' || state.kind === 'receiving';

  async function start() {
    const controller = new AbortController();
    abort.current = controller;
    setState({ kind: 'checking' });
    try {
      const res = await fetch(`${url}?plan=1`, { cache: 'no-store', signal: controller.signal });
      const body = await res.json().catch(() => ({}));
      if (!res.ok) throw new Error(body.message ?? `The archive could not be prepared (${res.status}).`);
      const plan = body as Plan;
      setState({ kind: 'receiving', plan, received: 0 });
      const zip = await fetch(url, { cache: 'no-store', signal: controller.signal });
      if (!zip.ok || !zip.body) {
        const refusal = await zip.json().catch(() => ({}));
        throw new Error(refusal.message ?? `The archive could not be prepared (${zip.status}).`);
      }
      const parts: Uint8Array[] = [];
      let received = 0;
      let shown = 0;
      const reader = zip.body.getReader();
      for (;;) {
        const { done, value } = await reader.read();
        if (done) break;
        parts.push(value);
        received += value.length;
        // A re-render per 256 kB is enough for the bar.
        if (received - shown > 256 * 1024) {
          shown = received;
          setState({ kind: 'receiving', plan, received });
        }
      }
      saveFile(new Blob(parts as BlobPart[], { type: 'application/zip' }), plan.filename);
      setState({ kind: 'done', plan, bytes: received });
    } catch (err) {
      if (controller.signal.aborted) return setState({ kind: 'stopped' });
      const message = err instanceof TypeError ? 'The download was cut off before the archive was complete: check your connection and try again.' : err instanceof Error ? err.message : 'The archive could not be prepared.';
      setState({ kind: 'error', message });
    } finally {
      abort.current = null;
    }
  }

  // Media are stored as they are and make up most of an archive; the pages and data are small beside them.
  const expected = state.kind === 'receiving' ? Math.max(state.plan.mediaBytes, 1) : 0;

  return (
    <div className="space-y-3" data-testid="download-archive">
      <p className="text-sm text-graphite-2">
        One zip with the whole project: pages that read offline (photos, clips and their notes), each entry as Markdown, every clip&rsquo;s notes as WebVTT,
        the measurement records and readings as CSV, saved calculations as JSON. Bring it back from &ldquo;Bring in an archive&rdquo; on your projects page.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button type="button" onClick={start} disabled={busy} aria-describedby="archive-status">
          {busy ? 'Preparing the archive…' : 'Download archive'}
        </Button>
        {busy ? (
          <Button type="button" tone="quiet" onClick={() => abort.current?.abort()}>
            Stop
          </Button>
        ) : null}
      </div>
      <div id="archive-status" aria-live="polite" className="space-y-2">
        {state.kind === 'checking' ? <p className="text-sm">Counting what the archive will hold…</p> : null}
        {state.kind === 'receiving' ? (
          <div className="space-y-1 text-sm" role="status">
            <p>
              Preparing the archive: {holds(state.plan)}. {mb(state.received)} received
              {state.plan.mediaBytes ? <> of about {mb(state.plan.mediaBytes)}</> : null}.
            </p>
            <progress className="h-3 w-full" max={expected} value={Math.min(state.received, expected)} aria-label="Archive received" />
          </div>
        ) : null}
        {state.kind === 'done' ? (
          <Notice kind="success" role="status" title="Archive ready">
            Saved as {state.plan.filename} ({mb(state.bytes)}): {holds(state.plan)}. Keep it with your other files; it reads offline from its index.html.
          </Notice>
        ) : null}
        {state.kind === 'stopped' ? <p className="text-sm">Stopped: nothing was saved.</p> : null}
        {state.kind === 'error' ? <Notice kind="error" title="No archive" role="alert">{state.message} Nothing was saved.</Notice> : null}
      </div>
    </div>
  );
}
