'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import type { Editor } from '@tiptap/react';
import { entryTitleSchema, type Operation } from '@/lib/validations/log';

export type FieldName = 'title' | 'operation' | 'body';
const FIELDS: FieldName[] = ['title', 'operation', 'body'];

export type SaveState =
  | { kind: 'clean' }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'saved'; at: Date }
  | { kind: 'retrying'; message: string; retryAt: number }
  | { kind: 'failed'; message: string; signedOut?: boolean }
  | { kind: 'invalid'; message: string }
  | { kind: 'conflict'; message: string };

const PAUSE_MS = 1000;
const BACKOFF_S = [2, 4, 8, 16, 30];
// Browsers refuse keepalive requests over 64 KiB; bigger bodies go as an ordinary request.
const KEEPALIVE_LIMIT = 60_000;

/**
 * The entry editor's save loop: each changed field is sent with the entry's version a second after typing
 * pauses (and when the tab is hidden or left); failures back off and retry, a 409 stops it, a title the
 * server would refuse is held back while the body keeps saving, and an in-app link first saves, then asks.
 * The editor hands its Tiptap instance over through `editorRef`; the body is read from it at send time.
 */
export function useEntryAutosave(url: string, entry: { title: string; operation: Operation; version: number }) {
  const [state, setStateRaw] = useState<SaveState>({ kind: 'clean' });
  const [fieldErrors, setFieldErrors] = useState<Partial<Record<FieldName, string>>>({});
  const [now, setNow] = useState(() => Date.now());

  // Everything the save loop reads lives in refs, so timers and event handlers never see stale values.
  const stateRef = useRef<SaveState>(state);
  const setState = useCallback((s: SaveState) => {
    // Every keystroke marks the body changed: don't re-render the whole editor for a state it is already in.
    if (s.kind === stateRef.current.kind && (s.kind === 'pending' || s.kind === 'saving')) return;
    stateRef.current = s;
    setStateRaw(s);
  }, []);
  const values = useRef({ title: entry.title, operation: entry.operation });
  const version = useRef(entry.version);
  const seq = useRef(0);
  const changedAt = useRef<Record<FieldName, number>>({ title: 0, operation: 0, body: 0 });
  const savedAt = useRef<Record<FieldName, number>>({ title: 0, operation: 0, body: 0 });
  const inFlight = useRef(false);
  const again = useRef(false);
  const attempts = useRef(0);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const guardOff = useRef(false);
  const editorRef = useRef<Editor | null>(null);
  const saveRef = useRef<(opts?: { keepalive?: boolean }) => Promise<void>>(async () => {});

  const hasUnsaved = () => inFlight.current || FIELDS.some((f) => changedAt.current[f] > savedAt.current[f]);
  // The same schema as the server's: a title it would refuse is held back (and said), never sent with the body.
  const titleProblem = () => {
    const r = entryTitleSchema.safeParse(values.current.title);
    return r.success ? null : (r.error.issues[0]?.message ?? 'Check the title.');
  };
  const sendable = () => FIELDS.filter((f) => changedAt.current[f] > savedAt.current[f] && !(f === 'title' && titleProblem()));

  const clearTimer = () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
  };
  const schedule = useCallback((ms: number) => {
    clearTimer();
    timer.current = setTimeout(() => void saveRef.current(), ms);
  }, []);

  const markChanged = useCallback(
    (field: FieldName) => {
      changedAt.current[field] = ++seq.current;
      const kind = stateRef.current.kind;
      if (kind === 'conflict') return;
      // While the server is failing, the back-off timer carries the latest text; typing must not hammer it.
      if (kind === 'retrying') return;
      if (kind !== 'saving' && kind !== 'invalid' && kind !== 'failed') setState({ kind: 'pending' });
      schedule(PAUSE_MS);
    },
    [schedule, setState],
  );

  saveRef.current = async (opts) => {
    const editor = editorRef.current;
    if (!editor || stateRef.current.kind === 'conflict') return;
    if (inFlight.current) {
      again.current = true;
      return;
    }
    const heldTitle = titleProblem();
    if (heldTitle && changedAt.current.title > savedAt.current.title) setFieldErrors((prev) => (prev.title === heldTitle ? prev : { ...prev, title: heldTitle }));
    const dirty = sendable();
    if (dirty.length === 0) {
      if (heldTitle && changedAt.current.title > savedAt.current.title) {
        clearTimer();
        setState({ kind: 'invalid', message: 'check the title; the rest is saved' });
      }
      return;
    }
    clearTimer();
    const sentAt = { ...changedAt.current };
    const payload: Record<string, unknown> = { version: version.current };
    if (dirty.includes('title')) payload.title = values.current.title;
    if (dirty.includes('operation')) payload.operation = values.current.operation;
    if (dirty.includes('body')) payload.body = editor.getJSON();
    const text = JSON.stringify(payload);

    inFlight.current = true;
    setState({ kind: 'saving' });
    let res: Response | null = null;
    try {
      res = await fetch(url, {
        method: 'PATCH',
        headers: { 'content-type': 'application/json', accept: 'application/json' },
        body: text,
        credentials: 'same-origin',
        keepalive: Boolean(opts?.keepalive) && text.length < KEEPALIVE_LIMIT,
      });
    } catch {
      res = null;
    }
    const json = res ? ((await res.json().catch(() => null)) as { entry?: { version?: unknown }; message?: string; fieldErrors?: Record<string, string[]> } | null) : null;
    inFlight.current = false;

    if (res?.ok) {
      const next = json?.entry?.version;
      // Without the new version the next save is refused as stale rather than overwriting anything.
      version.current = typeof next === 'number' ? next : version.current + 1;
      for (const f of dirty) savedAt.current[f] = sentAt[f];
      attempts.current = 0;
      const stillHeld = titleProblem();
      setFieldErrors((prev) => (stillHeld ? { title: stillHeld } : Object.keys(prev).length ? {} : prev));
      if (sendable().length || again.current) {
        again.current = false;
        setState({ kind: 'pending' });
        schedule(PAUSE_MS);
      } else if (stillHeld && hasUnsaved()) {
        setState({ kind: 'invalid', message: 'check the title; the rest is saved' });
      } else {
        setState({ kind: 'saved', at: new Date() });
      }
      return;
    }
    again.current = false;
    const status = res?.status ?? 0;
    if (status === 409) {
      clearTimer();
      setState({ kind: 'conflict', message: json?.message ?? 'This entry was changed somewhere else.' });
      return;
    }
    if (status === 400) {
      const errors: Partial<Record<FieldName, string>> = {};
      for (const [key, messages] of Object.entries(json?.fieldErrors ?? {})) {
        const field = key.split('.')[0] as FieldName;
        if (FIELDS.includes(field) && messages?.[0] && !errors[field]) errors[field] = messages[0];
      }
      setFieldErrors(errors);
      const named = FIELDS.filter((f) => errors[f]);
      const message = named.length ? `check the ${named.map(fieldLabel).join(' and ')}` : (json?.message ?? 'the server did not accept this edit');
      setState({ kind: 'invalid', message });
      return;
    }
    if (status === 0 || status >= 500 || status === 429) {
      const wait = BACKOFF_S[Math.min(attempts.current, BACKOFF_S.length - 1)];
      attempts.current += 1;
      setNow(Date.now());
      setState({
        kind: 'retrying',
        message: status === 0 ? 'Scribeline could not be reached' : status === 429 ? 'too many saves at once' : 'the server had a problem',
        retryAt: Date.now() + wait * 1000,
      });
      schedule(wait * 1000);
      return;
    }
    setState({
      kind: 'failed',
      message:
        status === 401
          ? 'You are signed out. Sign in again in another tab, then press Retry.'
          : (json?.message ?? `The server answered ${status}.`),
      signedOut: status === 401,
    });
  };

  const retryNow = () => {
    attempts.current = 0;
    clearTimer();
    void saveRef.current();
  };

  // Flush when the tab is hidden (switching apps on a phone, closing the laptop) and when leaving.
  useEffect(() => {
    const onHidden = () => {
      if (document.visibilityState === 'hidden') void saveRef.current({ keepalive: true });
    };
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      if (guardOff.current || !hasUnsaved()) return;
      event.preventDefault();
      event.returnValue = '';
    };
    const onOnline = () => {
      if (stateRef.current.kind === 'retrying') retryNow();
    };
    document.addEventListener('visibilitychange', onHidden);
    window.addEventListener('beforeunload', onBeforeUnload);
    window.addEventListener('online', onOnline);
    return () => {
      document.removeEventListener('visibilitychange', onHidden);
      window.removeEventListener('beforeunload', onBeforeUnload);
      window.removeEventListener('online', onOnline);
      clearTimer();
      // Leaving through an in-app link unmounts the editor without an unload: send what is pending.
      if (hasUnsaved() && stateRef.current.kind !== 'conflict') void saveRef.current({ keepalive: true });
    };
    // Listeners attached once: what they call reads the latest state through refs.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  // Leaving through an in-app link: save what is pending first, and ask before leaving anything unsaved.
  useEffect(() => {
    const onClick = (event: MouseEvent) => {
      if (guardOff.current || event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return;
      const link = (event.target as Element | null)?.closest?.('a[href]') as HTMLAnchorElement | null;
      if (!link || (link.target && link.target !== '_self') || link.hasAttribute('download')) return;
      const to = new URL(link.href, window.location.href);
      if (to.origin !== window.location.origin || (to.pathname === window.location.pathname && to.search === window.location.search)) return;
      if (!hasUnsaved()) return;
      event.preventDefault();
      event.stopPropagation();
      void (async () => {
        await saveRef.current();
        for (let i = 0; i < 30 && inFlight.current; i++) await new Promise((r) => setTimeout(r, 100));
        if (hasUnsaved() && !window.confirm('Some of this entry is not saved yet (see the message by the editor). Leave anyway and lose it?')) return;
        guardOff.current = true;
        window.location.assign(to.href);
      })();
    };
    document.addEventListener('click', onClick, true);
    return () => document.removeEventListener('click', onClick, true);
  }, []);

  // A countdown while waiting to retry.
  useEffect(() => {
    if (state.kind !== 'retrying') return;
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, [state.kind]);
  /** The editor hands over its Tiptap instance on every render (null until it has made one). */
  const setEditor = useCallback((editor: Editor | null) => {
    editorRef.current = editor;
  }, []);
  /** A typed title or a chosen operation: kept for the next save, which is scheduled. */
  const changeField = useCallback(
    <F extends 'title' | 'operation'>(field: F, value: { title: string; operation: Operation }[F]) => {
      values.current[field] = value;
      markChanged(field);
    },
    [markChanged],
  );
  /** Reloading or leaving on purpose: the unsaved-changes question is not asked again. */
  const stopGuarding = useCallback(() => {
    guardOff.current = true;
  }, []);
  const currentTitle = useCallback(() => values.current.title, []);

  return { state, now, fieldErrors, setFieldErrors, saveRef, markChanged, changeField, retryNow, stopGuarding, setEditor, currentTitle };
}

function fieldLabel(f: FieldName): string {
  return f === 'body' ? 'text' : f;
}
