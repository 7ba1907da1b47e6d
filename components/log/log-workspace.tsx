'use client';

import { startTransition, useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { sendJson } from '@/lib/client/api-client';
import { deleteSessionAction } from '@/lib/actions/sessions';
import { IDLE } from '@/components/forms/action-state';
import { Button, ButtonLink } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { inputClass } from '@/components/ui/field';
import { PlusIcon } from '@/components/ui/plus-icon';
import { SessionForm } from './session-form';
import { SessionVisibilityControl } from './session-visibility';
import { VisibilityBadge } from '@/components/ui/badge';
import { OPERATIONS } from '@/lib/validations/log';
import { formatDay, formatDuration, plural } from '@/lib/format';
import type { EntrySummary, SessionView } from '@/lib/types/log';
import type { Visibility } from '@/lib/types/visibility';

type Project = {
  id: number;
  slug: string;
  title: string;
  visibility?: Visibility;
  /** Members a newly published session would mail (said before the builder confirms). */
  mailAudience?: number;
};

const small = '!min-h-10 !px-3';

/**
 * The builder's view of the whole log: sessions and their entries, to add, edit, reorder, move and delete.
 * The sessions come from the page (rendered on the server); the session forms and deletes are server
 * actions that render the page again, and the moves (JSON routes) ask the router for a fresh render.
 */
export function LogWorkspace({
  project,
  initialSessions: sessions,
  paging,
}: {
  project: Project;
  /** One page of the log (SESSIONS_PER_PAGE), in order. */
  initialSessions: SessionView[];
  /** How many sessions the log holds, and the links to the pages around this one (the server pages by keyset). */
  paging: { total: number; nextHref: string | null; firstHref: string | null };
}) {
  const router = useRouter();
  const [adding, setAdding] = useState(paging.total === 0);
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const refresh = async () => startTransition(() => router.refresh());

  async function act(run: () => Promise<{ ok: true } | { ok: false; error: { message: string } }>, done: string): Promise<string | null> {
    const res = await run();
    if (!res.ok) {
      setMessage({ kind: 'error', text: res.error.message });
      return res.error.message;
    }
    setMessage({ kind: 'success', text: done });
    await refresh();
    return null;
  }

  return (
    <div className="space-y-6">
      {message ? (
        <Notice kind={message.kind} role={message.kind === 'error' ? 'alert' : 'status'}>
          {message.text}
        </Notice>
      ) : null}

      {paging.total === 0 ? (
        <Notice kind="info" title="Log your first shop session">
          A session is one day at the machines: what you planned, what got done, what is next. Add entries to it for each operation, with photos, clips and notes.
        </Notice>
      ) : null}

      <ol className="space-y-5" aria-label="Sessions">
        {sessions.map((s) => (
          <SessionCard
            key={s.id}
            project={project}
            session={s}
            index={s.position}
            count={paging.total}
            sessions={sessions}
            onChanged={refresh}
            act={act}
          />
        ))}
      </ol>

      {paging.firstHref || paging.nextHref ? (
        <nav aria-label="Pages of sessions" className="flex flex-wrap items-center justify-between gap-3 text-sm">
          <span className="text-graphite-2">
            Sessions {sessions.length ? `${sessions[0].position + 1}–${sessions[sessions.length - 1].position + 1}` : '–'} of {paging.total}
          </span>
          <span className="flex flex-wrap gap-2">
            {paging.firstHref ? (
              <ButtonLink href={paging.firstHref} tone="quiet">
                First sessions
              </ButtonLink>
            ) : null}
            {paging.nextHref ? (
              <ButtonLink href={paging.nextHref} tone="quiet">
                Later sessions
              </ButtonLink>
            ) : null}
          </span>
        </nav>
      ) : null}

      <section className="rounded-xl border border-dashed border-rule p-4" aria-labelledby="add-session">
        {adding ? (
          <>
            <h2 id="add-session" className="mb-3 text-lg font-bold">
              New session
            </h2>
            <SessionForm
              projectId={project.id}
              onDone={(s) => {
                setAdding(false);
                setMessage({ kind: 'success', text: `Session “${s.title}” added.` });
              }}
              onCancel={paging.total ? () => setAdding(false) : undefined}
            />
          </>
        ) : (
          <Button id="add-session" type="button" onClick={() => setAdding(true)} className="w-full sm:w-auto">
            <PlusIcon /> Add a session
          </Button>
        )}
      </section>
    </div>
  );
}

type CardProps = {
  project: Project;
  session: SessionView;
  index: number;
  count: number;
  sessions: SessionView[];
  onChanged: () => Promise<unknown>;
  act: (run: () => Promise<{ ok: true } | { ok: false; error: { message: string } }>, done: string) => Promise<string | null>;
};

function SessionCard({ project, session: s, index, count, sessions, onChanged, act }: CardProps) {
  const [editing, setEditing] = useState(false);
  return (
    <li className="rounded-xl border border-rule bg-card p-4 shadow-sm" data-testid={`session-${s.id}`}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <p className="text-xs font-semibold uppercase tracking-wide text-graphite-2">
            Session {index + 1} · {formatDay(s.heldOn)} · {formatDuration(s.minutesSpent)}
          </p>
          <h2 className="flex flex-wrap items-center gap-2 text-xl font-bold">
            {s.title} <VisibilityBadge visibility={s.visibility} />
          </h2>
        </div>
        <div className="flex flex-wrap gap-1">
          <Button type="button" tone="quiet" className={small} disabled={index === 0} aria-label={`Move session ${s.title} earlier`} onClick={() => act(() => sendJson(`/api/sessions/${s.id}/move`, 'POST', { position: index - 1 }), 'Session moved.')}>
            ↑
          </Button>
          <Button type="button" tone="quiet" className={small} disabled={index === count - 1} aria-label={`Move session ${s.title} later`} onClick={() => act(() => sendJson(`/api/sessions/${s.id}/move`, 'POST', { position: index + 1 }), 'Session moved.')}>
            ↓
          </Button>
          <Button type="button" tone="quiet" className={small} aria-expanded={editing} onClick={() => setEditing((e) => !e)}>
            {editing ? 'Close' : 'Edit session'}
          </Button>
          <ButtonLink href={`/projects/${project.slug}/sessions/${s.id}/sheet`} tone="quiet" className={small} aria-label={`Print sheet for session ${s.title}`}>
            Print sheet
          </ButtonLink>
          <ConfirmDialog
            small
            trigger="Delete"
            triggerLabel={`Delete session ${s.title}`}
            title={`Delete the session “${s.title}”?`}
            body={`Its ${plural(s.counts.entries, 'entry', 'entries')}, ${plural(s.counts.photos, 'photo')}, ${plural(s.counts.clips, 'clip')} and ${plural(s.counts.notes, 'note')} go with it. This cannot be undone.`}
            confirmLabel="Yes, delete"
            onConfirm={() =>
              act(async () => {
                const form = new FormData();
                form.set('sessionId', String(s.id));
                const state = await deleteSessionAction(IDLE, form);
                return state.ok ? { ok: true } : { ok: false, error: { message: state.message ?? 'Not deleted.' } };
              }, `Session “${s.title}” deleted.`)
            }
          />
        </div>
      </div>

      {editing ? (
        <div className="mt-4 border-t border-rule pt-4">
          <SessionForm
            projectId={project.id}
            session={s}
            onDone={() => setEditing(false)}
            onCancel={() => setEditing(false)}
          />
        </div>
      ) : (
        <dl className="mt-3 grid gap-3 text-sm sm:grid-cols-3">
          {(
            [
              ['Planned', s.planned],
              ['Done', s.done],
              ['Next', s.nextSteps],
            ] as const
          ).map(([label, text]) => (
            <div key={label}>
              <dt className="font-semibold">{label}</dt>
              <dd className="whitespace-pre-line text-graphite-2">{text || '—'}</dd>
            </div>
          ))}
        </dl>
      )}

      <SessionVisibilityControl session={s} projectVisibility={project.visibility} mailAudience={project.mailAudience} onChanged={onChanged} />

      <h3 className="mt-4 text-sm font-bold uppercase tracking-wide text-graphite-2">Entries</h3>
      {s.entries.length === 0 ? <p className="mt-1 text-sm text-graphite-2">No entries yet: add one for each operation of the day.</p> : null}
      <ol className="mt-2 space-y-2" aria-label={`Entries of ${s.title}`}>
        {s.entries.map((e, i) => (
          <EntryRow key={e.id} project={project} entry={e} index={i} count={s.entries.length} sessions={sessions} act={act} />
        ))}
      </ol>
      <NewEntryForm project={project} sessionId={s.id} />
    </li>
  );
}

function EntryRow({ project, entry: e, index, count, sessions, act }: { project: Project; entry: EntrySummary; index: number; count: number; sessions: SessionView[]; act: CardProps['act'] }) {
  const op = OPERATIONS.find((o) => o.value === e.operation)?.label ?? e.operation;
  return (
    <li className="rounded-lg border border-rule bg-paper px-3 py-2" data-testid={`entry-row-${e.id}`}>
      <div className="flex flex-wrap items-baseline gap-x-2 gap-y-1">
        <span className="rounded bg-dye-soft px-2 py-0.5 text-xs font-semibold text-dye">{op}</span>
        <Link href={`/projects/${project.slug}/entries/${e.id}/edit`} className="min-w-0 flex-1 basis-48 font-semibold">
          {e.title}
        </Link>
        <span className="text-xs text-graphite-2">
          {plural(e.photoCount, 'photo')} · {plural(e.clipCount, 'clip')} · {plural(e.noteCount, 'note')}
        </span>
      </div>
      <div className="mt-2 flex flex-wrap items-center gap-1">
        <Button type="button" tone="quiet" className={small} disabled={index === 0} aria-label={`Move entry ${e.title} up`} onClick={() => act(() => sendJson(`/api/entries/${e.id}/move`, 'POST', { position: index - 1 }), 'Entry moved.')}>
          ↑
        </Button>
        <Button type="button" tone="quiet" className={small} disabled={index === count - 1} aria-label={`Move entry ${e.title} down`} onClick={() => act(() => sendJson(`/api/entries/${e.id}/move`, 'POST', { position: index + 1 }), 'Entry moved.')}>
          ↓
        </Button>
        {sessions.length > 1 ? (
          <label className="sr-only" htmlFor={`move-${e.id}`}>
            Move {e.title} to another session
          </label>
        ) : null}
        {sessions.length > 1 ? (
          <select
            id={`move-${e.id}`}
            className="min-h-10 min-w-0 max-w-full flex-1 rounded-md border border-rule bg-card px-2 text-sm sm:max-w-64 sm:flex-none"
            value=""
            onChange={(ev) => {
              const to = Number(ev.target.value);
              if (to) void act(() => sendJson(`/api/entries/${e.id}/move`, 'POST', { sessionId: to, position: 0 }), 'Entry moved to another session.');
            }}
          >
            <option value="">Move to…</option>
            {sessions
              .filter((s) => s.id !== e.sessionId)
              .map((s) => (
                <option key={s.id} value={s.id}>
                  {s.title}
                </option>
              ))}
          </select>
        ) : null}
        <ConfirmDialog
          small
          trigger="Delete"
          triggerLabel={`Delete entry ${e.title}`}
          title={`Delete the entry “${e.title}”?`}
          body={`Its text, ${plural(e.photoCount, 'photo')}, ${plural(e.clipCount, 'clip')} and ${plural(e.noteCount, 'timestamped note')} will be removed for good.`}
          confirmLabel="Yes, delete"
          onConfirm={() => act(() => sendJson(`/api/entries/${e.id}`, 'DELETE'), `Entry “${e.title}” deleted.`)}
        />
      </div>
    </li>
  );
}

function NewEntryForm({ project, sessionId }: { project: Project; sessionId: number }) {
  const router = useRouter();
  const [title, setTitle] = useState('');
  const [operation, setOperation] = useState('turning');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <form
      className="mt-3 flex flex-wrap items-end gap-2"
      aria-label="New entry"
      onSubmit={async (ev) => {
        ev.preventDefault();
        setBusy(true);
        setError(null);
        const res = await sendJson<{ entry: { id: number } }>(`/api/sessions/${sessionId}/entries`, 'POST', { title, operation });
        setBusy(false);
        if (!res.ok) {
          setError(res.error.fieldErrors?.title?.[0] ?? res.error.fieldErrors?.operation?.[0] ?? res.error.message);
          return;
        }
        router.push(`/projects/${project.slug}/entries/${res.data.entry.id}/edit`);
      }}
    >
      <div className="min-w-48 flex-1">
        <label htmlFor={`new-entry-title-${sessionId}`} className="text-xs font-semibold">
          New entry title
        </label>
        <input id={`new-entry-title-${sessionId}`} className={inputClass} value={title} onChange={(ev) => setTitle(ev.target.value)} placeholder="e.g. Boring the register" aria-invalid={!!error} />
      </div>
      <div>
        <label htmlFor={`new-entry-op-${sessionId}`} className="text-xs font-semibold">
          Operation
        </label>
        <select id={`new-entry-op-${sessionId}`} className={inputClass} value={operation} onChange={(ev) => setOperation(ev.target.value)}>
          {OPERATIONS.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </div>
      <Button type="submit" disabled={busy}>
        {busy ? 'Adding…' : (
          <>
            <PlusIcon /> Add entry
          </>
        )}
      </Button>
      {error ? (
        <p className="w-full text-sm font-medium text-bad" role="alert">
          ✕ {error}
        </p>
      ) : null}
    </form>
  );
}
