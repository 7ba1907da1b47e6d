import type { Metadata } from 'next';
import { getCurrentUser } from '@/lib/auth/current-user';
import { authorizePublic } from '@/lib/auth/policy';
import { pageBySlug } from '@/lib/calculations/catalog';
import { searchFromRecord, drillsFromSearch } from '@/lib/calculations/page-state';
import { CalculatorPageHeader } from '@/components/calculators/page-header';
import { DrillsCalculator } from '@/components/calculators/drills-calculator';

const page = pageBySlug('drills')!;
export const metadata: Metadata = { title: page.title, description: page.blurb };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function CalculatorPage({ searchParams }: Props) {
  const [query, user] = await Promise.all([searchParams, getCurrentUser()]);
  authorizePublic(user, 'useCalculators');
  return (
    <div className="space-y-6">
      <CalculatorPageHeader page={page}>Number and letter drills are inch sizes; a bare number is refused, since #7 and 7 mm differ by 1.9 mm.</CalculatorPageHeader>
      <DrillsCalculator initial={drillsFromSearch(searchFromRecord(query))} signedIn={!!user} />
    </div>
  );
}
