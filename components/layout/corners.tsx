import Link from 'next/link';
import { navLink } from './nav-link';
import { SignOutButton } from './sign-out-button';
import { ViewerCopyCheck } from './viewer-copy-check';

/** What a signed-out reader sees in the corner; static, so the signed-out copies of the log have no hole. */
export function SignedOutCorner() {
  return (
    <>
      <Link href="/sign-in" className={navLink}>
        Sign in
      </Link>
      <Link href="/sign-up" className={`${navLink} bg-dye !text-on-accent hover:bg-dye-2`}>
        Create account
      </Link>
    </>
  );
}

/** A signed-in member's own links in the main navigation: their projects, and the accounts for an admin. */
export function MemberLinks({ manageUsers }: { manageUsers: boolean }) {
  return (
    <>
      <Link href="/projects" className={navLink}>
        My projects
      </Link>
      {manageUsers ? (
        <Link href="/admin/users" className={navLink}>
          Accounts
        </Link>
      ) : null}
    </>
  );
}

/** A signed-in member's corner: their name, their settings, signing out. */
export function SignedInCorner({ name }: { name: string }) {
  return (
    <>
      <span className="hidden max-w-48 truncate text-sm text-graphite-2 sm:inline" data-testid="signed-in-as">
        {name}
      </span>
      <Link href="/settings" className={navLink}>
        Settings
      </Link>
      <SignOutButton />
      <ViewerCopyCheck />
    </>
  );
}
