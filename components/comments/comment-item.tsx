'use client';

import { useId, useState, useTransition } from 'react';
import { formatClock, momentHref } from '@/lib/chapters';
import type { CommentView } from '@/lib/types/comments';
import { deleteCommentAction, editCommentAction, postCommentAction, unhideCommentAction } from '@/lib/actions/comments';
import { IDLE } from '@/components/forms/action-state';
import { Button } from '@/components/ui/button';
import { TimeAgo } from '@/components/ui/time-ago';
import { CommentText } from './comment-text';
import { CommentForm, HideCommentForm, ReportCommentForm } from './lazy-forms';
import { useDiscussion } from './entry-discussion';
import { ReaderQuestionIcon } from './reader-question-icon';
import { formatDateTime } from '@/lib/format';

type Mode = 'reply' | 'edit' | 'delete' | 'hide' | 'report' | null;

function RoleBadge({ role }: { role: 'builder' | 'mentor' }) {
  return (
    <span className="inline-flex items-center gap-1 rounded-full border border-dye/50 px-2 py-0.5 text-xs font-semibold text-dye">
      <span aria-hidden="true">{role === 'builder' ? '⚒' : '◆'}</span>
      {role === 'builder' ? 'Builder' : 'Mentor'}
    </span>
  );
}

const commentForm = (commentId: number) => {
  const data = new FormData();
  data.set('commentId', String(commentId));
  return data;
};

type Props = { comment: CommentView };

/** One comment with its replies, and the controls this viewer is allowed. */
export function CommentItem({ comment: c }: Props) {
  const { applyChange, removeLocally, refresh, seekClip, payload } = useDiscussion();
  const id = useId();
  const [mode, setMode] = useState<Mode>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, startBusy] = useTransition();
  const [seekNote, setSeekNote] = useState<string | null>(null);
  const isReply = c.parentId != null;
  const who = c.author?.name ?? 'A reader';

  function open(next: Mode) {
    setProblem(null);
    setMode((m) => (m === next ? null : next));
  }

  function remove() {
    startBusy(async () => {
      const state = await deleteCommentAction(IDLE, commentForm(c.id));
      // Already gone (another tab) is as good as deleted.
      if (!state.ok && state.status !== 404) return setProblem(state.message ?? 'Not deleted.');
      setMode(null);
      removeLocally(c.id);
    });
  }

  function unhide() {
    startBusy(async () => {
      const state = await unhideCommentAction(IDLE, commentForm(c.id));
      if (!state.ok || !state.data) return setProblem(state.message ?? 'Not shown again.');
      applyChange(state.data);
    });
  }

  function jump() {
    if (c.mediaId == null || c.atMs == null) return;
    // The pinned clip may not be the one on screen (an entry can hold several): open it at that second.
    if (!seekClip(c.mediaId, c.atMs)) {
      setSeekNote(null);
      window.location.assign(momentHref(window.location.pathname, c.mediaId, c.atMs));
    } else {
      setSeekNote(`The clip is at ${formatClock(c.atMs)}.`);
    }
  }

  const controls = [
    c.can.reply ? { key: 'reply', label: 'Reply', onClick: () => open('reply'), expanded: mode === 'reply' } : null,
    c.can.edit ? { key: 'edit', label: 'Edit', onClick: () => open('edit'), expanded: mode === 'edit' } : null,
    c.can.delete ? { key: 'delete', label: 'Delete', onClick: () => open('delete'), expanded: mode === 'delete' } : null,
    c.can.hide ? { key: 'hide', label: 'Hide', onClick: () => open('hide'), expanded: mode === 'hide' } : null,
    // Any signed-in reader may report someone else's comment to the admins (reportComment).
    c.state === 'shown' && payload?.viewer && c.author && c.author.id !== payload.viewer.id
      ? { key: 'report', label: 'Report', onClick: () => open('report'), expanded: mode === 'report' }
      : null,
  ].filter((x) => x !== null);

  return (
    <article id={`comment-${c.id}`} aria-labelledby={`${id}-who`} className="scroll-mt-24 space-y-2" data-comment-id={c.id}>
      {c.state === 'removed' ? (
        <p id={`${id}-who`} className="flex items-center gap-2 rounded-md border border-dashed border-rule px-3 py-2 text-sm italic text-graphite-2">
          <span aria-hidden="true">⌫</span> Comment removed by its author
        </p>
      ) : (
        <>
          <header className="flex flex-wrap items-center gap-x-2 gap-y-1 text-sm">
            <span id={`${id}-who`} className="font-semibold">
              {who}
            </span>
            {c.author?.role ? <RoleBadge role={c.author.role} /> : null}
            <span aria-hidden="true" className="text-graphite-2">
              ·
            </span>
            <TimeAgo iso={c.createdAt} className="text-graphite-2" />
            {c.editedAt ? (
              <span className="text-graphite-2" title={`Edited ${formatDateTime(c.editedAt)}`}>
                · <span aria-hidden="true">✎</span> edited
              </span>
            ) : null}
          </header>

          {c.mediaId != null && c.atMs != null ? (
            <button
              type="button"
              onClick={jump}
              className="inline-flex min-h-11 items-center gap-2 rounded-md border border-dye/40 bg-dye-soft px-3 text-sm font-semibold text-dye hover:border-dye"
              aria-label={`Asked at ${formatClock(c.atMs)}: play the clip from that moment`}
            >
              <ReaderQuestionIcon />
              <span>
                Asked at <span className="dim">{formatClock(c.atMs)}</span>
              </span>
              <span aria-hidden="true">▶</span>
            </button>
          ) : null}

          {c.state === 'hidden' && c.hidden ? (
            <div className="space-y-2 rounded-md border border-scribe/50 bg-scribe-soft px-3 py-2 text-sm">
              <p className="flex items-start gap-2">
                <span aria-hidden="true">⊘</span>
                <span>
                  <span className="font-semibold">Hidden by {c.hidden.by === 'builder' ? 'the builder' : 'an admin'}:</span> {c.hidden.reason}
                </span>
              </p>
              {c.hidden.textShown ? (
                <div className="rounded border border-dashed border-rule bg-card px-3 py-2">
                  <p className="mb-1 text-xs font-semibold uppercase tracking-wide text-graphite-2">
                    Hidden text — only its author, the builder and admins see it
                  </p>
                  <CommentText text={c.body} className="text-sm text-graphite-2" />
                </div>
              ) : null}
            </div>
          ) : mode === 'edit' ? (
            <CommentForm
              name={`Edit your comment`}
              label="Your comment"
              submitLabel="Save changes"
              busyLabel="Saving…"
              initialBody={c.body}
              action={editCommentAction}
              fields={{ commentId: c.id, version: c.version }}
              onDone={(saved) => {
                applyChange(saved);
                setMode(null);
              }}
              // Changed elsewhere: the list is read again, and the form says so.
              onRefused={(state) => (state.status === 409 ? refresh() : undefined)}
              onCancel={() => setMode(null)}
              autoFocus
            />
          ) : (
            <CommentText text={c.body} className="text-base" />
          )}

          {controls.length || c.can.unhide ? (
            <div className="flex flex-wrap gap-1" role="group" aria-label={`Actions on the comment by ${who}`}>
              {controls.map((b) => (
                <button
                  key={b.key}
                  type="button"
                  onClick={b.onClick}
                  aria-expanded={b.expanded}
                  className={`min-h-11 rounded-md px-3 text-sm font-semibold hover:bg-paper-2 ${b.key === 'delete' ? 'text-bad' : b.key === 'hide' ? 'text-scribe' : b.key === 'report' ? 'text-graphite-2' : 'text-dye'}`}
                >
                  {b.label}
                </button>
              ))}
              {c.can.unhide ? (
                <button type="button" onClick={unhide} disabled={busy} className="min-h-11 rounded-md px-3 text-sm font-semibold text-dye hover:bg-paper-2">
                  {busy ? 'Showing…' : 'Show again'}
                </button>
              ) : null}
            </div>
          ) : null}
        </>
      )}

      {seekNote ? (
        <p role="status" className="sr-only">
          {seekNote}
        </p>
      ) : null}

      {mode === 'delete' ? (
        <div role="group" aria-label="Confirm delete" className="flex flex-wrap items-center gap-2 rounded-md border border-bad/40 bg-bad-soft/60 px-3 py-2 text-sm">
          <span className="font-semibold">
            <span aria-hidden="true">⚠ </span>
            {c.replies.length ? 'Delete your comment? The replies stay, under “Comment removed by its author”.' : 'Delete your comment for good?'}
          </span>
          <Button type="button" tone="danger" disabled={busy} onClick={remove} autoFocus>
            {busy ? 'Deleting…' : 'Delete comment'}
          </Button>
          <Button type="button" tone="quiet" onClick={() => setMode(null)}>
            Keep it
          </Button>
        </div>
      ) : null}

      {mode === 'report' ? <ReportCommentForm commentId={c.id} who={who} onClose={() => setMode(null)} /> : null}

      {mode === 'hide' ? (
        <HideCommentForm
          commentId={c.id}
          who={who}
          onHidden={(hidden) => {
            setMode(null);
            if (hidden) applyChange(hidden);
          }}
          onCancel={() => setMode(null)}
        />
      ) : null}

      {problem ? (
        <p role="alert" className="text-sm font-medium text-bad">
          <span aria-hidden="true">✕ </span>
          {problem}
        </p>
      ) : null}

      {!isReply && (c.replies.length || mode === 'reply') ? (
        <div className="ml-3 space-y-4 border-l-2 border-rule pl-3 sm:ml-6 sm:pl-5">
          {c.replies.length ? (
            <ol className="space-y-4" aria-label={`Replies to ${who}`}>
              {c.replies.map((r) => (
                <li key={r.id}>
                  <CommentItem comment={r} />
                </li>
              ))}
            </ol>
          ) : null}
          {mode === 'reply' ? (
            <CommentForm
              name={`Reply to ${who}`}
              label={`Your reply to ${who}`}
              hint="Replies stay one level deep: every answer joins this thread."
              submitLabel="Post reply"
              busyLabel="Posting…"
              action={postCommentAction}
              fields={{ entryId: c.entryId, parentId: c.id }}
              onDone={(saved) => {
                applyChange(saved);
                setMode(null);
              }}
              onCancel={() => setMode(null)}
              autoFocus
            />
          ) : null}
        </div>
      ) : null}
    </article>
  );
}
