import type { Metadata } from 'next';
import { getCurrentUser } from '@/lib/auth/current-user';
import { authorizePublic } from '@/lib/auth/policy';
import { pageBySlug } from '@/lib/calculations/catalog';
import { searchFromRecord, indexingFromSearch } from '@/lib/calculations/page-state';
import { CalculatorPageHeader } from '@/components/calculators/page-header';
import { IndexingCalculator } from '@/components/calculators/indexing-calculator';

const page = pageBySlug('indexing')!;
export const metadata: Metadata = { title: page.title, description: page.blurb };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function CalculatorPage({ searchParams }: Props) {
  const [query, user] = await Promise.all([searchParams, getCurrentUser()]);
  authorizePublic(user, 'useCalculators');
  return (
    <div className="space-y-6">
      <CalculatorPageHeader page={page}>Enter the hole circles of your own plates, or start from the commonly supplied set.</CalculatorPageHeader>
      <IndexingCalculator initial={indexingFromSearch(searchFromRecord(query))} signedIn={!!user} />
    </div>
  );
}
