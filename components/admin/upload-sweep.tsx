'use client';

import { useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { sendJson } from '@/lib/client/api-client';
import { formatTimeOfDay, plural } from '@/lib/format';

type Result = { checked: number; deleted: string[] };

/** Runs the upload clean-up (files no photo or clip points to, older than an hour) and says what it did. */
export function UploadSweep() {
  const [busy, setBusy] = useState(false);
  const [done, setDone] = useState<(Result & { at: Date }) | null>(null);
  const [error, setError] = useState<string | null>(null);
  // One sweep at a time from this page, however fast the button is pressed.
  const running = useRef(false);

  async function sweep() {
    if (running.current) return;
    running.current = true;
    setBusy(true);
    setError(null);
    const res = await sendJson<Result>('/api/admin/uploads/sweep', 'POST', {});
    running.current = false;
    setBusy(false);
    if (!res.ok) {
      setError(res.error.message);
      return;
    }
    setDone({ ...res.data, at: new Date() });
  }

  return (
    <div className="space-y-3">
      <Button type="button" onClick={sweep} disabled={busy}>
        {busy ? 'Cleaning up…' : 'Clean up stored files now'}
      </Button>
      {error ? (
        <Notice kind="error" role="alert" title="Not cleaned up">
          {error}
        </Notice>
      ) : null}
      {done ? (
        <Notice kind="success" role="status" title={`Cleaned up at ${formatTimeOfDay(done.at)}`}>
          <p data-testid="sweep-result">
            Checked {plural(done.checked, 'stored file')};{' '}
            {done.deleted.length ? `removed ${plural(done.deleted.length, 'file')} that no photo or clip used.` : 'every one is in use or too recent, so nothing was removed.'}
          </p>
          {done.deleted.length ? (
            <details className="mt-1">
              <summary className="cursor-pointer">Removed file keys</summary>
              <ul className="mt-1 break-all font-mono text-xs">
                {done.deleted.map((k) => (
                  <li key={k}>{k}</li>
                ))}
              </ul>
            </details>
          ) : null}
        </Notice>
      ) : null}
    </div>
  );
}
