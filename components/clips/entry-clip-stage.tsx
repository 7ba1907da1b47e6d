'use client';

import { useCallback, useEffect, useRef, useState, type MouseEvent, type ReactNode } from 'react';
import { momentHref, parseMomentFragment } from '@/lib/chapters';
import type { MediaView, NoteView } from '@/lib/types/log';
import { ClipWithQuestions } from '@/components/comments/clip-with-questions';
import { useOptionalDiscussion } from '@/components/comments/entry-discussion';

type Props = {
  clips: MediaView[];
  notes: NoteView[];
  initialClipId: number;
  entryPath: string;
  canEdit: boolean;
  noteMarkers?: Record<number, ReactNode>;
};

type Shown = { clipId: number; startMs: number | null; request: number };

/**
 * The reader's page keeps one player. A moment link (`?clip=<id>#t=<s>`) opens that clip at that
 * moment, a moment of another clip switches clips first, and the URL follows what is on screen.
 */
export function EntryClipStage({ clips, notes, initialClipId, entryPath, canEdit, noteMarkers }: Props) {
  const [shown, setShown] = useState<Shown>({ clipId: initialClipId, startMs: null, request: 0 });
  const discussion = useOptionalDiscussion();
  const bindStage = discussion?.bindStage;

  const show = useCallback(
    (clipId: number, ms: number | null, writeUrl = true) => {
      if (!clips.some((c) => c.id === clipId)) return false;
      setShown((old) => ({ clipId, startMs: ms, request: old.request + 1 }));
      if (writeUrl) window.history.replaceState(window.history.state, '', ms === null ? `${entryPath}?clip=${clipId}` : momentHref(entryPath, clipId, ms));
      return true;
    },
    [clips, entryPath],
  );

  // The clip (?clip=, which the signed-out copy of the page is not built from) and the moment in the fragment,
  // on arrival and whenever the fragment changes (a plain #t= link). A moment without its clip gets the clip
  // shown named in the address, so the link can be passed on as it is.
  const shownClip = useRef(shown.clipId);
  shownClip.current = shown.clipId;
  useEffect(() => {
    const read = () => {
      const ms = parseMomentFragment(window.location.hash);
      const asked = Number(new URLSearchParams(window.location.search).get('clip'));
      const clipId = clips.some((c) => c.id === asked) ? asked : null;
      if (ms === null && clipId === null) return;
      if (ms !== null && clipId === null) window.history.replaceState(window.history.state, '', momentHref(entryPath, shownClip.current, ms));
      setShown((old) => {
        if (ms === null && clipId === old.clipId) return old;
        return { clipId: clipId ?? old.clipId, startMs: ms ?? old.startMs, request: old.request + 1 };
      });
    };
    read();
    window.addEventListener('hashchange', read);
    return () => window.removeEventListener('hashchange', read);
  }, [clips, entryPath]);

  useEffect(() => {
    if (!bindStage) return;
    bindStage((clipId, ms) => show(clipId, ms));
    return () => bindStage(null);
  }, [bindStage, show]);

  const clip = clips.find((c) => c.id === shown.clipId) ?? clips[0];

  function pick(e: MouseEvent<HTMLAnchorElement>, clipId: number) {
    if (e.metaKey || e.ctrlKey || e.shiftKey || e.altKey || e.button !== 0) return;
    e.preventDefault();
    show(clipId, null);
  }

  return (
    <>
      {clips.length > 1 ? (
        <nav aria-label="Clips of this entry" className="flex flex-wrap gap-2">
          {clips.map((c, i) => (
            <a
              key={c.id}
              href={`${entryPath}?clip=${c.id}`}
              onClick={(e) => pick(e, c.id)}
              aria-current={c.id === clip.id ? 'true' : undefined}
              className="inline-flex min-h-10 items-center rounded-full border border-rule px-3 text-sm no-underline aria-[current=true]:border-dye aria-[current=true]:bg-dye-soft"
            >
              <span aria-hidden="true">▶&nbsp;</span>
              {c.caption || c.name || `Clip ${i + 1}`}
            </a>
          ))}
        </nav>
      ) : null}
      <ClipWithQuestions
        key={clip.id}
        clip={clip}
        notes={notes.filter((n) => n.mediaId === clip.id)}
        canEdit={canEdit}
        startAtMs={shown.clipId === clip.id ? shown.startMs : null}
        startRequest={shown.request}
        noteMarkers={noteMarkers}
      />
    </>
  );
}
