'use client';

import { useId, useRef, useState, type ChangeEvent } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { generateReactHelpers } from '@uploadthing/react';
import { UploadAbortedError } from 'uploadthing/client';
import type { OurFileRouter } from '@/app/api/uploadthing/core';
import type { MediaView } from '@/lib/types/log';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { contentRefusal, sniffMedia, SNIFF_BYTES } from '@/lib/media/sniff';
import { CLIP_ACCEPT, CLIP_BATCH, durationRefusal, formatBytes, maxBytesFor, PHOTO_ACCEPT, PHOTO_BATCH, sizeRefusal } from '@/lib/media/rules';

const { useUploadThing } = generateReactHelpers<OurFileRouter>();

type Kind = 'photo' | 'clip';
/** serverData of each uploaded file, as app/api/uploadthing/core.ts returns it. */
type Outcome = { ok: true; media: MediaView } | { ok: false; message: string };
type Checked = { file: File; durationMs?: number };

/**
 * Reads a clip's length the way its viewers' browsers will: from a <video> element's metadata.
 * Undefined when this browser cannot read the file (the server then keeps the clip without a length).
 */
export function readClipDuration(file: Blob, timeoutMs = 15_000): Promise<number | undefined> {
  return new Promise((resolve) => {
    const url = URL.createObjectURL(file);
    const video = document.createElement('video');
    video.preload = 'metadata';
    video.muted = true;
    let settled = false;
    const finish = (ms?: number) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      video.removeAttribute('src');
      video.load();
      URL.revokeObjectURL(url);
      resolve(ms);
    };
    const timer = setTimeout(() => finish(undefined), timeoutMs);
    const report = () => {
      if (Number.isFinite(video.duration) && video.duration > 0) finish(Math.round(video.duration * 1000));
    };
    video.addEventListener('loadedmetadata', () => {
      if (Number.isFinite(video.duration)) {
        if (video.duration > 0) report();
        else finish(undefined);
        return;
      }
      // Clips recorded in a browser often carry no length: seeking past the end makes it find one.
      video.addEventListener('durationchange', report);
      video.currentTime = Number.MAX_SAFE_INTEGER;
    });
    video.addEventListener('error', () => finish(undefined));
    video.src = url;
  });
}

/** Checks a file on this device before any byte is sent: size, then what its first bytes say it is. */
async function checkOnDevice(file: File, kind: Kind): Promise<Checked | { error: string }> {
  const tooBig = sizeRefusal(kind, file.name, file.size);
  if (tooBig) return { error: tooBig };
  let head: Uint8Array;
  try {
    head = new Uint8Array(await file.slice(0, SNIFF_BYTES).arrayBuffer());
  } catch {
    return { error: `“${file.name}” could not be read on this device.` };
  }
  const sniffed = sniffMedia(head);
  const wrong = contentRefusal(sniffed, kind, file.name);
  if (wrong || !sniffed) return { error: wrong ?? `“${file.name}” could not be read.` };
  // Declare the type the content has, not the one the name suggests, so the server's checks agree.
  const typed = file.type === sniffed.mime ? file : new File([file], file.name, { type: sniffed.mime, lastModified: file.lastModified });
  if (kind === 'photo') return { file: typed };
  const durationMs = await readClipDuration(file);
  if (durationMs !== undefined) {
    const implausible = durationRefusal(file.name, file.size, durationMs);
    if (implausible) return { error: implausible };
  }
  return { file: typed, durationMs };
}

/** The parts of the SDK's UploadThingError the message is made from. */
type UploadFailure = { code: string; message: string; data?: unknown };

function messageOf(e: UploadFailure): string {
  const data = e.data as { error?: unknown } | undefined;
  if (e.code === 'UPLOAD_FAILED') {
    return typeof data?.error === 'string'
      ? `The upload service did not keep the file: ${data.error}`
      : 'The upload did not finish. Check your connection and try again.';
  }
  if (e.code === 'INTERNAL_CLIENT_ERROR') return 'Could not reach Scribeline. Check your connection and try again.';
  return e.message;
}

const WORDS: Record<Kind, { add: string; capture: string; one: string; many: string; hint: string }> = {
  photo: { add: 'Add photo', capture: 'Take photo', one: 'photo', many: 'photos', hint: `JPEG, PNG, WebP or GIF, up to ${formatBytes(maxBytesFor('photo'))} each.` },
  clip: { add: 'Add clip', capture: 'Record clip', one: 'clip', many: 'clips', hint: `MP4, MOV or WebM, up to ${formatBytes(maxBytesFor('clip'))}.` },
};

/** Adds photos or clips to an entry: from the files on the device or straight from its camera. */
export function MediaUploader({ entryId, kind, onUploaded }: { entryId: number; kind: Kind; onUploaded?: (m: MediaView) => void }) {
  const words = WORDS[kind];
  const id = useId();
  const queryClient = useQueryClient();
  const pickRef = useRef<HTMLInputElement>(null);
  const captureRef = useRef<HTMLInputElement>(null);
  // A fresh controller per upload; the hook reads the signal from the latest render.
  const [controller, setController] = useState(() => new AbortController());
  const [phase, setPhase] = useState<'idle' | 'checking' | 'sending' | 'verifying'>('idle');
  const [progress, setProgress] = useState(0);
  const [sending, setSending] = useState('');
  const [problems, setProblems] = useState<string[]>([]);
  const [added, setAdded] = useState<string | null>(null);
  const failures = useRef<string[]>([]);

  const { startUpload } = useUploadThing(kind === 'photo' ? 'entryPhoto' : 'entryClip', {
    signal: controller.signal,
    uploadProgressGranularity: 'fine',
    onUploadProgress: (p) => {
      setProgress(p);
      if (p >= 100) setPhase('verifying');
    },
    onUploadError: (e) => {
      failures.current.push(messageOf(e));
    },
  });

  async function handleFiles(list: FileList | null) {
    const files = list ? Array.from(list) : [];
    if (!files.length) return;
    setProblems([]);
    setAdded(null);
    setPhase('checking');
    const refusals: string[] = [];
    const ready: Checked[] = [];
    for (const file of files) {
      const checked = await checkOnDevice(file, kind);
      if ('error' in checked) refusals.push(checked.error);
      else ready.push(checked);
    }
    const kept: MediaView[] = [];
    const batch = kind === 'photo' ? PHOTO_BATCH : CLIP_BATCH;
    try {
      for (let i = 0; i < ready.length; i += batch) {
        const group = ready.slice(i, i + batch);
        setSending(group.length === 1 ? `“${group[0].file.name}”` : `${group.length} ${words.many}`);
        setProgress(0);
        setPhase('sending');
        failures.current = [];
        const results = await startUpload(
          group.map((c) => c.file),
          { entryId, durationMs: kind === 'clip' ? group[0].durationMs : undefined },
        );
        refusals.push(...failures.current);
        for (const r of results ?? []) {
          const outcome = r.serverData as Outcome | null;
          if (outcome?.ok) kept.push(outcome.media);
          else refusals.push(outcome?.message ?? `“${r.name}” was not saved. Please try again.`);
        }
      }
    } catch (err) {
      if (err instanceof UploadAbortedError) refusals.push('Upload cancelled: nothing was added from it.');
      else refusals.push('The upload stopped unexpectedly. Please try again.');
    } finally {
      setController(new AbortController());
      setPhase('idle');
    }
    if (kept.length) {
      await queryClient.invalidateQueries({ queryKey: ['media', entryId] });
      for (const m of kept) onUploaded?.(m);
      setAdded(kept.length === 1 ? `Added “${kept[0].name}”.` : `Added ${kept.length} ${words.many}.`);
    }
    setProblems(refusals);
  }

  const busy = phase !== 'idle';
  const onChange = (e: ChangeEvent<HTMLInputElement>) => {
    const files = e.currentTarget.files;
    void handleFiles(files).finally(() => {
      // Lets the same file be chosen again after a refusal.
      e.target.value = '';
    });
  };

  return (
    <div className="space-y-3" data-media-uploader={kind}>
      <div className="flex flex-wrap gap-2">
        <Button type="button" className="min-h-12 min-w-40" disabled={busy} onClick={() => pickRef.current?.click()} aria-describedby={`${id}-hint`}>
          <span aria-hidden="true" className="text-lg leading-none">
            +
          </span>
          {words.add}
        </Button>
        <Button type="button" tone="quiet" className="min-h-12 min-w-40" disabled={busy} onClick={() => captureRef.current?.click()}>
          <CameraIcon />
          {words.capture}
        </Button>
      </div>
      <input
        ref={pickRef}
        type="file"
        className="sr-only"
        tabIndex={-1}
        aria-hidden="true"
        accept={kind === 'photo' ? PHOTO_ACCEPT : CLIP_ACCEPT}
        multiple={kind === 'photo'}
        onChange={onChange}
      />
      <input
        ref={captureRef}
        type="file"
        className="sr-only"
        tabIndex={-1}
        aria-hidden="true"
        accept={kind === 'photo' ? 'image/*' : 'video/*'}
        capture="environment"
        onChange={onChange}
      />
      <p id={`${id}-hint`} className="text-xs text-graphite-2">
        {words.hint}
      </p>

      {phase === 'checking' ? (
        <p role="status" className="text-sm">
          Checking {words.many} on this device…
        </p>
      ) : null}
      {phase === 'sending' || phase === 'verifying' ? (
        <div className="space-y-2 rounded-md border border-rule bg-card p-3">
          <div className="flex items-baseline justify-between gap-3 text-sm">
            <span id={`${id}-progress`}>
              {phase === 'sending' ? <>Uploading {sending}</> : <>Checking {sending} on the server…</>}
            </span>
            <span className="dim font-semibold">{progress}%</span>
          </div>
          <div
            role="progressbar"
            aria-labelledby={`${id}-progress`}
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={progress}
            aria-valuetext={`${progress} percent`}
            className="h-3 overflow-hidden rounded-full border border-rule bg-paper-2"
          >
            <div className="h-full bg-dye transition-[width] duration-200" style={{ width: `${progress}%` }} />
          </div>
          {phase === 'sending' ? (
            <Button type="button" tone="quiet" onClick={() => controller.abort()}>
              Cancel upload
            </Button>
          ) : null}
        </div>
      ) : null}

      {problems.length ? (
        <Notice kind="error" role="alert" title={problems.length === 1 ? 'Not added' : `${problems.length} not added`}>
          <ul className="list-none space-y-1">
            {problems.map((p, i) => (
              <li key={i}>{p}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
      {added ? (
        <Notice kind="success" role="status">
          {added}
        </Notice>
      ) : null}
    </div>
  );
}

function CameraIcon() {
  return (
    <svg aria-hidden="true" width="20" height="20" viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round">
      <path d="M4 8h3l2-3h6l2 3h3v11H4z" />
      <circle cx="12" cy="13" r="3.5" />
    </svg>
  );
}
