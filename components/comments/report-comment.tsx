'use client';

import { useState } from 'react';
import { reportCommentAction } from '@/lib/actions/moderation';
import { REPORT_REASON_MAX, reportCommentSchema } from '@/lib/validations/moderation';
import { ReasonForm } from './reason-form';

/** A member tells the admins about a comment, with a reason; the admins hide it or dismiss the report. */
export function ReportCommentForm({ commentId, who, onClose }: { commentId: number; who: string; onClose: () => void }) {
  const [done, setDone] = useState<string | null>(null);

  if (done) {
    return (
      <p role="status" className="rounded-md border border-ok/50 bg-ok-soft px-3 py-2 text-sm text-ok">
        <span aria-hidden="true">✓ </span>
        {done}
      </p>
    );
  }

  return (
    <ReasonForm
      name={`Report the comment by ${who}`}
      label="Why report it? Only the admins see this"
      after="e.g. unsafe advice, rude, advertising."
      max={REPORT_REASON_MAX}
      schema={reportCommentSchema}
      action={reportCommentAction}
      fields={{ commentId }}
      submitLabel="Send the report"
      busyLabel="Sending…"
      className="space-y-2 rounded-md border border-rule bg-paper-2 px-3 py-3"
      onDone={(state) =>
        setDone(state.data?.alreadyReported ? 'You had already reported this comment; the admins have it.' : 'Reported to the admins. Thank you: they will hide it or leave it be.')
      }
      onCancel={onClose}
    />
  );
}
