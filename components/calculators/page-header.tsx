import Link from 'next/link';
import type { ReactNode } from 'react';
import { CAUTION_DEFER, CAUTIONS, type CautionTopic } from '@/lib/calculators';

/** The calculator's title, what it is for, and the usual cautions for the work it serves. */
export function CalculatorPageHeader({ page, children }: { page: { title: string; blurb: string; cautions: readonly CautionTopic[] }; children?: ReactNode }) {
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

/** The usual cautions for what the calculator is used for: one quiet line that opens into the list. */
export function CalculatorCautions({ topics }: { topics: readonly CautionTopic[] }) {
  const cautions = topics.map((t) => CAUTIONS[t]);
  const count = cautions.reduce((n, c) => n + c.points.length, 0);
  return (
    <details className="group rounded-md border border-scribe/40 bg-scribe-soft/40 text-sm" data-testid="calculator-cautions">
      <summary className="flex min-h-11 cursor-pointer list-none items-center gap-2 px-3 py-2 font-semibold [&::-webkit-details-marker]:hidden">
        <span aria-hidden="true" className="text-scribe">
          ⚠
        </span>
        <span>
          Usual cautions: {cautions.map((c) => c.title.split(':')[0].toLowerCase()).join(', ')} <span className="font-normal text-graphite-2">({count})</span>
        </span>
        <span aria-hidden="true" className="ml-auto text-graphite-2 transition-transform group-open:rotate-90">
          ›
        </span>
      </summary>
      <div className="space-y-3 border-t border-scribe/30 px-3 py-3">
        {cautions.map((c) => (
          <div key={c.title}>
            <p className="font-semibold">{c.title}</p>
            <ul className="mt-1 space-y-1">
              {c.points.map((p) => (
                <li key={p} className="pl-4 -indent-4">
                  <span aria-hidden="true" className="text-scribe">
                    ▸{' '}
                  </span>
                  {p}
                </li>
              ))}
            </ul>
          </div>
        ))}
        <p className="text-graphite-2">{CAUTION_DEFER}</p>
      </div>
    </details>
  );
}
