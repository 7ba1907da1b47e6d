/** Who can read a project or a session, as stored (the words people read are in lib/validations/visibility.ts). */
export const VISIBILITIES = ['private', 'unlisted', 'published'] as const;
export type Visibility = (typeof VISIBILITIES)[number];
