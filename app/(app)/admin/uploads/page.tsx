import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { canOnSite } from '@/lib/auth/policy';
import { UploadSweep } from '@/components/admin/upload-sweep';

export const metadata: Metadata = { title: 'Upload clean-up' };

export default async function AdminUploadsPage() {
  if (!canOnSite(await getCurrentUser(), 'manageUsers')) notFound();
  return (
    <div className="max-w-2xl space-y-4">
      <h1 className="text-2xl font-bold">Upload clean-up</h1>
      <p className="text-graphite-2">
        A photo or clip refused after upload, or an upload abandoned half-way, can leave a file at the upload service that nothing in Scribeline
        uses. The clean-up removes such files once they are over an hour old; files of every photo and clip in a log are never touched.
      </p>
      <UploadSweep />
    </div>
  );
}
