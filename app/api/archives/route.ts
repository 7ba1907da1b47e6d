import { created, route } from '@/lib/http/route';
import { AppError } from '@/lib/errors';
import { ARCHIVE_LIMITS } from '@/lib/server/archive/format';
import { importProjectArchive } from '@/lib/server/archive/import';

const ZIP_TYPES = ['application/zip', 'application/x-zip-compressed', 'application/octet-stream'];

/**
 * Brings a project archive back as a new private project of the signed-in member. The body is the zip
 * itself (so the browser can report upload progress); 201 { projectId, slug, title, counts }.
 */
export const POST = route({ auth: 'user', signInTo: 'bring in an archive' }, async ({ req, user }) => {
  const type = (req.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();
  if (!ZIP_TYPES.includes(type)) throw new AppError('unsupported_media_type', 'Send the archive as a zip file (application/zip).', { archive: ['Send the archive as a zip file.'] });
  const length = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(length) && length > ARCHIVE_LIMITS.uploadBytes) {
    throw new AppError('too_large', `The archive is larger than ${Math.round(ARCHIVE_LIMITS.uploadBytes / 1024 / 1024)} MB, more than one import takes.`, { archive: ['The archive is too large.'] });
  }
  return created(await importProjectArchive(user, req.body));
});
