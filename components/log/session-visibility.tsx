'use client';

import { useEffect, useId, useRef, useState } from 'react';
import { sendJson } from '@/lib/client/api-client';
import { Notice } from '@/components/ui/notice';
import { Button } from '@/components/ui/button';
import { SESSION_VISIBILITY_OPTIONS } from '@/lib/validations/following';
import { VISIBILITY_LABEL, VISIBILITY_PHRASE } from '@/lib/validations/visibility';
import type { SessionView } from '@/lib/types/log';
import type { Visibility } from '@/lib/types/visibility';
import { VisibilityIcon } from '@/components/ui/badge';

const RANK: Record<Visibility, number> = { private: 0, unlisted: 1, published: 2 };
const PROJECT_WORDS: Record<Visibility, string> = {
  private: `This project is ${VISIBILITY_PHRASE.private}, so for now only you and your mentors see this session, whatever you pick here.`,
  unlisted: `This project is ${VISIBILITY_PHRASE.unlisted}, so this session is at most reachable by its link until the project is ${VISIBILITY_PHRASE.published}.`,
  published: '',
};

/** Who a publish would tell, said before the builder confirms. */
function audienceWords(session: { publishedAt: string | null }, projectVisibility: Visibility | undefined, audience: number | undefined): string {
  if (projectVisibility && projectVisibility !== 'published') return `No e-mail goes out yet: followers are told once the project itself is ${VISIBILITY_PHRASE.published}.`;
  if (session.publishedAt) return 'It has been there before, so no one is e-mailed again.';
  if (audience === undefined) return 'Followers with e-mail on get one e-mail about it.';
  if (audience === 0) return 'No follower has e-mail on, so no one is e-mailed.';
  return audience === 1 ? 'One follower gets an e-mail about it.' : `${audience} followers get an e-mail about it.`;
}

/**
 * Who can read one session, each choice said in words. Picking a choice (by mouse, touch or arrow
 * keys) only marks it; nothing is saved until the builder confirms, and putting a session in the open
 * log first says who will be e-mailed. A refusal (for instance an unanswered "stop" flag) shows here.
 */
export function SessionVisibilityControl({
  session,
  projectVisibility,
  mailAudience,
  onChanged,
}: {
  session: Pick<SessionView, 'id' | 'title' | 'visibility' | 'version' | 'publishedAt'>;
  projectVisibility?: Visibility;
  /** Members a newly published session of this project would e-mail. */
  mailAudience?: number;
  onChanged: () => Promise<unknown>;
}) {
  const name = useId();
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const current = session.visibility;
  const [chosen, setChosen] = useState<Visibility>(current);
  useEffect(() => setChosen(current), [current]);
  const box = useRef<HTMLFieldSetElement>(null);
  const capped = projectVisibility && RANK[projectVisibility] < RANK[current] ? PROJECT_WORDS[projectVisibility] : '';
  const phrase = (v: Visibility) => VISIBILITY_PHRASE[v];

  // After saving or cancelling, focus stays on this control (on the choice now in force), never the page top.
  const refocus = useRef(false);
  useEffect(() => {
    if (!refocus.current || busy) return;
    refocus.current = false;
    box.current?.querySelector<HTMLInputElement>('input[type="radio"]:checked')?.focus();
  });

  function cancel() {
    setChosen(current);
    refocus.current = true;
  }

  async function save() {
    if (chosen === current || busy) return;
    const next = chosen;
    setBusy(true);
    setResult(null);
    const res = await sendJson<{ announced: number }>(`/api/sessions/${session.id}/visibility`, 'PATCH', { visibility: next, version: session.version });
    if (!res.ok) {
      setBusy(false);
      setChosen(current);
      setResult({ kind: 'error', text: res.error.message });
      refocus.current = true;
      return;
    }
    const told = res.data.announced ? ` ${res.data.announced === 1 ? 'One follower gets' : `${res.data.announced} followers get`} an e-mail.` : '';
    setResult({ kind: 'success', text: `“${session.title}” is now ${phrase(next)}.${told}` });
    await onChanged();
    setBusy(false);
    refocus.current = true;
  }

  const publishing = chosen === 'published' && current !== 'published';
  return (
    <fieldset ref={box} className="mt-3 rounded-lg border border-rule bg-paper p-3" data-testid={`session-visibility-${session.id}`}>
      <legend className="px-1 text-sm font-bold">Who can read this session</legend>
      <div className="grid gap-2 sm:grid-cols-3">
        {SESSION_VISIBILITY_OPTIONS.map((o) => {
          const checked = o.value === chosen;
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
                disabled={busy}
                onChange={() => {
                  setChosen(o.value);
                  setResult(null);
                }}
                className="mt-1 h-4 w-4 shrink-0 accent-[var(--color-dye)]"
              />
              <span>
                <span className="flex items-center gap-1 font-semibold">
                  <VisibilityIcon visibility={o.value} /> {o.label}
                  {o.value === current ? <span className="text-xs font-normal text-graphite-2">(now)</span> : null}
                </span>
                <span className="block text-xs text-graphite-2">{o.hint}</span>
              </span>
            </label>
          );
        })}
      </div>
      {chosen !== current ? (
        <div
          role="group"
          aria-label={publishing ? 'Confirm putting it in the open log' : 'Confirm the change'}
          className={`mt-2 space-y-2 rounded-md border px-3 py-2 text-sm ${publishing ? 'border-scribe/60 bg-scribe-soft' : 'border-rule bg-card'}`}
        >
          <p>
            {publishing ? (
              <>
                <span className="font-semibold">
                  Put “{session.title}” {phrase('published')}?
                </span>{' '}
                It shows on the home page and your profile. {audienceWords(session, projectVisibility, mailAudience)}
              </>
            ) : (
              <span className="font-semibold">
                Change who can read “{session.title}” to “{VISIBILITY_LABEL[chosen]}”?
              </span>
            )}
          </p>
          <div className="flex flex-wrap gap-2">
            <Button type="button" onClick={() => void save()} disabled={busy}>
              {busy ? 'Saving…' : publishing ? `Yes, put it ${phrase('published')}` : `Save: ${VISIBILITY_LABEL[chosen]}`}
            </Button>
            <Button type="button" tone="quiet" onClick={cancel} disabled={busy}>
              Keep it {phrase(current)}
            </Button>
          </div>
        </div>
      ) : null}
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
