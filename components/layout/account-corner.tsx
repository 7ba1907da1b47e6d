import Link from 'next/link';
import { getCurrentUser } from '@/lib/auth/current-user';
import { canOnSite } from '@/lib/auth/policy';
import { SignOutButton } from './sign-out-button';
import { navLink } from './nav-link';
import { SignedOutCorner } from './signed-out-corner';

/** The viewer's own links in the main navigation (a dynamic hole of the cached header). */
export async function ViewerLinks() {
  const user = await getCurrentUser();
  return (
    <>
      {user ? (
        <Link href="/projects" className={navLink}>
          My projects
        </Link>
      ) : null}
      {canOnSite(user, 'manageUsers') ? (
        <Link href="/admin/users" className={navLink}>
          Accounts
        </Link>
      ) : null}
    </>
  );
}

/** Signed in: name, settings, sign out; signed out: sign in and create an account (a dynamic hole of the cached header). */
export async function AccountCorner() {
  const user = await getCurrentUser();
  return user ? (
    <>
      <span className="hidden max-w-48 truncate text-sm text-graphite-2 sm:inline" data-testid="signed-in-as">
        {user.name}
      </span>
      <Link href="/settings" className={navLink}>
        Settings
      </Link>
      <SignOutButton />
    </>
  ) : (
    <SignedOutCorner />
  );
}
