'use client';

import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import dynamic from 'next/dynamic';
import { chapterSpans, formatClock } from '@/lib/chapters';
import type { MediaView, NoteView } from '@/lib/types/log';
import { getJson, sendJson } from '@/lib/client/api-client';
import { useServerData } from '@/components/hooks/use-server-data';
import { Notice } from '@/components/ui/notice';
import { PlusIcon } from '@/components/ui/plus-icon';
import type { NoteDraft, SaveOutcome } from './note-form';
import { TimeNoteList } from './time-note-list';
import { ChaptersPanel } from './chapters-panel';
import { KIND_LABEL, NoteKindIcon, KIND_TONE } from './note-kind';
import type { CommentView } from '@/lib/types/comments';
import type { PlayheadLink } from './playhead-link';
import { ReaderQuestionIcon } from '@/components/comments/reader-question-icon';
import { ClipPlayer } from './clip-player';
import { FormLoading } from '@/components/forms/form-loading';

// The note form is the builder's: it loads when a note is added or changed, so a reader's page never carries it.
const NoteForm = dynamic(() => import('./note-form').then((m) => m.NoteForm), { loading: FormLoading });

type Props = {
  clip: MediaView;
  notes: NoteView[];
  canEdit: boolean;
  /** Where to play from when the clip opens (a moment link); a new `startRequest` seeks there again. */
  startAtMs?: number | null;
  startRequest?: number;
  /** Small marks shown with a note, by note id (e.g. a mentor's risk flag). */
  noteMarkers?: Record<number, ReactNode>;
  /** Readers' comments pinned to moments of this clip: listed among the notes, never in the chapters. */
  readerQuestions?: CommentView[];
  /** Where a reader's question is read and answered in full; `#comment-<id>` is added. */
  questionThreadBase?: string;
  /** Shares the playhead with what sits outside the workbench (the comment form). */
  playhead?: PlayheadLink;
  /** Shown under the player, e.g. a reader's "Ask about this moment". */
  underPlayer?: ReactNode;
};

const byTime = (a: NoteView, b: NoteView) => a.startMs - b.startMs || a.id - b.id;

type Writing = { mode: 'new'; draft: NoteDraft; resume: boolean } | { mode: 'edit'; note: NoteView; resume: boolean } | null;

/** A clip with its timestamped notes: play, jump to a note, pin a new one at the playhead, and the chapters they make. */
export function ClipWorkbench({ clip, notes: initialNotes, canEdit, startAtMs = null, startRequest = 0, noteMarkers, readerQuestions, questionThreadBase = '', playhead, underPlayer }: Props) {
  const {
    data: notes = initialNotes,
    error: loadError,
    refresh: reloadNotes,
    update: updateNotes,
  } = useServerData<NoteView[]>(initialNotes, () => getJson<{ notes: NoteView[] }>(`/api/media/${clip.id}/notes`).then((r) => r.notes));
  const sorted = useMemo(() => [...notes].sort(byTime), [notes]);

  const media = useRef<HTMLVideoElement | null>(null);
  const noteButton = useRef<HTMLButtonElement>(null);
  // The time shown, the note marked "Now" and what "Note at" pins all follow the media element's own
  // time: a moment asked for before the media can seek waits here until its metadata is loaded.
  const pendingMs = useRef<number | null>(startAtMs);
  const measuringLength = useRef(false);
  const [nowMs, setNowMs] = useState(0);
  const [playerDurationMs, setPlayerDurationMs] = useState<number | null>(null);
  const [playing, setPlaying] = useState(false);
  const [failed, setFailed] = useState(false);
  const [writing, setWriting] = useState<Writing>(null);
  // A clip on a video site loads its player once something asks for a moment of it (or the reader presses play).
  const [playerWanted, setPlayerWanted] = useState(startAtMs !== null);
  // Marks the workbench interactive (hydrated) for browser tests and the phone benchmark: before, a click on a note does nothing.
  const [live, setLive] = useState(false);
  useEffect(() => setLive(true), []);
  // The builder's note form arrives in the background once the page is live, so "Note at" opens it at once.
  useEffect(() => {
    if (canEdit) void import('./note-form');
  }, [canEdit]);
  const durationMs = playerDurationMs ?? clip.durationMs;

  const questions = useMemo(() => (readerQuestions ?? []).filter((q) => q.mediaId === clip.id && q.atMs != null), [readerQuestions, clip.id]);

  // The note under the playhead: each note holds until the next one starts, its own end, or the clip's end.
  // Readers' questions take their turn on the same timeline, exactly like notes.
  const currentKey = useMemo(() => {
    const marks = [
      ...sorted.map((n) => ({ key: `n${n.id}`, startMs: n.startMs, endMs: n.endMs, text: n.text })),
      ...questions.map((q) => ({ key: `q${q.id}`, startMs: q.atMs!, endMs: null, text: q.body })),
    ].sort((a, b) => a.startMs - b.startMs);
    const spans = chapterSpans(marks, durationMs);
    for (let i = marks.length - 1; i >= 0; i--) {
      if (spans[i].startMs <= nowMs && nowMs < spans[i].endMs) return marks[i].key;
    }
    return null;
  }, [sorted, questions, durationMs, nowMs]);
  const currentId = currentKey?.startsWith('n') ? Number(currentKey.slice(1)) : null;
  const currentQuestionId = currentKey?.startsWith('q') ? Number(currentKey.slice(1)) : null;
  const current = sorted.find((n) => n.id === currentId) ?? null;
  const currentQuestion = questions.find((q) => q.id === currentQuestionId) ?? null;

  // Keep the note under the playhead in sight inside the list's own scroll box, without moving the page.
  const listBox = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const box = listBox.current;
    if (!box || (currentId === null && currentQuestionId === null) || box.scrollHeight <= box.clientHeight) return;
    const item = box.querySelector<HTMLElement>(currentId !== null ? `[data-note-id="${currentId}"]` : `[data-question-id="${currentQuestionId}"]`);
    if (!item) return;
    const top = item.offsetTop;
    if (top < box.scrollTop || top + item.offsetHeight > box.scrollTop + box.clientHeight) box.scrollTop = Math.max(0, top - 8);
  }, [currentId, currentQuestionId]);

  // Seeks to the waiting moment once the media can: when its metadata has loaded (it may have loaded
  // from the cache before the element was handed over), and after a recorded WebM's length is known.
  const applyPending = useCallback(() => {
    const el = media.current;
    if (!el || !(el.readyState >= 1) || measuringLength.current) return;
    if (el.duration === Infinity && el instanceof HTMLMediaElement) {
      // A WebM from a browser's recorder says Infinity until it has been played through: seek far past
      // the end once, read the length it then knows, and come back.
      measuringLength.current = true;
      const done = () => {
        el.removeEventListener('durationchange', check);
        measuringLength.current = false;
        if (Number.isFinite(el.duration) && el.duration > 0) setPlayerDurationMs(Math.round(el.duration * 1000));
        el.currentTime = (pendingMs.current ?? 0) / 1000;
        setNowMs(pendingMs.current ?? 0);
        pendingMs.current = null;
      };
      const check = () => {
        if (Number.isFinite(el.duration)) done();
      };
      el.addEventListener('durationchange', check);
      el.currentTime = 1e101;
      return;
    }
    if (pendingMs.current === null) return;
    const ms = pendingMs.current;
    pendingMs.current = null;
    el.currentTime = ms / 1000;
    setNowMs(ms);
  }, []);
  const lastMedia = useRef<HTMLVideoElement | null>(null);
  const onMedia = useCallback(
    (el: HTMLVideoElement | null) => {
      media.current = el;
      if (el) lastMedia.current = el;
      if (el && el.readyState >= 1) applyPending();
    },
    [applyPending],
  );
  // A page left by navigation stays in the document, hidden, to come back as it was: its clip must not
  // go on playing out of sight. The position is kept; the reader presses play again on return.
  // (The last element seen is the one paused: a ref may be let go before this clean-up runs.)
  useLayoutEffect(() => () => lastMedia.current?.pause(), []);
  const onLoaded = applyPending;
  const onTime = useCallback((ms: number) => {
    if (!measuringLength.current) setNowMs(ms);
  }, []);
  const onDuration = useCallback((ms: number) => {
    if (!measuringLength.current) setPlayerDurationMs(ms);
  }, []);

  function seek(ms: number) {
    pendingMs.current = ms;
    setPlayerWanted(true);
    applyPending();
  }

  // A moment asked for again while this clip is on screen (a link on the same page).
  const lastRequest = useRef(startRequest);
  useEffect(() => {
    if (startRequest === lastRequest.current) return;
    lastRequest.current = startRequest;
    if (startAtMs !== null) seek(startAtMs);
  });

  // Outside the workbench, the comment form pins to this playhead and pinned comments seek it.
  const seekRef = useRef(seek);
  useEffect(() => {
    seekRef.current = seek;
  });
  useEffect(() => {
    playhead?.report(clip.id, nowMs, durationMs ?? null);
  }, [playhead, clip.id, nowMs, durationMs]);
  useEffect(() => {
    if (!playhead) return;
    playhead.bind(clip.id, (ms) => seekRef.current(ms));
    return () => playhead.bind(clip.id, null);
  }, [playhead, clip.id]);

  function pauseForWriting(): boolean {
    const el = media.current;
    const wasPlaying = !!el && !el.paused;
    if (wasPlaying) el!.pause();
    return wasPlaying;
  }

  // Where focus goes once the form has closed: back to what opened it.
  const refocus = useRef<'note-button' | number | null>(null);
  useEffect(() => {
    if (writing || refocus.current === null) return;
    const target = refocus.current;
    refocus.current = null;
    if (target === 'note-button') noteButton.current?.focus();
    else listBox.current?.querySelector<HTMLButtonElement>(`[data-note-id="${target}"] button`)?.focus();
  }, [writing]);

  function finishWriting(resume: boolean) {
    refocus.current = writing?.mode === 'edit' ? writing.note.id : 'note-button';
    setWriting(null);
    if (resume) void media.current?.play()?.catch(() => undefined);
  }

  function startNote(atMs: number) {
    const resume = pauseForWriting();
    // Whole seconds: the moment the button showed, and a reader lands just before the action.
    const startMs = Math.floor(atMs / 1000) * 1000;
    setWriting({ mode: 'new', draft: { startMs, endMs: null, kind: 'note', text: '' }, resume });
  }

  function startEdit(note: NoteView) {
    setWriting({ mode: 'edit', note, resume: pauseForWriting() });
  }

  function merge(changed: NoteView[], removedId?: number) {
    updateNotes((old = []) => {
      const ids = new Set(changed.map((n) => n.id));
      return [...old.filter((n) => !ids.has(n.id) && n.id !== removedId), ...changed].sort(byTime);
    });
    reloadNotes();
  }

  async function saveNew(draft: NoteDraft): Promise<SaveOutcome> {
    const res = await sendJson<{ note: NoteView }>(`/api/media/${clip.id}/notes`, 'POST', draft);
    if (!res.ok) return { ok: false, message: res.error.message, fieldErrors: res.error.fieldErrors };
    merge([res.data.note]);
    finishWriting(writing?.resume ?? false);
    return { ok: true };
  }

  async function saveEdit(note: NoteView, draft: NoteDraft): Promise<SaveOutcome> {
    const res = await sendJson<{ note: NoteView }>(`/api/notes/${note.id}`, 'PATCH', { ...draft, version: note.version });
    if (!res.ok) {
      if (res.error.status === 409) reloadNotes();
      return {
        ok: false,
        message: res.error.status === 409 ? `${res.error.message} The list has been reloaded; cancel to see it.` : res.error.message,
        fieldErrors: res.error.fieldErrors,
      };
    }
    merge([res.data.note]);
    finishWriting(writing?.resume ?? false);
    return { ok: true };
  }

  async function remove(note: NoteView): Promise<string | null> {
    const res = await sendJson(`/api/notes/${note.id}`, 'DELETE');
    if (!res.ok && res.error.status !== 404) return res.error.message;
    merge([], note.id);
    return null;
  }

  const aspectRatio = clip.width && clip.height ? `${clip.width} / ${clip.height}` : '16 / 9';
  const editor =
    writing?.mode === 'edit' ? (
      <NoteForm
        key={`edit-${writing.note.id}`}
        mode="edit"
        initial={{ startMs: writing.note.startMs, endMs: writing.note.endMs, kind: writing.note.kind, text: writing.note.text }}
        nowMs={nowMs}
        durationMs={durationMs}
        onSave={(d) => saveEdit(writing.note, d)}
        onCancel={() => finishWriting(writing.resume)}
      />
    ) : null;

  return (
    <div className="space-y-6" data-clip-workbench={clip.id} data-live={live ? '' : undefined}>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(18rem,2fr)]">
        <div className="min-w-0 space-y-3">
          {/* No overflow clipping here: it would hide the focus ring drawn around the video. */}
          <div className="rounded-md bg-black">
            <ClipPlayer
              source={clip.source}
              wanted={playerWanted}
              src={clip.url}
              title={clip.name}
              aspectRatio={aspectRatio}
              chaptersUrl={clip.source === 'link' ? null : `/api/media/${clip.id}/chapters?format=vtt`}
              onMedia={onMedia}
              onTime={onTime}
              onDuration={onDuration}
              onLoaded={onLoaded}
              onPlayingChange={setPlaying}
              onFailed={() => setFailed(true)}
            />
          </div>
          {failed ? (
            <Notice kind="error" title="This clip would not play here">
              <p>
                {clip.source === 'link' ? 'The site it comes from may not allow playing it elsewhere. ' : 'The file may still be processing, or your browser cannot play its format. '}
                <a href={clip.url} target="_blank" rel="noopener noreferrer">
                  Open the clip on its own<span className="sr-only"> (opens a new tab)</span> ↗
                </a>
              </p>
            </Notice>
          ) : null}

          <p className="flex flex-wrap items-baseline justify-between gap-x-3 text-sm text-graphite-2">
            <span className="font-semibold text-graphite">{clip.name}</span>
            <span className="dim">
              {formatClock(nowMs)}
              {durationMs ? ` / ${formatClock(durationMs)}` : ''}
              <span className="sr-only">{playing ? ' (playing)' : ' (paused)'}</span>
            </span>
          </p>

          {/* Said once when the note under the playhead changes, not on every tick of the clock. */}
          <div aria-live="polite" aria-atomic="true" className="min-h-6 text-sm">
            {current ? (
              <p className="flex items-start gap-2">
                <span className={`mt-0.5 ${KIND_TONE[current.kind]}`}>
                  <NoteKindIcon kind={current.kind} className="h-4 w-4" />
                </span>
                <span>
                  <span className="font-semibold">
                    Now, {KIND_LABEL[current.kind].toLowerCase()} at <span className="dim">{formatClock(current.startMs)}</span>:
                  </span>{' '}
                  {current.text}
                </span>
              </p>
            ) : currentQuestion ? (
              <p className="flex items-start gap-2">
                <span className="mt-0.5 text-dye">
                  <ReaderQuestionIcon />
                </span>
                <span>
                  <span className="font-semibold">
                    Now, reader’s question at <span className="dim">{formatClock(currentQuestion.atMs!)}</span> from {currentQuestion.author?.name ?? 'a reader'}:
                  </span>{' '}
                  {currentQuestion.body}
                </span>
              </p>
            ) : null}
          </div>

          {canEdit ? (
            writing?.mode === 'new' ? (
              <NoteForm
                key={`new-${writing.draft.startMs}`}
                mode="new"
                initial={writing.draft}
                nowMs={nowMs}
                durationMs={durationMs}
                onSave={saveNew}
                onCancel={() => finishWriting(writing.resume)}
              />
            ) : (
              <button
                ref={noteButton}
                type="button"
                onClick={() => startNote(nowMs)}
                className="flex min-h-14 w-full items-center justify-center gap-3 rounded-lg bg-scribe px-6 text-lg font-bold text-white shadow-sm hover:brightness-110 sm:w-auto dark:text-paper"
              >
                <PlusIcon className="h-6 w-6" />
                Note at <span className="dim">{formatClock(nowMs)}</span>
              </button>
            )
          ) : null}
          {underPlayer}
        </div>

        <section aria-labelledby={`notes-${clip.id}`} className="min-w-0 space-y-3">
          <h3 id={`notes-${clip.id}`} className="flex items-baseline justify-between text-lg font-semibold">
            Notes on this clip
            <span className="text-sm font-normal text-graphite-2">
              {sorted.length + questions.length ? `${sorted.length + questions.length} in time order` : ''}
            </span>
          </h3>
          {loadError ? (
            <Notice kind="error" title="Could not refresh the notes">
              <p>{loadError.message}</p>
            </Notice>
          ) : null}
          <div ref={listBox} className={`relative lg:p-1.5 ${writing?.mode === 'edit' ? '' : 'lg:max-h-[36rem] lg:overflow-y-auto'}`}>
            <TimeNoteList
              notes={sorted}
              currentId={currentId}
              canEdit={canEdit}
              editingId={writing?.mode === 'edit' ? writing.note.id : null}
              editor={editor}
              onSeek={(n) => seek(n.startMs)}
              onEdit={startEdit}
              onDelete={remove}
              markers={noteMarkers}
              questions={questions}
              currentQuestionId={currentQuestionId}
              onSeekQuestion={(q) => seek(q.atMs ?? 0)}
              questionThreadHref={(q) => `${questionThreadBase}#comment-${q.id}`}
            />
          </div>
        </section>
      </div>

      <ChaptersPanel
        clipId={clip.id}
        notes={sorted}
        canEdit={canEdit}
        onImported={(created) => merge(created)}
      />
    </div>
  );
}
