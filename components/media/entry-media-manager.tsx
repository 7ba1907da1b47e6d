'use client';

import { useId, useRef, useState, type FormEvent } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { MediaView } from '@/lib/types/log';
import { getJson, sendJson } from '@/lib/client/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { QueryIsland } from '@/components/providers';
import { inputClass } from '@/components/ui/field';
import { formatBytes } from '@/lib/media/rules';
import { formatClock } from '@/lib/chapters';
import { MediaUploader } from './media-uploader';
import { ClipLinkForm } from './clip-link-form';

const byPosition = (a: MediaView, b: MediaView) => a.position - b.position || a.id - b.id;

/** The clip's own player sits in its notes section on the same page (EntryClipSections): go there and play. */
function playClip(id: number) {
  const section = document.querySelector<HTMLElement>(`[data-clip-workbench="${id}"]`);
  if (!section) return;
  section.scrollIntoView({ behavior: 'smooth', block: 'start' });
  const video = section.querySelector('video');
  video?.focus({ preventScroll: true });
  void video?.play()?.catch(() => undefined);
}

function facts(m: MediaView): string {
  if (m.source === 'link') {
    try {
      return `Link · ${new URL(m.url).hostname.replace(/^www\./, '')}`;
    } catch {
      return 'Link';
    }
  }
  const parts: string[] = [];
  if (m.kind === 'photo' && m.width && m.height) parts.push(`${m.width} × ${m.height} px`);
  // The player's clock form (whole seconds, never rounded up), so the list and the player agree.
  if (m.kind === 'clip') parts.push(m.durationMs ? formatClock(m.durationMs) : 'length unknown');
  if (m.sizeBytes !== null) parts.push(formatBytes(m.sizeBytes));
  return parts.join(' · ');
}

/** Its lists live in TanStack Query, in an island of their own (the root layout carries no query client). */
export function EntryMediaManager(props: { entryId: number; initialMedia: MediaView[] }) {
  return (
    <QueryIsland>
      <EntryMediaManagerView {...props} />
    </QueryIsland>
  );
}

/** The builder's view of an entry's photos and clips: add, caption, reorder, delete. */
function EntryMediaManagerView({ entryId, initialMedia }: { entryId: number; initialMedia: MediaView[] }) {
  const id = useId();
  const queryClient = useQueryClient();
  const { data: media = initialMedia, error } = useQuery({
    queryKey: ['media', entryId],
    queryFn: async () => (await getJson<{ media: MediaView[] }>(`/api/entries/${entryId}/media`)).media,
    initialData: initialMedia,
  });
  const photos = media.filter((m) => m.kind === 'photo').sort(byPosition);
  const clips = media.filter((m) => m.kind === 'clip').sort(byPosition);

  const [failure, setFailure] = useState<string | null>(null);
  const [pending, setPending] = useState<MediaView | null>(null);
  const [deleting, setDeleting] = useState(false);
  const dialogRef = useRef<HTMLDialogElement>(null);
  const headings = { photo: useRef<HTMLHeadingElement>(null), clip: useRef<HTMLHeadingElement>(null) };
  const [announce, setAnnounce] = useState('');

  const refresh = () => queryClient.invalidateQueries({ queryKey: ['media', entryId] });

  async function move(item: MediaView, to: number, label: string) {
    setFailure(null);
    const res = await sendJson<{ media: MediaView }>(`/api/media/${item.id}`, 'PATCH', { position: to });
    if (!res.ok) {
      setFailure(res.error.message);
      return;
    }
    await refresh();
    setAnnounce(`“${item.name}” moved ${label}, now ${to + 1}.`);
  }

  function askDelete(item: MediaView) {
    setFailure(null);
    setPending(item);
    dialogRef.current?.showModal();
  }

  async function confirmDelete() {
    if (!pending) return;
    setDeleting(true);
    const res = await sendJson(`/api/media/${pending.id}`, 'DELETE');
    setDeleting(false);
    if (!res.ok) {
      setFailure(res.error.message);
      dialogRef.current?.close();
      return;
    }
    const kind = pending.kind;
    setAnnounce(`Deleted “${pending.name}”.`);
    dialogRef.current?.close();
    setPending(null);
    await refresh();
    // The row and its buttons are gone: put focus somewhere that still exists.
    headings[kind].current?.focus();
  }

  const section = (kind: 'photo' | 'clip', items: MediaView[]) => (
    <section aria-labelledby={`${id}-${kind}`} className="space-y-4 rounded-lg border border-rule bg-card p-4">
      <h3 id={`${id}-${kind}`} ref={headings[kind]} tabIndex={-1} className="text-lg font-bold">
        {kind === 'photo' ? 'Photos' : 'Clips'} <span className="dim text-sm font-normal text-graphite-2">({items.length})</span>
      </h3>
      {items.length ? (
        <ol className="space-y-3">
          {items.map((m, i) => (
            <MediaRow
              key={m.id}
              item={m}
              index={i}
              count={items.length}
              onMove={(to, label) => move(m, to, label)}
              onDelete={() => askDelete(m)}
              onSaved={refresh}
            />
          ))}
        </ol>
      ) : (
        <p className="text-sm text-graphite-2">{kind === 'photo' ? 'No photos in this entry yet.' : 'No clips in this entry yet.'}</p>
      )}
      <MediaUploader entryId={entryId} kind={kind} />
      {kind === 'clip' ? (
        <details className="rounded-md border border-rule p-3">
          <summary className="min-h-11 cursor-pointer content-center font-semibold">Add a clip published elsewhere</summary>
          <div className="mt-3">
            <ClipLinkForm entryId={entryId} />
          </div>
        </details>
      ) : null}
    </section>
  );

  return (
    <div className="space-y-5" data-entry-media={entryId}>
      {error ? (
        <Notice kind="error" role="alert" title="Could not refresh">
          {error.message}
        </Notice>
      ) : null}
      {failure ? (
        <Notice kind="error" role="alert" title="Not changed">
          {failure}
        </Notice>
      ) : null}
      <p className="sr-only" aria-live="polite">
        {announce}
      </p>
      {section('photo', photos)}
      {section('clip', clips)}

      <dialog
        ref={dialogRef}
        aria-labelledby={`${id}-delete-title`}
        onClose={() => setPending(null)}
        className="m-auto w-[min(28rem,calc(100vw-2rem))] rounded-lg border border-rule bg-card p-6 text-graphite backdrop:bg-black/50"
      >
        {pending ? (
          <>
            <h2 id={`${id}-delete-title`} className="text-lg font-bold">
              Delete “{pending.name}”?
            </h2>
            <p className="mt-2 text-sm text-graphite-2">
              {pending.source === 'link'
                ? 'The link and the notes pinned to this clip are removed from the log. The video itself stays where it is published.'
                : pending.kind === 'photo'
                  ? 'The photo is removed from the log and from storage for good.'
                  : 'The clip, its stored file and the notes pinned to it are removed for good.'}
            </p>
            <div className="mt-5 flex flex-wrap justify-end gap-2">
              <Button type="button" tone="quiet" onClick={() => dialogRef.current?.close()} autoFocus>
                Keep it
              </Button>
              <Button type="button" tone="danger" onClick={confirmDelete} disabled={deleting}>
                {deleting ? 'Deleting…' : 'Yes, delete'}
              </Button>
            </div>
          </>
        ) : null}
      </dialog>
    </div>
  );
}

function MediaRow({
  item,
  index,
  count,
  onMove,
  onDelete,
  onSaved,
}: {
  item: MediaView;
  index: number;
  count: number;
  onMove: (to: number, label: string) => void;
  onDelete: () => void;
  onSaved: () => Promise<unknown>;
}) {
  const kindWord = item.kind === 'photo' ? 'photo' : 'clip';
  return (
    <li className="flex flex-col gap-3 rounded-md border border-rule bg-paper p-3 sm:flex-row sm:items-start" data-media-id={item.id}>
      <div className="w-full shrink-0 sm:w-32">
        {item.kind === 'photo' ? (
          <img src={item.url} alt="" width={item.width ?? undefined} height={item.height ?? undefined} loading="lazy" decoding="async" className="block h-auto max-h-48 w-full rounded border border-rule object-contain sm:max-h-32" />
        ) : (
          <button
            type="button"
            onClick={() => playClip(item.id)}
            aria-label={`Play ${item.source === 'link' ? 'linked clip' : 'clip'} “${item.name}” in its player below`}
            className="flex h-16 w-full items-center justify-center gap-2 rounded border border-rule bg-paper-2 text-graphite-2 hover:border-dye hover:text-dye sm:aspect-video sm:h-auto"
          >
            <span aria-hidden="true">▶</span>
            <span className="text-xs font-semibold">{item.source === 'link' ? 'Linked clip' : 'Clip'}</span>
          </button>
        )}
      </div>
      <div className="min-w-0 flex-1 space-y-2">
        <div>
          <p className="truncate font-semibold" title={item.name}>
            <span className="dim mr-2 text-graphite-2">{index + 1}.</span>
            {item.name}
          </p>
          <p className="dim text-xs text-graphite-2">{facts(item)}</p>
        </div>
        <CaptionEditor item={item} onSaved={onSaved} />
        <div className="flex flex-wrap gap-2">
          <Button type="button" tone="quiet" disabled={index === 0} onClick={() => onMove(index - 1, 'up')} aria-label={`Move ${kindWord} “${item.name}” up`}>
            <span aria-hidden="true">↑</span> Up
          </Button>
          <Button type="button" tone="quiet" disabled={index === count - 1} onClick={() => onMove(index + 1, 'down')} aria-label={`Move ${kindWord} “${item.name}” down`}>
            <span aria-hidden="true">↓</span> Down
          </Button>
          <Button type="button" tone="danger" onClick={onDelete} aria-label={`Delete ${kindWord} “${item.name}”`}>
            Delete
          </Button>
        </div>
      </div>
    </li>
  );
}

function CaptionEditor({ item, onSaved }: { item: MediaView; onSaved: () => Promise<unknown> }) {
  const id = useId();
  const [value, setValue] = useState(item.caption);
  const [state, setState] = useState<{ kind: 'idle' | 'saving' | 'saved' } | { kind: 'error'; message: string }>({ kind: 'idle' });
  const changed = value.trim() !== item.caption;

  async function save(e: FormEvent) {
    e.preventDefault();
    setState({ kind: 'saving' });
    const res = await sendJson<{ media: MediaView }>(`/api/media/${item.id}`, 'PATCH', { caption: value });
    if (!res.ok) {
      setState({ kind: 'error', message: res.error.fieldErrors?.caption?.[0] ?? res.error.message });
      return;
    }
    setState({ kind: 'saved' });
    await onSaved();
  }

  return (
    <form onSubmit={save} className="flex flex-col gap-2 sm:flex-row sm:items-end" aria-label={`Caption for “${item.name}”`}>
      <div className="flex-1">
        <label htmlFor={`${id}-caption`} className="text-sm font-semibold">
          Caption
        </label>
        <input
          id={`${id}-caption`}
          className={inputClass}
          value={value}
          maxLength={300}
          onChange={(e) => {
            setValue(e.target.value);
            if (state.kind !== 'saving') setState({ kind: 'idle' });
          }}
          aria-invalid={state.kind === 'error'}
          aria-describedby={state.kind === 'error' ? `${id}-error` : undefined}
        />
      </div>
      <Button type="submit" tone="quiet" disabled={!changed || state.kind === 'saving'}>
        {state.kind === 'saving' ? 'Saving…' : 'Save caption'}
      </Button>
      {state.kind === 'error' ? (
        <p id={`${id}-error`} className="text-sm font-medium text-bad">
          <span aria-hidden="true">✕</span> {state.message}
        </p>
      ) : null}
      {state.kind === 'saved' && !changed ? (
        <p role="status" className="text-sm text-ok">
          <span aria-hidden="true">✓</span> Saved
        </p>
      ) : null}
    </form>
  );
}
