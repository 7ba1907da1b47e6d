import { randomBytes } from 'node:crypto';
import { NextRequest } from 'next/server';
import { ZodError } from 'zod';
import { createUploadthing, type FileRouter } from 'uploadthing/next';
import { UploadThingError } from 'uploadthing/server';
import { getUserFromRequest } from '@/lib/auth/current-user';
import { authorizeLog } from '@/lib/server/log-scope';
import { acceptUploadedFile, type UploadMetadata, type UploadOutcome } from '@/lib/server/media';
import { AppError, validationError } from '@/lib/errors';
import { uploadInputSchema, type UploadInput } from '@/lib/validations/media';
import { CLIP_BATCH, durationRefusal, PHOTO_BATCH, sizeRefusal } from '@/lib/media/rules';

// The upload SDK's own limits only take powers of two; the exact ones (20 MB, 2 GB) are checked below
// on the sizes the browser declares, and again on the stored size once the file has arrived.
const f = createUploadthing({
  errorFormatter: (err) => ({
    message: err.cause instanceof ZodError ? validationError(err.cause).message : err.message,
  }),
});

const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/gif'];
const CLIP_TYPES = ['video/mp4', 'video/quicktime', 'video/webm', 'video/x-matroska'];

type DeclaredFile = { name: string; size: number; type: string };

/**
 * Files are private on the upload service (read only through signed URLs the app hands out after the policy
 * check), and each key is seeded with random bytes instead of the file's name, size and times, so a key
 * cannot be worked out from the file. The SDK folds the seed into a short hash, so a key is still not a
 * secret: privacy rests on the ACL and the signatures.
 */
const ROUTE_OPTIONS = { getFileHashParts: () => [randomBytes(32).toString('base64url')] };

/** The SDK hands the middleware a standard Request in tests and a NextRequest under Next; the session reader wants the latter. */
function asNextRequest(req: Request): NextRequest {
  return req instanceof NextRequest ? req : new NextRequest(req.url, { headers: req.headers, method: req.method });
}

function refusalFrom(err: unknown): UploadThingError {
  if (err instanceof AppError) {
    if (err.code === 'unauthenticated') return new UploadThingError({ code: 'FORBIDDEN', message: 'Sign in to add photos and clips.' });
    if (err.code === 'not_found') return new UploadThingError({ code: 'NOT_FOUND', message: err.message });
    if (err.code === 'forbidden') return new UploadThingError({ code: 'FORBIDDEN', message: 'Only the builder can add photos and clips to this log.' });
    return new UploadThingError({ code: 'BAD_REQUEST', message: err.message });
  }
  console.error('[scribeline] upload refused by an unexpected error', err);
  return new UploadThingError({ code: 'INTERNAL_SERVER_ERROR', message: 'Scribeline could not start the upload. Please try again.' });
}

async function admit(kind: 'photo' | 'clip', req: Request, files: readonly DeclaredFile[], input: UploadInput): Promise<UploadMetadata> {
  let userId: number;
  try {
    const user = await getUserFromRequest(asNextRequest(req));
    await authorizeLog(user, 'editLog', { entryId: input.entryId });
    userId = user!.id;
  } catch (err) {
    throw refusalFrom(err);
  }
  const allowed = kind === 'photo' ? PHOTO_TYPES : CLIP_TYPES;
  for (const file of files) {
    const tooBig = sizeRefusal(kind, file.name, file.size);
    if (tooBig) throw new UploadThingError({ code: 'TOO_LARGE', message: tooBig });
    if (!allowed.includes(file.type)) {
      const wanted = kind === 'photo' ? 'JPEG, PNG, WebP or GIF photos' : 'MP4, MOV or WebM clips';
      throw new UploadThingError({ code: 'BAD_REQUEST', message: `“${file.name}” is not one of the ${wanted} this accepts.` });
    }
    if (kind === 'clip' && input.durationMs !== undefined) {
      const implausible = durationRefusal(file.name, file.size, input.durationMs);
      if (implausible) throw new UploadThingError({ code: 'BAD_REQUEST', message: implausible });
    }
  }
  return { userId, entryId: input.entryId, durationMs: kind === 'clip' ? (input.durationMs ?? null) : null, clientId: input.clientId ?? null, caption: input.caption };
}

export const ourFileRouter = {
  entryPhoto: f({ image: { maxFileSize: '32MB', maxFileCount: PHOTO_BATCH, acl: 'private' } }, ROUTE_OPTIONS)
    .input(uploadInputSchema)
    .middleware(({ req, files, input }) => admit('photo', req, files, input))
    .onUploadComplete(({ metadata, file }): Promise<UploadOutcome> => acceptUploadedFile('photo', metadata, file)),
  entryClip: f({ video: { maxFileSize: '2GB', maxFileCount: CLIP_BATCH, acl: 'private' } }, ROUTE_OPTIONS)
    .input(uploadInputSchema)
    .middleware(({ req, files, input }) => admit('clip', req, files, input))
    .onUploadComplete(({ metadata, file }): Promise<UploadOutcome> => acceptUploadedFile('clip', metadata, file)),
} satisfies FileRouter;

export type OurFileRouter = typeof ourFileRouter;
