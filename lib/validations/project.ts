import { z } from 'zod';
import { VISIBILITY_LABEL } from './visibility';

export const VISIBILITY_OPTIONS = [
  { value: 'private', label: VISIBILITY_LABEL.private, hint: 'Only you and the mentors you invite.' },
  { value: 'unlisted', label: VISIBILITY_LABEL.unlisted, hint: 'Whoever you give its address to; no page lists it.' },
  { value: 'published', label: VISIBILITY_LABEL.published, hint: 'On the home page and your profile.' },
] as const;

export const UNIT_OPTIONS = [
  { value: 'mm', label: 'Millimetres (mm)' },
  { value: 'in', label: 'Inches (in)' },
] as const;

export const projectInputSchema = z.object({
  title: z
    .string({ error: 'Give the project a title.' })
    .trim()
    .min(3, 'The title needs at least 3 characters.')
    .max(120, 'Keep the title under 120 characters.'),
  summary: z.string({ error: 'The summary must be text.' }).trim().max(2000, 'Keep the summary under 2000 characters.').default(''),
  units: z.enum(['mm', 'in'], { error: 'Units must be mm or in.' }),
  visibility: z.enum(['private', 'unlisted', 'published'], { error: 'Visibility must be private, unlisted or published.' }),
});
export type ProjectInput = z.infer<typeof projectInputSchema>;
/** What the form holds before parsing (summary may be absent). */
export type ProjectFormValues = z.input<typeof projectInputSchema>;

export const projectUpdateSchema = projectInputSchema.partial().extend({
  version: z.number({ error: 'The version you edited is missing; reload the page.' }).int().positive(),
});
export type ProjectUpdate = z.infer<typeof projectUpdateSchema>;

export const projectIdSchema = z.coerce.number({ error: 'The project id must be a number.' }).int().positive('The project id must be a positive number.');

export const projectListQuerySchema = z.object({
  scope: z.enum(['mine', 'mentored', 'published'], { error: 'scope must be mine, mentored or published.' }).default('published'),
  /** The last page's `nextCursor` (read, and refused with a 400 naming it, by the list itself). */
  after: z.string().optional(),
});
