'use client';

import { useEffect, useId, useState } from 'react';
import { postJson } from '@/components/forms/api-client';
import { Notice } from '@/components/ui/notice';
import { SESSION_VISIBILITY_OPTIONS } from '@/lib/validations/following';
import type { SessionView } from '@/lib/types/log';
import { VisibilityIcon } from '@/components/ui/badge';

type Visibility = SessionView['visibility'];

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
