'use client';

import { createContext, useCallback, useContext, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import type { CommentsPayload, CommentView } from '@/lib/types/comments';
import { getJson } from '@/lib/client/api-client';
import { useServerPages } from '@/components/hooks/use-server-data';
import { viewerCopyCookie } from '@/components/layout/shared-copy-viewer';
import type { PlayheadLink } from '@/components/clips/playhead-link';
import type { CommentFormHandle } from './comment-form';

export type Playhead = { clipId: number; nowMs: number; durationMs: number | null };

type Discussion = {
  entryId: number;
  /** Every page loaded so far, as one payload (its `nextCursor` is the last page's). */
  payload: CommentsPayload | undefined;
  loadError: Error | null;
  loading: boolean;
  /** Loads the next page of threads ("Show more comments"); only offered while `payload.nextCursor` is set. */
  loadMore: () => void;
  loadingMore: boolean;
  /** Puts a changed or new comment in place at once, then reloads the list from the server. */
  applyChange: (comment: CommentView) => void;
  removeLocally: (id: number) => void;
  refresh: () => void;
  link: PlayheadLink;
  /** Plays a moment of one of this entry's clips, switching clips first when needed; false when the page has no such clip. */
  seekClip: (clipId: number, ms: number) => boolean;
  /** The clip stage hands over how it switches clips while it is mounted, and null when it goes. */
  bindStage: (show: ((clipId: number, ms: number) => boolean) | null) => void;
  /** "Ask about this moment" by the player: opens the new-comment form pinned to the playhead, at once or as soon as the form has loaded. */
  askAboutMoment: () => void;
  /** The new-comment form hands over its handle when it mounts (it loads on demand), and null when it goes. */
  bindAskForm: (form: CommentFormHandle | null) => void;
};

const DiscussionContext = createContext<Discussion | null>(null);
// The playhead changes several times a second: its own context, so only what shows it re-renders.
const PlayheadContext = createContext<Playhead | null>(null);

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

type Pages = { pages: CommentsPayload[] };

/** The pages as one payload: the threads in order, the counts and permissions of the newest read. */
function merged(data: Pages | undefined): CommentsPayload | undefined {
  const pages = data?.pages;
  if (!pages?.length) return undefined;
  const last = pages[pages.length - 1];
  return { ...pages[0], comments: pages.flatMap((p) => p.comments), nextCursor: last.nextCursor };
}

/** A change applied to the page that holds the comment's thread (a new thread goes on the last page loaded). */
function onPages(data: Pages | undefined, change: (p: CommentsPayload) => CommentsPayload, id: number, parentId: number | null): Pages | undefined {
  if (!data?.pages.length) return data;
  const threadId = parentId ?? id;
  const found = data.pages.findIndex((p) => p.comments.some((t) => t.id === threadId || t.replies.some((r) => r.id === id)));
  const at = found >= 0 ? found : data.pages.length - 1;
  const changed = change(data.pages[at]);
  // The count is the whole entry's; the merged payload reads it from the first page.
  const delta = changed.count - data.pages[at].count;
  const pages = data.pages.map((p, i) => (i === at ? changed : p)).map((p, i) => (i === 0 && at !== 0 ? { ...p, count: p.count + delta } : p));
  return { ...data, pages };
}

/**
 * Holds an entry's comments and the playhead of its clip for everything between the player and the comment form.
 * `shared`: the page is the copy cached for everyone, built as a signed-out reader sees it; a signed-in
 * member's browser reads the first page again, with what they may do (the form, their own comments' controls).
 */
export function EntryDiscussion({ entryId, initial, shared = false, children }: { entryId: number; initial: CommentsPayload | null; shared?: boolean; children: ReactNode }) {
  // Pages of threads, keyset-paged by the server, the first rendered with the page; a refresh reads the
  // pages shown again, in order. No query library: a reader's page stays light.
  const { data, error: loadError, fetching, fetchingMore: loadingMore, loadMore, refresh, update } = useServerPages<CommentsPayload>(
    initial ?? undefined,
    (after) => getJson<CommentsPayload>(`/api/entries/${entryId}/comments${after ? `?after=${encodeURIComponent(after)}` : ''}`),
    (last) => last.nextCursor,
  );
  const [playhead, setPlayhead] = useState<Playhead | null>(null);
  const seekers = useRef(new Map<number, (ms: number) => void>());
  const stage = useRef<((clipId: number, ms: number) => boolean) | null>(null);
  const bindStage = useCallback((show: ((clipId: number, ms: number) => boolean) | null) => {
    stage.current = show;
  }, []);
  const askForm = useRef<CommentFormHandle | null>(null);
  // A click on "Ask about this moment" while the form's code is still on its way is kept until the form mounts:
  // it was lost before, and the reader's comment went out without its moment.
  const askPending = useRef(false);
  const askAboutMoment = useCallback(() => {
    if (askForm.current) askForm.current.focusWithPin();
    else askPending.current = true;
  }, []);
  const bindAskForm = useCallback((form: CommentFormHandle | null) => {
    askForm.current = form;
    if (form && askPending.current) {
      askPending.current = false;
      form.focusWithPin();
    }
  }, []);
  useEffect(() => {
    if (shared && viewerCopyCookie()) refresh();
  }, [shared, refresh]);

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

  const applyChange = useCallback(
    (c: CommentView) => {
      update((old) => onPages(old, (p) => withChange(p, c), c.id, c.parentId));
      refresh();
    },
    [update, refresh],
  );
  const removeLocally = useCallback(
    (id: number) => {
      update((old) => onPages(old, (p) => without(p, id), id, null));
      refresh();
    },
    [update, refresh],
  );

  const payload = useMemo(() => merged(data), [data]);
  const loading = fetching;
  const value = useMemo<Discussion>(
    () => ({ entryId, payload, loadError, loading, loadMore, loadingMore, applyChange, removeLocally, refresh, link, seekClip, bindStage, askAboutMoment, bindAskForm }),
    [entryId, payload, loadError, loading, loadMore, loadingMore, applyChange, removeLocally, refresh, link, seekClip, bindStage, askAboutMoment, bindAskForm],
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
