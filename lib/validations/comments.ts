import { z } from 'zod';
import { MAX_CLIP_MS } from './notes';

export const COMMENT_BODY_MAX = 2000;
export const HIDE_REASON_MAX = 300;

/** How many comments (replies included) one member may post: a burst, then a steady pace. */
export const COMMENT_RATE_LIMITS = [
  { max: 5, windowMs: 60_000, per: 'minute' },
  { max: 30, windowMs: 3_600_000, per: 'hour' },
] as const;

/** Characters as people count them: an emoji or an accented letter is one, not two UTF-16 units. */
export function countChars(text: string): number {
  return Array.from(text).length;
}

/** Plain text as stored: Windows line ends made plain, control characters other than newline and tab dropped. */
export function cleanPlainText(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/\r\n?/g, '\n').replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g, '');
}

const bodyMaxMessage = `Comment must be ${COMMENT_BODY_MAX.toLocaleString('en-US')} characters or fewer.`;

export const commentBodySchema = z
  .string({ error: 'Write your comment.' })
  .transform(cleanPlainText)
  .pipe(
    z
      .string()
      .trim()
      .min(1, 'Write your comment.')
      .refine((s) => countChars(s) <= COMMENT_BODY_MAX, bodyMaxMessage),
  );

const id = (field: string) => z.number({ error: `${field} must be a number.` }).int(`${field} must be a whole number.`).positive(`${field} must be a positive whole number.`);

export const commentCreateSchema = z
  .object({
    body: commentBodySchema,
    /** Answer to this top-level comment. */
    parentId: id('parentId').nullable().optional(),
    /** Pin to this clip of the entry, at atMs. */
    mediaId: id('mediaId').nullable().optional(),
    atMs: z
      .number({ error: 'The moment must be a number of milliseconds.' })
      .int('The moment must be whole milliseconds.')
      .min(0, 'The moment cannot be negative.')
      .max(MAX_CLIP_MS, 'The moment is past the end of any clip.')
      .nullable()
      .optional(),
  })
  .refine((c) => (c.mediaId == null) === (c.atMs == null), {
    path: ['atMs'],
    message: 'A pinned comment needs both the clip and the moment.',
    when: () => true,
  });

export const commentUpdateSchema = z.object({
  body: commentBodySchema,
  version: z.number({ error: 'The version you edited is missing; reload the page.' }).int().positive('The version you edited is missing; reload the page.'),
});

export const commentHideSchema = z.object({
  reason: z
    .string({ error: 'Say why the comment is hidden.' })
    .transform(cleanPlainText)
    .pipe(
      z
        .string()
        .trim()
        .min(1, 'Say why the comment is hidden: readers see the reason.')
        .refine((s) => countChars(s) <= HIDE_REASON_MAX, `Reason must be ${HIDE_REASON_MAX} characters or fewer.`),
    ),
});
