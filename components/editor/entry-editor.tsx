'use client';

import './prose-entry.css';
import { useCallback, useEffect, useId, useMemo, useRef, useState, useSyncExternalStore, type FormEvent, type KeyboardEvent as ReactKeyboardEvent, type ReactNode } from 'react';
import { EditorContent, useEditor, useEditorState, type Editor } from '@tiptap/react';
import { Fragment, Slice, type Node as PMNode } from '@tiptap/pm/model';
import { entryExtensions, safeHref } from '@/lib/rich-text/extensions';
import { ENTRY_TITLE_MAX, OPERATIONS, entryTitleSchema, type Operation } from '@/lib/validations/log';
import type { MediaView } from '@/lib/types/log';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { formatTimeOfDay } from '@/lib/format';
import { signInHref } from '@/components/ui/sign-in-link';

export type EditableEntry = { id: number; title: string; operation: Operation; body: Record<string, unknown>; version: number };

type Props = {
  entry: EditableEntry;
  /** The entry's own media; its photos are what "Insert photo" offers. */
  photos: MediaView[];
  /** Where edits are sent; the entry's JSON route unless told otherwise. */
  saveUrl?: string;
};

type FieldName = 'title' | 'operation' | 'body';
const FIELDS: FieldName[] = ['title', 'operation', 'body'];

type SaveState =
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

export function EntryEditor({ entry, photos, saveUrl }: Props) {
  const url = saveUrl ?? `/api/entries/${entry.id}`;
  const mod = useModKey();
  const uid = useId();
  const ids = { title: `${uid}-title`, operation: `${uid}-operation`, body: `${uid}-body`, link: `${uid}-link`, photos: `${uid}-photos` };

  // Later props (a server refresh after an upload) must never reset what is being typed.
  const [initialBody] = useState(entry.body);
  const [title, setTitle] = useState(entry.title);
  const [operation, setOperation] = useState<Operation>(entry.operation);
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

  // Keep links, code and the rest; drop pictures pasted from elsewhere: photos come from the entry's uploads.
  const photoUrls = useRef(new Set<string>());
  const openLinkRef = useRef(() => {});
  photoUrls.current = new Set(photos.filter((p) => p.kind === 'photo').map((p) => p.url));

  // Memoized: a new editorProps object on each render would make the editor reconfigure itself every time.
  const bodyInvalid = Boolean(fieldErrors.body);
  const editorProps = useMemo(
    () => ({
      attributes: {
        id: ids.body,
        role: 'textbox',
        'aria-multiline': 'true',
        'aria-labelledby': `${ids.body}-label`,
        'aria-invalid': bodyInvalid ? 'true' : 'false',
        'aria-describedby': bodyInvalid ? `${ids.body}-error` : `${ids.body}-hint`,
        class: 'prose-entry',
      },
      transformPasted: (slice: Slice) => new Slice(keepOwnImages(slice.content, photoUrls.current), slice.openStart, slice.openEnd),
      handleKeyDown: (_view: unknown, event: KeyboardEvent) => {
        if ((event.metaKey || event.ctrlKey) && !event.altKey && event.key.toLowerCase() === 'k') {
          event.preventDefault();
          openLinkRef.current();
          return true;
        }
        return false;
      },
    }),
    [bodyInvalid, ids.body],
  );

  const editor = useEditor({
    extensions: entryExtensions,
    content: initialBody,
    immediatelyRender: false,
    editorProps,
    onUpdate: () => markChanged('body'),
  });
  editorRef.current = editor;

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

  // ---- Link form --------------------------------------------------------------------------------
  const [link, setLink] = useState<{ open: boolean; draft: string; existing: boolean; error?: string }>({ open: false, draft: '', existing: false });
  const linkInput = useRef<HTMLInputElement>(null);
  openLinkRef.current = () => {
    const ed = editorRef.current;
    if (!ed) return;
    const href = (ed.getAttributes('link').href as string | undefined) ?? '';
    setLink({ open: true, draft: href, existing: Boolean(href) });
    requestAnimationFrame(() => linkInput.current?.focus());
  };
  const closeLink = () => {
    setLink({ open: false, draft: '', existing: false });
    editor?.commands.focus();
  };
  const applyLink = (event: FormEvent) => {
    event.preventDefault();
    if (!editor) return;
    const typed = link.draft.trim();
    if (!typed) {
      setLink((l) => ({ ...l, error: 'Type the address the link goes to.' }));
      return;
    }
    const withScheme = /^[a-z][a-z0-9+.-]*:/i.test(typed) ? typed : /^[^\s/@]+@[^\s/@]+$/.test(typed) ? `mailto:${typed}` : `https://${typed}`;
    const href = safeHref(withScheme);
    if (!href) {
      setLink((l) => ({ ...l, error: 'Use a web address (https://…, http://…) or an e-mail address (mailto:…).' }));
      return;
    }
    const { empty } = editor.state.selection;
    if (empty && !editor.isActive('link')) {
      // Links stretch as you type at their end: stop here so the next words are plain text.
      editor.chain().focus().insertContent({ type: 'text', text: typed, marks: [{ type: 'link', attrs: { href } }] }).unsetMark('link').run();
    } else {
      editor.chain().focus().extendMarkRange('link').setLink({ href }).run();
    }
    setLink({ open: false, draft: '', existing: false });
  };
  const removeLink = () => {
    editor?.chain().focus().extendMarkRange('link').unsetLink().run();
    setLink({ open: false, draft: '', existing: false });
  };

  // ---- Photo picker -------------------------------------------------------------------------------
  const dialog = useRef<HTMLDialogElement>(null);
  const photoList = photos.filter((p) => p.kind === 'photo');
  const insertPhoto = (photo: MediaView) => {
    dialog.current?.close();
    editor
      ?.chain()
      .focus()
      .setImage({
        src: photo.url,
        alt: (photo.caption || photo.name || 'Photo').slice(0, 300),
        width: photo.width ?? undefined,
        height: photo.height ?? undefined,
      })
      .run();
  };

  // ---- Conflict: keep the writer's words ---------------------------------------------------------
  const [copied, setCopied] = useState<'no' | 'yes' | 'manual'>('no');
  const myText = () => `${values.current.title}\n\n${editor ? plainText(editor.state.doc) : ''}`;
  const copyMyText = async () => {
    try {
      await navigator.clipboard.writeText(myText());
      setCopied('yes');
    } catch {
      setCopied('manual');
    }
  };
  const reloadSaved = () => {
    guardOff.current = true;
    window.location.reload();
  };

  const onTitle = (v: string) => {
    setTitle(v);
    values.current.title = v;
    if (fieldErrors.title) setFieldErrors(({ title: _t, ...rest }) => rest);
    markChanged('title');
  };
  const onOperation = (v: Operation) => {
    setOperation(v);
    values.current.operation = v;
    if (fieldErrors.operation) setFieldErrors(({ operation: _o, ...rest }) => rest);
    markChanged('operation');
  };

  return (
    <div className="space-y-4" data-entry-editor={entry.id}>
      <div className="flex flex-wrap items-end gap-x-4 gap-y-3">
        <div className="min-w-0 flex-[2_1_16rem]">
          <Field id={ids.title} label="Title" error={fieldErrors.title}>
            <input
              id={ids.title}
              className={inputClass}
              value={title}
              maxLength={ENTRY_TITLE_MAX}
              onChange={(e) => onTitle(e.target.value)}
              onBlur={() => void saveRef.current()}
              aria-invalid={Boolean(fieldErrors.title)}
              aria-describedby={describedBy(ids.title, fieldErrors.title)}
            />
          </Field>
        </div>
        <div className="min-w-0 flex-[1_1_11rem]">
          <Field id={ids.operation} label="Operation" error={fieldErrors.operation}>
            <select
              id={ids.operation}
              className={inputClass}
              value={operation}
              onChange={(e) => onOperation(e.target.value as Operation)}
              aria-invalid={Boolean(fieldErrors.operation)}
              aria-describedby={describedBy(ids.operation, fieldErrors.operation)}
            >
              {OPERATIONS.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </select>
          </Field>
        </div>
      </div>

      {state.kind === 'conflict' ? (
        <div role="alert" className="rounded-md border border-bad/50 bg-bad-soft px-4 py-3 text-sm text-graphite" data-save-conflict>
          <p className="flex items-start gap-2 font-semibold text-bad">
            <span aria-hidden="true">✕</span>
            Changed in another tab or device — your latest edits were not saved.
          </p>
          <p className="mt-1">
            {state.message} Copy your text first if you want to keep it, then reload the saved version and add your changes back.
          </p>
          <div className="mt-3 flex flex-wrap gap-2">
            <Button type="button" tone="quiet" onClick={copyMyText}>
              Copy my text
            </Button>
            <Button type="button" onClick={reloadSaved}>
              Reload the saved version
            </Button>
          </div>
          {copied === 'yes' ? (
            <p className="mt-2 font-medium text-ok">
              <span aria-hidden="true">✓</span> Your title and text are on the clipboard.
            </p>
          ) : null}
          {copied === 'manual' ? (
            <div className="mt-2 space-y-1">
              <label htmlFor={`${uid}-copy`} className="font-medium">
                The clipboard is not available here: select this text and copy it.
              </label>
              <textarea id={`${uid}-copy`} readOnly rows={6} className={inputClass} value={myText()} onFocus={(e) => e.currentTarget.select()} />
            </div>
          ) : null}
        </div>
      ) : null}

      <div>
        <span id={`${ids.body}-label`} className="mb-1 block text-sm font-semibold" onClick={() => editor?.commands.focus()}>
          Text
        </span>
        <div className="entry-editor-surface rounded-md border border-rule bg-card">
          {/* The tools and the save status stay in view while a long entry scrolls. */}
          <div className="sticky top-0 z-10 rounded-t-md border-b border-rule bg-card">
          <div className="flex flex-wrap items-center justify-between gap-x-2 gap-y-1 p-1">
            <Toolbar editor={editor} onLink={() => openLinkRef.current()} onPhoto={() => dialog.current?.showModal()} photosControls={ids.photos} />
            <SaveStatus state={state} now={now} onRetry={retryNow} />
          </div>
          {link.open ? (
            <form onSubmit={applyLink} className="flex flex-wrap items-end gap-2 border-t border-rule bg-paper-2 px-2 py-2" aria-label="Link">
              <div className="min-w-0 flex-[1_1_14rem]">
                <label htmlFor={ids.link} className="text-sm font-semibold">
                  Link address
                </label>
                <input
                  ref={linkInput}
                  id={ids.link}
                  className={inputClass}
                  inputMode="url"
                  autoComplete="url"
                  placeholder="https://…"
                  value={link.draft}
                  onChange={(e) => setLink((l) => ({ ...l, draft: e.target.value, error: undefined }))}
                  onKeyDown={(e) => {
                    if (e.key === 'Escape') {
                      e.preventDefault();
                      closeLink();
                    }
                  }}
                  aria-invalid={Boolean(link.error)}
                  aria-describedby={link.error ? `${ids.link}-error` : undefined}
                />
              </div>
              <div className="flex flex-wrap gap-2">
                <Button type="submit">{link.existing ? 'Update link' : 'Add link'}</Button>
                {link.existing ? (
                  <Button type="button" tone="danger" onClick={removeLink}>
                    Remove link
                  </Button>
                ) : null}
                <Button type="button" tone="quiet" onClick={closeLink}>
                  Cancel
                </Button>
              </div>
              {link.error ? (
                <p id={`${ids.link}-error`} className="w-full text-sm font-medium text-bad">
                  <span aria-hidden="true">✕</span> {link.error}
                </p>
              ) : null}
            </form>
          ) : null}
          </div>
          {editor ? <EditorContent editor={editor} /> : <div className="prose-entry min-h-56 px-4 py-3 text-graphite-2">Loading the editor…</div>}
        </div>
        {fieldErrors.body ? (
          <p id={`${ids.body}-error`} className="mt-1 flex items-center gap-1 text-sm font-medium text-bad" data-field-error="body">
            <span aria-hidden="true">✕</span> {fieldErrors.body}
          </p>
        ) : (
          <p id={`${ids.body}-hint`} className="mt-1 text-xs text-graphite-2">
            Saved as you write. Shortcuts: {mod}+B bold, {mod}+I italic, {mod}+K link, {mod}+Z undo.
          </p>
        )}
      </div>

      <dialog
        ref={dialog}
        id={ids.photos}
        aria-labelledby={`${ids.photos}-title`}
        className="m-auto w-[min(40rem,calc(100vw-2rem))] rounded-lg border border-rule bg-card p-0 text-graphite backdrop:bg-black/50"
        onClick={(e) => {
          if (e.target === e.currentTarget) dialog.current?.close();
        }}
        onClose={() => editor?.commands.focus()}
      >
        <div className="flex items-center justify-between gap-2 border-b border-rule px-4 py-2">
          <h2 id={`${ids.photos}-title`} className="text-lg font-semibold">
            Insert a photo
          </h2>
          <Button type="button" tone="quiet" onClick={() => dialog.current?.close()}>
            Close
          </Button>
        </div>
        <div className="max-h-[70vh] overflow-y-auto p-4">
          {photoList.length === 0 ? (
            <p className="text-sm text-graphite-2">
              This entry has no photos yet. Upload photos to the entry first; they will show up here to place in the text.
            </p>
          ) : (
            <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
              {photoList.map((photo) => (
                <li key={photo.id}>
                  <button
                    type="button"
                    onClick={() => insertPhoto(photo)}
                    className="flex w-full flex-col gap-1 rounded-md border border-rule bg-paper p-1.5 text-left text-sm hover:border-dye hover:bg-dye-soft"
                  >
                    <img src={photo.url} alt="" loading="lazy" className="aspect-[4/3] w-full rounded object-cover" />
                    <span className="line-clamp-2 min-h-10 px-0.5">{photo.caption || photo.name}</span>
                    <span className="sr-only">Insert this photo</span>
                  </button>
                </li>
              ))}
            </ul>
          )}
        </div>
      </dialog>
    </div>
  );
}

function fieldLabel(f: FieldName): string {
  return f === 'body' ? 'text' : f;
}

const noSubscribe = () => () => {};
/** "⌘" on Apple keyboards, else "Ctrl"; "Ctrl" during server rendering and hydration. */
function useModKey(): string {
  return useSyncExternalStore(
    noSubscribe,
    () => (/Mac|iPhone|iPad/.test(navigator.platform || navigator.userAgent) ? '⌘' : 'Ctrl'),
    () => 'Ctrl',
  );
}

/** The body as plain text for the clipboard: lists keep their markers and quotes their "> ". */
function plainText(doc: PMNode): string {
  const lines = (node: PMNode, prefix: string): string[] => {
    const name = node.type.name;
    if (node.isTextblock) {
      const text = node.textBetween(0, node.content.size, undefined, (leaf) => (leaf.type.name === 'hardBreak' ? '\n' : ''));
      return text.split('\n').map((line) => prefix + line);
    }
    if (name === 'image') return [`${prefix}[Photo: ${node.attrs.alt || node.attrs.src}]`];
    if (name === 'horizontalRule') return [`${prefix}———`];
    const out: string[] = [];
    node.forEach((child, _offset, i) => {
      if (name === 'bulletList' || name === 'orderedList') {
        const marker = name === 'bulletList' ? '- ' : `${Number(node.attrs.start ?? 1) + i}. `;
        lines(child, '').forEach((line, j) => out.push(prefix + (j === 0 ? marker : ' '.repeat(marker.length)) + line));
      } else {
        out.push(...lines(child, name === 'blockquote' ? `${prefix}> ` : prefix));
      }
    });
    return out;
  };
  const blocks: string[] = [];
  doc.forEach((block) => blocks.push(lines(block, '').join('\n')));
  return blocks.join('\n\n').trim();
}

function keepOwnImages(fragment: Fragment, allowed: Set<string>): Fragment {
  const kept: PMNode[] = [];
  fragment.forEach((node) => {
    if (node.type.name === 'image' && !allowed.has(String(node.attrs.src))) return;
    kept.push(node.isLeaf ? node : node.copy(keepOwnImages(node.content, allowed)));
  });
  return Fragment.fromArray(kept);
}

// ---- Save status ------------------------------------------------------------------------------------

function SaveStatus({ state, now, onRetry }: { state: SaveState; now: number; onRetry: () => void }) {
  let icon = '';
  let text: ReactNode = '';
  let tone = 'border-rule bg-paper-2 text-graphite-2';
  let retry = false;
  switch (state.kind) {
    case 'clean':
      icon = '✓';
      text = 'No changes yet';
      break;
    case 'pending':
      icon = '✎';
      text = 'Changes not saved yet';
      break;
    case 'saving':
      icon = '↻';
      text = 'Saving…';
      break;
    case 'saved':
      icon = '✓';
      text = `Saved ${formatTimeOfDay(state.at)}`;
      tone = 'border-ok/50 bg-ok-soft text-ok';
      break;
    case 'retrying': {
      const s = Math.max(0, Math.ceil((state.retryAt - now) / 1000));
      icon = '✕';
      text = `Not saved — ${state.message}; retrying${s > 0 ? ` in ${s} s` : '…'}`;
      tone = 'border-bad/50 bg-bad-soft text-bad';
      retry = true;
      break;
    }
    case 'failed':
      icon = '✕';
      text = `Not saved — ${state.message}`;
      tone = 'border-bad/50 bg-bad-soft text-bad';
      retry = true;
      break;
    case 'invalid':
      icon = '✕';
      text = `Not saved — ${state.message}`;
      tone = 'border-bad/50 bg-bad-soft text-bad';
      break;
    case 'conflict':
      icon = '✕';
      text = 'Not saved — changed elsewhere';
      tone = 'border-bad/50 bg-bad-soft text-bad';
      break;
  }
  return (
    // A fixed minimum width: the chip must not hop between rows as its words change while typing.
    <div className="ml-auto flex min-w-52 flex-wrap items-center justify-end gap-2">
      <p role="status" aria-live="polite" className={`inline-flex min-h-8 items-center gap-1.5 rounded-full border px-3 text-sm font-medium ${tone}`} data-save-state={state.kind}>
        <span aria-hidden="true" className={state.kind === 'saving' ? 'inline-block animate-spin motion-reduce:animate-none' : ''}>
          {icon}
        </span>
        {text}
      </p>
      {state.kind === 'failed' && state.signedOut ? (
        // A new tab keeps this page and its unsaved text; sign-in there comes back to this editor.
        <a href={signInHref(`${window.location.pathname}${window.location.search}`)} target="_blank" rel="noopener" className="min-h-10 rounded-md border border-rule bg-card px-3 py-2 text-sm font-semibold">
          Sign in again
        </a>
      ) : null}
      {retry ? (
        <button type="button" onClick={onRetry} className="min-h-10 rounded-md border border-rule bg-card px-3 text-sm font-semibold hover:bg-paper-2">
          Retry now
        </button>
      ) : null}
    </div>
  );
}

// ---- Toolbar -----------------------------------------------------------------------------------------

type Tool = {
  key: string;
  label: string;
  shortcut?: string;
  keys?: string;
  icon: ReactNode;
  text?: string;
  active?: boolean;
  disabled?: boolean;
  run: () => void;
  group: number;
};

function Toolbar({ editor, onLink, onPhoto, photosControls }: { editor: Editor | null; onLink: () => void; onPhoto: () => void; photosControls: string }) {
  const s = useEditorState({
    editor: editor as Editor,
    selector: ({ editor: e }) =>
      e
        ? {
            h2: e.isActive('heading', { level: 2 }),
            h3: e.isActive('heading', { level: 3 }),
            bold: e.isActive('bold'),
            italic: e.isActive('italic'),
            strike: e.isActive('strike'),
            bulletList: e.isActive('bulletList'),
            orderedList: e.isActive('orderedList'),
            blockquote: e.isActive('blockquote'),
            code: e.isActive('code'),
            codeBlock: e.isActive('codeBlock'),
            link: e.isActive('link'),
            canUndo: e.can().undo(),
            canRedo: e.can().redo(),
          }
        : null,
  });
  const [tabStop, setTabStop] = useState('h2');
  const bar = useRef<HTMLDivElement>(null);
  const mod = useModKey();
  const k = mod === '⌘' ? 'Meta' : 'Control';
  const c = () => editor!.chain().focus();

  const tools: Tool[] = [
    { key: 'h2', group: 0, label: 'H2 heading', shortcut: `${mod}+Alt+2`, keys: `${k}+Alt+2`, icon: <b>H2</b>, active: s?.h2, run: () => c().toggleHeading({ level: 2 }).run() },
    { key: 'h3', group: 0, label: 'H3 subheading', shortcut: `${mod}+Alt+3`, keys: `${k}+Alt+3`, icon: <b>H3</b>, active: s?.h3, run: () => c().toggleHeading({ level: 3 }).run() },
    { key: 'bold', group: 1, label: 'Bold', shortcut: `${mod}+B`, keys: `${k}+B`, icon: <b className="text-base">B</b>, active: s?.bold, run: () => c().toggleBold().run() },
    { key: 'italic', group: 1, label: 'Italic', shortcut: `${mod}+I`, keys: `${k}+I`, icon: <i className="font-serif text-base">I</i>, active: s?.italic, run: () => c().toggleItalic().run() },
    { key: 'strike', group: 1, label: 'Strike through', shortcut: `${mod}+Shift+S`, keys: `${k}+Shift+S`, icon: <s className="text-base">S</s>, active: s?.strike, run: () => c().toggleStrike().run() },
    { key: 'code', group: 1, label: 'Inline code', shortcut: `${mod}+E`, keys: `${k}+E`, icon: <IconCode />, active: s?.code, run: () => c().toggleCode().run() },
    { key: 'link', group: 1, label: 'Link', shortcut: `${mod}+K`, keys: `${k}+K`, icon: <IconLink />, active: s?.link, run: onLink },
    { key: 'bulletList', group: 2, label: 'Bulleted list', shortcut: `${mod}+Shift+8`, keys: `${k}+Shift+8`, icon: <IconBullets />, active: s?.bulletList, run: () => c().toggleBulletList().run() },
    { key: 'orderedList', group: 2, label: 'Numbered list', shortcut: `${mod}+Shift+7`, keys: `${k}+Shift+7`, icon: <IconNumbers />, active: s?.orderedList, run: () => c().toggleOrderedList().run() },
    { key: 'blockquote', group: 2, label: 'Quote', shortcut: `${mod}+Shift+B`, keys: `${k}+Shift+B`, icon: <IconQuote />, active: s?.blockquote, run: () => c().toggleBlockquote().run() },
    { key: 'codeBlock', group: 2, label: 'Code block', shortcut: `${mod}+Alt+C`, keys: `${k}+Alt+C`, icon: <IconCodeBlock />, active: s?.codeBlock, run: () => c().toggleCodeBlock().run() },
    { key: 'photo', group: 3, label: 'Photo', icon: <IconPhoto />, text: 'Photo', run: onPhoto },
    { key: 'undo', group: 4, label: 'Undo', shortcut: `${mod}+Z`, keys: `${k}+Z`, icon: <IconUndo />, disabled: !s?.canUndo, run: () => c().undo().run() },
    { key: 'redo', group: 4, label: 'Redo', shortcut: `${mod}+Shift+Z`, keys: `${k}+Shift+Z`, icon: <IconRedo />, disabled: !s?.canRedo, run: () => c().redo().run() },
  ];
  const enabled = tools.filter((t) => !t.disabled);
  const stop = enabled.some((t) => t.key === tabStop) ? tabStop : enabled[0].key;

  // One tab stop for the whole bar; arrow keys move along it (WAI-ARIA toolbar pattern).
  const onKeyDown = (event: ReactKeyboardEvent<HTMLDivElement>) => {
    if (!['ArrowLeft', 'ArrowRight', 'Home', 'End'].includes(event.key)) return;
    const buttons = Array.from(bar.current?.querySelectorAll<HTMLButtonElement>('button[data-tool]:not(:disabled)') ?? []);
    const at = buttons.indexOf(document.activeElement as HTMLButtonElement);
    if (at < 0) return;
    event.preventDefault();
    const next =
      event.key === 'Home' ? 0 : event.key === 'End' ? buttons.length - 1 : (at + (event.key === 'ArrowRight' ? 1 : -1) + buttons.length) % buttons.length;
    buttons[next].focus();
  };

  return (
    <div
      ref={bar}
      role="toolbar"
      aria-label="Formatting"
      onKeyDown={onKeyDown}
      className="flex flex-wrap items-center gap-0.5"
    >
      {tools.map((tool, i) => (
        <span key={tool.key} className="contents">
          {i > 0 && tools[i - 1].group !== tool.group ? <span aria-hidden="true" className="mx-0.5 h-6 w-px bg-rule" /> : null}
          <button
            type="button"
            data-tool={tool.key}
            tabIndex={tool.key === stop ? 0 : -1}
            onFocus={() => setTabStop(tool.key)}
            onMouseDown={(e) => e.preventDefault()}
            onClick={() => editor && tool.run()}
            disabled={!editor || tool.disabled}
            aria-label={tool.label}
            aria-pressed={tool.active === undefined ? undefined : Boolean(tool.active)}
            aria-keyshortcuts={tool.keys}
            aria-haspopup={tool.key === 'photo' ? 'dialog' : undefined}
            aria-controls={tool.key === 'photo' ? photosControls : undefined}
            title={tool.shortcut ? `${tool.label} (${tool.shortcut})` : tool.label}
            className="inline-flex h-10 min-w-10 items-center justify-center gap-1 rounded-md px-2 text-sm text-graphite hover:bg-paper-2 disabled:opacity-40 aria-pressed:bg-dye aria-pressed:text-on-accent"
          >
            <span aria-hidden="true" className="inline-flex items-center">
              {tool.icon}
            </span>
            {tool.text ? (
              <span aria-hidden="true" className="hidden sm:inline">
                {tool.text}
              </span>
            ) : null}
          </button>
        </span>
      ))}
    </div>
  );
}

// Our own small line icons, drawn on a 20-unit grid.
function Svg({ children }: { children: ReactNode }) {
  return (
    <svg viewBox="0 0 20 20" width="20" height="20" fill="none" stroke="currentColor" strokeWidth="1.7" strokeLinecap="round" strokeLinejoin="round">
      {children}
    </svg>
  );
}
const IconCode = () => (
  <Svg>
    <path d="M7 6 3 10l4 4M13 6l4 4-4 4" />
  </Svg>
);
const IconCodeBlock = () => (
  <Svg>
    <rect x="2.5" y="3.5" width="15" height="13" rx="1.5" />
    <path d="m7 8-2 2 2 2M13 8l2 2-2 2" />
  </Svg>
);
const IconLink = () => (
  <Svg>
    <path d="M8.5 11.5a3 3 0 0 0 4.2 0l2.6-2.6a3 3 0 0 0-4.2-4.2l-.9.9" />
    <path d="M11.5 8.5a3 3 0 0 0-4.2 0l-2.6 2.6a3 3 0 0 0 4.2 4.2l.9-.9" />
  </Svg>
);
const IconBullets = () => (
  <Svg>
    <circle cx="4" cy="5.5" r="0.9" fill="currentColor" />
    <circle cx="4" cy="10" r="0.9" fill="currentColor" />
    <circle cx="4" cy="14.5" r="0.9" fill="currentColor" />
    <path d="M8 5.5h9M8 10h9M8 14.5h9" />
  </Svg>
);
const IconNumbers = () => (
  <Svg>
    <path d="M3 4h1.5v4M3 8h3M3 12.5c0-.8.6-1.3 1.4-1.3s1.4.5 1.4 1.2c0 1.3-2.8 1.6-2.8 3.1h2.8M9 5.5h8M9 10h8M9 14.5h8" strokeWidth="1.4" />
  </Svg>
);
const IconQuote = () => (
  <Svg>
    <path d="M4 4v12" strokeWidth="2.4" />
    <path d="M8.5 6.5h8M8.5 10h8M8.5 13.5h5" />
  </Svg>
);
const IconPhoto = () => (
  <Svg>
    <rect x="2.5" y="4" width="15" height="12" rx="1.5" />
    <circle cx="7" cy="8.2" r="1.4" />
    <path d="m3 15 4.5-4.5 3 3 2.5-2.5 4.5 4.5" />
  </Svg>
);
const IconUndo = () => (
  <Svg>
    <path d="M7 5 3.5 8.5 7 12" />
    <path d="M3.5 8.5H12a4.5 4.5 0 0 1 0 9H9" />
  </Svg>
);
const IconRedo = () => (
  <Svg>
    <path d="m13 5 3.5 3.5L13 12" />
    <path d="M16.5 8.5H8a4.5 4.5 0 0 0 0 9h3" />
  </Svg>
);
