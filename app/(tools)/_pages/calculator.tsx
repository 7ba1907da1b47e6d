import type { Metadata } from 'next';
import { Suspense, type ComponentType, type ReactNode } from 'react';
import { authorizePublic } from '@/lib/auth/policy';
import { calculatorPageBySlug } from '@/lib/calculators/pages/registry';
import type { CalculatorPage } from '@/lib/calculators/pages/definition';
import { searchFromRecord } from '@/lib/calculators/pages/url-state';
import { CalculatorPageHeader } from '@/components/calculators/page-header';

type Search = Promise<Record<string, string | string[] | undefined>>;

/**
 * A calculator's two routes, app/(tools)/calculators/<slug>/page.tsx and its from-address twin: each imports
 * its own component, so a page loads no other calculator's code. The page is prerendered whole at build
 * (words, cautions, starting boxes); the twin, where next.config.mjs sends an address that holds boxes, renders
 * those boxes for the request under the same prerendered words.
 */
export function calculatorRoute<S>(slug: string, Calculator: ComponentType<{ initial: S }>) {
  const page = calculatorPageBySlug(slug) as CalculatorPage<S> | null;
  if (!page) throw new Error(`No calculator page ${slug} in lib/calculators/pages/registry.ts.`);
  const metadata: Metadata = { title: page.title, description: page.blurb };
  const starting = () => page.fromSearch(new URLSearchParams());

  function Frame({ children }: { children: ReactNode }) {
    authorizePublic(null, 'useCalculators');
    return (
      <div className="space-y-6">
        <CalculatorPageHeader page={page!}>{page!.note}</CalculatorPageHeader>
        {children}
      </div>
    );
  }

  function CalculatorStartingPage() {
    return (
      <Frame>
        <Calculator initial={starting()} />
      </Frame>
    );
  }

  /** The calculator with the boxes the address holds. */
  async function BoxesFromAddress({ searchParams }: { searchParams: Search }) {
    return <Calculator initial={page!.fromSearch(searchFromRecord(await searchParams))} />;
  }

  function CalculatorFromAddressPage({ searchParams }: { searchParams: Search }) {
    return (
      <Frame>
        {/* The prerendered shell holds the calculator with its starting boxes, so nothing moves when the request's part arrives. */}
        <Suspense fallback={<Calculator initial={starting()} />}>
          <BoxesFromAddress searchParams={searchParams} />
        </Suspense>
      </Frame>
    );
  }

  return { metadata, Page: CalculatorStartingPage, FromAddressPage: CalculatorFromAddressPage };
}
