// The comment, report, follow, account and mentor forms' server actions against the real database: the same
// checks and answers as their JSON routes, as states for useActionState (who may call them is walked in
// permission-matrix.test.ts; this file checks what they read from a form and what they refuse).
import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser } from '../support/db';
import { actAs } from '../support/action-request';
import { initModels, Comment, CommentReport, Entry, Follow, MentorInvitation, Project, ShopSession, User } from '@/db/models';
import { editCommentAction, hideCommentAction, postCommentAction } from '@/lib/actions/comments';
import { reportCommentAction } from '@/lib/actions/moderation';
import { followAction, setFollowMailAction, unfollowAction } from '@/lib/actions/following';
import { changeNameAction, changePasswordAction, resendVerificationAction } from '@/lib/actions/account';
import { acceptInvitationAction, inviteMentorAction } from '@/lib/actions/mentors';
import { formOf } from './permission-probes';

guardTestDatabase();

// Server actions called directly: the request they see (tests/support/action-request.ts).
vi.mock('next/headers', () => import('../support/action-request').then((m) => m.fakeNextHeaders));
vi.mock('next/cache', () => import('../support/action-request').then((m) => m.fakeNextCache));

type Person = Awaited<ReturnType<typeof makeUser>>;
let builder: Person;
let reader: Person;
let other: Person;
let project: Project;
let entry: Entry;
const IDLE = { ok: true };

beforeAll(async () => {
  initModels();
  [builder, reader, other] = await Promise.all([makeUser(), makeUser(), makeUser()]);
  project = await Project.create({
    ownerId: builder.id, slug: `actions-${Date.now().toString(36)}`, title: 'Dividing head adapter', summary: '', units: 'mm', visibility: 'published', publishedAt: new Date(),
  });
  const session = await ShopSession.create({
    projectId: project.id, position: 0, title: 'Boring the register', heldOn: '2026-11-30', minutesSpent: 90, planned: '', done: '', nextSteps: '',
    visibility: 'published', publishedAt: new Date(), announcedAt: new Date(),
  });
  entry = await Entry.create({ sessionId: session.id, position: 0, title: 'Register to size', operation: 'boring', body: JSON.stringify({ type: 'doc', content: [] }) });
});

afterAll(async () => {
  const ids = [builder.id, reader.id, other.id];
  await Project.destroy({ where: { ownerId: { [Op.in]: ids } } });
  await User.destroy({ where: { id: { [Op.in]: ids } } });
  await closeDb();
});


describe('comments', () => {
  test('a new comment and a reply from their forms: ids read from text fields, the comment handed back', async () => {
    actAs(reader);
    const top = await postCommentAction(IDLE, formOf({ entryId: String(entry.id), body: '  Which boring bar did you use?  ' }));
    expect(top.ok).toBe(true);
    expect(top.data).toMatchObject({ entryId: entry.id, parentId: null, body: 'Which boring bar did you use?' });
    actAs(builder);
    const reply = await postCommentAction(IDLE, formOf({ entryId: entry.id, parentId: String(top.data!.id), body: 'A 12 mm carbide bar, 40 mm stick-out.' }));
    expect(reply.data).toMatchObject({ parentId: top.data!.id });
  });

  test('an empty body is a 400 naming body, and nothing is saved', async () => {
    actAs(reader);
    const before = await Comment.count({ where: { entryId: entry.id } });
    const state = await postCommentAction(IDLE, formOf({ entryId: entry.id, body: '   ' }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.body?.[0]).toBe('Write your comment.');
    expect(await Comment.count({ where: { entryId: entry.id } })).toBe(before);
  });

  test('a bad entry id names its field; anything but a form is a 400, never a 500', async () => {
    actAs(reader);
    const bad = await postCommentAction(IDLE, formOf({ entryId: 'twelve', body: 'Hello' }));
    expect(bad).toMatchObject({ ok: false, status: 400 });
    expect(Object.keys(bad.fieldErrors ?? {})).toContain('entryId');
    const notAForm = await postCommentAction(IDLE, { entryId: entry.id, body: 'Hello' } as unknown as FormData);
    expect(notAForm).toMatchObject({ ok: false, status: 400 });
    expect(notAForm.message).toMatch(/form could not be read/);
  });

  test('a half pin (a clip without its moment) is refused naming atMs', async () => {
    actAs(reader);
    const state = await postCommentAction(IDLE, formOf({ entryId: entry.id, body: 'At this moment?', mediaId: 999999 }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.atMs?.[0]).toMatch(/both the clip and the moment/);
  });

  test('a post from another site is refused (403) before anything is read', async () => {
    actAs(reader, 'https://elsewhere.example');
    const before = await Comment.count({ where: { entryId: entry.id } });
    const state = await postCommentAction(IDLE, formOf({ entryId: entry.id, body: 'Cross-site' }));
    expect(state).toMatchObject({ ok: false, status: 403 });
    expect(await Comment.count({ where: { entryId: entry.id } })).toBe(before);
  });

  test('an edit with a stale version is a 409 and leaves the text', async () => {
    actAs(reader);
    const posted = await postCommentAction(IDLE, formOf({ entryId: entry.id, body: 'First words.' }));
    const id = posted.data!.id;
    expect((await editCommentAction(IDLE, formOf({ commentId: id, body: 'Second words.', version: 1 }))).ok).toBe(true);
    const stale = await editCommentAction(IDLE, formOf({ commentId: id, body: 'Third words.', version: 1 }));
    expect(stale).toMatchObject({ ok: false, status: 409 });
    expect((await Comment.findByPk(id))?.body).toBe('Second words.');
  });

  test('hiding needs a reason (400 naming reason); with one the builder hides it', async () => {
    actAs(reader);
    const posted = await postCommentAction(IDLE, formOf({ entryId: entry.id, body: 'Buy my chucks at a discount!' }));
    actAs(builder);
    const empty = await hideCommentAction(IDLE, formOf({ commentId: posted.data!.id, reason: ' ' }));
    expect(empty).toMatchObject({ ok: false, status: 400 });
    expect(empty.fieldErrors?.reason?.[0]).toMatch(/Say why/);
    const hidden = await hideCommentAction(IDLE, formOf({ commentId: posted.data!.id, reason: 'Advertising.' }));
    expect(hidden.data).toMatchObject({ state: 'hidden', hidden: { by: 'builder', reason: 'Advertising.' } });
  });
});

describe('reports', () => {
  test('a short reason names reason; a report is kept once; one’s own comment cannot be reported', async () => {
    actAs(builder);
    const posted = await postCommentAction(IDLE, formOf({ entryId: entry.id, body: 'Run it at 2000 rpm with the key in.' }));
    actAs(reader);
    const short = await reportCommentAction(IDLE, formOf({ commentId: posted.data!.id, reason: 'no' }));
    expect(short).toMatchObject({ ok: false, status: 400 });
    expect(short.fieldErrors?.reason?.[0]).toMatch(/in a few words/);
    const first = await reportCommentAction(IDLE, formOf({ commentId: posted.data!.id, reason: 'Unsafe: chuck key left in.' }));
    const again = await reportCommentAction(IDLE, formOf({ commentId: posted.data!.id, reason: 'Unsafe: chuck key left in.' }));
    expect(first.data).toEqual({ alreadyReported: false });
    expect(again.data).toEqual({ alreadyReported: true });
    expect(await CommentReport.count({ where: { commentId: posted.data!.id } })).toBe(1);
    actAs(builder);
    const own = await reportCommentAction(IDLE, formOf({ commentId: posted.data!.id, reason: 'Reporting myself.' }));
    expect(own).toMatchObject({ ok: false, status: 400 });
    expect(own.fieldErrors?.reason).toBeDefined();
  });
});

describe('follows', () => {
  test('follow and unfollow a project answer with the button’s new state', async () => {
    actAs(other);
    const on = await followAction(IDLE, formOf({ projectId: project.id }));
    expect(on.data).toMatchObject({ following: true, mail: true });
    const followers = on.data!.followers;
    const off = await unfollowAction(IDLE, formOf({ projectId: project.id }));
    expect(off.data).toMatchObject({ following: false, followId: null, followers: followers - 1 });
  });

  test('a builder is followed by handle; a form naming nothing to follow is a 400', async () => {
    actAs(other);
    const handle = (await User.findByPk(builder.id))!.handle;
    expect((await followAction(IDLE, formOf({ handle }))).data).toMatchObject({ following: true });
    const nothing = await followAction(IDLE, formOf({}));
    expect(nothing).toMatchObject({ ok: false, status: 400 });
  });

  test('the e-mail switch reads true/false; anything else is a 400 naming mail and changes nothing', async () => {
    actAs(other);
    const f = await Follow.findOne({ where: { userId: other.id, builderId: builder.id } });
    const bad = await setFollowMailAction(IDLE, formOf({ followId: f!.id, mail: 'maybe' }));
    expect(bad).toMatchObject({ ok: false, status: 400 });
    expect(bad.fieldErrors?.mail).toBeDefined();
    expect((await Follow.findByPk(f!.id))?.mail).toBe(true);
    expect((await setFollowMailAction(IDLE, formOf({ followId: f!.id, mail: 'false' }))).ok).toBe(true);
    expect((await Follow.findByPk(f!.id))?.mail).toBe(false);
  });
});

describe('account settings', () => {
  test('an empty name names its field; a good one is saved', async () => {
    actAs(other);
    const empty = await changeNameAction(IDLE, formOf({ name: '' }));
    expect(empty).toMatchObject({ ok: false, status: 400 });
    expect(empty.fieldErrors?.name).toBeDefined();
    const saved = await changeNameAction(IDLE, formOf({ name: 'Ilse Marrow' }));
    expect(saved).toMatchObject({ ok: true, message: 'Your name is saved.' });
    expect((await User.findByPk(other.id))?.name).toBe('Ilse Marrow');
  });

  test('a wrong current password is refused naming currentPassword, and no session ends', async () => {
    actAs(other);
    const before = (await User.findByPk(other.id))!.sessionVersion;
    const state = await changePasswordAction(IDLE, formOf({ currentPassword: 'not-the-password', newPassword: 'tailstock die holder again' }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.currentPassword?.[0]).toBe('That is not your current password.');
    expect((await User.findByPk(other.id))!.sessionVersion).toBe(before);
  });
});

describe('send the link again', () => {
  test('an unverified member gets a new link (the answer names the address); a verified one is told so (409)', async () => {
    const unverified = await makeUser('member', { verified: false });
    try {
      actAs(unverified);
      const sent = await resendVerificationAction(IDLE, formOf({ next: '/settings' }));
      const email = (await User.findByPk(unverified.id))!.email;
      expect(sent).toMatchObject({ ok: true, message: `We sent a new link to ${email}. Earlier links no longer work.` });
      actAs(other);
      expect(await resendVerificationAction(IDLE, formOf({ next: '/settings' }))).toMatchObject({ ok: false, status: 409 });
    } finally {
      await User.destroy({ where: { id: unverified.id } });
    }
  });
});

describe('mentors', () => {
  test('a bad address names email and no invitation is made', async () => {
    actAs(builder);
    const before = await MentorInvitation.count({ where: { projectId: project.id } });
    const state = await inviteMentorAction(IDLE, formOf({ projectId: project.id, email: 'not an address', note: '' }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.email).toBeDefined();
    expect(await MentorInvitation.count({ where: { projectId: project.id } })).toBe(before);
    const sent = await inviteMentorAction(IDLE, formOf({ projectId: project.id, email: `Mentor-${Date.now()}@Example.test`, note: 'Would you look over the register fit?' }));
    expect(sent.data).toMatchObject({ state: 'pending', email: expect.stringMatching(/^mentor-\d+@example\.test$/) });
  });

  test('accepting with a token that is not one is a 400 naming token', async () => {
    actAs(reader);
    const state = await acceptInvitationAction(IDLE, formOf({ token: 'abc.def' }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.token).toBeDefined();
  });
});
