import { z } from 'zod';
import { canPlay, VIDEO_EXTENSIONS, AUDIO_EXTENSIONS } from 'react-player/patterns';
import { CLIP_MAX_DURATION_MS } from '../media/rules';
import { clientIdSchema } from './bench';

/** What the uploader sends with a batch: the entry it belongs to and, for a clip, its length as the browser measured it. */
export const uploadInputSchema = z.object({
  entryId: z.number({ error: 'entryId must be a number.' }).int('entryId must be a whole number.').positive('entryId must be a positive whole number.'),
  durationMs: z
    .number({ error: 'durationMs must be a number of milliseconds.' })
    .int('durationMs must be whole milliseconds.')
    .positive('The clip length must be more than zero.')
    .max(CLIP_MAX_DURATION_MS * 2, 'The clip length is far too long.')
    .optional(),
  /** Sent by the bench view's queue: the same id again gives the photo or clip it already made. */
  clientId: clientIdSchema.optional(),
  /** A note kept with the photo or clip from the moment it was taken. */
  caption: z.string({ error: 'The caption must be text.' }).trim().max(300, 'Keep the caption under 300 characters.').optional(),
});
export type UploadInput = z.infer<typeof uploadInputSchema>;

export const LINK_MAX_LENGTH = 2048;

/** Which of the player's sources a link would play through; audio-only sources are not clips. */
function playable(url: string): boolean {
  if (AUDIO_EXTENSIONS.test(url) && !VIDEO_EXTENSIONS.test(url)) return false;
  return canPlay.html(url) || canPlay.hls(url) || canPlay.dash(url) || canPlay.mux(url) || canPlay.youtube(url) || canPlay.vimeo(url) || canPlay.wistia(url) || canPlay.twitch(url) || canPlay.tiktok(url);
}

export const clipUrlSchema = z
  .string({ error: 'Paste the link to the video.' })
  .trim()
  .min(1, 'Paste the link to the video.')
  .max(LINK_MAX_LENGTH, `Keep the link under ${LINK_MAX_LENGTH} characters.`)
  .superRefine((value, ctx) => {
    let url: URL;
    try {
      url = new URL(value);
    } catch {
      ctx.addIssue({ code: 'custom', message: 'That is not a web address: it should start with https://' });
      return;
    }
    if (url.protocol !== 'https:' && url.protocol !== 'http:') {
      ctx.addIssue({ code: 'custom', message: 'Only http:// and https:// links can be added.' });
      return;
    }
    if (!url.hostname) {
      ctx.addIssue({ code: 'custom', message: 'The link has no site name in it.' });
      return;
    }
    if (url.username || url.password) {
      ctx.addIssue({ code: 'custom', message: 'Remove the user name or password from the link before sharing it.' });
      return;
    }
    if (!playable(url.href)) {
      ctx.addIssue({
        code: 'custom',
        message: 'That link does not lead to a video we can play: use the address of a video page on a video site, or of a .mp4, .webm, .mov or .m3u8 file.',
      });
    }
  });

export const clipLinkSchema = z.object({
  url: clipUrlSchema,
  name: z.string({ error: 'The name must be text.' }).trim().max(255, 'Keep the name under 255 characters.').optional(),
});
export type ClipLinkInput = z.infer<typeof clipLinkSchema>;
export type ClipLinkValues = z.input<typeof clipLinkSchema>;

export const mediaUpdateSchema = z
  .object({
    caption: z.string({ error: 'The caption must be text.' }).trim().max(300, 'Keep the caption under 300 characters.').optional(),
    position: z.coerce.number({ error: 'position must be a number.' }).int('position must be a whole number.').min(0, 'position cannot be negative.').optional(),
  })
  .refine((v) => v.caption !== undefined || v.position !== undefined, { message: 'Send a caption or a position to change.' });

export const sweepSchema = z.object({
  olderThanMs: z.coerce.number({ error: 'olderThanMs must be a number.' }).int().min(0, 'olderThanMs cannot be negative.').optional(),
});

/** A readable name for a linked video when none was given: the site and the last part of the path. */
export function linkName(href: string): string {
  const url = new URL(href);
  const host = url.hostname.replace(/^www\./, '');
  const last = url.pathname.split('/').filter(Boolean).pop() ?? '';
  let tail = last;
  try {
    tail = decodeURIComponent(last);
  } catch {
    // A stray % in the path: keep it as written.
  }
  tail = tail.slice(0, 120);
  return tail ? `${host} · ${tail}` : host;
}
