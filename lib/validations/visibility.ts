/**
 * Who can read a project or a session, in Scribeline's own words. The stored values stay
 * private / unlisted / published; only what people read is said here, once for every screen and mail.
 */
export type VisibilityValue = 'private' | 'unlisted' | 'published';

export const VISIBILITY_LABEL: Record<VisibilityValue, string> = {
  private: 'On the bench',
  unlisted: 'By link',
  published: 'In the open log',
};
