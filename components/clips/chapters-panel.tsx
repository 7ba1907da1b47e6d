'use client';

import { useEffect, useId, useRef, useState, type ChangeEvent } from 'react';
import { formatClock, toTimestampList } from '@/lib/chapters';
import type { NoteView } from '@/lib/types/log';
import { CAPTION_FILE_MAX_BYTES } from '@/lib/validations/log-words';
import { sendJson } from '@/lib/client/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

type ImportAnswer = { created: NoteView[]; problems: { line: number; reason: string }[]; problemsNotListed: number };
type ImportState =
  | { state: 'idle' }
  | { state: 'reading'; fileName: string }
  | { state: 'done'; fileName: string; answer: ImportAnswer }
  | { state: 'failed'; fileName: string; message: string; lines: string[] };

type Props = {
  clipId: number;
  notes: NoteView[];
  canEdit: boolean;
  onImported: (created: NoteView[]) => void;
};

const linkButton =
  'inline-flex min-h-11 items-center justify-center gap-2 rounded-md border border-rule bg-card px-4 py-2 text-sm font-semibold text-graphite no-underline hover:bg-paper-2';

export function ChaptersPanel({ clipId, notes, canEdit, onImported }: Props) {
  const id = useId();
  const list = toTimestampList(notes);
  const [copied, setCopied] = useState<'copied' | 'failed' | null>(null);
  const [imp, setImp] = useState<ImportState>({ state: 'idle' });
  const listRef = useRef<HTMLTextAreaElement>(null);
  const fileRef = useRef<HTMLInputElement>(null);

  useEffect(() => {
    if (!copied) return;
    const t = setTimeout(() => setCopied(null), 2500);
    return () => clearTimeout(t);
  }, [copied]);

  async function copy() {
    try {
      await navigator.clipboard.writeText(list);
      setCopied('copied');
    } catch {
      // No clipboard access (an insecure origin, or refused): select the text so Ctrl+C works.
      listRef.current?.focus();
      listRef.current?.select();
      setCopied('failed');
    }
  }

  async function onFile(e: ChangeEvent<HTMLInputElement>) {
    const file = e.target.files?.[0];
    e.target.value = '';
    if (!file) return;
    if (file.size > CAPTION_FILE_MAX_BYTES) {
      setImp({ state: 'failed', fileName: file.name, message: `${file.name} is larger than 1 MB; a chapter or caption file is far smaller. Check that you picked the right file.`, lines: [] });
      return;
    }
    setImp({ state: 'reading', fileName: file.name });
    const text = await file.text();
    const res = await sendJson<ImportAnswer>(`/api/media/${clipId}/notes/import`, 'POST', { fileName: file.name, text });
    if (!res.ok) {
      setImp({ state: 'failed', fileName: file.name, message: res.error.message, lines: res.error.fieldErrors?.text ?? [] });
      return;
    }
    setImp({ state: 'done', fileName: file.name, answer: res.data });
    onImported(res.data.created);
  }

  return (
    <section aria-labelledby={`${id}-title`} className="space-y-4 rounded-lg border border-rule bg-paper-2/50 p-4">
      <div>
        <h3 id={`${id}-title`} className="text-lg font-semibold">
          Chapters
        </h3>
        <p className="text-sm text-graphite-2">
          {canEdit ? 'This clip’s notes as WebVTT chapters (the player offers them too) or as a timestamp list to copy.' : 'This clip’s notes as WebVTT chapters or a timestamp list.'}
        </p>
      </div>

      {notes.length ? (
        <div className="space-y-3">
          <div className="flex flex-wrap gap-2">
            <a className={linkButton} href={`/api/media/${clipId}/chapters?format=vtt`} download>
              <span aria-hidden="true">⤓</span> Download WebVTT chapters (.vtt)
            </a>
            <Button type="button" tone="quiet" onClick={() => void copy()} aria-describedby={`${id}-copy-state`}>
              {copied === 'copied' ? (
                <span aria-hidden="true">✓</span>
              ) : (
                <svg viewBox="0 0 20 20" aria-hidden="true" className="h-4 w-4" fill="none" stroke="currentColor" strokeWidth="1.8">
                  <rect x="7" y="7" width="10" height="10" rx="1.5" />
                  <path d="M13 4.5V4a1 1 0 0 0-1-1H4a1 1 0 0 0-1 1v8a1 1 0 0 0 1 1h.5" />
                </svg>
              )}
              {copied === 'copied' ? 'Copied' : 'Copy the timestamp list'}
            </Button>
            <span id={`${id}-copy-state`} role="status" className="self-center text-sm">
              {copied === 'copied' ? 'The list is on your clipboard.' : copied === 'failed' ? 'Copying was refused: the list is selected, press Ctrl+C (⌘C).' : ''}
            </span>
          </div>
          <label htmlFor={`${id}-list`} className="block text-sm font-semibold">
            Timestamp list, one line per note
          </label>
          <textarea id={`${id}-list`} ref={listRef} readOnly wrap="off" value={list} rows={Math.min(8, notes.length + 1)} className="dim w-full rounded-md border border-rule bg-card px-3 py-2 text-sm" />
        </div>
      ) : (
        <p className="text-sm text-graphite-2">Chapters appear here once the clip has notes.</p>
      )}

      {canEdit ? (
        <div className="space-y-2 border-t border-rule pt-3">
          <label htmlFor={`${id}-file`} className="block text-sm font-semibold">
            Import notes from a WebVTT (.vtt) or SRT (.srt) file
          </label>
          <p id={`${id}-file-hint`} className="text-xs text-graphite-2">
            Each cue becomes a note at its start time. Lines that cannot be read are listed; the rest are still added. Up to 1 MB.
          </p>
          <input
            id={`${id}-file`}
            ref={fileRef}
            type="file"
            accept=".vtt,.srt,text/vtt"
            onChange={(e) => void onFile(e)}
            disabled={imp.state === 'reading'}
            aria-describedby={`${id}-file-hint`}
            className="block w-full text-sm file:mr-3 file:min-h-11 file:rounded-md file:border file:border-rule file:bg-card file:px-4 file:font-semibold file:text-graphite"
          />
          <div role="status" aria-live="polite">
            {imp.state === 'reading' ? <p className="text-sm">Reading {imp.fileName}…</p> : null}
            {imp.state === 'done' ? <ImportReport fileName={imp.fileName} answer={imp.answer} /> : null}
          </div>
          {imp.state === 'failed' ? (
            <Notice kind="error" role="alert" title="Nothing imported">
              <p>{imp.message}</p>
              {imp.lines.length ? (
                <ul className="mt-1 list-disc pl-5">
                  {imp.lines.map((l) => (
                    <li key={l}>{l}</li>
                  ))}
                </ul>
              ) : null}
            </Notice>
          ) : null}
        </div>
      ) : null}
    </section>
  );
}

function ImportReport({ fileName, answer }: { fileName: string; answer: ImportAnswer }) {
  const n = answer.created.length;
  return (
    <div className="space-y-2">
      <Notice kind="success" title={`${n} note${n === 1 ? '' : 's'} added from ${fileName}`}>
        <ul className="mt-1 space-y-0.5">
          {answer.created.slice(0, 12).map((c) => (
            <li key={c.id}>
              <span className="dim">{formatClock(c.startMs)}</span> {c.text}
            </li>
          ))}
          {n > 12 ? <li>…and {n - 12} more.</li> : null}
        </ul>
      </Notice>
      {answer.problems.length ? (
        <Notice kind="caution" title={`${answer.problems.length + answer.problemsNotListed} line${answer.problems.length + answer.problemsNotListed === 1 ? '' : 's'} could not be read`}>
          <ul className="mt-1 space-y-0.5">
            {answer.problems.map((p) => (
              <li key={`${p.line}-${p.reason}`}>
                <span className="font-semibold">Line {p.line}:</span> {p.reason}
              </li>
            ))}
            {answer.problemsNotListed ? <li>…and {answer.problemsNotListed} more.</li> : null}
          </ul>
        </Notice>
      ) : null}
    </div>
  );
}
