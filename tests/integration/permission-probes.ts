// The probes walked by permission-matrix.test.ts: one or more per action of the matrix, each calling a
// real route handler or server action as a given person and returning the HTTP status it answered.
import type { NextResponse } from 'next/server';
import { request, params } from '../support/db';
import type { Action, Relation, Visibility } from '@/lib/auth/policy';
import { User } from '@/db/models';
import { GET as listProjects, POST as createProjectRoute } from '@/app/api/projects/route';
import { GET as readProject, PATCH as patchProject, DELETE as deleteProjectRoute } from '@/app/api/projects/[id]/route';
import { POST as createSessionRoute } from '@/app/api/projects/[id]/sessions/route';
import { GET as readSession } from '@/app/api/sessions/[id]/route';
import { GET as readEntry, PATCH as patchEntry } from '@/app/api/entries/[id]/route';
import { GET as fitsRoute } from '@/app/api/fits/route';
import { setSiteRoleAction } from '@/lib/actions/users';

export type Person = { id: number; email: string; cookie: string };
export type World = Record<Exclude<Relation, 'anonymous'>, Person> & { setCookie(cookie: string | undefined): void };
export type Target = {
  projectId: number;
  projectSlug: string;
  sessionId: number;
  entryId: number;
  projectVisibility: Visibility;
  sessionVisibility: Visibility;
};
/** What a probe made before acting: ids it needs, and who wrote the thing acted on. */
export type Prepared = { authorId?: number; ids?: Record<string, number>; token?: string } | undefined;

export type Probe = {
  action: Action;
  /** The handler or action walked, for the test's name. */
  via: string;
  /** Walk the project's three visibilities (otherwise: a published project). */
  dependsOnVisibility?: boolean;
  /** Walk the session's three visibilities too; the facts then name the session. */
  sessionScoped?: boolean;
  prepare?(w: World, t: Target, rel: Relation): Promise<Prepared>;
  run(w: World, t: Target, who: Person | null, prepared: Prepared): Promise<number>;
  /** Extra checks after the call, e.g. that a refused change left the row alone. */
  check?(w: World, t: Target, prepared: Prepared, allowed: boolean): Promise<void>;
};

type Handler<P> = (req: ReturnType<typeof request>, ctx: { params: Promise<P> }) => Promise<NextResponse | Response>;

/** Calls a route handler as a person and returns the status. */
export async function call<P>(handler: Handler<P>, path: string, who: Person | null, p: P, init: { method?: string; body?: unknown } = {}): Promise<number> {
  const res = await handler(request(path, { method: init.method, body: init.body, cookie: who?.cookie }), params(p));
  return res.status;
}

/** A server action's answer as the status a route would have given. */
export function actionStatus(state: { ok: boolean; status?: number }): number {
  return state.ok ? 200 : (state.status ?? 500);
}

const id = (n: number) => ({ id: String(n) });

export const PROBES: Probe[] = [
  // — the project and its log —
  {
    action: 'view', via: 'GET /api/projects/[id]', dependsOnVisibility: true,
    run: (_w, t, who) => call(readProject, `/api/projects/${t.projectId}`, who, id(t.projectId)),
  },
  {
    action: 'view', via: 'GET /api/sessions/[id]', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(readSession, `/api/sessions/${t.sessionId}`, who, id(t.sessionId)),
  },
  {
    action: 'view', via: 'GET /api/entries/[id]', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(readEntry, `/api/entries/${t.entryId}`, who, id(t.entryId)),
  },
  {
    action: 'update', via: 'PATCH /api/projects/[id]', dependsOnVisibility: true,
    run: (_w, t, who) => call(patchProject, `/api/projects/${t.projectId}`, who, id(t.projectId), { method: 'PATCH', body: { summary: 'Changed by the matrix walk.', version: 1 } }),
  },
  {
    action: 'delete', via: 'DELETE /api/projects/[id]', dependsOnVisibility: true,
    run: (_w, t, who) => call(deleteProjectRoute, `/api/projects/${t.projectId}`, who, id(t.projectId), { method: 'DELETE' }),
  },
  {
    action: 'editLog', via: 'POST /api/projects/[id]/sessions', dependsOnVisibility: true,
    run: (_w, t, who) =>
      call(createSessionRoute, `/api/projects/${t.projectId}/sessions`, who, id(t.projectId), { method: 'POST', body: { title: 'Walked session', heldOn: '2026-12-01', minutesSpent: 30 } }),
  },
  {
    action: 'editLog', via: 'PATCH /api/entries/[id]', dependsOnVisibility: true, sessionScoped: true,
    run: (_w, t, who) => call(patchEntry, `/api/entries/${t.entryId}`, who, id(t.entryId), { method: 'PATCH', body: { title: 'Renamed by the walk', version: 1 } }),
  },
  // — site —
  {
    action: 'createProject', via: 'POST /api/projects',
    run: (_w, _t, who) => call(createProjectRoute, '/api/projects', who, {}, { method: 'POST', body: { title: 'Walked project', summary: '', units: 'mm', visibility: 'private' } }),
  },
  {
    action: 'listOwnProjects', via: 'GET /api/projects?scope=mine',
    run: (_w, _t, who) => call(listProjects, '/api/projects?scope=mine', who, {}),
  },
  {
    action: 'manageUsers', via: 'setSiteRoleAction (server action)',
    async prepare() {
      const u = await User.create({ email: `matrix-${Date.now()}-${Math.random().toString(36).slice(2)}@example.test`, name: 'Walked account', handle: `walk-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`, passwordHash: 'x', siteRole: 'member' });
      return { ids: { userId: u.id } };
    },
    async run(_w, _t, _who, prepared) {
      const form = new FormData();
      form.set('userId', String(prepared!.ids!.userId));
      form.set('siteRole', 'member');
      return actionStatus(await setSiteRoleAction({ ok: true }, form));
    },
    async check(_w, _t, prepared) {
      await User.destroy({ where: { id: prepared!.ids!.userId } });
    },
  },
  // — public —
  {
    action: 'useCalculators', via: 'GET /api/fits',
    run: (_w, _t, who) => call(fitsRoute, '/api/fits?size=25&fit=H7/g6', who, {}),
  },
  {
    action: 'readPublishedLogs', via: 'GET /api/projects',
    run: (_w, _t, who) => call(listProjects, '/api/projects', who, {}),
  },
];
