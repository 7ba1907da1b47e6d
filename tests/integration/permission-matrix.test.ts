// Walks the whole permission matrix (lib/auth/policy.ts PERMISSIONS) through the real route handlers and
// server actions: for every action, every relation (anonymous, member, follower, mentor, owner, admin)
// and every visibility the action's cell depends on, a probe builds fresh rows in the real database,
// calls the handler as that person, and checks that it did exactly what the matrix allows — a 2xx when
// allowed, a refusal (401, 403 or 404) when not. The matrix itself is checked against the product's
// rules in tests/unit/policy.test.ts; this file checks that the code paths obey it.
import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser } from '../support/db';
import { actAs } from '../support/action-request';
import { initModels, Project, ProjectMembership, User, ShopSession, Entry, Follow } from '@/db/models';
import {
  PERMISSIONS, RELATIONS, PROJECT_ACTIONS, SITE_ACTIONS, PUBLIC_ACTIONS, canOnProject, canOnSite, canPublic,
  type Action, type Actor, type ProjectFacts, type Relation, type Visibility, type ProjectAction, type SiteAction, type PublicAction,
} from '@/lib/auth/policy';
import { PROBES, type Probe, type World, type Person, type Target } from './permission-probes';

guardTestDatabase();

// Server actions read the session through next/headers and revalidate through next/cache, which exist
// only inside a Next request: give them the cookie of the person acting (tests/support/action-request.ts).
vi.mock('next/headers', () => import('../support/action-request').then((m) => m.fakeNextHeaders));
vi.mock('next/cache', () => import('../support/action-request').then((m) => m.fakeNextCache));

const VISIBILITIES: Visibility[] = ['private', 'unlisted', 'published'];
let world: World;
const createdUsers: number[] = [];

beforeAll(async () => {
  initModels();
  const [owner, mentor, follower, member, admin] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser(), makeUser('admin')]);
  createdUsers.push(owner.id, mentor.id, follower.id, member.id, admin.id);
  world = { owner, mentor, follower, member, admin, setCookie: (c) => actAs(c ? { cookie: c } : null) };
});

afterAll(async () => {
  await Project.destroy({ where: { ownerId: { [Op.in]: createdUsers } } });
  await User.destroy({ where: { id: { [Op.in]: createdUsers } } });
  await closeDb();
});

/** A fresh project in the given state, with the world's mentor and follower attached to it. */
async function makeTarget(w: World, project: Visibility, session: Visibility): Promise<Target> {
  const p = await Project.create({
    ownerId: w.owner.id,
    slug: `matrix-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`,
    title: 'Matrix probe',
    summary: '',
    units: 'mm',
    visibility: project,
    publishedAt: project === 'published' ? new Date() : null,
  });
  await ProjectMembership.create({ projectId: p.id, userId: w.mentor.id, role: 'mentor' });
  await Follow.create({ userId: w.follower.id, projectId: p.id, builderId: null });
  const s = await ShopSession.create({
    projectId: p.id, position: 0, title: 'Probe session', heldOn: '2026-11-30', minutesSpent: 0, planned: '', done: '', nextSteps: '',
    visibility: session, publishedAt: session === 'published' ? new Date() : null, announcedAt: new Date(),
  });
  const e = await Entry.create({ sessionId: s.id, position: 0, title: 'Probe entry', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) });
  return { projectId: p.id, projectSlug: p.slug, sessionId: s.id, entryId: e.id, projectVisibility: project, sessionVisibility: session };
}

function actorOf(rel: Relation): Actor {
  if (rel === 'anonymous') return null;
  const p = world[rel];
  // The world's accounts have verified addresses (makeUser); unverified ones are walked in accounts.test.ts.
  return { id: p.id, siteRole: rel === 'admin' ? 'admin' : 'member', emailVerified: true };
}

function personOf(rel: Relation): Person | null {
  return rel === 'anonymous' ? null : world[rel];
}

const isProject = (a: Action): a is ProjectAction => (PROJECT_ACTIONS as readonly string[]).includes(a);
const isSite = (a: Action): a is SiteAction => (SITE_ACTIONS as readonly string[]).includes(a);

/** What the matrix says for this person and target. */
function expected(probe: Probe, rel: Relation, target: Target, authorId: number | undefined): boolean {
  const actor = actorOf(rel);
  if (isProject(probe.action)) {
    const facts: ProjectFacts = {
      ownerId: world.owner.id,
      visibility: target.projectVisibility,
      mentorIds: [world.mentor.id],
      followerIds: [world.follower.id],
      ...(probe.sessionScoped ? { sessionVisibility: target.sessionVisibility } : {}),
      ...(authorId !== undefined ? { authorId } : {}),
    };
    return canOnProject(actor, probe.action, facts);
  }
  if (isSite(probe.action)) return canOnSite(actor, probe.action);
  return canPublic(actor, probe.action as PublicAction);
}

type Case = { label: string; probe: Probe; rel: Relation; project: Visibility; session: Visibility };
const cases: Case[] = PROBES.flatMap((probe) => {
  const projectStates = probe.dependsOnVisibility ? VISIBILITIES : (['published'] as Visibility[]);
  const sessionStates = probe.sessionScoped ? VISIBILITIES : (['published'] as Visibility[]);
  return projectStates.flatMap((project) =>
    sessionStates.flatMap((session) =>
      RELATIONS.map((rel) => ({ label: `${probe.action} via ${probe.via} — ${rel}, project ${project}, session ${session}`, probe, rel, project, session })),
    ),
  );
});

describe('every action of the matrix has at least one probe', () => {
  test('no action is left unwalked', () => {
    const walked = new Set(PROBES.map((p) => p.action));
    const missing = (Object.keys(PERMISSIONS) as Action[]).filter((a) => !walked.has(a));
    expect(missing).toEqual([]);
  });
  test('the matrix names every relation for every action', () => {
    for (const action of [...PROJECT_ACTIONS, ...SITE_ACTIONS, ...PUBLIC_ACTIONS]) expect(Object.keys(PERMISSIONS[action]).sort()).toEqual([...RELATIONS].sort());
  });
});

describe('route handlers and server actions obey the matrix', () => {
  test.each(cases)('$label', async ({ probe, rel, project, session }) => {
    const target = await makeTarget(world, project, session);
    const prepared = await probe.prepare?.(world, target, rel);
    const allowed = expected(probe, rel, target, prepared?.authorId);
    const person = personOf(rel);
    world.setCookie(person?.cookie);
    const status = await probe.run(world, target, person, prepared);
    world.setCookie(undefined);
    if (allowed) {
      expect(status, `${rel} should be allowed`).toBeGreaterThanOrEqual(200);
      expect(status, `${rel} should be allowed`).toBeLessThan(300);
    } else {
      expect([401, 403, 404], `${rel} should be refused, got ${status}`).toContain(status);
      // Signed out is always "sign in"; a private thing is invisible to outsiders.
      if (rel === 'anonymous' && status !== 404) expect(status).toBe(401);
    }
    if (probe.check) await probe.check(world, target, prepared, allowed);
  });
});

