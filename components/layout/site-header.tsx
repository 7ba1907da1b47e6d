import Link from 'next/link';
import type { ReactNode } from 'react';
import { Logo } from './logo';
import { navLink } from './nav-link';

/**
 * The header, the same for every reader but for two slots: the viewer's own links in the main navigation
 * and the account corner (components/layout/site-frame.tsx fills them). Its rows have fixed heights (one
 * row from `sm`, two on a phone: name and account, then the links), so nothing below moves when the slots
 * or the web fonts arrive. No server-only import here: the error page (a client component) uses it too.
 */
export function SiteHeader({ viewerLinks = null, corner = null }: { viewerLinks?: ReactNode; corner?: ReactNode }) {
  return (
    <header className="border-b border-rule bg-card/80">
      <div className="mx-auto grid max-w-6xl grid-cols-[auto_minmax(0,1fr)] grid-rows-[3.5rem_3.5rem] items-center gap-x-2 px-4 sm:grid-cols-[auto_minmax(0,1fr)_auto] sm:grid-rows-[3.75rem]">
        <Link href="/" className="mr-3 flex items-center gap-2 text-lg font-bold text-graphite no-underline">
          <Logo className="h-8 w-8" />
          Scribeline
        </Link>
        {/* On a phone the links get a row of their own below the name and the account buttons, scrolling sideways if need be. */}
        {/* The strip's padding leaves room for the focus ring, which a scrolling box would otherwise cut off. */}
        <nav
          aria-label="Main"
          className="col-span-2 row-start-2 -mx-1.5 flex w-[calc(100%+0.75rem)] scroll-px-1.5 items-center gap-1 overflow-x-auto whitespace-nowrap p-1.5 sm:col-span-1 sm:col-start-2 sm:row-start-1 sm:mx-0 sm:w-auto"
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
          {viewerLinks}
          {/* On a phone the search link ends the links' row: beside the name it pushed the account buttons onto two lines. */}
          <SearchLink className="ml-auto sm:hidden" />
        </nav>
        <div className="col-start-2 row-start-1 flex h-11 items-center justify-self-end gap-1 sm:col-start-3">
          {/* Search: a small GET form where there is room, an icon link to the search page where there is not. */}
          <form action="/search" method="get" role="search" aria-label="Search the logs" className="hidden items-center lg:flex">
            <label htmlFor="header-search" className="sr-only">
              Search the logs
            </label>
            <input
              id="header-search"
              name="q"
              type="search"
              maxLength={200}
              placeholder="Search logs"
              enterKeyHint="search"
              className="h-9 w-44 rounded-md border border-rule bg-card px-3 text-sm text-graphite placeholder:text-graphite-2"
            />
          </form>
          <SearchLink className="max-sm:hidden lg:hidden" />
          {corner}
        </div>
      </div>
    </header>
  );
}

/**
 * An icon link to the search page, where the header has no room for the search box. `relative`: its hidden
 * label is placed against the link, so in the phone's scrolling row of links it cannot widen the page.
 */
function SearchLink({ className }: { className: string }) {
  return (
    <Link href="/search" className={`${navLink} relative px-2.5 ${className}`}>
      <svg aria-hidden="true" viewBox="0 0 20 20" className="h-5 w-5" fill="none" stroke="currentColor" strokeWidth="2">
        <circle cx="8.5" cy="8.5" r="5.5" />
        <path d="M12.5 12.5 17 17" strokeLinecap="round" />
      </svg>
      <span className="sr-only">Search</span>
    </Link>
  );
}

export const mainClass = 'mx-auto w-full max-w-6xl px-4 py-6 sm:py-8';

/** The header (without the viewer's slots) and the main column, for the error page, a client component. */
export function PlainFrame({ children }: { children: ReactNode }) {
  return (
    <>
      <SiteHeader />
      <main id="main" className={mainClass}>
        {children}
      </main>
    </>
  );
}
