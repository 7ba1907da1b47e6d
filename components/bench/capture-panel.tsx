'use client';

import { useEffect, useId, useState } from 'react';
import { contentRefusal, sniffMedia, SNIFF_BYTES } from '@/lib/media/sniff';
import { sizeRefusal } from '@/lib/media/rules';
import { formatTimeOfDay } from '@/lib/format';

type Taken = { file: File; kind: 'photo' | 'clip'; mime: string; takenAt: Date; preview: string | null };

export type Kept = { blob: Blob; name: string; kind: 'photo' | 'clip'; mime: string; takenAt: Date; note: string };

/** What the camera gave, checked on the phone (size, then what its first bytes say it is). */
async function check(file: File): Promise<{ kind: 'photo' | 'clip'; mime: string } | { error: string }> {
  let head: Uint8Array;
  try {
    head = new Uint8Array(await file.slice(0, SNIFF_BYTES).arrayBuffer());
  } catch {
    return { error: `“${file.name}” could not be read on this phone.` };
  }
  const sniffed = sniffMedia(head);
  const kind = sniffed?.kind === 'clip' ? 'clip' : 'photo';
  const wrong = contentRefusal(sniffed, kind, file.name) ?? sizeRefusal(kind, file.name, file.size);
  if (wrong || !sniffed) return { error: wrong ?? `“${file.name}” could not be read.` };
  return { kind, mime: sniffed.mime };
}

const big = 'min-h-12 rounded-md px-4 font-semibold';

/**
 * A photo or short clip straight from the phone's camera, with a note and the time it was taken, and a
 * note on its own; both go into the session through the queue.
 */
export function CapturePanel({ entryTitle, onPhoto, onNote, disabled }: { entryTitle: string | null; onPhoto: (k: Kept) => Promise<void>; onNote: (text: string) => Promise<void>; disabled?: boolean }) {
  const id = useId();
  const [taken, setTaken] = useState<Taken | null>(null);
  const [noteOpen, setNoteOpen] = useState(false);
  const [text, setText] = useState('');
  const [problem, setProblem] = useState('');

  useEffect(() => () => {
    if (taken?.preview) URL.revokeObjectURL(taken.preview);
  }, [taken]);

  const close = () => {
    setTaken(null);
    setNoteOpen(false);
    setText('');
  };

  return (
    <section aria-label="Photos and notes" className="space-y-2">
      {!taken && !noteOpen ? (
        <div className="flex gap-2">
          {entryTitle ? (
            <label className={`${big} flex flex-1 cursor-pointer items-center justify-center gap-2 border border-rule bg-card ${disabled ? 'pointer-events-none opacity-50' : ''}`}>
              <CameraIcon />
              Photo or clip
              <input
                type="file"
                accept="image/*,video/*"
                capture="environment"
                className="sr-only"
                disabled={disabled}
                onChange={async (e) => {
                  const file = e.currentTarget.files?.[0];
                  e.currentTarget.value = '';
                  if (!file) return;
                  const takenAt = new Date();
                  setProblem('');
                  const checked = await check(file);
                  if ('error' in checked) return setProblem(checked.error);
                  setTaken({ file, ...checked, takenAt, preview: checked.kind === 'photo' ? URL.createObjectURL(file) : null });
                }}
              />
            </label>
          ) : null}
          <button type="button" disabled={disabled} className={`${big} flex-1 border border-rule bg-card disabled:opacity-50`} onClick={() => setNoteOpen(true)}>
            Note
          </button>
        </div>
      ) : (
        <form
          className="space-y-2 rounded-md border border-dye bg-card p-3"
          onSubmit={async (e) => {
            e.preventDefault();
            if (taken) {
              await onPhoto({ blob: taken.file, name: taken.file.name || `bench-${taken.takenAt.getTime()}`, kind: taken.kind, mime: taken.mime, takenAt: taken.takenAt, note: text.trim() });
            } else {
              if (!text.trim()) return setProblem('Write the note first.');
              await onNote(text.trim());
            }
            setProblem('');
            close();
          }}
        >
          {taken ? (
            <div className="flex items-center gap-3">
              {taken.preview ? (
                <img src={taken.preview} alt="The photo just taken" className="h-16 w-16 rounded object-cover" />
              ) : (
                <span className="rounded border border-rule px-2 py-1 text-sm">Clip</span>
              )}
              <p className="text-sm">
                {taken.kind === 'clip' ? 'Clip' : 'Photo'} taken at {formatTimeOfDay(taken.takenAt)}, for “{entryTitle}”.
              </p>
            </div>
          ) : null}
          <label htmlFor={`${id}-note`} className="block text-sm font-semibold">
            {taken ? 'Note with it (optional)' : 'Note for “What got done”'}
          </label>
          <textarea id={`${id}-note`} value={text} onChange={(e) => setText(e.target.value)} rows={2} maxLength={taken ? 280 : 1000} className="w-full rounded-md border border-rule bg-paper p-2 text-base" />
          <div className="flex gap-2">
            <button type="submit" className={`${big} flex-1 bg-dye text-on-accent`}>
              {taken ? (taken.kind === 'clip' ? 'Keep clip' : 'Keep photo') : 'Keep note'}
            </button>
            <button type="button" className={`${big} border border-rule bg-card`} onClick={close}>
              Cancel
            </button>
          </div>
        </form>
      )}
      {problem ? (
        <p role="alert" className="text-sm font-semibold text-bad">
          <span aria-hidden="true">✕ </span>
          {problem}
        </p>
      ) : null}
    </section>
  );
}

function CameraIcon() {
  return (
    <svg aria-hidden="true" width="22" height="22" viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round">
      <path d="M4 8h3l2-3h6l2 3h3v11H4z" />
      <circle cx="12" cy="13" r="3.5" />
    </svg>
  );
}
