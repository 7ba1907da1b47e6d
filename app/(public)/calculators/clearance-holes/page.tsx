import type { Metadata } from 'next';
import { getCurrentUser } from '@/lib/auth/current-user';
import { authorizePublic } from '@/lib/auth/policy';
import { pageBySlug } from '@/lib/calculations/catalog';
import { searchFromRecord, clearanceFromSearch } from '@/lib/calculations/page-state';
import { CalculatorPageHeader } from '@/components/calculators/page-header';
import { ClearanceCalculator } from '@/components/calculators/clearance-calculator';

const page = pageBySlug('clearance-holes')!;
export const metadata: Metadata = { title: page.title, description: page.blurb };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function CalculatorPage({ searchParams }: Props) {
  const [query, user] = await Promise.all([searchParams, getCurrentUser()]);
  authorizePublic(user, 'useCalculators');
  return (
    <div className="space-y-6">
      <CalculatorPageHeader page={page}>Metric holes from ISO 273; inch holes from the usual shop tables.</CalculatorPageHeader>
      <ClearanceCalculator initial={clearanceFromSearch(searchFromRecord(query))} signedIn={!!user} />
    </div>
  );
}
