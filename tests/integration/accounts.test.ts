// Accounts (issue 11): verified addresses, sign-up and reset that answer the same for any address, sessions
// that end, password rules, address change, account deletion, account mail limits, the dev mailbox.
// The rules come from the issue; where a number comes from outside (bcrypt's 72 bytes), its source is named.
import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import { Op, QueryTypes } from 'sequelize';
import bcrypt from 'bcryptjs';
import { guardTestDatabase, closeDb, makeUser, request, params, sessionCookie } from '../support/db';
import { POST as signUpRoute } from '@/app/api/account/route';
import { POST as verifyRoute } from '@/app/api/account/verify/route';
import { POST as resetRequestRoute } from '@/app/api/account/password-reset/route';
import { POST as resetConfirmRoute } from '@/app/api/account/password-reset/confirm/route';
import { GET as accountGet, PATCH as accountPatch, DELETE as accountDelete } from '@/app/api/me/account/route';
import { POST as passwordRoute } from '@/app/api/me/account/password/route';
import { POST as emailRoute } from '@/app/api/me/account/email/route';
import { POST as resendRoute } from '@/app/api/me/account/verification/route';
import { POST as inviteRoute } from '@/app/api/projects/[id]/invitations/route';
import { POST as acceptRoute } from '@/app/api/invitations/accept/route';
import { GET as listCommentsRoute, POST as commentRoute } from '@/app/api/entries/[id]/comments/route';
import { POST as followProjectRoute } from '@/app/api/projects/[id]/follow/route';
import { POST as followBuilderRoute } from '@/app/api/builders/[handle]/follow/route';
import { GET as readProjectRoute } from '@/app/api/projects/[id]/route';
import { initModels, AccountToken, Comment, Entry, Follow, Media, OutboxMessage, Project, ProjectMembership, RiskFlag, ShopSession, User } from '@/db/models';
import { getSequelize } from '@/db/connection';
import { authOptions } from '@/lib/auth/options';
import { setSiteRole } from '@/lib/server/users';
import { listCapturedMail } from '@/lib/server/dev-mailbox';
import { toErrorResponse } from '@/lib/http/errors';
import { ACCOUNT_MAIL_LIMITS } from '@/lib/server/account-mail-limits';
import { runFileDeletions } from '@/lib/server/file-cleanup';
import { VERIFY_FIRST_MESSAGE } from '@/lib/auth/policy';

guardTestDatabase();

const TAG = `acct-${Date.now().toString(36)}-${process.pid}`;
type U = Awaited<ReturnType<typeof makeUser>>;
const users: number[] = [];
const projects: number[] = [];
let clientSeq = 0;
// Each test asks from its own client address, so the per-client limit only bites where a test means it to.
const freshClient = () => `198.51.100.${(++clientSeq % 250) + 1}`;
const addr = (name: string) => `${name}-${TAG}@example.test`;

function post(handler: (req: ReturnType<typeof request>, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>, path: string, body: unknown, cookie?: string, client = freshClient()) {
  const req = request(path, { method: 'POST', body, cookie });
  req.headers.set('x-forwarded-for', client);
  return handler(req, params({}));
}
const me = (cookie: string) => accountGet(request('/api/me/account', { cookie }), params({}));

async function lastMail(to: string, kind: string) {
  const rows = await OutboxMessage.findAll({ where: { toAddress: to.toLowerCase(), kind }, order: [['id', 'DESC']], limit: 1 });
  return rows[0] ?? null;
}
function linkToken(text: string, path: string): string {
  const m = new RegExp(`${path.replace('/', '\\/')}\\?token=([A-Za-z0-9_\\-.%]+)`).exec(text);
  expect(m, `a ${path} link in:\n${text}`).not.toBeNull();
  return decodeURIComponent(m![1]);
}

async function signUp(email: string, password = 'lathe spigot recess fit', extra: Record<string, unknown> = {}) {
  return post(signUpRoute, '/api/account', { name: 'Maren Holt', email, password, ...extra });
}
/** A signed-up account as sign-in would give it: id and a session cookie. */
async function signedIn(email: string) {
  const u = (await User.findOne({ where: { email } }))!;
  users.push(u.id);
  return { id: u.id, email, cookie: await sessionCookie(u.id, u.sessionVersion) };
}

async function makeLog(ownerId: number, visibility: 'published' | 'private') {
  const project = await Project.create({
    ownerId, slug: `${TAG}-${projects.length}-${visibility}`, title: `Backplate ${visibility}`, summary: 'A cast-iron backplate.', units: 'mm', visibility,
    publishedAt: visibility === 'published' ? new Date() : null,
  });
  projects.push(project.id);
  const session = await ShopSession.create({
    projectId: project.id, position: 0, title: 'Spigot', heldOn: '2026-10-10', minutesSpent: 90, planned: '', done: '', nextSteps: '',
    visibility, publishedAt: visibility === 'published' ? new Date() : null,
  });
  const entry = await Entry.create({ sessionId: session.id, position: 0, title: 'Turning the spigot', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) });
  return { project, session, entry };
}

beforeAll(() => {
  initModels();
});

afterAll(async () => {
  await OutboxMessage.destroy({ where: { toAddress: { [Op.like]: `%${TAG}%` } } });
  await Project.destroy({ where: { id: { [Op.in]: projects } } });
  const emails = (await User.findAll({ where: { id: { [Op.in]: users } }, attributes: ['email'] })).map((u) => u.email);
  await OutboxMessage.destroy({ where: { toAddress: { [Op.in]: emails } } });
  await User.destroy({ where: { [Op.or]: [{ id: { [Op.in]: users } }, { email: { [Op.like]: `%${TAG}%` } }] } });
  await getSequelize().query('DELETE FROM account_mail_counts WHERE subject LIKE ? OR subject LIKE ?', { replacements: [`%${TAG}%`, '198.51.100.%'] });
  await closeDb();
});

describe('sign-up', () => {
  test('a new address gets an unverified account and a verification link; the answer is 202 "check your mail"', async () => {
    const email = addr('new');
    const res = await signUp(email.toUpperCase());
    expect(res.status).toBe(202);
    expect((await res.json()).message).toMatch(/Check your mail/);
    const u = (await User.findOne({ where: { email } }))!;
    users.push(u.id);
    expect(u.emailVerifiedAt).toBeNull();
    expect(await bcrypt.compare('lathe spigot recess fit', u.passwordHash)).toBe(true);
    const mail = await lastMail(email, 'verify-address');
    expect(mail?.textBody).toMatch(/\/verify-email\?token=/);
  });

  test('a taken address gets the same answer, no second account, and its owner is told by mail', async () => {
    const owner = await makeUser();
    users.push(owner.id);
    const fresh = await (await signUp(addr('fresh'))).json();
    const res = await signUp(owner.email, 'another long passphrase here');
    expect(res.status).toBe(202);
    const body = await res.json();
    expect(body.message.replace(owner.email, 'X')).toBe(fresh.message.replace(addr('fresh'), 'X'));
    expect(await User.count({ where: { email: owner.email } })).toBe(1);
    expect(await bcrypt.compare('another long passphrase here', (await User.findByPk(owner.id))!.passwordHash)).toBe(false);
    expect((await lastMail(owner.email, 'sign-up-attempt'))?.textBody).toMatch(/already have one/);
    await signedIn(addr('fresh'));
  });

  test('a common password is refused, naming the field (list from @zxcvbn-ts/language-common)', async () => {
    const res = await signUp(addr('common'), 'password1234');
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.fieldErrors.password[0]).toMatch(/most common passwords/);
    expect(await User.count({ where: { email: addr('common') } })).toBe(0);
  });

  test('a password past 72 bytes is refused, not cut (bcrypt reads only 72 bytes: bcrypt paper, Provos & Mazières 1999)', async () => {
    const seventyThree = 'é'.repeat(36) + 'x'; // 36 × 2 bytes + 1 = 73 bytes, 37 characters
    const res = await signUp(addr('long'), seventyThree);
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.password[0]).toMatch(/72 bytes/);
    expect(await User.count({ where: { email: addr('long') } })).toBe(0);
  });

  test('the verification link verifies the address once; a second use is refused', async () => {
    const email = addr('verify');
    await signUp(email);
    const token = linkToken((await lastMail(email, 'verify-address'))!.textBody, '/verify-email');
    const first = await post(verifyRoute, '/api/account/verify', { token });
    expect(first.status).toBe(200);
    expect((await User.findOne({ where: { email } }))!.emailVerifiedAt).not.toBeNull();
    const again = await post(verifyRoute, '/api/account/verify', { token });
    expect(again.status).toBe(400);
    expect((await again.json()).message).toMatch(/already been used/);
    await signedIn(email);
  });

  test('a forged or tampered link is a 400, never a 500', async () => {
    for (const token of ['nonsense-token-value', 'eyJpIjoxLCJuIjoieCIsInAiOiJ2ZXJpZnkifQ.AAAA', 'a.b.c.d.e.f.g']) {
      const res = await post(verifyRoute, '/api/account/verify', { token });
      expect(res.status, token).toBe(400);
    }
  });

  test('the return path of an invitation survives sign-up (in the verification link), and a foreign one is dropped', async () => {
    const email = addr('next');
    await signUp(email, undefined, { next: '/invitations/accept?token=abc' });
    expect((await lastMail(email, 'verify-address'))!.textBody).toMatch(/next=%2Finvitations%2Faccept%3Ftoken%3Dabc/);
    const evil = addr('evil-next');
    await signUp(evil, undefined, { next: '/\\evil.test/x' });
    expect((await lastMail(evil, 'verify-address'))!.textBody).not.toMatch(/evil\.test/);
    await signedIn(email);
    await signedIn(evil);
  });
});

describe('a verified address is needed to reach other people', () => {
  let builder: U;
  let entryId: number;
  let projectId: number;
  let builderHandle: string;
  beforeAll(async () => {
    builder = await makeUser();
    users.push(builder.id);
    const log = await makeLog(builder.id, 'published');
    entryId = log.entry.id;
    projectId = log.project.id;
    builderHandle = (await User.findByPk(builder.id))!.handle;
  });

  test('invitation chain: register the invited address → accept refused (403, verify first); verify → accept works', async () => {
    const email = addr('invited');
    const inv = await inviteRoute(request(`/api/projects/${projectId}/invitations`, { method: 'POST', cookie: builder.cookie, body: { email } }), params({ id: String(projectId) }));
    expect(inv.status).toBe(201);
    const inviteToken = linkToken((await lastMail(email, 'mentor-invite'))!.textBody, '/invitations/accept');
    expect((await signUp(email)).status).toBe(202);
    const who = await signedIn(email);

    const refused = await post(acceptRoute, '/api/invitations/accept', { token: inviteToken }, who.cookie);
    expect(refused.status).toBe(403);
    expect((await refused.json()).message).toBe(VERIFY_FIRST_MESSAGE);
    expect(await ProjectMembership.count({ where: { projectId, userId: who.id } })).toBe(0);
    // Still private to them: the private-project rule is untouched.
    const verifyToken = linkToken((await lastMail(email, 'verify-address'))!.textBody, '/verify-email');
    expect((await post(verifyRoute, '/api/account/verify', { token: verifyToken })).status).toBe(200);

    const accepted = await post(acceptRoute, '/api/invitations/accept', { token: inviteToken }, who.cookie);
    expect(accepted.status).toBe(200);
    expect(await ProjectMembership.count({ where: { projectId, userId: who.id, role: 'mentor' } })).toBe(1);
  });

  test('an unverified member cannot comment or follow (403 saying to verify); verified they can', async () => {
    const unverified = await makeUser('member', { verified: false });
    users.push(unverified.id);
    const c = await commentRoute(request(`/api/entries/${entryId}/comments`, { method: 'POST', cookie: unverified.cookie, body: { body: 'What feed did you use?' } }), params({ id: String(entryId) }));
    expect(c.status).toBe(403);
    expect((await c.json()).message).toMatch(/Verify your e-mail address/);
    const f = await followProjectRoute(request(`/api/projects/${projectId}/follow`, { method: 'POST', cookie: unverified.cookie }), params({ id: String(projectId) }));
    expect(f.status).toBe(403);
    const b = await followBuilderRoute(request(`/api/builders/${builderHandle}/follow`, { method: 'POST', cookie: unverified.cookie }), params({ handle: builderHandle }));
    expect(b.status).toBe(403);
    // The comments box says why it is closed, so the page can offer the link again.
    const list = await listCommentsRoute(request(`/api/entries/${entryId}/comments`, { cookie: unverified.cookie }), params({ id: String(entryId) }));
    expect((await list.json()).can).toEqual({ comment: false, closedReason: 'verify' });
    expect(await Comment.count({ where: { authorId: unverified.id } })).toBe(0);
    expect(await Follow.count({ where: { userId: unverified.id } })).toBe(0);

    await User.update({ emailVerifiedAt: new Date() }, { where: { id: unverified.id } });
    const ok = await commentRoute(request(`/api/entries/${entryId}/comments`, { method: 'POST', cookie: unverified.cookie, body: { body: 'What feed did you use?' } }), params({ id: String(entryId) }));
    expect(ok.status).toBe(201);
  });

  test('the verification mail can be sent again; earlier links stop working', async () => {
    const email = addr('resend');
    await signUp(email);
    const who = await signedIn(email);
    const first = linkToken((await lastMail(email, 'verify-address'))!.textBody, '/verify-email');
    const res = await post(resendRoute, '/api/me/account/verification', {}, who.cookie);
    expect(res.status).toBe(202);
    const second = linkToken((await lastMail(email, 'verify-address'))!.textBody, '/verify-email');
    expect(second).not.toBe(first);
    expect((await post(verifyRoute, '/api/account/verify', { token: first })).status).toBe(400);
    expect((await post(verifyRoute, '/api/account/verify', { token: second })).status).toBe(200);
  });
});

describe('sessions that end', () => {
  test('after signing out, the saved cookie no longer works', async () => {
    const u = await makeUser();
    users.push(u.id);
    expect((await me(u.cookie)).status).toBe(200);
    await authOptions.events!.signOut!({ token: { sub: String(u.id), sv: 0 }, session: undefined as never });
    expect((await me(u.cookie)).status).toBe(401);
  });

  test('after a password change, earlier cookies no longer work; a new sign-in does', async () => {
    const u = await makeUser();
    users.push(u.id);
    const res = await post(passwordRoute, '/api/me/account/password', { currentPassword: 'integration-pass', newPassword: 'dividing head forty to one' }, u.cookie);
    expect(res.status).toBe(200);
    expect((await me(u.cookie)).status).toBe(401);
    const row = (await User.findByPk(u.id))!;
    expect(await bcrypt.compare('dividing head forty to one', row.passwordHash)).toBe(true);
    expect((await me(await sessionCookie(u.id, row.sessionVersion))).status).toBe(200);
    expect((await lastMail(u.email, 'password-changed'))).not.toBeNull();
  });

  test('a wrong current password changes nothing (400 naming currentPassword)', async () => {
    const u = await makeUser();
    users.push(u.id);
    const res = await post(passwordRoute, '/api/me/account/password', { currentPassword: 'not it at all', newPassword: 'dividing head forty to one' }, u.cookie);
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.currentPassword).toBeDefined();
    expect((await me(u.cookie)).status).toBe(200);
  });

  test('after a role change, earlier cookies no longer work', async () => {
    const u = await makeUser();
    users.push(u.id);
    await setSiteRole(u.id, 'admin');
    expect((await me(u.cookie)).status).toBe(401);
  });

  test('a cookie without a session version (made before versions) is no session', async () => {
    const u = await makeUser();
    users.push(u.id);
    const { encode } = await import('next-auth/jwt');
    const old = await encode({ token: { sub: String(u.id) }, secret: process.env.NEXTAUTH_SECRET! });
    expect((await me(`next-auth.session-token=${old}`)).status).toBe(401);
  });
});

describe('password reset', () => {
  test('same answer whether or not the address has an account; only an account gets mail', async () => {
    const u = await makeUser();
    users.push(u.id);
    const nobody = addr('nobody');
    const a = await post(resetRequestRoute, '/api/account/password-reset', { email: u.email });
    const b = await post(resetRequestRoute, '/api/account/password-reset', { email: nobody });
    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect((await a.json()).message.replace(u.email, 'X')).toBe((await b.json()).message.replace(nobody, 'X'));
    expect(await lastMail(u.email, 'password-reset')).not.toBeNull();
    expect(await OutboxMessage.count({ where: { toAddress: nobody } })).toBe(0);
  });

  test('the link sets a new password once, ends earlier sessions, and cannot be used again', async () => {
    const u = await makeUser();
    users.push(u.id);
    await post(resetRequestRoute, '/api/account/password-reset', { email: u.email });
    const token = linkToken((await lastMail(u.email, 'password-reset'))!.textBody, '/reset-password');
    const weak = await post(resetConfirmRoute, '/api/account/password-reset/confirm', { token, password: 'qwertyuiop' });
    expect(weak.status).toBe(400);
    const ok = await post(resetConfirmRoute, '/api/account/password-reset/confirm', { token, password: 'knurled brass thumb screw' });
    expect(ok.status).toBe(200);
    expect(await bcrypt.compare('knurled brass thumb screw', (await User.findByPk(u.id))!.passwordHash)).toBe(true);
    expect((await me(u.cookie)).status).toBe(401);
    const again = await post(resetConfirmRoute, '/api/account/password-reset/confirm', { token, password: 'another brass thumb screw' });
    expect(again.status).toBe(400);
    expect(await bcrypt.compare('knurled brass thumb screw', (await User.findByPk(u.id))!.passwordHash)).toBe(true);
  });

  test('an expired link is refused', async () => {
    const u = await makeUser();
    users.push(u.id);
    await post(resetRequestRoute, '/api/account/password-reset', { email: u.email });
    const token = linkToken((await lastMail(u.email, 'password-reset'))!.textBody, '/reset-password');
    await AccountToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: u.id, purpose: 'reset', usedAt: null } });
    const res = await post(resetConfirmRoute, '/api/account/password-reset/confirm', { token, password: 'knurled brass thumb screw' });
    expect(res.status).toBe(400);
    expect((await res.json()).message).toMatch(/expired/);
    expect(await bcrypt.compare('integration-pass', (await User.findByPk(u.id))!.passwordHash)).toBe(true);
  });
});

describe('your account', () => {
  test('the name can be changed; a bad one is a 400 naming name', async () => {
    const u = await makeUser();
    users.push(u.id);
    const bad = await accountPatch(request('/api/me/account', { method: 'PATCH', cookie: u.cookie, body: { name: 'x' } }), params({}));
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.name).toBeDefined();
    const ok = await accountPatch(request('/api/me/account', { method: 'PATCH', cookie: u.cookie, body: { name: 'Ilse Brandt' } }), params({}));
    expect(ok.status).toBe(200);
    expect((await User.findByPk(u.id))!.name).toBe('Ilse Brandt');
    expect((await accountPatch(request('/api/me/account', { method: 'PATCH', body: { name: 'Nobody' } }), params({}))).status).toBe(401);
  });

  test('a new address takes effect only once it follows its link; the old address is told', async () => {
    const u = await makeUser();
    users.push(u.id);
    const next = addr('moved');
    const res = await post(emailRoute, '/api/me/account/email', { email: next, currentPassword: 'integration-pass' }, u.cookie);
    expect(res.status).toBe(202);
    expect((await User.findByPk(u.id))!.email).toBe(u.email);
    expect((await (await me(u.cookie)).json()).pendingEmail).toBe(next);
    expect((await lastMail(u.email, 'address-change-notice'))?.textBody).toContain(next);
    const token = linkToken((await lastMail(next, 'confirm-new-address'))!.textBody, '/verify-email');
    expect((await post(verifyRoute, '/api/account/verify', { token })).status).toBe(200);
    const row = (await User.findByPk(u.id))!;
    expect(row.email).toBe(next);
    expect(row.emailVerifiedAt).not.toBeNull();
  });

  test('an address that belongs to another account gets no link, with the same answer', async () => {
    const [u, other] = await Promise.all([makeUser(), makeUser()]);
    users.push(u.id, other.id);
    const res = await post(emailRoute, '/api/me/account/email', { email: other.email, currentPassword: 'integration-pass' }, u.cookie);
    expect(res.status).toBe(202);
    expect(await lastMail(other.email, 'confirm-new-address')).toBeNull();
    expect((await User.findByPk(u.id))!.email).toBe(u.email);
  });
});

describe('deleting the account', () => {
  async function world() {
    const [builder, mentor, reader] = await Promise.all([makeUser(), makeUser(), makeUser()]);
    users.push(builder.id, mentor.id, reader.id);
    const pub = await makeLog(builder.id, 'published');
    const priv = await makeLog(builder.id, 'private');
    await ProjectMembership.create({ projectId: pub.project.id, userId: mentor.id, role: 'mentor' });
    await Media.create({
      entryId: priv.entry.id, kind: 'photo', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/p', name: 'plate.jpg',
      mime: 'image/jpeg', sizeBytes: 1000, width: 10, height: 10, durationMs: null, uploadedBy: builder.id,
    });
    const flag = await RiskFlag.create({
      projectId: pub.project.id, sessionId: pub.session.id, entryId: pub.entry.id, targetKind: 'entry', noteId: null, recordId: null, mentorId: mentor.id,
      severity: 'stop', hazard: 'rotating-work', concern: 'Chuck key left in.', instead: 'Take the key out before power-on.',
    });
    const comment = await Comment.create({ entryId: pub.entry.id, authorId: builder.id, parentId: null, mediaId: null, atMs: null, body: 'Measured with a micrometer.' });
    await Follow.create({ userId: reader.id, builderId: builder.id, projectId: null, mail: true });
    await Follow.create({ userId: builder.id, builderId: reader.id, projectId: null, mail: true });
    return { builder, mentor, reader, pub, priv, flag, comment };
  }
  const del = (who: U, body: unknown) => accountDelete(request('/api/me/account', { method: 'DELETE', cookie: who.cookie, body }), params({}));

  test('keep: published logs stay under "Former member", the rest goes; follows and sessions end', async () => {
    const w = await world();
    expect((await del(w.builder, { logs: 'keep', currentPassword: 'wrong' })).status).toBe(400);
    expect(await Project.count({ where: { id: w.priv.project.id } })).toBe(1);
    expect((await del(w.builder, { logs: 'keep', currentPassword: 'integration-pass' })).status).toBe(204);
    const row = (await User.findByPk(w.builder.id))!;
    expect(row.name).toBe('Former member');
    expect(row.email).not.toBe(w.builder.email);
    expect(row.deletedAt).not.toBeNull();
    expect(await Project.count({ where: { id: w.pub.project.id } })).toBe(1);
    expect(await Project.count({ where: { id: w.priv.project.id } })).toBe(0);
    expect(await Media.count({ where: { entryId: w.priv.entry.id } })).toBe(0);
    expect((await Comment.findByPk(w.comment.id))!.body).toBe('Measured with a micrometer.');
    expect(await Follow.count({ where: { [Op.or]: [{ userId: w.builder.id }, { builderId: w.builder.id }] } })).toBe(0);
    expect((await me(w.builder.cookie)).status).toBe(401);
    // The old address is free again.
    expect(await User.count({ where: { email: w.builder.email } })).toBe(0);
  });

  test('remove: every log and comment goes; a mentor deleting their account leaves their flags on the log', async () => {
    const w = await world();
    expect((await del(w.mentor, { logs: 'remove', currentPassword: 'integration-pass' })).status).toBe(204);
    expect(await RiskFlag.count({ where: { id: w.flag.id } })).toBe(1);
    expect(await ProjectMembership.count({ where: { userId: w.mentor.id } })).toBe(0);

    expect((await del(w.builder, { logs: 'remove', currentPassword: 'integration-pass' })).status).toBe(204);
    expect(await Project.count({ where: { id: { [Op.in]: [w.pub.project.id, w.priv.project.id] } } })).toBe(0);
    expect(await Comment.count({ where: { authorId: w.builder.id, deletedAt: null } })).toBe(0);
    const pubRead = await readProjectRoute(request(`/api/projects/${w.pub.project.id}`, { cookie: w.reader.cookie }), params({ id: String(w.pub.project.id) }));
    expect(pubRead.status).toBe(404);
  });

  test("the removed logs' files are queued for deletion in the same transaction, and the clean-up finishes them", async () => {
    const w = await world();
    const upload = (entryId: number, fileKey: string) =>
      Media.create({
        entryId, kind: 'photo', source: 'upload', fileKey, url: `/api/media/${fileKey}/file`, name: 'spigot.jpg',
        mime: 'image/jpeg', sizeBytes: 1000, width: 10, height: 10, durationMs: null, uploadedBy: w.builder.id,
      });
    const gone = `${TAG}-private-plate`;
    const kept = `${TAG}-published-plate`;
    await upload(w.priv.entry.id, gone);
    await upload(w.pub.entry.id, kept);
    const queued = async () =>
      (await getSequelize().query<{ fileKey: string }>('SELECT file_key AS fileKey FROM file_deletions WHERE file_key IN (:keys)', { replacements: { keys: [gone, kept] }, type: QueryTypes.SELECT })).map((r) => r.fileKey);
    // The upload service is out of reach when the account goes (a fresh module copy reads the address where nothing listens):
    // only the queue, written with the deletion, keeps the file from being forgotten.
    const previous = process.env.UPLOADTHING_API_URL;
    process.env.UPLOADTHING_API_URL = 'http://127.0.0.1:9';
    vi.resetModules();
    try {
      const fresh = await import('@/lib/server/accounts');
      await fresh.deleteAccount({ id: w.builder.id, siteRole: 'member', emailVerified: true }, { logs: 'keep', currentPassword: 'integration-pass' });
    } finally {
      process.env.UPLOADTHING_API_URL = previous;
    }
    expect(await Media.count({ where: { fileKey: gone } })).toBe(0);
    // The published log stays with its file; only the private project's file waits for deletion.
    expect(await queued()).toEqual([gone]);
    // The service is back: the scheduled clean-up's run deletes it and empties the queue.
    const report = await runFileDeletions();
    expect(report.error).toBeUndefined();
    expect(await queued()).toEqual([]);
  });

  test('a wrong password queues nothing', async () => {
    const w = await world();
    const key = `${TAG}-wrong-password`;
    await Media.create({
      entryId: w.priv.entry.id, kind: 'photo', source: 'upload', fileKey: key, url: `/api/media/${key}/file`, name: 'spigot.jpg',
      mime: 'image/jpeg', sizeBytes: 1000, width: 10, height: 10, durationMs: null, uploadedBy: w.builder.id,
    });
    expect((await del(w.builder, { logs: 'remove', currentPassword: 'wrong' })).status).toBe(400);
    expect(await Media.count({ where: { fileKey: key } })).toBe(1);
    expect(await getSequelize().query('SELECT id FROM file_deletions WHERE file_key = ?', { replacements: [key], type: QueryTypes.SELECT })).toEqual([]);
  });

  test('a bad choice is a 400 naming logs, and nothing is deleted', async () => {
    const u = await makeUser();
    users.push(u.id);
    const res = await del(u, { logs: 'everything', currentPassword: 'integration-pass' });
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.logs).toBeDefined();
    expect((await User.findByPk(u.id))!.deletedAt).toBeNull();
  });
});

describe('account mail limits', () => {
  test(`at most ${ACCOUNT_MAIL_LIMITS.perAddress} account e-mails an hour to one address, counted atomically`, async () => {
    const email = addr('flood');
    const results = await Promise.all(
      Array.from({ length: ACCOUNT_MAIL_LIMITS.perAddress + 3 }, () => post(resetRequestRoute, '/api/account/password-reset', { email })),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 202)).toHaveLength(ACCOUNT_MAIL_LIMITS.perAddress);
    expect(statuses.filter((s) => s === 429)).toHaveLength(3);
    const refused = results.find((r) => r.status === 429)!;
    expect((await refused.json()).message).toMatch(/Too many e-mails/);
  });

  test(`at most ${ACCOUNT_MAIL_LIMITS.perClient} account e-mails an hour from one client`, async () => {
    const client = '203.0.113.77';
    await getSequelize().query('DELETE FROM account_mail_counts WHERE subject = ?', { replacements: [client] });
    const statuses: number[] = [];
    for (let i = 0; i <= ACCOUNT_MAIL_LIMITS.perClient; i++) {
      statuses.push((await post(resetRequestRoute, '/api/account/password-reset', { email: addr(`spread${i}`) }, undefined, client)).status);
    }
    expect(statuses.slice(0, ACCOUNT_MAIL_LIMITS.perClient).every((s) => s === 202)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
    await getSequelize().query('DELETE FROM account_mail_counts WHERE subject = ?', { replacements: [client] });
  });
});

describe('the dev mailbox', () => {
  const saved = process.env.SCRIBELINE_DEV_MAILBOX;
  afterAll(() => {
    if (saved === undefined) delete process.env.SCRIBELINE_DEV_MAILBOX;
    else process.env.SCRIBELINE_DEV_MAILBOX = saved;
  });
  const status = async (actor: Parameters<typeof listCapturedMail>[0]) => {
    try {
      await listCapturedMail(actor);
      return 200;
    } catch (e) {
      return toErrorResponse(e).status;
    }
  };

  test('switched on: signed out → 404, member → 404, admin → 200', async () => {
    process.env.SCRIBELINE_DEV_MAILBOX = '1';
    expect(await status(null)).toBe(404);
    expect(await status({ id: 1, siteRole: 'member', emailVerified: true })).toBe(404);
    expect(await status({ id: 2, siteRole: 'admin', emailVerified: true })).toBe(200);
  });

  test('switched off (whatever NODE_ENV says): 404 for everyone', async () => {
    delete process.env.SCRIBELINE_DEV_MAILBOX;
    expect(await status(null)).toBe(404);
    expect(await status({ id: 1, siteRole: 'member', emailVerified: true })).toBe(404);
    expect(await status({ id: 2, siteRole: 'admin', emailVerified: true })).toBe(404);
  });
});
