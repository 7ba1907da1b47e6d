import type { Metadata } from 'next';
import { getCurrentUser } from '@/lib/auth/current-user';
import { authorizePublic } from '@/lib/auth/policy';
import { pageBySlug } from '@/lib/calculations/catalog';
import { searchFromRecord, boltCircleFromSearch } from '@/lib/calculations/page-state';
import { CalculatorPageHeader } from '@/components/calculators/page-header';
import { BoltCircleCalculator } from '@/components/calculators/bolt-circle-calculator';

const page = pageBySlug('bolt-circle')!;
export const metadata: Metadata = { title: page.title, description: page.blurb };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function CalculatorPage({ searchParams }: Props) {
  const [query, user] = await Promise.all([searchParams, getCurrentUser()]);
  authorizePublic(user, 'useCalculators');
  return (
    <div className="space-y-6">
      <CalculatorPageHeader page={page}>X to the right, Y up, angles counter-clockwise from +X, as on a drawing.</CalculatorPageHeader>
      <BoltCircleCalculator initial={boltCircleFromSearch(searchFromRecord(query))} signedIn={!!user} />
    </div>
  );
}
