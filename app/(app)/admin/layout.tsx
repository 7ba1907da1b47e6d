import type { ReactNode } from 'react';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { canOnSite } from '@/lib/auth/policy';
import { AdminNav } from '@/components/admin/admin-nav';

/** The admins' pages share one small menu; to anyone else they do not exist. */
export default async function AdminLayout({ children }: { children: ReactNode }) {
  if (!canOnSite(await getCurrentUser(), 'manageUsers')) notFound();
  return (
    <div className="min-w-0 space-y-4">
      <AdminNav />
      {children}
    </div>
  );
}
