import Link from 'next/link';
import { Logo } from './logo';
import { SignOutButton } from './sign-out-button';
import { canOnSite, type Actor } from '@/lib/auth/policy';

type Props = { user: (NonNullable<Actor> & { name: string }) | null };

const navLink = 'inline-flex min-h-11 items-center rounded-md px-3 text-sm font-semibold text-graphite no-underline hover:bg-paper-2';

export function SiteHeader({ user }: Props) {
  return (
    <header className="border-b border-rule bg-card/80">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-2 gap-y-1 px-4 py-2">
        <Link href="/" className="mr-3 flex items-center gap-2 text-lg font-bold text-graphite no-underline">
          <Logo className="h-8 w-8" />
          Scribeline
        </Link>
        {/* On a phone the links get a row of their own below the name and the account buttons, scrolling sideways if need be. */}
        {/* The strip's padding leaves room for the focus ring, which a scrolling box would otherwise cut off. */}
        <nav
          aria-label="Main"
          className="order-last -mx-1.5 flex w-[calc(100%+0.75rem)] scroll-px-1.5 items-center gap-1 overflow-x-auto whitespace-nowrap p-1.5 sm:order-none sm:mx-0 sm:w-auto sm:flex-1 sm:flex-wrap sm:overflow-visible sm:p-0"
        >
          <Link href="/" className={navLink}>
            Logs
          </Link>
          <Link href="/fits" className={navLink}>
            Fits
          </Link>
          <Link href="/calculators" className={navLink}>
            Calculators
          </Link>
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
        </nav>
        <div className="ml-auto flex items-center gap-1 sm:ml-0">
          {user ? (
            <>
              <span className="hidden text-sm text-graphite-2 sm:inline" data-testid="signed-in-as">
                {user.name}
              </span>
              <Link href="/settings" className={navLink}>
                Settings
              </Link>
              <SignOutButton />
            </>
          ) : (
            <>
              <Link href="/sign-in" className={navLink}>
                Sign in
              </Link>
              <Link href="/sign-up" className={`${navLink} bg-dye !text-on-accent hover:bg-dye-2`}>
                Create account
              </Link>
            </>
          )}
        </div>
      </div>
    </header>
  );
}
