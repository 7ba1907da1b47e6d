'use client';

import { useEffect, useId, useState } from 'react';
import { postJson } from '@/components/forms/api-client';
import { Notice } from '@/components/ui/notice';
import { SESSION_VISIBILITY_OPTIONS } from '@/lib/validations/following';
import type { SessionView } from '@/lib/types/log';

type Visibility = SessionView['visibility'];

// Drawn, not emoji: emoji fonts are missing on some shop computers, and the words carry the meaning anyway.
function VisibilityIcon({ visibility }: { visibility: Visibility }) {
  const common = { width: 14, height: 14, viewBox: '0 0 16 16', fill: 'none', stroke: 'currentColor', strokeWidth: 1.6, 'aria-hidden': true } as const;
  if (visibility === 'private')
    return (
      <svg {...common}>
        <rect x="3" y="7" width="10" height="7" rx="1.5" />
        <path d="M5.5 7V5a2.5 2.5 0 0 1 5 0v2" />
      </svg>
    );
  if (visibility === 'unlisted')
    return (
      <svg {...common}>
        <path d="M6.5 9.5l3-3" />
        <path d="M7 5l1-1a2.8 2.8 0 0 1 4 4l-1 1" />
        <path d="M9 11l-1 1a2.8 2.8 0 0 1-4-4l1-1" />
      </svg>
    );
  return (
    <svg {...common}>
      <circle cx="8" cy="8" r="5.5" />
      <path d="M2.5 8h11M8 2.5c1.8 1.6 2.6 3.4 2.6 5.5S9.8 11.9 8 13.5C6.2 11.9 5.4 10.1 5.4 8S6.2 4.1 8 2.5z" />
    </svg>
  );
}

const RANK: Record<Visibility, number> = { private: 0, unlisted: 1, published: 2 };
const PROJECT_WORDS: Record<Visibility, string> = {
  private: 'This project is private, so for now only you and your mentors see this session, whatever you pick here.',
  unlisted: 'This project is unlisted, so this session is at most reachable by its link until you publish the project.',
  published: '',
};

/**
 * Who can read one session: private, unlisted or published, each said in words. A change saves at
 * once; a refusal (for instance an unanswered "stop" flag) is shown under the choices.
 */
export function SessionVisibilityControl({
  session,
  projectVisibility,
  onChanged,
}: {
  session: Pick<SessionView, 'id' | 'title' | 'visibility'>;
  projectVisibility?: Visibility;
  onChanged: () => Promise<unknown>;
}) {
  const name = useId();
  const [busy, setBusy] = useState<Visibility | null>(null);
  const [result, setResult] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const current = session.visibility;
  // The choice shows at once; it goes back if the server refuses it.
  const [shown, setShown] = useState<Visibility>(current);
  useEffect(() => setShown(current), [current]);
  const capped = projectVisibility && RANK[projectVisibility] < RANK[current] ? PROJECT_WORDS[projectVisibility] : '';

  async function choose(next: Visibility) {
    if (next === shown || busy) return;
    setShown(next);
    setBusy(next);
    setResult(null);
    const res = await postJson<{ announced: number }>(`/api/sessions/${session.id}/visibility`, 'PATCH', { visibility: next });
    setBusy(null);
    if (!res.ok) {
      setShown(current);
      setResult({ kind: 'error', text: res.error.message });
      return;
    }
    const label = SESSION_VISIBILITY_OPTIONS.find((o) => o.value === next)!.label.toLowerCase();
    const told = res.data.announced ? ` ${res.data.announced === 1 ? 'One follower gets' : `${res.data.announced} followers get`} an e-mail.` : '';
    setResult({ kind: 'success', text: `“${session.title}” is now ${label}.${told}` });
    await onChanged();
  }

  return (
    <fieldset className="mt-3 rounded-lg border border-rule bg-paper p-3" data-testid={`session-visibility-${session.id}`}>
      <legend className="px-1 text-sm font-bold">Who can read this session</legend>
      <div className="grid gap-2 sm:grid-cols-3">
        {SESSION_VISIBILITY_OPTIONS.map((o) => {
          const checked = o.value === shown;
          return (
            <label
              key={o.value}
              className={`flex min-h-11 cursor-pointer items-start gap-2 rounded-md border px-3 py-2 text-sm ${
                checked ? 'border-dye bg-dye-soft' : 'border-rule bg-card hover:border-dye/60'
              } ${busy ? 'opacity-70' : ''}`}
            >
              <input
                type="radio"
                name={name}
                value={o.value}
                checked={checked}
                disabled={!!busy}
                onChange={() => void choose(o.value)}
                className="mt-1 h-4 w-4 shrink-0 accent-[var(--color-dye)]"
              />
              <span>
                <span className="flex items-center gap-1 font-semibold">
                  <VisibilityIcon visibility={o.value} /> {o.label}
                  {o.value === current && !busy ? <span className="text-xs font-normal text-graphite-2">(now)</span> : null}
                  {busy === o.value ? <span className="text-xs font-normal text-graphite-2">saving…</span> : null}
                </span>
                <span className="block text-xs text-graphite-2">{o.hint}</span>
              </span>
            </label>
          );
        })}
      </div>
      {capped ? (
        <p className="mt-2 flex gap-1 text-xs text-graphite-2">
          <span aria-hidden="true">ℹ</span> {capped}
        </p>
      ) : null}
      {result ? (
        <div className="mt-2">
          <Notice kind={result.kind} role={result.kind === 'error' ? 'alert' : 'status'} title={result.kind === 'error' ? 'Not changed' : 'Saved'}>
            {result.text}
          </Notice>
        </div>
      ) : null}
    </fieldset>
  );
}
