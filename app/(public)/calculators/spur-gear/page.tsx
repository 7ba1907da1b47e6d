import type { Metadata } from 'next';
import { getCurrentUser } from '@/lib/auth/current-user';
import { authorizePublic } from '@/lib/auth/policy';
import { pageBySlug } from '@/lib/calculations/catalog';
import { searchFromRecord, spurGearFromSearch } from '@/lib/calculations/page-state';
import { CalculatorPageHeader } from '@/components/calculators/page-header';
import { SpurGearCalculator } from '@/components/calculators/spur-gear-calculator';

const page = pageBySlug('spur-gear')!;
export const metadata: Metadata = { title: page.title, description: page.blurb };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function CalculatorPage({ searchParams }: Props) {
  const [query, user] = await Promise.all([searchParams, getCurrentUser()]);
  authorizePublic(user, 'useCalculators');
  return (
    <div className="space-y-6">
      <CalculatorPageHeader page={page}>For cutting with a form cutter on the dividing head.</CalculatorPageHeader>
      <SpurGearCalculator initial={spurGearFromSearch(searchFromRecord(query))} signedIn={!!user} />
    </div>
  );
}
