'use client';

import './prose-entry.css';
import { useId, useMemo, useRef, useState, type FormEvent } from 'react';
import { EditorContent, useEditor } from '@tiptap/react';
import { Fragment, Slice, type Node as PMNode } from '@tiptap/pm/model';
import { entryExtensions, safeHref } from '@/lib/rich-text/extensions';
import { ENTRY_TITLE_MAX, OPERATIONS, type Operation } from '@/lib/validations/log';
import type { MediaView } from '@/lib/types/log';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { useEntryAutosave } from './use-entry-autosave';
import { SaveStatus } from './save-status';
import { Toolbar, useModKey } from './editor-toolbar';

export type EditableEntry = { id: number; title: string; operation: Operation; body: Record<string, unknown>; version: number };

type Props = {
  entry: EditableEntry;
  /** The entry's own media; its photos are what "Insert photo" offers. */
  photos: MediaView[];
  /** Where edits are sent; the entry's JSON route unless told otherwise. */
  saveUrl?: string;
};

export function EntryEditor({ entry, photos, saveUrl }: Props) {
  const url = saveUrl ?? `/api/entries/${entry.id}`;
  const mod = useModKey();
  const uid = useId();
  const ids = { title: `${uid}-title`, operation: `${uid}-operation`, body: `${uid}-body`, link: `${uid}-link`, photos: `${uid}-photos` };

  // Later props (a server refresh after an upload) must never reset what is being typed.
  const [initialBody] = useState(entry.body);
  const [title, setTitle] = useState(entry.title);
  const [operation, setOperation] = useState<Operation>(entry.operation);
  const { state, now, fieldErrors, setFieldErrors, saveRef, markChanged, changeField, retryNow, stopGuarding, setEditor, currentTitle } = useEntryAutosave(url, entry);

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
  setEditor(editor);

  // ---- Link form --------------------------------------------------------------------------------
  const [link, setLink] = useState<{ open: boolean; draft: string; existing: boolean; error?: string }>({ open: false, draft: '', existing: false });
  const linkInput = useRef<HTMLInputElement>(null);
  openLinkRef.current = () => {
    const ed = editor;
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
  const myText = () => `${currentTitle()}\n\n${editor ? plainText(editor.state.doc) : ''}`;
  const copyMyText = async () => {
    try {
      await navigator.clipboard.writeText(myText());
      setCopied('yes');
    } catch {
      setCopied('manual');
    }
  };
  const reloadSaved = () => {
    stopGuarding();
    window.location.reload();
  };

  const onTitle = (v: string) => {
    setTitle(v);
    if (fieldErrors.title) setFieldErrors(({ title: _t, ...rest }) => rest);
    changeField('title', v);
  };
  const onOperation = (v: Operation) => {
    setOperation(v);
    if (fieldErrors.operation) setFieldErrors(({ operation: _o, ...rest }) => rest);
    changeField('operation', v);
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
