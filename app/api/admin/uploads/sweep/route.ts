import { route } from '@/lib/http/route';
import { authorizeSite } from '@/lib/auth/policy';
import { sweepOrphanUploads } from '@/lib/server/upload-service';
import { sweepSchema } from '@/lib/validations/media';
import { AppError } from '@/lib/errors';


const HOUR_MS = 60 * 60 * 1000;

/**
 * Removes stored files that no photo or clip points to and that are older than `olderThanMs`
 * (default one hour, long enough for any upload still being recorded). Admins only; for a scheduler.
 */
export const POST = route(async ({ req, user }) => {
  authorizeSite(user, 'manageUsers');
  const text = await req.text();
  let body: unknown = {};
  if (text.trim()) {
    try {
      body = JSON.parse(text);
    } catch {
      throw new AppError('validation', 'The request body is not valid JSON.');
    }
  }
  const { olderThanMs = HOUR_MS } = sweepSchema.parse(body);
  return sweepOrphanUploads(olderThanMs);
});
