'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';

const LINKS = [
  { href: '/admin/users', label: 'Accounts' },
  { href: '/admin/comments', label: 'Comments to review' },
  { href: '/admin/uploads', label: 'Upload clean-up' },
];

/** The admins' jobs, one link each; the current one is marked in words for screen readers too. */
export function AdminNav() {
  const path = usePathname();
  return (
    <nav aria-label="Admin" className="flex flex-wrap gap-2 border-b border-rule pb-3">
      {LINKS.map((l) => {
        const here = path === l.href;
        return (
          <Link
            key={l.href}
            href={l.href}
            aria-current={here ? 'page' : undefined}
            className={`inline-flex min-h-11 items-center rounded-md border px-3 text-sm font-semibold no-underline ${here ? 'border-dye bg-dye-soft text-dye' : 'border-rule bg-card text-graphite hover:border-dye'}`}
          >
            {l.label}
          </Link>
        );
      })}
    </nav>
  );
}
