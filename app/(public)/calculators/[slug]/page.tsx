import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { authorizePublic } from '@/lib/auth/policy';
import { searchFromRecord } from '@/lib/calculations/url-state';
import { CalculatorPageHeader } from '@/components/calculators/page-header';
import { CALCULATORS, calculatorBySlug } from '@/components/calculators/registry';

type Props = {
  params: Promise<{ slug: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
};

// Every calculator page is listed in the registry; any other address is the 404 page.
export const dynamicParams = false;

export function generateStaticParams() {
  return CALCULATORS.map((c) => ({ slug: c.slug }));
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const calculator = calculatorBySlug((await params).slug);
  return calculator ? { title: calculator.title, description: calculator.blurb } : {};
}

export default async function CalculatorPage({ params, searchParams }: Props) {
  const calculator = calculatorBySlug((await params).slug);
  if (!calculator) notFound();
  const [query, user, Calculator] = await Promise.all([searchParams, getCurrentUser(), calculator.view()]);
  authorizePublic(user, 'useCalculators');
  return (
    <div className="space-y-6">
      <CalculatorPageHeader page={calculator}>{calculator.note}</CalculatorPageHeader>
      <Calculator initial={calculator.fromSearch(searchFromRecord(query))} signedIn={!!user} />
    </div>
  );
}
