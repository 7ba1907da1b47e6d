// Plain shapes of mentors, invitations and risk flags, as lib/server returns them and components render them.
import type { FlagHazard, FlagSeverity, FlagStatus } from '../validations/flags';

export type { FlagHazard, FlagSeverity, FlagStatus };

/** What a flag points at, with enough to name it beside the flag. */
export type FlagTargetView =
  | { kind: 'entry' }
  | { kind: 'note'; noteId: number; mediaId: number; startMs: number; text: string }
  | { kind: 'measurement'; recordId: number; feature: string };

export type FlagView = {
  id: number;
  projectId: number;
  sessionId: number;
  entryId: number;
  entryTitle: string;
  target: FlagTargetView;
  mentor: { id: number; name: string };
  severity: FlagSeverity;
  hazard: FlagHazard;
  concern: string;
  instead: string;
  status: FlagStatus;
  acknowledgedAt: string | null;
  resolvedAt: string | null;
  answer: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
  /** What the viewer may do with it, from the policy. */
  can: { edit: boolean; answer: boolean };
};

/** Open (not yet resolved) flags of a project: in all, and per session. */
export type OpenFlagCounts = { total: number; bySession: Record<number, number> };

export type MentorView = { id: number; name: string; email: string; since: string };

export type InvitationState = 'pending' | 'accepted' | 'revoked' | 'expired';

export type InvitationView = {
  id: number;
  email: string;
  invitedBy: string;
  state: InvitationState;
  createdAt: string;
  expiresAt: string;
  acceptedAt: string | null;
  revokedAt: string | null;
};

export type MentorsOverview = { mentors: MentorView[]; invitations: InvitationView[] };

/**
 * What the accept page knows about a link: whether it can be accepted and, if not, why;
 * the invited address is shown only partly masked.
 */
export type InvitationCheck =
  | { ok: false; reason: 'invalid' }
  | {
      ok: boolean;
      reason: 'ready' | 'revoked' | 'accepted' | 'expired' | 'signed-out' | 'wrong-account' | 'builder' | 'already-mentor';
      invitationId: number;
      maskedEmail: string;
      project: { id: number; slug: string; title: string; summary: string };
      builderName: string;
      expiresAt: string;
      acceptedAt: string | null;
    };
