import Link from 'next/link';
import type { CalculatorPage } from '@/lib/calculations/catalog';
import { CalculatorCautions } from './bits';

/** The calculator's title, what it is for, and the usual cautions for the work it serves. */
export function CalculatorPageHeader({ page, children }: { page: CalculatorPage; children?: React.ReactNode }) {
  return (
    <header className="space-y-3">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/calculators">Calculators</Link> <span aria-hidden="true">›</span> {page.title}
      </nav>
      <h1 className="text-3xl font-bold">{page.title}</h1>
      <p className="max-w-3xl text-graphite-2">
        {page.blurb} {children}
      </p>
      <CalculatorCautions topics={page.cautions} />
    </header>
  );
}
