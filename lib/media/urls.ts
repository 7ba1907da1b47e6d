/**
 * The app's own address of an uploaded photo or clip. Pages, entry bodies and JSON carry only this:
 * it checks the viewer and redirects to a short-lived signed URL, so a cached page never holds a signature.
 */
export function mediaFileUrl(id: number): string {
  return `/api/media/${id}/file`;
}

const MEDIA_FILE_URL = /^\/api\/media\/([1-9][0-9]{0,15})\/file$/;

/** The media id in an app file address, or null when `src` is not one. */
export function mediaIdFromFileUrl(src: string): number | null {
  const m = MEDIA_FILE_URL.exec(src);
  return m ? Number(m[1]) : null;
}

/** How long a signed address handed out by the file route stays valid: long enough to play a clip through. */
export const SIGNED_URL_SECONDS = { photo: 5 * 60, clip: 60 * 60 } as const;
