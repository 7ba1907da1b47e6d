'use client';

import { formatClock } from '@/lib/chapters';
import type { CommentView } from '@/lib/types/comments';
import { ReaderQuestionIcon } from '@/components/comments/reader-question-icon';

type Props = {
  question: CommentView;
  current: boolean;
  onSeek: (q: CommentView) => void;
  /** Where the whole thread is read and answered. */
  threadHref: string;
};

/** A reader's comment pinned to a moment, in the clip's time-ordered list beside the builder's notes. */
export function ReaderQuestionItem({ question: q, current, onSeek, threadHref }: Props) {
  const who = q.author?.name ?? 'A reader';
  const replies = q.replies.length;
  const hidden = q.state === 'hidden';
  return (
    <li
      className={`rounded-lg border-2 border-dashed ${current ? 'border-dye bg-dye-soft' : 'border-dye/40 bg-card'}`}
      data-current={current || undefined}
      data-question-id={q.id}
    >
      <button
        type="button"
        onClick={() => onSeek(q)}
        aria-current={current ? 'true' : undefined}
        aria-label={`${formatClock(q.atMs ?? 0)}, Reader’s question from ${who}${hidden ? ', Hidden' : ''}${current ? ', Now' : ''}: ${q.body}. Play from here.`}
        className="flex min-h-14 w-full min-w-0 items-start gap-3 rounded-t-md px-3 py-2 text-left hover:bg-paper-2/60"
      >
        <span className="flex w-16 shrink-0 flex-col items-start">
          <span className={`dim text-base font-semibold ${current ? 'text-dye' : 'text-graphite'}`}>{formatClock(q.atMs ?? 0)}</span>
        </span>{' '}
        {/* Spaces between the pieces, and "from", so the button's name contains its text as shown. */}
        <span className="min-w-0 flex-1">
          <span className="flex flex-wrap items-center gap-x-2 gap-y-1">
            <span className="inline-flex items-center gap-1 text-xs font-semibold uppercase tracking-wide text-dye">
              <ReaderQuestionIcon />
              Reader’s question
            </span>{' '}
            <span className="text-xs font-semibold text-graphite-2">from {who}</span>{' '}
            {hidden ? (
              <span className="inline-flex items-center gap-1 rounded-full border border-scribe/60 px-2 text-xs font-semibold text-scribe">
                <span aria-hidden="true">⊘</span> Hidden
              </span>
            ) : null}{' '}
            {current ? (
              <span className="inline-flex items-center gap-1 text-xs font-semibold text-dye">
                <span aria-hidden="true">▶</span> Now
              </span>
            ) : null}
          </span>{' '}
          <span className={`mt-0.5 block whitespace-pre-line break-words text-sm ${hidden ? 'text-graphite-2' : ''}`}>{q.body}</span>
        </span>
      </button>
      <a href={threadHref} className="flex min-h-11 items-center gap-1 border-t border-dashed border-dye/30 px-3 text-sm font-semibold">
        {replies ? `${replies === 1 ? '1 reply' : `${replies} replies`} — read the thread` : 'Read or answer it in the comments'}
        <span aria-hidden="true">{threadHref.startsWith('#') ? '↓' : '→'}</span>
        <span className="sr-only"> (the question from {who} at {formatClock(q.atMs ?? 0)})</span>
      </a>
    </li>
  );
}
