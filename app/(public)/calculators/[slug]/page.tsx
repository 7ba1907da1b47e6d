import type { Metadata } from 'next';
import { Suspense } from 'react';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { authorizePublic } from '@/lib/auth/policy';
import { searchFromRecord } from '@/lib/calculators/pages/url-state';
import { CalculatorPageHeader } from '@/components/calculators/page-header';
import { CALCULATORS, calculatorBySlug } from '@/components/calculators/registry';

type Search = Promise<Record<string, string | string[] | undefined>>;
type Props = { params: Promise<{ slug: string }>; searchParams: Search };

// Each page's words and cautions are prerendered at build; the boxes (from the query) and the save
// button (from the session) are the dynamic part. Any slug not in the registry is the 404 page.
export function generateStaticParams() {
  return CALCULATORS.map((c) => ({ slug: c.slug }));
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const calculator = calculatorBySlug((await params).slug);
  return calculator ? { title: calculator.title, description: calculator.blurb } : {};
}

/** The calculator itself, with the boxes the URL holds and the viewer's save button. */
async function CalculatorBody({ slug, searchParams }: { slug: string; searchParams: Search }) {
  const calculator = calculatorBySlug(slug)!;
  const [query, user, Calculator] = await Promise.all([searchParams, getCurrentUser(), calculator.view()]);
  authorizePublic(user, 'useCalculators');
  return <Calculator initial={calculator.fromSearch(searchFromRecord(query))} signedIn={!!user} />;
}

export default async function CalculatorPage({ params, searchParams }: Props) {
  const calculator = calculatorBySlug((await params).slug);
  if (!calculator) notFound();
  const Calculator = await calculator.view();
  return (
    <div className="space-y-6">
      <CalculatorPageHeader page={calculator}>{calculator.note}</CalculatorPageHeader>
      {/* The prerendered shell holds the calculator with its starting boxes, so nothing moves when the request's part arrives. */}
      <Suspense fallback={<Calculator initial={calculator.fromSearch(searchFromRecord({}))} signedIn={false} />}>
        <CalculatorBody slug={calculator.slug} searchParams={searchParams} />
      </Suspense>
    </div>
  );
}
