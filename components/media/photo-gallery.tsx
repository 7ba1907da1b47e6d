'use client';

import { useCallback, useId, useRef, useState, type KeyboardEvent, type MouseEvent, type PointerEvent } from 'react';
import type { MediaView } from '@/lib/types/log';

const SWIPE_PX = 40;

const altOf = (p: MediaView) => p.caption || p.name;

/**
 * An entry's photos at their own proportions, and a full-size view: a modal dialog that pages with
 * ←/→ or a swipe, closes with Esc, keeps focus inside while open and gives it back on close.
 * Reads nothing but the photos it is given, so published logs can use it as is.
 */
export function PhotoGallery({ photos }: { photos: MediaView[] }) {
  const id = useId();
  const dialogRef = useRef<HTMLDialogElement>(null);
  const thumbs = useRef<Array<HTMLAnchorElement | null>>([]);
  const swipe = useRef<{ x: number; y: number; pointer: number } | null>(null);
  const [index, setIndex] = useState(0);
  const count = photos.length;
  const current = photos[Math.min(index, count - 1)];

  const openAt = (i: number) => {
    setIndex(i);
    dialogRef.current?.showModal();
  };
  const step = useCallback((delta: number) => setIndex((i) => (i + delta + count) % count), [count]);
  const close = () => dialogRef.current?.close();

  // Escape closes the dialog natively; either way focus goes back to the photo last shown.
  const onClose = () => thumbs.current[index]?.focus();

  const onKeyDown = (e: KeyboardEvent<HTMLDialogElement>) => {
    if (e.key === 'ArrowRight') {
      e.preventDefault();
      step(1);
    } else if (e.key === 'ArrowLeft') {
      e.preventDefault();
      step(-1);
    } else if (e.key === 'Tab') {
      // Keep Tab cycling among the dialog's own controls rather than leaving for the browser's.
      const focusable = Array.from(e.currentTarget.querySelectorAll<HTMLElement>('button:not([disabled])'));
      if (!focusable.length) return;
      const first = focusable[0];
      const last = focusable[focusable.length - 1];
      if (e.shiftKey && document.activeElement === first) {
        e.preventDefault();
        last.focus();
      } else if (!e.shiftKey && document.activeElement === last) {
        e.preventDefault();
        first.focus();
      }
    }
  };

  const onPointerDown = (e: PointerEvent<HTMLDivElement>) => {
    if (e.pointerType === 'mouse') return;
    swipe.current = { x: e.clientX, y: e.clientY, pointer: e.pointerId };
  };
  const onPointerUp = (e: PointerEvent<HTMLDivElement>) => {
    const start = swipe.current;
    swipe.current = null;
    if (!start || start.pointer !== e.pointerId) return;
    const dx = e.clientX - start.x;
    const dy = e.clientY - start.y;
    if (Math.abs(dx) >= SWIPE_PX && Math.abs(dx) > Math.abs(dy)) step(dx < 0 ? 1 : -1);
  };

  if (!count || !current) return null;

  return (
    <>
      <ul className="grid grid-cols-2 items-start gap-3 sm:grid-cols-3" aria-label={count === 1 ? 'Photo' : `${count} photos`}>
        {photos.map((p, i) => (
          <li key={p.id}>
            <figure className="space-y-1">
              {/* A link to the photo itself (a new tab, or no script, opens it there), which opens the full-size view here; on paper it is just the photo. */}
              <a
                ref={(el) => {
                  thumbs.current[i] = el;
                }}
                href={p.url}
                onClick={(e: MouseEvent<HTMLAnchorElement>) => {
                  if (e.metaKey || e.ctrlKey || e.shiftKey || e.altKey || e.button !== 0) return;
                  e.preventDefault();
                  openAt(i);
                }}
                className="block w-full cursor-zoom-in overflow-hidden rounded-md border border-rule bg-paper-2 no-underline"
              >
                {/* Plain img with its own width and height: the box keeps the photo's proportions before it loads. */}
                <img src={p.url} alt={altOf(p)} width={p.width ?? undefined} height={p.height ?? undefined} loading="lazy" decoding="async" className="block h-auto w-full" />
                <span className="sr-only">, open full size (photo {i + 1} of {count})</span>
              </a>
              {p.caption ? <figcaption className="text-sm text-graphite-2">{p.caption}</figcaption> : null}
            </figure>
          </li>
        ))}
      </ul>

      <dialog
        ref={dialogRef}
        aria-labelledby={`${id}-title`}
        aria-describedby={current.caption ? `${id}-caption` : undefined}
        onKeyDown={onKeyDown}
        onClose={onClose}
        className="fixed inset-0 m-0 h-dvh max-h-none w-screen max-w-none bg-[#101214] p-0 text-[#f2efe8] backdrop:bg-black/80"
        data-photo-lightbox
      >
        <div className="flex h-full flex-col">
          <div className="flex items-center justify-between gap-3 px-3 py-2">
            <h2 id={`${id}-title`} className="dim text-sm font-semibold" aria-live="polite">
              Photo {index + 1} of {count}
            </h2>
            <button type="button" onClick={close} autoFocus className="inline-flex min-h-11 min-w-11 items-center justify-center gap-2 rounded-md border border-white/30 px-3 text-sm font-semibold hover:bg-white/10">
              <span aria-hidden="true">✕</span> Close
            </button>
          </div>

          <div
            className="relative flex min-h-0 flex-1 touch-pan-y items-center justify-center px-2 select-none"
            onPointerDown={onPointerDown}
            onPointerUp={onPointerUp}
            onPointerCancel={() => (swipe.current = null)}
          >
            <img
              key={current.id}
              src={current.url}
              alt={altOf(current)}
              width={current.width ?? undefined}
              height={current.height ?? undefined}
              draggable={false}
              className="block h-auto max-h-full w-auto max-w-full object-contain"
            />
          </div>

          <div className="space-y-2 px-3 py-3">
            {current.caption ? (
              <p id={`${id}-caption`} className="text-center text-sm">
                {current.caption}
              </p>
            ) : null}
            {count > 1 ? (
              <div className="flex items-center justify-center gap-3">
                <button type="button" onClick={() => step(-1)} className="inline-flex min-h-12 min-w-28 items-center justify-center gap-2 rounded-md border border-white/30 px-4 font-semibold hover:bg-white/10">
                  <span aria-hidden="true">←</span> Previous
                </button>
                <button type="button" onClick={() => step(1)} className="inline-flex min-h-12 min-w-28 items-center justify-center gap-2 rounded-md border border-white/30 px-4 font-semibold hover:bg-white/10">
                  Next <span aria-hidden="true">→</span>
                </button>
              </div>
            ) : null}
            <p className="text-center text-xs text-white/60">{count > 1 ? 'Arrow keys or a swipe move between photos; Esc closes.' : 'Esc closes.'}</p>
          </div>
        </div>
      </dialog>
    </>
  );
}
