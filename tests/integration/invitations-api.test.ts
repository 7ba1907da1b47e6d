import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as overview, POST as invite } from '@/app/api/projects/[id]/invitations/route';
import { DELETE as revoke } from '@/app/api/invitations/[id]/route';
import { POST as accept } from '@/app/api/invitations/accept/route';
import { DELETE as removeMentorRoute } from '@/app/api/projects/[id]/mentors/[userId]/route';
import { checkInvitation, maskEmail, readInvitationToken } from '@/lib/server/invitations';
import { initModels, MentorInvitation, OutboxMessage, Project, ProjectMembership, User } from '@/db/models';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let builder: U, invitee: U, stranger: U, mentor: U;
let published: number, hidden: number;
const projects: number[] = [];
const users: number[] = [];
const TAG = `inv-${Date.now().toString(36)}-${process.pid}`;

async function makeProject(visibility: 'published' | 'private') {
  const p = await Project.create({
    ownerId: builder.id,
    slug: `${TAG}-${visibility}`,
    title: `Backplate ${visibility} ${TAG}`,
    summary: 'A cast-iron backplate.',
    units: 'mm',
    visibility,
    publishedAt: visibility === 'published' ? new Date() : null,
  });
  projects.push(p.id);
  return p.id;
}

const invitePost = (who: U | null, projectId: number, body: unknown) =>
  invite(request(`/api/projects/${projectId}/invitations`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(projectId) }));
const acceptPost = (who: U | null, token: string) => accept(request('/api/invitations/accept', { method: 'POST', cookie: who?.cookie, body: { token } }), params({}));
const revokeDelete = (who: U | null, id: number) => revoke(request(`/api/invitations/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) }));

/** Invites `email` as the builder and reads the signed link out of the e-mail waiting in the outbox. */
async function inviteAndReadToken(projectId: number, email: string): Promise<{ id: number; token: string; text: string }> {
  const res = await invitePost(builder, projectId, { email });
  expect(res.status).toBe(201);
  const { invitation } = await res.json();
  const rows = await OutboxMessage.findAll({ where: { toAddress: email.toLowerCase(), kind: 'mentor-invite' }, order: [['id', 'DESC']], limit: 1 });
  expect(rows).toHaveLength(1);
  const match = /\/invitations\/accept\?token=([A-Za-z0-9_\-.%]+)/.exec(rows[0].textBody);
  expect(match).not.toBeNull();
  return { id: invitation.id, token: decodeURIComponent(match![1]), text: rows[0].textBody };
}

beforeAll(async () => {
  initModels();
  [builder, invitee, stranger, mentor] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser()]);
  users.push(builder.id, invitee.id, stranger.id, mentor.id);
  published = await makeProject('published');
  hidden = await makeProject('private');
  await ProjectMembership.create({ projectId: published, userId: mentor.id, role: 'mentor' });
});

afterAll(async () => {
  const emails = (await User.findAll({ where: { id: { [Op.in]: users } }, attributes: ['email'] })).map((u) => u.email);
  await OutboxMessage.destroy({ where: { [Op.or]: [{ toAddress: { [Op.in]: emails } }, { toAddress: { [Op.like]: `%${TAG}%` } }] } });
  // Invitations and memberships go with their project (ON DELETE CASCADE).
  await Project.destroy({ where: { id: { [Op.in]: projects } } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await closeDb();
});

describe('inviting a mentor', () => {
  test('the builder invites: a row with the lowercased address, 7 days to run, and the mail with the accept link in the same go', async () => {
    const shouted = invitee.email.toUpperCase();
    const before = Date.now();
    const res = await invitePost(builder, published, { email: shouted, note: 'Would you look over the first power-on?' });
    expect(res.status).toBe(201);
    const { invitation } = await res.json();
    expect(invitation.email).toBe(invitee.email);
    expect(invitation.state).toBe('pending');
    const row = (await MentorInvitation.findByPk(invitation.id))!;
    // 7 days = 604 800 000 ms (the product's chosen lifetime).
    expect(row.expiresAt.getTime() - before).toBeGreaterThanOrEqual(7 * 24 * 3600 * 1000 - 5_000);
    expect(row.expiresAt.getTime() - before).toBeLessThanOrEqual(7 * 24 * 3600 * 1000 + 5_000);
    expect(row.nonceHash).toMatch(/^[0-9a-f]{64}$/);

    const mail = await OutboxMessage.findAll({ where: { toAddress: invitee.email, kind: 'mentor-invite' } });
    expect(mail).toHaveLength(1);
    expect(mail[0].textBody).toContain('/invitations/accept?token=');
    expect(mail[0].textBody).toContain(`Backplate published ${TAG}`);
    expect(mail[0].textBody).toContain('Would you look over the first power-on?');
    expect(mail[0].textBody).toContain("Follow your machine's manual");
    // The nonce travels only in the link: the row holds its SHA-256, never the nonce itself.
    const token = decodeURIComponent(/token=([^\s]+)/.exec(mail[0].textBody)![1]);
    const read = readInvitationToken(token)!;
    expect(read.id).toBe(invitation.id);
    expect(row.nonceHash).not.toContain(read.nonce);
  });

  test('refuses the builder’s own address and an existing mentor, naming the field', async () => {
    const self = await User.findByPk(builder.id);
    const own = await invitePost(builder, published, { email: self!.email });
    expect(own.status).toBe(400);
    expect((await own.json()).fieldErrors.email[0]).toMatch(/own address/);
    const again = await invitePost(builder, published, { email: mentor.email });
    expect(again.status).toBe(400);
    expect((await again.json()).fieldErrors.email[0]).toMatch(/already a mentor/);
    const bad = await invitePost(builder, published, { email: 'not an address' });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.email).toBeDefined();
  });

  test('only the builder invites: a member 403, a mentor 403, signed out 401, an outsider to a private project 404', async () => {
    expect((await invitePost(stranger, published, { email: `x-${TAG}@example.test` })).status).toBe(403);
    expect((await invitePost(mentor, published, { email: `x-${TAG}@example.test` })).status).toBe(403);
    expect((await invitePost(null, published, { email: `x-${TAG}@example.test` })).status).toBe(401);
    expect((await invitePost(stranger, hidden, { email: `x-${TAG}@example.test` })).status).toBe(404);
    const list = await overview(request(`/api/projects/${published}/invitations`, { cookie: stranger.cookie }), params({ id: String(published) }));
    expect(list.status).toBe(403);
    expect(await OutboxMessage.count({ where: { toAddress: `x-${TAG}@example.test` } })).toBe(0);
  });
});

describe('accepting an invitation', () => {
  test('the invited address accepts: the invitation is used and the account becomes a mentor', async () => {
    const who = await makeUser();
    users.push(who.id);
    const { id, token } = await inviteAndReadToken(hidden, who.email);
    const res = await acceptPost(who, token);
    expect(res.status).toBe(200);
    expect((await res.json()).project.id).toBe(hidden);
    expect(await ProjectMembership.count({ where: { projectId: hidden, userId: who.id, role: 'mentor' } })).toBe(1);
    const row = (await MentorInvitation.findByPk(id))!;
    expect(row.acceptedAt).not.toBeNull();
    expect(row.acceptedById).toBe(who.id);
  });

  test('a used link is refused the second time (single use)', async () => {
    const who = await makeUser();
    users.push(who.id);
    const { token } = await inviteAndReadToken(hidden, who.email);
    expect((await acceptPost(who, token)).status).toBe(200);
    const again = await acceptPost(who, token);
    expect(again.status).toBe(409);
    expect((await again.json()).message).toMatch(/already used/);
  });

  test('an expired link is refused, saying when it expired', async () => {
    const who = await makeUser();
    users.push(who.id);
    const { id, token } = await inviteAndReadToken(hidden, who.email);
    await MentorInvitation.update({ expiresAt: new Date(Date.now() - 60_000) }, { where: { id } });
    const res = await acceptPost(who, token);
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.message).toMatch(/expired on .+; ask the builder for a new one/);
    expect(body.fieldErrors.token).toBeDefined();
    expect(await ProjectMembership.count({ where: { projectId: hidden, userId: who.id } })).toBe(0);
  });

  test('signed in as another address: refused, naming the invited address masked, and nothing granted', async () => {
    const who = await makeUser();
    users.push(who.id);
    const { token } = await inviteAndReadToken(hidden, who.email);
    const res = await acceptPost(stranger, token);
    expect(res.status).toBe(403);
    const body = await res.json();
    expect(body.message).toContain(maskEmail(who.email));
    expect(body.message).not.toContain(who.email);
    expect(await ProjectMembership.count({ where: { projectId: hidden, userId: stranger.id } })).toBe(0);
    const check = await checkInvitation({ id: stranger.id, siteRole: 'member' }, token);
    expect(check.reason).toBe('wrong-account');
    // …and the right account still can.
    expect((await acceptPost(who, token)).status).toBe(200);
  });

  test('a tampered link is refused: a changed signature, and a payload naming another invitation', async () => {
    const who = await makeUser();
    users.push(who.id);
    const { id, token } = await inviteAndReadToken(hidden, who.email);
    const [payload, mac] = token.split('.');
    const flipped = `${payload}.${mac.slice(0, -1)}${mac.endsWith('A') ? 'B' : 'A'}`;
    expect((await acceptPost(who, flipped)).status).toBe(400);
    const data = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8'));
    const forged = `${Buffer.from(JSON.stringify({ ...data, i: id + 1 })).toString('base64url')}.${mac}`;
    expect((await acceptPost(who, forged)).status).toBe(400);
    expect((await acceptPost(who, 'nothing-like-a-token')).status).toBe(400);
    expect((await checkInvitation(null, flipped)).reason).toBe('invalid');
    expect(await ProjectMembership.count({ where: { projectId: hidden, userId: who.id } })).toBe(0);
  });

  test('a revoked link is refused; inviting the same address again withdraws the earlier link', async () => {
    const who = await makeUser();
    users.push(who.id);
    const first = await inviteAndReadToken(hidden, who.email);
    expect((await revokeDelete(stranger, first.id)).status).toBe(404);
    const r = await revokeDelete(builder, first.id);
    expect(r.status).toBe(200);
    expect((await r.json()).invitation.state).toBe('revoked');
    const res = await acceptPost(who, first.token);
    expect(res.status).toBe(409);
    expect((await res.json()).message).toMatch(/withdrew/);

    const second = await inviteAndReadToken(hidden, who.email);
    const third = await inviteAndReadToken(hidden, who.email);
    expect((await acceptPost(who, second.token)).status).toBe(409);
    expect((await acceptPost(who, third.token)).status).toBe(200);
  });

  test('signed out: 401, and the page knows to send the visitor to sign in', async () => {
    const who = await makeUser();
    users.push(who.id);
    const { token } = await inviteAndReadToken(hidden, who.email);
    expect((await acceptPost(null, token)).status).toBe(401);
    const check = await checkInvitation(null, token);
    expect(check.reason).toBe('signed-out');
    if (check.reason !== 'invalid') expect(check.maskedEmail).toBe(maskEmail(who.email));
  });
});

describe('mentors list', () => {
  test('the builder sees mentors and waiting invitations, and removes a mentor; nobody else can', async () => {
    const res = await overview(request(`/api/projects/${published}/invitations`, { cookie: builder.cookie }), params({ id: String(published) }));
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.mentors.map((m: { id: number }) => m.id)).toContain(mentor.id);
    expect(body.invitations.some((i: { email: string }) => i.email === invitee.email)).toBe(true);

    const remove = (who: U | null) =>
      removeMentorRoute(request(`/api/projects/${published}/mentors/${mentor.id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(published), userId: String(mentor.id) }));
    expect((await remove(stranger)).status).toBe(403);
    expect((await remove(mentor)).status).toBe(403);
    expect((await remove(builder)).status).toBe(204);
    expect(await ProjectMembership.count({ where: { projectId: published, userId: mentor.id } })).toBe(0);
    expect((await remove(builder)).status).toBe(404);
  });
});

describe('masking', () => {
  // Our own rule: first and last letter of the local part, the domain in full.
  test.each([
    ['agnes@farrow.test', 'a***s@farrow.test'],
    ['ab@x.test', 'a*@x.test'],
    ['abc@x.test', 'a*c@x.test'],
  ])('%s → %s', (email, masked) => {
    expect(maskEmail(email)).toBe(masked);
  });
});
