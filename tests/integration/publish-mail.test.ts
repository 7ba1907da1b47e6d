import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { PATCH as visibilityRoute } from '@/app/api/sessions/[id]/visibility/route';
import { PATCH as patchSessionRoute } from '@/app/api/sessions/[id]/route';
import { PATCH as patchProjectRoute } from '@/app/api/projects/[id]/route';
import { POST as unsubscribeRoute } from '@/app/api/unsubscribe/route';
import { initModels, Follow, OutboxMessage, Project, ShopSession, User } from '@/db/models';
import { sendDueMail } from '@/lib/server/mail';
import { startMailService, type CapturedMessage, type MailService } from '@/scripts/mail-service/server';

guardTestDatabase();

// Followers hear once when a session becomes effectively published (session and project both
// published), through the outbox, and the message that reaches the local SMTP service carries the
// session link and a working unsubscribe link.

const APP = 'http://127.0.0.1:3999';
type U = Awaited<ReturnType<typeof makeUser>>;
let builder: U, onProject: U, onBuilder: U, mailOff: U, onBoth: U, builderOnly: U, stranger: U;
let everyone: U[];
const projects: number[] = [];
const stamp = `${Date.now().toString(36)}-${process.pid}`;
let service: MailService;
let dataDir: string;

const call = {
  visibility: (who: U, id: number, visibility: string) => visibilityRoute(request(`/api/sessions/${id}/visibility`, { method: 'PATCH', cookie: who.cookie, body: { visibility } }), params({ id: String(id) })),
  patchSession: (who: U, id: number, b: unknown) => patchSessionRoute(request(`/api/sessions/${id}`, { method: 'PATCH', cookie: who.cookie, body: b }), params({ id: String(id) })),
  patchProject: (who: U, id: number, b: unknown) => patchProjectRoute(request(`/api/projects/${id}`, { method: 'PATCH', cookie: who.cookie, body: b }), params({ id: String(id) })),
};

const outboxFor = (sessionId: number) => OutboxMessage.findAll({ where: { dedupeKey: { [Op.like]: `session-published:${sessionId}:%` } }, order: [['id', 'ASC']] });

async function makeProject(visibility: 'published' | 'unlisted', tag: string) {
  const p = await Project.create({ ownerId: builder.id, slug: `mail-${tag}-${stamp}`, title: `Backplate ${tag} ${stamp}`, summary: '', units: 'mm', visibility, publishedAt: visibility === 'published' ? new Date() : null });
  projects.push(p.id);
  return p;
}

let pos = 0;
const makeSession = (projectId: number, title: string) =>
  ShopSession.create({ projectId, position: pos++, title, heldOn: '2026-10-10', minutesSpent: 150, planned: '', done: 'Brought the spigot to 130.012 mm.', nextSteps: '' });

async function follows(projectId: number) {
  const b = builder.id;
  await Follow.bulkCreate([
    { userId: onProject.id, projectId, builderId: null, mail: true },
    { userId: onBuilder.id, projectId: null, builderId: b, mail: true },
    { userId: mailOff.id, projectId, builderId: null, mail: false },
    { userId: onBoth.id, projectId, builderId: null, mail: true },
    { userId: onBoth.id, projectId: null, builderId: b, mail: true },
    // Project follow with mail off, builder follow with mail on: still told, once.
    { userId: builderOnly.id, projectId, builderId: null, mail: false },
    { userId: builderOnly.id, projectId: null, builderId: b, mail: true },
    // Rows the API would refuse; the builder must never be mailed about their own session anyway.
    { userId: b, projectId, builderId: null, mail: true },
    { userId: b, projectId: null, builderId: b, mail: true },
  ], { ignoreDuplicates: true });
}

beforeAll(async () => {
  initModels();
  process.env.NEXTAUTH_URL = APP;
  [builder, onProject, onBuilder, mailOff, onBoth, builderOnly, stranger] = await Promise.all(Array.from({ length: 7 }, () => makeUser()));
  everyone = [builder, onProject, onBuilder, mailOff, onBoth, builderOnly, stranger];
  await User.update({ name: 'Edda Renwick (test)' }, { where: { id: builder.id } });
  dataDir = await mkdtemp(path.join(os.tmpdir(), 'scribeline-publish-mail-'));
  service = await startMailService({ smtpPort: 0, httpPort: 0, dataDir });
  process.env.SMTP_HOST = '127.0.0.1';
  process.env.SMTP_PORT = String(service.smtpPort);
  process.env.SMTP_SECURE = 'false';
});

afterAll(async () => {
  await OutboxMessage.destroy({ where: { toAddress: { [Op.in]: everyone.map((u) => u.email) } } });
  await Project.destroy({ where: { id: { [Op.in]: projects } } });
  await User.destroy({ where: { id: { [Op.in]: everyone.map((u) => u.id) } } });
  await service?.close();
  await closeDb();
  if (dataDir) await rm(dataDir, { recursive: true, force: true });
});

describe('publishing a session in a published project', () => {
  let project: Project;
  let session: ShopSession;

  beforeAll(async () => {
    project = await makeProject('published', 'pub');
    await follows(project.id);
    session = await makeSession(project.id, 'Turning the spigot');
  });

  test('queues exactly one message per follower with mail on: none for mail off, none for the builder, one for two follows', async () => {
    expect(await outboxFor(session.id)).toHaveLength(0);
    await call.visibility(builder, session.id, 'unlisted');
    expect(await outboxFor(session.id)).toHaveLength(0); // unlisted is not published

    const res = await call.visibility(builder, session.id, 'published');
    expect(res.status).toBe(200);
    expect((await res.json()).announced).toBe(4);
    const rows = await outboxFor(session.id);
    expect(rows.map((r) => r.toAddress).sort()).toEqual([onProject, onBuilder, onBoth, builderOnly].map((u) => u.email).sort());
    expect(rows.every((r) => r.kind === 'session-published' && r.status === 'pending')).toBe(true);
    expect(rows.map((r) => r.dedupeKey).sort()).toEqual([onProject, onBuilder, onBoth, builderOnly].map((u) => `session-published:${session.id}:${u.id}`).sort());
    expect((await ShopSession.findByPk(session.id))!.announcedAt).not.toBeNull();
  });

  test('editing it afterwards, hiding and publishing it again send nothing more', async () => {
    const fresh = (await ShopSession.findByPk(session.id))!;
    expect((await call.patchSession(builder, session.id, { title: 'Turning the spigot, take two', version: fresh.version })).status).toBe(200);
    expect((await call.visibility(builder, session.id, 'private')).status).toBe(200);
    const again = await call.visibility(builder, session.id, 'published');
    expect((await again.json()).announced).toBe(0);
    expect(await outboxFor(session.id)).toHaveLength(4);
  });

  test('the message reaches the SMTP service naming project, session and builder, with the session and unsubscribe links', async () => {
    for (let i = 0; i < 20; i++) if ((await sendDueMail({ limit: 50 })).claimed === 0) break;
    const res = await fetch(`${service.httpUrl}/messages?to=${encodeURIComponent(onProject.email)}`);
    const { messages } = (await res.json()) as { messages: CapturedMessage[] };
    expect(messages).toHaveLength(1);
    const m = messages[0];
    const sessionUrl = `${APP}/logs/${project.slug}/sessions/${session.id}`;
    expect(m.subject).toBe(`New session in “${project.title}” by Edda Renwick (test): Turning the spigot`);
    expect(m.text).toContain(`Read it: ${sessionUrl}`);
    expect(m.text).toContain('Brought the spigot to 130.012 mm.');
    expect(m.html).toContain(`href="${sessionUrl}"`);
    const link = /Stop these e-mails for this project: (\S+)/.exec(m.text ?? '')?.[1];
    expect(link).toBeDefined();
    const url = new URL(link!);
    expect(`${url.origin}${url.pathname}`).toBe(`${APP}/unsubscribe`);
    expect(m.html).toContain(`href="${link!.replace(/&/g, '&amp;')}"`);

    // The unsubscribe link's token switches off exactly that member's project follow.
    const token = url.searchParams.get('token')!;
    const follow = (await Follow.findOne({ where: { userId: onProject.id, projectId: project.id } }))!;
    const tampered = token.replace(/^\d+/, String(follow.id + 1));
    expect((await unsubscribeRoute(request('/api/unsubscribe', { method: 'POST', body: { token: tampered } }), params({}))).status).toBe(400);
    expect((await Follow.findByPk(follow.id))!.mail).toBe(true);
    expect((await unsubscribeRoute(request('/api/unsubscribe', { method: 'POST', body: { token } }), params({}))).status).toBe(200);
    expect((await Follow.findByPk(follow.id))!.mail).toBe(false);

    // A member who follows only the builder is told why, and their link stops the builder follow.
    const viaBuilder = (await (await fetch(`${service.httpUrl}/messages?to=${encodeURIComponent(onBuilder.email)}`)).json()) as { messages: CapturedMessage[] };
    expect(viaBuilder.messages).toHaveLength(1);
    expect(viaBuilder.messages[0].text).toMatch(/You get this because you follow Edda Renwick \(test\) on Scribeline\./);
  });

  test('after unsubscribing, the next session published is not mailed to that member', async () => {
    const next = await makeSession(project.id, 'Drilling the bolt circle');
    const res = await call.visibility(builder, next.id, 'published');
    expect((await res.json()).announced).toBe(3);
    expect((await outboxFor(next.id)).map((r) => r.toAddress)).not.toContain(onProject.email);
  });
});

describe('publishing the project', () => {
  test('announces its already published sessions once, and never again when published a second time', async () => {
    const project = await makeProject('unlisted', 'unl');
    await follows(project.id);
    const session = await makeSession(project.id, 'Boring the register');
    const res = await call.visibility(builder, session.id, 'published');
    expect((await res.json()).announced).toBe(0); // the project is only unlisted: not public yet
    expect((await ShopSession.findByPk(session.id))!.announcedAt).toBeNull();
    const privateOne = await makeSession(project.id, 'Still private');

    let p = (await Project.findByPk(project.id))!;
    expect((await call.patchProject(builder, project.id, { visibility: 'published', version: p.version })).status).toBe(200);
    expect(await outboxFor(session.id)).toHaveLength(4);
    expect(await outboxFor(privateOne.id)).toHaveLength(0);

    p = (await Project.findByPk(project.id))!;
    await call.patchProject(builder, project.id, { visibility: 'unlisted', version: p.version });
    p = (await Project.findByPk(project.id))!;
    await call.patchProject(builder, project.id, { visibility: 'published', version: p.version });
    expect(await outboxFor(session.id)).toHaveLength(4);
  });

  test('a refused project update (stale version) announces nothing', async () => {
    const project = await makeProject('unlisted', 'stale');
    await follows(project.id);
    const session = await makeSession(project.id, 'Facing the blank');
    await call.visibility(builder, session.id, 'published');
    const p = (await Project.findByPk(project.id))!;
    const res = await call.patchProject(builder, project.id, { visibility: 'published', version: p.version + 5 });
    expect(res.status).toBe(409);
    expect(await outboxFor(session.id)).toHaveLength(0);
    expect((await ShopSession.findByPk(session.id))!.announcedAt).toBeNull();
    expect((await Project.findByPk(project.id))!.visibility).toBe('unlisted');
  });
});
