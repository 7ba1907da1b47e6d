// Plain shapes of readers' comments, as lib/server returns them and components render them.

/** shown: its text is public; hidden: hidden by the builder or an admin; removed: deleted by its author. */
export type CommentState = 'shown' | 'hidden' | 'removed';

export type CommentView = {
  id: number;
  entryId: number;
  /** The top-level comment this one answers; replies go one level deep. */
  parentId: number | null;
  /** The clip and moment the comment is pinned to, if any (top-level comments only). */
  mediaId: number | null;
  atMs: number | null;
  /** Null once the comment is removed. */
  author: { id: number; name: string; role: 'builder' | 'mentor' | null } | null;
  state: CommentState;
  /**
   * The text. Empty when removed, and when hidden unless this viewer may still read it
   * (the builder, an admin, or its author); then `hidden.textShown` is true.
   */
  body: string;
  hidden: { by: 'builder' | 'admin'; reason: string; at: string; textShown: boolean } | null;
  version: number;
  createdAt: string;
  editedAt: string | null;
  /** What this viewer may do with it, decided on the server by the policy. */
  can: { reply: boolean; edit: boolean; delete: boolean; hide: boolean; unhide: boolean };
  /** Replies, oldest first (top-level comments only; always empty on a reply). */
  replies: CommentView[];
};

/** Why the viewer cannot write a comment here, if they cannot. */
export type CommentClosedReason = 'sign-in' | 'verify' | 'not-published' | null;

export type CommentsPayload = {
  entryId: number;
  comments: CommentView[];
  /** Comments and replies a reader sees, removed ones not counted (on every page, not only this one). */
  count: number;
  /** The next page of threads (`?after=` on GET /api/entries/[id]/comments), or null on the last page. */
  nextCursor: string | null;
  viewer: { id: number } | null;
  can: { comment: boolean; closedReason: CommentClosedReason };
  limits: { bodyMax: number; perMinute: number; perHour: number };
};
