import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { format } from 'date-fns';
import { getCurrentUser } from '@/lib/auth/current-user';
import { canOnSite } from '@/lib/auth/policy';
import { listUsers } from '@/lib/server/users';
import { SiteRoleForm } from '@/components/admin/site-role-form';

export const metadata: Metadata = { title: 'Accounts' };

export default async function AdminUsersPage() {
  const user = await getCurrentUser();
  // Not an admin: the page does not exist for them.
  if (!canOnSite(user, 'manageUsers')) notFound();
  const users = await listUsers();
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Accounts</h1>
      <p className="text-graphite-2">Every account is a member. Admins look after the community and can change site roles here.</p>
      <div className="overflow-x-auto rounded-lg border border-rule bg-card">
        <table className="w-full text-left text-sm">
          <thead className="border-b border-rule bg-paper-2">
            <tr>
              <th scope="col" className="p-3">Name</th>
              <th scope="col" className="p-3">E-mail</th>
              <th scope="col" className="p-3">Joined</th>
              <th scope="col" className="p-3">Site role</th>
            </tr>
          </thead>
          <tbody>
            {users.map((u) => (
              <tr key={u.id} className="border-b border-rule last:border-0" data-testid={`user-row-${u.email}`}>
                <td className="p-3 font-semibold">{u.name}</td>
                <td className="p-3">{u.email}</td>
                <td className="p-3">{format(new Date(u.createdAt), 'd MMM yyyy')}</td>
                <td className="p-3">
                  <SiteRoleForm userId={u.id} name={u.name} siteRole={u.siteRole} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
