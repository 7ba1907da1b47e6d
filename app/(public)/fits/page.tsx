import type { Metadata } from 'next';
import Link from 'next/link';
import { Suspense } from 'react';
import { FitsWorkbench } from '@/components/fits/fits-workbench';
import { entryFromSearch } from '@/components/fits/read-entry';

export const metadata: Metadata = {
  title: 'Limits and fits',
  description: 'ISO 286 limits and fits and the ANSI B4.1 inch classes for the home shop: type a size and a zone, fit or class, get the limits in mm and inches, drawn to scale.',
};

type Search = Promise<Record<string, string | string[] | undefined>>;
type Props = { searchParams: Search };

/** The boxes as the address fills them (?q=…), read at request time. */
async function WorkbenchFromAddress({ searchParams }: { searchParams: Search }) {
  return <FitsWorkbench initial={entryFromSearch(await searchParams)} />;
}

// Prerendered at build: the words and an empty workbench; a look-up in the address fills the boxes at request time.
export default function FitsPage({ searchParams }: Props) {
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <h1 className="text-3xl font-bold">Limits and fits</h1>
        <p className="max-w-3xl text-graphite-2">
          Type a nominal size and an ISO 286 tolerance zone or fit, or an inch size and an ANSI B4.1 class such as RC4, LC2 or FN2. The limits come
          straight from the standards&apos; tables, in millimetres and inches, as you type. Measure at 20 °C, the reference temperature of every dimension.
        </p>
        <p className="text-sm text-graphite-2">
          Tap drills, clearance holes, bolt circles and the other shop sums are in the <Link href="/calculators">calculators</Link>.
        </p>
      </header>
      <Suspense fallback={<FitsWorkbench initial={entryFromSearch({})} />}>
        <WorkbenchFromAddress searchParams={searchParams} />
      </Suspense>
    </div>
  );
}
