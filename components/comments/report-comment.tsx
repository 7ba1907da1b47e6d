'use client';

import { useId, useRef, useState } from 'react';
import { sendJson } from '@/lib/client/api-client';
import { Button } from '@/components/ui/button';
import { inputClass } from '@/components/ui/field';
import { countChars } from '@/lib/validations/comments';
import { REPORT_REASON_MAX } from '@/lib/validations/moderation';

/** A member tells the admins about a comment, with a reason; the admins hide it or dismiss the report. */
export function ReportCommentForm({ commentId, who, onClose }: { commentId: number; who: string; onClose: () => void }) {
  const id = useId();
  const [reason, setReason] = useState('');
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const inFlight = useRef(false);

  async function send() {
    if (inFlight.current) return;
    inFlight.current = true;
    setBusy(true);
    setProblem(null);
    const res = await sendJson<{ reported: true; alreadyReported: boolean }>(`/api/comments/${commentId}/report`, 'POST', { reason });
    inFlight.current = false;
    setBusy(false);
    if (!res.ok) return setProblem(res.error.fieldErrors?.reason?.[0] ?? res.error.message);
    setDone(res.data.alreadyReported ? 'You had already reported this comment; the admins have it.' : 'Reported to the admins. Thank you: they will hide it or leave it be.');
  }

  if (done) {
    return (
      <p role="status" className="rounded-md border border-ok/50 bg-ok-soft px-3 py-2 text-sm text-ok">
        <span aria-hidden="true">✓ </span>
        {done}
      </p>
    );
  }

  return (
    <form
      aria-label={`Report the comment by ${who}`}
      className="space-y-2 rounded-md border border-rule bg-paper-2 px-3 py-3"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void send();
      }}
    >
      <label htmlFor={`${id}-reason`} className="block text-sm font-semibold">
        Why report it? Only the admins see this
      </label>
      <textarea
        id={`${id}-reason`}
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        rows={2}
        autoFocus
        maxLength={REPORT_REASON_MAX}
        className={`${inputClass} resize-y`}
        aria-invalid={!!problem}
        aria-describedby={`${id}-reason-hint${problem ? ` ${id}-reason-error` : ''}`}
      />
      <p id={`${id}-reason-hint`} className="dim text-xs text-graphite-2">
        {countChars(reason.trim())} / {REPORT_REASON_MAX} · e.g. unsafe advice, rude, advertising.
      </p>
      {problem ? (
        <p id={`${id}-reason-error`} role="alert" className="text-sm font-medium text-bad">
          <span aria-hidden="true">✕ </span>
          {problem}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={busy}>
          {busy ? 'Sending…' : 'Send the report'}
        </Button>
        <Button type="button" tone="quiet" onClick={onClose}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
