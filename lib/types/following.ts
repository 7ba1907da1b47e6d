// Plain shapes of publishing and following, as lib/server returns them and components render them.

/** Whether the viewer follows something, for a follow button. */
export type FollowState = {
  following: boolean;
  followId: number | null;
  mail: boolean;
  /** How many members follow it. */
  followers: number;
};

/** One of the member's follows, for their settings page. */
export type FollowView = {
  id: number;
  kind: 'project' | 'builder';
  mail: boolean;
  createdAt: string;
  /** Null title when the project is no longer shared with the member (made private). */
  project: { id: number; slug: string; title: string | null; builderName: string | null } | null;
  builder: { id: number; name: string; handle: string } | null;
};

/** A session on the home page's list of recently published sessions. */
export type PublishedSessionCard = {
  id: number;
  title: string;
  heldOn: string;
  publishedAt: string;
  /** A line of what got done. */
  summary: string;
  project: { id: number; slug: string; title: string };
  builder: { id: number; name: string; handle: string };
};

export type BuilderProfile = {
  id: number;
  name: string;
  handle: string;
  memberSince: string;
  projects: { id: number; slug: string; title: string; summary: string; units: 'mm' | 'in'; publishedAt: string | null; publishedSessions: number; lastPublishedAt: string | null }[];
  /** Where the next page of projects starts (`?after=`), or null on the last page. */
  nextCursor: string | null;
  follow: FollowState;
  /** Whether the viewer may follow this builder (signed in, and not the builder). */
  canFollow: boolean;
  isSelf: boolean;
};

/** What an unsubscribe link will switch off. */
export type UnsubscribeTarget = {
  followId: number;
  kind: 'project' | 'builder';
  /** Project title or builder name. */
  name: string;
  mail: boolean;
  /** The member's other follow that would still send mail about the same sessions, if any. */
  alsoMailing: string | null;
};
