'use client';

import { useEffect, useRef, useState, type ReactNode } from 'react';
import { formatClock } from '@/lib/chapters';
import type { NoteView } from '@/lib/types/log';
import { Button } from '@/components/ui/button';
import { KIND_LABEL, NoteKindLabel } from './note-kind';
import type { CommentView } from '@/lib/types/comments';
import { ReaderQuestionItem } from './reader-question-item';

type Props = {
  notes: NoteView[];
  currentId: number | null;
  canEdit: boolean;
  editingId: number | null;
  /** The edit form, shown in place of the note being edited. */
  editor: ReactNode;
  onSeek: (note: NoteView) => void;
  onEdit: (note: NoteView) => void;
  onDelete: (note: NoteView) => Promise<string | null>;
  /** Small marks shown with a note, by note id (e.g. a mentor's risk flag). */
  markers?: Record<number, ReactNode>;
  /** Readers' comments pinned to moments of the clip, listed in time order among the notes. */
  questions?: CommentView[];
  currentQuestionId?: number | null;
  onSeekQuestion?: (question: CommentView) => void;
  questionThreadHref?: (question: CommentView) => string;
};

// A clip can carry many notes: the rows' repeated styles are short classes in app/globals.css (.note-play,
// .note-when, .note-clock, .note-words), which keeps a long list's page small.
type Row = { kind: 'note'; note: NoteView; at: number } | { kind: 'question'; question: CommentView; at: number };

export function TimeNoteList({ notes, currentId, canEdit, editingId, editor, onSeek, onEdit, onDelete, markers, questions = [], currentQuestionId = null, onSeekQuestion, questionThreadHref }: Props) {
  const [confirming, setConfirming] = useState<number | null>(null);
  const [deleting, setDeleting] = useState<number | null>(null);
  const [failure, setFailure] = useState<{ id: number; message: string } | null>(null);
  // After a delete, focus moves to the next note (or the one before, or the list), never to the page top.
  const box = useRef<HTMLDivElement>(null);
  const focusAfterDelete = useRef<number | 'list' | null>(null);
  useEffect(() => {
    const target = focusAfterDelete.current;
    if (target === null) return;
    focusAfterDelete.current = null;
    const button = target === 'list' ? null : box.current?.querySelector<HTMLButtonElement>(`[data-note-id="${target}"] button`);
    (button ?? box.current)?.focus();
  }, [notes]);

  async function remove(note: NoteView) {
    setDeleting(note.id);
    setFailure(null);
    const i = notes.findIndex((n) => n.id === note.id);
    const neighbour = notes[i + 1] ?? notes[i - 1] ?? null;
    focusAfterDelete.current = neighbour ? neighbour.id : 'list';
    const message = await onDelete(note);
    setDeleting(null);
    setConfirming(null);
    if (message) {
      focusAfterDelete.current = null;
      setFailure({ id: note.id, message });
    }
  }

  return (
    <div ref={box} tabIndex={-1} className="rounded-lg">
      {!notes.length && !questions.length ? (
      <p className="rounded-lg border border-dashed border-rule p-4 text-sm text-graphite-2">
        {canEdit ? 'No notes on this clip yet. Play it and press the Note button at a moment worth pointing out.' : 'No notes on this clip yet.'}
      </p>
      ) : (
    <ol className="space-y-2" aria-label="Notes in time order">
      {[
        ...notes.map((note): Row => ({ kind: 'note', note, at: note.startMs })),
        ...questions.map((question): Row => ({ kind: 'question', question, at: question.atMs ?? 0 })),
      ]
        // Stable: notes keep their order, and a question at the same moment follows the notes there.
        .sort((a, b) => a.at - b.at)
        .map((row) => {
        if (row.kind === 'question') {
          const q = row.question;
          return <ReaderQuestionItem key={`q${q.id}`} question={q} current={q.id === currentQuestionId} onSeek={(x) => onSeekQuestion?.(x)} threadHref={questionThreadHref?.(q) ?? `#comment-${q.id}`} />;
        }
        const note = row.note;
        const current = note.id === currentId;
        if (note.id === editingId) return <li key={note.id}>{editor}</li>;
        return (
          <li
            key={note.id}
            className={`rounded-lg border-2 ${current ? 'border-dye bg-dye-soft' : 'border-rule bg-card'}`}
            data-current={current || undefined}
            data-note-id={note.id}
          >
            <div className="flex items-stretch">
              <button
                type="button"
                onClick={() => onSeek(note)}
                aria-current={current ? 'true' : undefined}
                aria-label={`${formatClock(note.startMs)}${note.endMs != null ? ` to ${formatClock(note.endMs)}` : ''}, ${KIND_LABEL[note.kind]}${current ? ', Now' : ''}: ${note.text}. Play from here.`}
                className="note-play"
              >
                {/* The spaces between the pieces keep the visible words apart for assistive technology, so the
                    button's name (aria-label) contains the text as shown. */}
                <span className="note-when">
                  <span className={`note-clock ${current ? 'text-dye' : 'text-graphite'}`}>{formatClock(note.startMs)}</span>{' '}
                  {note.endMs != null ? <span className="dim text-xs text-graphite-2">to {formatClock(note.endMs)}</span> : null}
                </span>{' '}
                <span className="min-w-0 flex-1">
                  <span className="flex flex-wrap items-center gap-2">
                    <NoteKindLabel kind={note.kind} />{' '}
                    {current ? (
                      <span className="inline-flex items-center gap-1 text-xs font-semibold text-dye">
                        <span aria-hidden="true">▶</span> Now
                      </span>
                    ) : null}
                  </span>{' '}
                  <span className="note-words">{note.text}</span>
                </span>
              </button>
              {canEdit ? (
                <span className="flex shrink-0 flex-col justify-center gap-1 border-l border-rule p-1">
                  <button type="button" className="min-h-11 rounded-md px-3 text-sm font-semibold text-dye hover:bg-paper-2" onClick={() => onEdit(note)} aria-label={`Edit the note at ${formatClock(note.startMs)}`}>
                    Edit
                  </button>
                  <button
                    type="button"
                    className="min-h-11 rounded-md px-3 text-sm font-semibold text-bad hover:bg-bad-soft"
                    onClick={() => setConfirming(note.id)}
                    aria-label={`Delete the note at ${formatClock(note.startMs)}`}
                    aria-expanded={confirming === note.id}
                  >
                    Delete
                  </button>
                </span>
              ) : null}
            </div>
            {markers?.[note.id] ? <div className="flex justify-end border-t border-rule/60 px-3 py-1">{markers[note.id]}</div> : null}
            {confirming === note.id ? (
              <div role="group" aria-label="Confirm delete" className="flex flex-wrap items-center gap-2 border-t border-rule bg-bad-soft/60 px-3 py-2 text-sm">
                <span className="font-semibold">
                  <span aria-hidden="true">⚠ </span>Delete this note for good?
                </span>
                <Button type="button" tone="danger" disabled={deleting === note.id} onClick={() => void remove(note)} autoFocus>
                  {deleting === note.id ? 'Deleting…' : 'Delete note'}
                </Button>
                <Button type="button" tone="quiet" onClick={() => setConfirming(null)}>
                  Keep it
                </Button>
              </div>
            ) : null}
            {failure?.id === note.id ? (
              <p role="alert" className="border-t border-rule px-3 py-2 text-sm text-bad">
                <span aria-hidden="true">✕ </span>
                {failure.message}
              </p>
            ) : null}
          </li>
        );
      })}
    </ol>
      )}
    </div>
  );
}
