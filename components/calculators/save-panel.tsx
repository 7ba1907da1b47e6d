'use client';

import Link from 'next/link';
import { useRef, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { getJson, sendJson } from '@/lib/client/api-client';
import { Button } from '@/components/ui/button';
import { Field, describedBy, inputClass } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { QueryIsland } from '@/components/providers';
import type { ProjectView } from '@/lib/types/project';
import type { EntrySummary, SessionView } from '@/lib/types/log';
import type { SavedCalculationView } from '@/lib/types/calculations';
import type { SaveCandidate } from './save-to-entry';

const selectClass = `${inputClass} min-h-11`;

// Loaded when a signed-in builder opens "Save to an entry": the calculator pages carry none of it before.
export function SavePanel(props: { id: string; candidates: SaveCandidate[] }) {
  return (
    <QueryIsland>
      <Panel {...props} />
    </QueryIsland>
  );
}

function Panel({ id, candidates }: { id: string; candidates: SaveCandidate[] }) {
  const [which, setWhich] = useState(0);
  const [pickedProject, setProjectId] = useState('');
  const [pickedSession, setSessionId] = useState('');
  const [pickedEntry, setEntryId] = useState('');
  const [label, setLabel] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ message: string; label?: string } | null>(null);
  const [saved, setSaved] = useState<{ calc: SavedCalculationView; href: string; entryTitle: string; what: string } | null>(null);
  // A second click while the first save is on its way must not save twice.
  const inFlight = useRef(false);

  const projects = useQuery({
    queryKey: ['projects', 'mine'],
    queryFn: () => getJson<{ projects: ProjectView[] }>('/api/projects?scope=mine'),
    select: (d) => d.projects.filter((p) => p.can.editLog),
  });
  // Until the builder picks, each box holds the latest: the project worked on last (the list comes
  // newest first), its last session, that session's last entry.
  const projectId = pickedProject || String(projects.data?.[0]?.id ?? '');
  const sessions = useQuery({
    queryKey: ['sessions', projectId],
    queryFn: () => getJson<{ sessions: SessionView[] }>(`/api/projects/${projectId}/sessions`),
    select: (d) => d.sessions,
    enabled: projectId !== '',
  });
  const sessionId = pickedSession || String(sessions.data?.at(-1)?.id ?? '');
  const entries = useQuery({
    queryKey: ['entries', sessionId],
    queryFn: () => getJson<{ entries: EntrySummary[] }>(`/api/sessions/${sessionId}/entries`),
    select: (d) => d.entries,
    enabled: sessionId !== '',
  });
  const entryId = pickedEntry || String(entries.data?.at(-1)?.id ?? '');

  const candidate = candidates[Math.min(which, candidates.length - 1)];
  const project = projects.data?.find((p) => String(p.id) === projectId);
  const entry = entries.data?.find((e) => String(e.id) === entryId);
  // What Save would save now; once saved, Save rests until something here changes.
  const what = JSON.stringify([entryId, which, label.trim()]);
  const alreadySaved = saved?.what === what;

  async function save(e: React.FormEvent) {
    e.preventDefault();
    if (!entryId || !project || !entry) {
      setError({ message: 'Choose the project, session and entry to save into.' });
      return;
    }
    if (inFlight.current || alreadySaved) return;
    inFlight.current = true;
    setBusy(true);
    setError(null);
    setSaved(null);
    const res = await sendJson<{ calculation: SavedCalculationView }>(`/api/entries/${entryId}/calculations`, 'POST', {
      kind: candidate.request.kind,
      input: candidate.request.input,
      ...(label.trim() ? { label: label.trim() } : {}),
    });
    setBusy(false);
    inFlight.current = false;
    if (!res.ok) {
      setError({ message: res.error.message, label: res.error.fieldErrors?.label?.[0] });
      return;
    }
    setSaved({ calc: res.data.calculation, href: `/logs/${project.slug}/entries/${entry.id}`, entryTitle: entry.title, what });
  }

  return (
    <form id={id} aria-label="Save to an entry" className="space-y-3 rounded-lg border border-rule bg-card p-4" onSubmit={save} noValidate>
      {candidates.length > 1 ? (
        <fieldset className="space-y-1">
          <legend className="text-sm font-semibold">What to save</legend>
          {candidates.map((c, i) => (
            <label key={c.title} className="flex min-h-11 cursor-pointer items-center gap-3 text-sm">
              <input type="radio" name={`${id}-which`} checked={which === i} onChange={() => setWhich(i)} className="h-4 w-4 accent-[var(--color-dye)]" />
              {c.title}
            </label>
          ))}
        </fieldset>
      ) : null}

      {projects.isPending ? <p className="text-sm text-graphite-2">Loading your projects…</p> : null}
      {projects.isError ? <Notice kind="error">{projects.error.message}</Notice> : null}
      {projects.data && !projects.data.length ? (
        <Notice kind="info" title="No project to save into yet">
          Results are saved into an entry of one of your projects. <Link href="/projects/new">Start a project</Link>, log a session and an entry, then
          come back.
        </Notice>
      ) : null}

      {projects.data?.length ? (
        <div className="grid gap-3 sm:grid-cols-3">
          <Field id={`${id}-project`} label="Project">
            <select
              id={`${id}-project`}
              className={selectClass}
              value={projectId}
              onChange={(e) => {
                setProjectId(e.target.value);
                setSessionId('');
                setEntryId('');
              }}
            >
              <option value="">Choose…</option>
              {projects.data.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.title}
                </option>
              ))}
            </select>
          </Field>
          <Field id={`${id}-session`} label="Session">
            <select
              id={`${id}-session`}
              className={selectClass}
              value={sessionId}
              disabled={!projectId || sessions.isPending}
              onChange={(e) => {
                setSessionId(e.target.value);
                setEntryId('');
              }}
            >
              <option value="">{projectId && sessions.isPending ? 'Loading…' : 'Choose…'}</option>
              {sessions.data?.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.position + 1}. {s.title}
                </option>
              ))}
            </select>
          </Field>
          <Field id={`${id}-entry`} label="Entry">
            <select id={`${id}-entry`} className={selectClass} value={entryId} disabled={!sessionId || entries.isPending} onChange={(e) => setEntryId(e.target.value)}>
              <option value="">{sessionId && entries.isPending ? 'Loading…' : 'Choose…'}</option>
              {entries.data?.map((en) => (
                <option key={en.id} value={en.id}>
                  {en.title}
                </option>
              ))}
            </select>
          </Field>
        </div>
      ) : null}
      {projectId && sessions.data && !sessions.data.length ? <p className="text-sm text-graphite-2">This project has no sessions yet.</p> : null}
      {sessionId && entries.data && !entries.data.length ? <p className="text-sm text-graphite-2">This session has no entries yet.</p> : null}
      {sessions.isError ? <Notice kind="error">{sessions.error.message}</Notice> : null}
      {entries.isError ? <Notice kind="error">{entries.error.message}</Notice> : null}

      <Field id={`${id}-label`} label="Label (optional)" hint={`Left empty: “${candidate.defaultLabel}”.`} error={error?.label}>
        <input
          id={`${id}-label`}
          className={inputClass}
          value={label}
          maxLength={120}
          placeholder={candidate.defaultLabel}
          onChange={(e) => setLabel(e.target.value)}
          aria-invalid={error?.label ? true : undefined}
          aria-describedby={describedBy(`${id}-label`, error?.label, 'hint')}
        />
      </Field>

      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={busy || !entryId || alreadySaved}>
          {busy ? 'Saving…' : alreadySaved ? 'Saved' : 'Save'}
        </Button>
        <span className="text-xs text-graphite-2">The result is worked out again on the server and kept with the tables version.</span>
      </div>

      {error && !error.label ? (
        <Notice kind="error" role="alert">
          {error.message}
        </Notice>
      ) : null}
      {saved ? (
        <Notice kind="success" title="Saved into the entry" role="status">
          “{saved.calc.label}” is now in <Link href={saved.href}>{saved.entryTitle}</Link>.
          {alreadySaved ? ' To save it again, change the label or choose another entry.' : ''}
        </Notice>
      ) : null}
    </form>
  );
}
