import Link from 'next/link';
import type { LengthUnit } from '@/lib/measurements';

const WORDS: Record<LengthUnit, string> = { mm: 'millimetres', in: 'inches' };

/** Shows which unit comes first on the page, with the other one click away. */
export function UnitToggle({ unit, href }: { unit: LengthUnit; href: string }) {
  const other: LengthUnit = unit === 'mm' ? 'in' : 'mm';
  return (
    <p className="flex flex-wrap items-center gap-2 text-sm" data-testid="unit-toggle">
      <span className="text-graphite-2">
        Sizes in <strong className="text-graphite">{WORDS[unit]}</strong>
      </span>
      <Link
        href={href}
        scroll={false}
        className="inline-flex min-h-11 items-center rounded-md border border-rule bg-card px-3 font-semibold no-underline hover:bg-paper-2"
      >
        Show in {WORDS[other]}
      </Link>
    </p>
  );
}
