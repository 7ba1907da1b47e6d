import type { Metadata } from 'next';
import { getCurrentUser } from '@/lib/auth/current-user';
import { authorizePublic } from '@/lib/auth/policy';
import { pageBySlug } from '@/lib/calculations/catalog';
import { searchFromRecord, tapDrillFromSearch } from '@/lib/calculations/page-state';
import { CalculatorPageHeader } from '@/components/calculators/page-header';
import { TapDrillCalculator } from '@/components/calculators/tap-drill-calculator';

const page = pageBySlug('tap-drill')!;
export const metadata: Metadata = { title: page.title, description: page.blurb };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function TapDrillPage({ searchParams }: Props) {
  const [query, user] = await Promise.all([searchParams, getCurrentUser()]);
  authorizePublic(user, 'useCalculators');
  return (
    <div className="space-y-6">
      <CalculatorPageHeader page={page}>Percentage of thread by the usual handbook relation; about 75 % is the shop&apos;s target.</CalculatorPageHeader>
      <TapDrillCalculator initial={tapDrillFromSearch(searchFromRecord(query))} signedIn={!!user} />
    </div>
  );
}
