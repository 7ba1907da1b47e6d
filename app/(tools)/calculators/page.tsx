import type { Metadata } from 'next';
import Link from 'next/link';
import { TABLES_VERSION } from '@/lib/calculators';
import { authorizePublic } from '@/lib/auth/policy';
import { CALCULATOR_PAGES } from '@/lib/calculators/pages/registry';

export const metadata: Metadata = {
  title: 'Shop calculators',
  description: 'Tap drills, clearance holes and counterbores, drill sizes, bolt circles, indexing, gear blanks and spindle speeds, in mm and inches.',
};

// The same for everyone, so prerendered at build: asked for the anonymous visitor, who may use them.
export default function CalculatorsPage() {
  authorizePublic(null, 'useCalculators');
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <h1 className="text-3xl font-bold">Shop calculators</h1>
        <p className="max-w-3xl text-graphite-2">
          The sums done at every session, worked out as you type, every length in millimetres and inches. A link keeps the inputs, and a builder can
          save a result into the entry it was worked out for. Limits and fits have <Link href="/fits">their own page</Link>.
        </p>
      </header>
      <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3" aria-label="Calculators">
        {CALCULATOR_PAGES.map((p) => (
          <li key={p.slug}>
            <Link
              href={`/calculators/${p.slug}`}
              className="flex h-full min-h-24 gap-3 rounded-xl border border-rule bg-card p-4 text-graphite no-underline hover:border-dye hover:bg-paper-2"
            >
              <span aria-hidden="true" className="text-2xl leading-7 text-dye">
                {p.icon}
              </span>
              <span>
                <span className="block text-lg font-bold text-dye">{p.title}</span>
                <span className="mt-1 block text-sm text-graphite-2">{p.blurb}</span>
              </span>
            </Link>
          </li>
        ))}
      </ul>
      <p className="text-xs text-graphite-2">
        Tables: version {TABLES_VERSION}. Each result names its sources; values marked “from memory” or “common practice” are worth checking against
        your own handbook before cutting.
      </p>
    </div>
  );
}
