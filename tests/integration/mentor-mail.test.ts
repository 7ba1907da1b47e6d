import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';

import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { closeDb, guardTestDatabase, makeUser, params, request } from '@/tests/support/db';
import { POST as invite } from '@/app/api/projects/[id]/invitations/route';
import { POST as postFlag } from '@/app/api/entries/[id]/flags/route';
import { POST as resolve } from '@/app/api/flags/[id]/resolve/route';
import { Entry, initModels, OutboxMessage, Project, ProjectMembership, ShopSession, User } from '@/db/models';
import { sendDueMail } from '@/lib/server/mail';
import { escapeHtml, SAFETY_LINE } from '@/lib/mail/templates';
import { startMailService, type CapturedMessage, type MailService } from '@/scripts/mail-service/server';

guardTestDatabase();

// The whole way: the action writes the outbox row, the sender delivers it over SMTP on loopback, the
// local mail service catches it, and we read it back through its HTTP API.
const TAG = `mmail-${Date.now().toString(36)}-${process.pid}`;
const APP = 'http://127.0.0.1:3999';

type U = Awaited<ReturnType<typeof makeUser>>;
let service: MailService;
let dataDir: string;
let builder: U, mentor: U;
let projectId: number, entryId: number;
const users: number[] = [];

async function messagesTo(to: string): Promise<CapturedMessage[]> {
  const res = await fetch(`${service.httpUrl}/messages?to=${encodeURIComponent(to)}`);
  expect(res.status).toBe(200);
  return ((await res.json()) as { messages: CapturedMessage[] }).messages;
}

async function drain() {
  for (let i = 0; i < 20; i++) {
    const report = await sendDueMail({ limit: 50 });
    expect(report.error).toBeUndefined();
    if (report.claimed === 0) break;
  }
}

beforeAll(async () => {
  initModels();
  dataDir = await mkdtemp(path.join(os.tmpdir(), 'scribeline-mentor-mail-'));
  service = await startMailService({ smtpPort: 0, httpPort: 0, dataDir });
  process.env.SMTP_HOST = '127.0.0.1';
  process.env.SMTP_PORT = String(service.smtpPort);
  process.env.SMTP_SECURE = 'false';
  process.env.NEXTAUTH_URL = APP;
  [builder, mentor] = await Promise.all([makeUser(), makeUser()]);
  users.push(builder.id, mentor.id);
  await User.update({ name: `Edda <b>${TAG}</b>` }, { where: { id: builder.id } });
  const project = await Project.create({ ownerId: builder.id, slug: TAG, title: `Backplate & spigot ${TAG}`, summary: '', units: 'mm', visibility: 'private', publishedAt: null });
  projectId = project.id;
  await ProjectMembership.create({ projectId, userId: mentor.id, role: 'mentor' });
  const session = await ShopSession.create({ projectId, position: 0, title: 'First run', heldOn: '2026-10-10', minutesSpent: 60, planned: '', done: '', nextSteps: '' });
  entryId = (await Entry.create({ sessionId: session.id, position: 0, title: 'First power-on with the plate', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) })).id;
  // Leftovers of other files go out first, so they cannot crowd ours.
  await drain();
});

afterAll(async () => {
  const emails = (await User.findAll({ where: { id: { [Op.in]: users } }, attributes: ['email'] })).map((u) => u.email);
  await OutboxMessage.destroy({ where: { toAddress: { [Op.or]: [{ [Op.in]: emails }, { [Op.like]: `%${TAG}%` }] } } });
  await Project.destroy({ where: { id: projectId } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await service?.close();
  await closeDb();
  if (dataDir) await rm(dataDir, { recursive: true, force: true });
});

describe('mentor mail reaches the local SMTP service', () => {
  it('the invitation: project, builder, what a mentor does, the accept link, its expiry and the safety line', async () => {
    const to = `invitee.${TAG}@example.test`;
    const res = await invite(request(`/api/projects/${projectId}/invitations`, { method: 'POST', cookie: builder.cookie, body: { email: to } }), params({ id: String(projectId) }));
    expect(res.status).toBe(201);
    await drain();
    const got = await messagesTo(to);
    expect(got).toHaveLength(1);
    const m = got[0];
    expect(m.subject).toBe(`Edda <b>${TAG}</b> asks you to mentor “Backplate & spigot ${TAG}”`);
    expect(m.headers['x-scribeline-kind']).toBe('mentor-invite');
    expect(m.text).toContain('flags operations that could hurt someone or spoil the part');
    expect(m.text).toMatch(new RegExp(`Accept the invitation: ${APP.replace(/[.:/]/g, '\\$&')}/invitations/accept\\?token=[A-Za-z0-9_-]+\\.[A-Za-z0-9_-]+`));
    expect(m.text).toMatch(/The link works once, until \w{3}, \d{1,2} \w{3} \d{4}/);
    expect(m.text).toContain(SAFETY_LINE);
    // The HTML part escapes what the builder typed, and carries the same link.
    expect(m.html).toContain(escapeHtml(`Edda <b>${TAG}</b>`));
    expect(m.html).not.toContain(`<b>${TAG}</b>`);
    expect(m.html).toContain(`href="${APP}/invitations/accept?token=`);
  });

  it('the answered flag: to the mentor, with the flag, the answer and a link to the entry', async () => {
    const flag = await postFlag(
      request(`/api/entries/${entryId}/flags`, {
        method: 'POST',
        cookie: mentor.cookie,
        body: { target: 'entry', severity: 'warning', hazard: 'rotating-work', concern: 'Plate may not be seated on the shoulder.', instead: 'Seat it, key out, start slow, stand clear.' },
      }),
      params({ id: String(entryId) }),
    );
    expect(flag.status).toBe(201);
    const { flag: raised } = await flag.json();
    const answer = `Seated with a feeler refusing all round; key in the drawer. ${TAG}`;
    const done = await resolve(request(`/api/flags/${raised.id}/resolve`, { method: 'POST', cookie: builder.cookie, body: { answer, version: raised.version } }), params({ id: String(raised.id) }));
    expect(done.status).toBe(200);
    await drain();

    const mentorEmail = (await User.findByPk(mentor.id))!.email;
    const got = await messagesTo(mentorEmail);
    expect(got).toHaveLength(1);
    const m = got[0];
    expect(m.headers['x-scribeline-kind']).toBe('flag-answered');
    expect(m.subject).toContain('answered your flag on “First power-on with the plate”');
    expect(m.text).toContain('Plate may not be seated on the shoulder.');
    expect(m.text).toContain(answer);
    expect(m.text).toContain(`${APP}/logs/${TAG}/entries/${entryId}#flag-${raised.id}`);
    expect(m.text).toContain('Warning · Rotating work and chucks');
    expect(m.text).toContain(SAFETY_LINE);

    // The builder was told of the flag when it was raised.
    const builderEmail = (await User.findByPk(builder.id))!.email;
    const raisedMail = await messagesTo(builderEmail);
    expect(raisedMail).toHaveLength(1);
    expect(raisedMail[0].headers['x-scribeline-kind']).toBe('flag-raised');
    expect(raisedMail[0].text).toContain('What to do instead:\nSeat it, key out, start slow, stand clear.');
    expect(raisedMail[0].text).toContain(`${APP}/projects/${TAG}/entries/${entryId}/edit#flag-${raised.id}`);
  });
});
