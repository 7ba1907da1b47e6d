import 'server-only';
import { appUrl } from './app-url';
import { createHash, createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { initModels, MentorInvitation, Project, ProjectMembership, User } from '../../db/models';
import { withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import { authorizeSite, type Actor } from '../auth/policy';
import { authorizeLog } from './log-scope';
import { enqueueMail } from './mail';
import { mentorInviteMail } from '../mail/templates';
import { acceptInvitationSchema, invitationInputSchema, INVITATION_LIFETIME_DAYS } from '../validations/invitations';
import type { InvitationCheck, InvitationState, InvitationView, MentorsOverview } from '../types/flags';
import { signingSecret } from '../env';

// A mentor invitation travels as a link whose token is base64url(JSON {i, n}) + '.' + HMAC-SHA256 of that
// payload under NEXTAUTH_SECRET. The row keeps only SHA-256 of the nonce n, so neither a stolen secret
// alone nor a copy of the table alone can make a working link; acceptedAt makes it single-use.

const DAY_MS = 24 * 60 * 60 * 1000;
export const INVITATION_LIFETIME_MS = INVITATION_LIFETIME_DAYS * DAY_MS;
/** A builder who sends more than this many invitations for one project in a day is stopped for a while. */
const INVITATIONS_PER_PROJECT_PER_DAY = 20;

const secret = (): string => signingSecret('invitation links');

const sha256 = (value: string) => createHash('sha256').update(value).digest('hex');
const sign = (payload: string) => createHmac('sha256', secret()).update(payload).digest('base64url');

function sameText(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/** The token for an invitation row and its nonce. */
export function invitationToken(invitationId: number, nonce: string): string {
  const payload = Buffer.from(JSON.stringify({ i: invitationId, n: nonce })).toString('base64url');
  return `${payload}.${sign(payload)}`;
}

/** The invitation id and nonce of a token whose signature holds, else null. Never throws. */
export function readInvitationToken(token: string): { id: number; nonce: string } | null {
  const parts = token.split('.');
  if (parts.length !== 2 || !parts[0] || !parts[1]) return null;
  const [payload, mac] = parts;
  if (!sameText(mac, sign(payload))) return null;
  try {
    const data = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as { i?: unknown; n?: unknown };
    if (!Number.isInteger(data.i) || (data.i as number) <= 0 || typeof data.n !== 'string' || !data.n) return null;
    return { id: data.i as number, nonce: data.n };
  } catch {
    return null;
  }
}

export { appUrl };

export const acceptUrl = (token: string) => appUrl(`/invitations/accept?token=${encodeURIComponent(token)}`);

/** "Sat 10 Oct 2026, 14:05 UTC": the same for everyone who reads it. */
export function formatExpiry(date: Date): string {
  return new Intl.DateTimeFormat('en-GB', {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    timeZone: 'UTC',
    timeZoneName: 'short',
  }).format(date);
}

/** "a***s@farrow.test": enough to recognise one's own address, not enough to harvest it. */
export function maskEmail(email: string): string {
  const at = email.lastIndexOf('@');
  if (at <= 0) return '***';
  const local = email.slice(0, at);
  const domain = email.slice(at);
  if (local.length <= 2) return `${local[0]}*${domain}`;
  return `${local[0]}${'*'.repeat(Math.min(3, local.length - 2))}${local[local.length - 1]}${domain}`;
}

function stateOf(inv: MentorInvitation, now = new Date()): InvitationState {
  if (inv.acceptedAt) return 'accepted';
  if (inv.revokedAt) return 'revoked';
  if (inv.expiresAt.getTime() <= now.getTime()) return 'expired';
  return 'pending';
}

function toInvitationView(inv: MentorInvitation): InvitationView {
  return {
    id: inv.id,
    email: inv.email,
    invitedBy: inv.invitedBy?.name ?? '',
    state: stateOf(inv),
    createdAt: inv.createdAt.toISOString(),
    expiresAt: inv.expiresAt.toISOString(),
    acceptedAt: inv.acceptedAt ? inv.acceptedAt.toISOString() : null,
    revokedAt: inv.revokedAt ? inv.revokedAt.toISOString() : null,
  };
}

/** The project's mentors and its invitations (newest first), for the builder. */
export async function listMentorsOverview(actor: Actor, projectId: number): Promise<MentorsOverview> {
  initModels();
  await authorizeLog(actor, 'manageMentors', { projectId });
  const [memberships, invitations] = await Promise.all([
    ProjectMembership.findAll({
      where: { projectId, role: 'mentor' },
      include: [{ model: User, as: 'user', attributes: ['id', 'name', 'email'] }],
      order: [['createdAt', 'ASC']],
    }),
    MentorInvitation.findAll({
      where: { projectId },
      include: [{ model: User, as: 'invitedBy', attributes: ['id', 'name'] }],
      order: [['createdAt', 'DESC'], ['id', 'DESC']],
      limit: 50,
    }),
  ]);
  return {
    mentors: memberships.filter((m) => m.user).map((m) => ({ id: m.user!.id, name: m.user!.name, email: m.user!.email, since: m.createdAt.toISOString() })),
    // Accepted ones are listed as mentors; revoked ones only clutter the list.
    invitations: invitations.map(toInvitationView).filter((i) => i.state === 'pending' || i.state === 'expired'),
  };
}

/**
 * The builder invites someone by e-mail: a new invitation row (any earlier pending one for the same address
 * is withdrawn, so "resend" is simply inviting again) and the e-mail with the signed link, in one transaction.
 */
export async function createInvitation(actor: Actor, projectId: number, input: unknown): Promise<InvitationView> {
  initModels();
  return withTransaction(async (transaction) => {
    const scope = await authorizeLog(actor, 'manageMentors', { projectId }, transaction);
    const data = invitationInputSchema.parse(input);
    // Invitations of one project take turns on its row. Without it, parallel invitations each took gap
    // locks on the (project, email) index while withdrawing earlier ones and then waited on each other's
    // inserts into those gaps: a deadlock. The reads below are locking reads, so each sees what the
    // invitations ahead of it committed (the daily limit holds, and one pending link per address).
    await Project.findByPk(projectId, { attributes: ['id'], transaction, lock: transaction.LOCK.UPDATE });
    const builder = (await User.findByPk(scope.facts.ownerId, { attributes: ['id', 'name', 'email'], transaction }))!;
    if (builder.email.toLowerCase() === data.email) {
      throw new AppError('validation', 'Please check email: that is your own address — the builder cannot mentor their own project.', {
        email: ['That is your own address: the builder cannot mentor their own project.'],
      });
    }
    const invitee = await User.findOne({ where: { email: data.email }, attributes: ['id'], transaction });
    if (invitee && scope.facts.mentorIds.includes(invitee.id)) {
      throw new AppError('validation', 'Please check email: that person is already a mentor of this project.', {
        email: ['That person is already a mentor of this project.'],
      });
    }
    const now = new Date();
    const recent = await MentorInvitation.findAll({
      where: { projectId, createdAt: { [Op.gt]: new Date(now.getTime() - DAY_MS) } },
      attributes: ['id'],
      transaction,
      lock: transaction.LOCK.SHARE,
    });
    if (recent.length >= INVITATIONS_PER_PROJECT_PER_DAY) {
      throw new AppError('rate_limited', `That is ${INVITATIONS_PER_PROJECT_PER_DAY} invitations for this project today: try again tomorrow.`);
    }
    await MentorInvitation.update(
      { revokedAt: now },
      { where: { projectId, email: data.email, acceptedAt: null, revokedAt: null }, transaction },
    );
    const nonce = randomBytes(32).toString('base64url');
    const expiresAt = new Date(now.getTime() + INVITATION_LIFETIME_MS);
    const invitation = await MentorInvitation.create(
      { projectId, email: data.email, invitedById: actor!.id, nonceHash: sha256(nonce), expiresAt },
      { transaction },
    );
    const mail = mentorInviteMail({
      inviterName: builder.name,
      projectTitle: scope.projectTitle,
      inviteUrl: acceptUrl(invitationToken(invitation.id, nonce)),
      expiresOn: formatExpiry(expiresAt),
      personalNote: data.note || undefined,
      inviteeEmail: data.email,
    });
    await enqueueMail({ to: data.email, ...mail, kind: 'mentor-invite' }, { transaction });
    // Built from what was written, inside the transaction.
    invitation.invitedBy = builder.id === actor!.id ? builder : ((await User.findByPk(actor!.id, { attributes: ['id', 'name'], transaction })) ?? undefined);
    return toInvitationView(invitation);
  });
}

/** The builder withdraws an invitation that has not been accepted: its link stops working. */
export async function revokeInvitation(actor: Actor, invitationId: number): Promise<InvitationView> {
  initModels();
  return withTransaction(async (transaction) => {
    const invitation = await MentorInvitation.findByPk(invitationId, {
      include: [{ model: User, as: 'invitedBy', attributes: ['id', 'name'] }],
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!invitation) throw new AppError('not_found', 'That invitation was not found.');
    await authorizeLog(actor, 'manageMentors', { projectId: invitation.projectId }, transaction);
    if (invitation.acceptedAt) {
      throw new AppError('conflict', 'That invitation was already accepted: remove the mentor from the list instead.');
    }
    if (!invitation.revokedAt) {
      invitation.revokedAt = new Date();
      await invitation.save({ transaction });
    }
    return toInvitationView(invitation);
  });
}

/** The builder removes a mentor from the project; the flags they raised stay in the log. */
export async function removeMentor(actor: Actor, projectId: number, userId: number): Promise<void> {
  initModels();
  await withTransaction(async (transaction) => {
    await authorizeLog(actor, 'manageMentors', { projectId }, transaction);
    const removed = await ProjectMembership.destroy({ where: { projectId, userId, role: 'mentor' }, transaction });
    if (!removed) throw new AppError('not_found', 'That person is not a mentor of this project.');
  });
}

type Loaded = { invitation: MentorInvitation; project: Project; builder: User };

async function loadByToken(token: string, transaction?: Transaction): Promise<Loaded | null> {
  const read = readInvitationToken(token);
  if (!read) return null;
  const invitation = await MentorInvitation.findByPk(read.id, { transaction, ...(transaction ? { lock: transaction.LOCK.UPDATE } : {}) });
  if (!invitation || !sameText(invitation.nonceHash, sha256(read.nonce))) return null;
  const project = await Project.findByPk(invitation.projectId, { attributes: ['id', 'slug', 'title', 'summary', 'ownerId'], transaction });
  if (!project) return null;
  const builder = (await User.findByPk(project.ownerId, { attributes: ['id', 'name'], transaction }))!;
  return { invitation, project, builder };
}

/** Why this actor cannot accept now, or 'ready'. */
async function reasonFor(actor: Actor, { invitation, project }: Loaded, transaction?: Transaction) {
  const state = stateOf(invitation);
  if (state !== 'pending') return state;
  if (!actor) return 'signed-out' as const;
  if (actor.id === project.ownerId) return 'builder' as const;
  const user = await User.findByPk(actor.id, { attributes: ['id', 'email'], transaction });
  if (!user || user.email.toLowerCase() !== invitation.email.toLowerCase()) return 'wrong-account' as const;
  const already = await ProjectMembership.count({ where: { projectId: project.id, userId: actor.id, role: 'mentor' }, transaction });
  if (already) return 'already-mentor' as const;
  return 'ready' as const;
}

/** For the accept page: what the link is and whether this visitor can accept it. Reads only. */
export async function checkInvitation(actor: Actor, token: string): Promise<InvitationCheck> {
  initModels();
  const loaded = token ? await loadByToken(token) : null;
  if (!loaded) return { ok: false, reason: 'invalid' };
  const reason = await reasonFor(actor, loaded);
  const { invitation, project, builder } = loaded;
  return {
    ok: reason === 'ready',
    reason,
    invitationId: invitation.id,
    maskedEmail: maskEmail(invitation.email),
    project: { id: project.id, slug: project.slug, title: project.title, summary: project.summary },
    builderName: builder.name,
    expiresAt: invitation.expiresAt.toISOString(),
    acceptedAt: invitation.acceptedAt ? invitation.acceptedAt.toISOString() : null,
  };
}

/** Accepting: in one transaction, with the invitation row locked, it is marked used and the mentor role is granted. */
export async function acceptInvitation(actor: Actor, input: unknown): Promise<{ project: { id: number; slug: string; title: string } }> {
  authorizeSite(actor, 'acceptInvitation');
  const me = actor;
  const { token } = acceptInvitationSchema.parse(input);
  initModels();
  return withTransaction(async (transaction) => {
    const loaded = await loadByToken(token, transaction);
    if (!loaded) {
      throw new AppError('validation', 'Please check token: this invitation link is not valid. Copy the whole link from the e-mail, or ask the builder for a new one.', {
        token: ['This invitation link is not valid.'],
      });
    }
    const { invitation, project } = loaded;
    const reason = await reasonFor(me, loaded, transaction);
    switch (reason) {
      case 'accepted':
        throw new AppError('conflict', 'This invitation was already used. Each link works once; ask the builder for a new one if you need it.');
      case 'revoked':
        throw new AppError('conflict', 'The builder withdrew this invitation. Ask them for a new one if you should mentor this project.');
      case 'expired':
        throw new AppError('validation', `Please check token: this invitation expired on ${formatExpiry(invitation.expiresAt)}; ask the builder for a new one.`, {
          token: [`This invitation expired on ${formatExpiry(invitation.expiresAt)}; ask the builder for a new one.`],
        });
      case 'builder':
        throw new AppError('validation', 'You build this project: the builder cannot be its mentor.', { token: ['The builder cannot be a mentor of their own project.'] });
      case 'wrong-account':
        throw new AppError(
          'forbidden',
          `This invitation is for ${maskEmail(invitation.email)}, and you are signed in with another address. Sign out, then sign in with the invited address to accept.`,
        );
      default:
        break;
    }
    invitation.acceptedAt = new Date();
    invitation.acceptedById = me.id;
    await invitation.save({ transaction });
    await ProjectMembership.findOrCreate({
      where: { projectId: project.id, userId: me.id, role: 'mentor' },
      defaults: { projectId: project.id, userId: me.id, role: 'mentor' },
      transaction,
    });
    return { project: { id: project.id, slug: project.slug, title: project.title } };
    // Two links for the same person accepted at once: the second attempt finds the membership the first made.
  }, { retryOnUnique: true });
}
