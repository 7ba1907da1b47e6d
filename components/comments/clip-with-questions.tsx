'use client';

import { useMemo, type ComponentProps } from 'react';
import { formatClock } from '@/lib/chapters';
import { pinnedQuestions } from '@/lib/comments/pinned';
import { ClipWorkbench } from '@/components/clips/clip-workbench';
import { useDiscussion, usePlayhead } from './entry-discussion';
import { ReaderQuestionIcon } from './reader-question-icon';

type Props = Omit<ComponentProps<typeof ClipWorkbench>, 'readerQuestions' | 'playhead'>;

/** The clip's workbench on a reader's page: readers' pinned questions among the notes, and its playhead shared with the comment form. */
export function ClipWithQuestions(props: Props) {
  const { payload, link, askAboutMoment } = useDiscussion();
  const questions = useMemo(() => pinnedQuestions(payload?.comments ?? [], props.clip.id), [payload, props.clip.id]);
  return (
    <ClipWorkbench
      {...props}
      readerQuestions={questions}
      playhead={link}
      underPlayer={payload?.can.comment && !props.canEdit ? <AskButton onAsk={askAboutMoment} clipId={props.clip.id} /> : null}
    />
  );
}

function AskButton({ onAsk, clipId }: { onAsk: () => void; clipId: number }) {
  const playhead = usePlayhead();
  const at = playhead && playhead.clipId === clipId ? playhead.nowMs : 0;
  return (
    <button
      type="button"
      onClick={onAsk}
      className="inline-flex min-h-11 items-center gap-2 rounded-md border border-dye/50 bg-card px-4 text-sm font-semibold text-dye hover:bg-dye-soft"
    >
      <ReaderQuestionIcon />
      <span>
        Ask about this moment (<span className="dim">{formatClock(at)}</span>)
      </span>
    </button>
  );
}
