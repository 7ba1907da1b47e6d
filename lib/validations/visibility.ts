/**
 * Who can read a project or a session, in Scribeline's own words. The stored values stay
 * private / unlisted / published; only what people read is said here, once for every screen and mail.
 */
import type { Visibility } from '../types/visibility';

export const VISIBILITY_LABEL: Record<Visibility, string> = {
  private: 'On the bench',
  unlisted: 'By link',
  published: 'In the open log',
};

/** The same states inside a sentence: "“Spigot” is now shared by link." */
export const VISIBILITY_PHRASE: Record<Visibility, string> = {
  private: 'on the bench',
  unlisted: 'shared by link',
  published: 'in the open log',
};
