/** One comment waiting for an admin: its open reports, or why it was hidden. */
export type ModerationItem = {
  commentId: number;
  body: string;
  authorName: string;
  createdAt: string;
  /** Where it is read: /logs/<slug>/entries/<entryId>#comment-<id>. */
  href: string;
  where: string;
  reports: { reporterName: string; reason: string; at: string }[];
  hidden: { at: string; byName: string; reason: string } | null;
};

export type ModerationQueue = { reported: ModerationItem[]; hidden: ModerationItem[] };

export type AccountRow = { id: number; name: string; email: string; handle: string; siteRole: 'member' | 'admin'; createdAt: string };
export type AccountPage = { accounts: AccountRow[]; total: number; page: number; pages: number; q: string };
