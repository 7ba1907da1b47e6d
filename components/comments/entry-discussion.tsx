'use client';

import { createContext, useCallback, useContext, useMemo, useRef, useState, type ReactNode, type RefObject } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { CommentsPayload, CommentView } from '@/lib/types/comments';
import { getJson } from '@/lib/client/api-client';
import type { PlayheadLink } from '@/components/clips/playhead-link';
import type { CommentFormHandle } from './comment-form';

export type Playhead = { clipId: number; nowMs: number; durationMs: number | null };

type Discussion = {
  entryId: number;
  payload: CommentsPayload | undefined;
  loadError: Error | null;
  loading: boolean;
  /** Puts a changed or new comment in place at once, then reloads the list from the server. */
  applyChange: (comment: CommentView) => void;
  removeLocally: (id: number) => void;
  refresh: () => void;
  link: PlayheadLink;
  /** Plays a moment of one of this entry's clips, switching clips first when needed; false when the page has no such clip. */
  seekClip: (clipId: number, ms: number) => boolean;
  /** The clip stage hands over how it switches clips while it is mounted, and null when it goes. */
  bindStage: (show: ((clipId: number, ms: number) => boolean) | null) => void;
  /** The new-comment form, when there is one: "Ask about this moment" by the player opens it pinned. */
  askForm: RefObject<CommentFormHandle | null>;
};

const DiscussionContext = createContext<Discussion | null>(null);
// The playhead changes several times a second: its own context, so only what shows it re-renders.
const PlayheadContext = createContext<Playhead | null>(null);

export const commentsKey = (entryId: number) => ['comments', entryId] as const;

function withChange(payload: CommentsPayload, c: CommentView): CommentsPayload {
  const comments = payload.comments.map((top) => {
    if (top.id === c.id) return { ...c, replies: top.replies };
    if (c.parentId === top.id) {
      const has = top.replies.some((r) => r.id === c.id);
      return { ...top, replies: has ? top.replies.map((r) => (r.id === c.id ? c : r)) : [...top.replies, c] };
    }
    return top;
  });
  const isNew = c.parentId == null ? !payload.comments.some((t) => t.id === c.id) : !payload.comments.some((t) => t.replies.some((r) => r.id === c.id));
  return { ...payload, comments: c.parentId == null && isNew ? [...comments, c] : comments, count: payload.count + (isNew ? 1 : 0) };
}

function without(payload: CommentsPayload, id: number): CommentsPayload {
  const comments = payload.comments
    .map((top) => (top.id === id ? { ...top, state: 'removed' as const, body: '', author: null } : { ...top, replies: top.replies.filter((r) => r.id !== id) }))
    .filter((top) => top.state !== 'removed' || top.replies.length > 0);
  return { ...payload, comments, count: Math.max(0, payload.count - 1) };
}

/** Holds an entry's comments and the playhead of its clip for everything between the player and the comment form. */
export function EntryDiscussion({ entryId, initial, children }: { entryId: number; initial: CommentsPayload | null; children: ReactNode }) {
  const queryClient = useQueryClient();
  const queryKey = useMemo(() => commentsKey(entryId), [entryId]);
  const query = useQuery({
    queryKey,
    queryFn: () => getJson<CommentsPayload>(`/api/entries/${entryId}/comments`),
    ...(initial ? { initialData: initial } : {}),
  });
  const [playhead, setPlayhead] = useState<Playhead | null>(null);
  const seekers = useRef(new Map<number, (ms: number) => void>());
  const stage = useRef<((clipId: number, ms: number) => boolean) | null>(null);
  const bindStage = useCallback((show: ((clipId: number, ms: number) => boolean) | null) => {
    stage.current = show;
  }, []);
  const askForm = useRef<CommentFormHandle | null>(null);

  const link = useMemo<PlayheadLink>(
    () => ({
      report: (clipId, nowMs, durationMs) =>
        setPlayhead((old) => (old && old.clipId === clipId && old.nowMs === nowMs && old.durationMs === durationMs ? old : { clipId, nowMs, durationMs })),
      bind: (clipId, seek) => {
        if (seek) seekers.current.set(clipId, seek);
        else seekers.current.delete(clipId);
      },
    }),
    [],
  );

  const seekClip = useCallback((clipId: number, ms: number) => {
    const seek = seekers.current.get(clipId);
    if (seek) seek(ms);
    else if (!stage.current?.(clipId, ms)) return false;
    document.querySelector(`[data-clip-workbench="${clipId}"]`)?.scrollIntoView({ behavior: 'smooth', block: 'start' });
    return true;
  }, []);

  const refresh = useCallback(() => void queryClient.invalidateQueries({ queryKey }), [queryClient, queryKey]);
  const applyChange = useCallback(
    (c: CommentView) => {
      queryClient.setQueryData<CommentsPayload>(queryKey, (old) => (old ? withChange(old, c) : old));
      refresh();
    },
    [queryClient, queryKey, refresh],
  );
  const removeLocally = useCallback(
    (id: number) => {
      queryClient.setQueryData<CommentsPayload>(queryKey, (old) => (old ? without(old, id) : old));
      refresh();
    },
    [queryClient, queryKey, refresh],
  );

  const { data: payload, error: loadError, isFetching: loading } = query;
  const value = useMemo<Discussion>(
    () => ({ entryId, payload, loadError, loading, applyChange, removeLocally, refresh, link, seekClip, bindStage, askForm }),
    [entryId, payload, loadError, loading, applyChange, removeLocally, refresh, link, seekClip, bindStage],
  );
  return (
    <DiscussionContext.Provider value={value}>
      <PlayheadContext.Provider value={playhead}>{children}</PlayheadContext.Provider>
    </DiscussionContext.Provider>
  );
}

/** Null outside an EntryDiscussion (a moment link elsewhere simply navigates). */
export function useOptionalDiscussion(): Discussion | null {
  return useContext(DiscussionContext);
}

export function useDiscussion(): Discussion {
  const d = useContext(DiscussionContext);
  if (!d) throw new Error('useDiscussion needs an EntryDiscussion around it.');
  return d;
}

/** Null outside an EntryDiscussion, or before any clip has reported. */
export function usePlayhead(): Playhead | null {
  return useContext(PlayheadContext);
}
