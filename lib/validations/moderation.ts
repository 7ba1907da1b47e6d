import { z } from 'zod';
import { cleanPlainText, countChars } from './comments';

export const REPORT_REASON_MAX = 300;

/** A member's report of a comment: { reason }, 3–300 characters of plain text. */
export const reportCommentSchema = z.object({
  reason: z
    .string({ error: 'Say why you are reporting this comment.' })
    .transform(cleanPlainText)
    .pipe(
      z
        .string()
        .trim()
        .min(3, 'Say why you are reporting this comment, in a few words.')
        .refine((s) => countChars(s) <= REPORT_REASON_MAX, `Keep the reason to ${REPORT_REASON_MAX} characters or fewer.`),
    ),
});

/** The accounts list's search and page: ?q=&page= (page from 1). */
export const accountSearchSchema = z.object({
  q: z.string({ error: 'The search must be text.' }).trim().max(100, 'Keep the search under 100 characters.').default(''),
  page: z.coerce.number({ error: 'The page must be a number.' }).int('The page must be a whole number.').min(1, 'Pages start at 1.').max(10_000, 'There are not that many pages.').default(1),
});
export const ACCOUNTS_PER_PAGE = 20;
