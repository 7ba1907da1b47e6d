'use client';

import { hideCommentAction } from '@/lib/actions/comments';
import type { CommentView } from '@/lib/types/comments';
import { commentHideSchema, HIDE_REASON_MAX } from '@/lib/validations/comments';
import { ReasonForm } from './reason-form';

/** The builder's or an admin's form to hide a comment with a reason readers see. */
export function HideCommentForm({ commentId, who, onHidden, onCancel }: { commentId: number; who: string; onHidden: (hidden: CommentView | undefined) => void; onCancel: () => void }) {
  return (
    <ReasonForm
      name={`Hide the comment by ${who}`}
      label="Why hide it? Readers see this reason"
      after="the text is kept, and you can show it again."
      max={HIDE_REASON_MAX}
      schema={commentHideSchema}
      action={hideCommentAction}
      fields={{ commentId }}
      submitLabel="Hide comment"
      busyLabel="Hiding…"
      danger
      className="space-y-2 rounded-md border border-scribe/50 bg-scribe-soft/60 px-3 py-3"
      onDone={(state) => onHidden(state.data)}
      onCancel={onCancel}
    />
  );
}
