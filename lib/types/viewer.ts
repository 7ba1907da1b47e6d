/** Which copy of the published log's pages a member is given (lib/server/viewer.ts). */
export type ViewerCopy = 'shared' | 'own';

/** What a shared copy's browser islands need to know of the signed-in member (`GET /api/me/viewer`). */
export type ViewerView = {
  name: string;
  handle: string | null;
  /** Their address is verified (following and commenting need it). */
  verified: boolean;
  /** The "Accounts" link of the header (admins). */
  manageUsers: boolean;
  copy: ViewerCopy;
};

/**
 * The cookie that tells next.config.mjs's rewrites (and the browser's islands) that this signed-in member
 * reads the shared copy. Not a secret and not a permission: whichever copy it picks, every read is still
 * decided by the policy, and the shared copy holds only what everyone may see.
 */
export const VIEWER_COPY_COOKIE = 'scribeline-copy';
