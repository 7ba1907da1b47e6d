import { describe, expect, test } from 'vitest';
import { authorizeProject, canOnProject, canOnSite, relationTo, type Actor, type ProjectAction, type ProjectFacts, type Visibility } from '@/lib/auth/policy';
import { AppError } from '@/lib/errors';
import { toErrorResponse } from '@/lib/http/errors';

const OWNER = 1;
const MENTOR = 2;
const OTHER = 3;
const ADMIN = 4;

const actors: Record<string, Actor> = {
  anonymous: null,
  member: { id: OTHER, siteRole: 'member' },
  owner: { id: OWNER, siteRole: 'member' },
  mentor: { id: MENTOR, siteRole: 'member' },
  admin: { id: ADMIN, siteRole: 'admin' },
};

const project = (visibility: Visibility): ProjectFacts => ({ ownerId: OWNER, visibility, mentorIds: [MENTOR] });

function sameForEveryVisibility(row: Record<string, boolean>): Record<Visibility, Record<string, boolean>> {
  return { private: row, unlisted: row, published: row };
}

// The product's rules, written out in full as the expected matrix (true = allowed).
// view: private only for the builder's circle (builder, mentors, admins); unlisted and published for anyone.
// update / manageMentors: the builder only. delete: the builder, or an admin removing abuse.
const expected: Partial<Record<ProjectAction, Record<Visibility, Record<string, boolean>>>> = {
  view: {
    private: { anonymous: false, member: false, owner: true, mentor: true, admin: true },
    unlisted: { anonymous: true, member: true, owner: true, mentor: true, admin: true },
    published: { anonymous: true, member: true, owner: true, mentor: true, admin: true },
  },
  update: sameForEveryVisibility({ anonymous: false, member: false, owner: true, mentor: false, admin: false }),
  delete: sameForEveryVisibility({ anonymous: false, member: false, owner: true, mentor: false, admin: true }),
  manageMentors: sameForEveryVisibility({ anonymous: false, member: false, owner: true, mentor: false, admin: false }),
  editLog: sameForEveryVisibility({ anonymous: false, member: false, owner: true, mentor: false, admin: false }),
};

const rows = (Object.keys(expected) as ProjectAction[]).flatMap((action) =>
  (['private', 'unlisted', 'published'] as const).flatMap((visibility) =>
    Object.keys(actors).map((who) => ({ action, visibility, who, allowed: expected[action]![visibility][who] })),
  ),
);

describe('project policy: every role × every action × every visibility', () => {
  test.each(rows)('$who may $action a $visibility project: $allowed', ({ action, visibility, who, allowed }) => {
    expect(canOnProject(actors[who], action, project(visibility))).toBe(allowed);
  });
});

describe('the error a refused actor sees', () => {
  const statusOf = (actor: Actor, action: ProjectAction, visibility: Visibility): number | 'ok' => {
    try {
      authorizeProject(actor, action, project(visibility));
      return 'ok';
    } catch (e) {
      expect(e).toBeInstanceOf(AppError);
      return toErrorResponse(e).status;
    }
  };
  test('a private project is a 404 to anyone outside the circle, signed in or not', () => {
    expect(statusOf(null, 'view', 'private')).toBe(404);
    expect(statusOf(actors.member, 'view', 'private')).toBe(404);
    expect(statusOf(actors.member, 'update', 'private')).toBe(404);
  });
  test('changing anything signed out is a 401', () => {
    expect(statusOf(null, 'update', 'published')).toBe(401);
    expect(statusOf(null, 'delete', 'private')).toBe(401);
  });
  test('a visible project that is not yours is a 403', () => {
    expect(statusOf(actors.member, 'update', 'published')).toBe(403);
    expect(statusOf(actors.mentor, 'update', 'private')).toBe(403);
    expect(statusOf(actors.mentor, 'delete', 'unlisted')).toBe(403);
  });
  test('allowed actions pass', () => {
    expect(statusOf(actors.owner, 'delete', 'private')).toBe('ok');
    expect(statusOf(actors.admin, 'view', 'private')).toBe('ok');
  });
});

describe('site actions', () => {
  test.each([
    ['anonymous', 'createProject', false],
    ['member', 'createProject', true],
    ['admin', 'createProject', true],
    ['anonymous', 'listOwnProjects', false],
    ['member', 'listOwnProjects', true],
    ['anonymous', 'manageUsers', false],
    ['member', 'manageUsers', false],
    ['owner', 'manageUsers', false],
    ['admin', 'manageUsers', true],
  ] as const)('%s may %s: %s', (who, action, allowed) => {
    expect(canOnSite(actors[who], action)).toBe(allowed);
  });
});

test('an admin who owns a project acts on it as its builder', () => {
  expect(relationTo({ id: OWNER, siteRole: 'admin' }, project('private'))).toBe('owner');
});
