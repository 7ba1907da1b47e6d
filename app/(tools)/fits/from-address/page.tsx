import { Suspense } from 'react';
import { FitsWorkbench } from '@/components/fits/fits-workbench';
import { entryFromSearch } from '@/components/fits/read-entry';
import { FitsPage, fitsMetadata } from '../../_pages/fits';

export const metadata = fitsMetadata;

type Search = Promise<Record<string, string | string[] | undefined>>;

/** The boxes as the address fills them (?q=…), read at request time. */
async function WorkbenchFromAddress({ searchParams }: { searchParams: Search }) {
  return <FitsWorkbench initial={entryFromSearch(await searchParams)} />;
}

// /fits with a look-up in its address (next.config.mjs rewrites it here; the browser still shows /fits?q=…):
// the words and empty boxes are prerendered, the boxes and result of the address render for the request.
export default function FitsFromAddress({ searchParams }: { searchParams: Search }) {
  return (
    <FitsPage>
      <Suspense fallback={<FitsWorkbench initial={entryFromSearch({})} />}>
        <WorkbenchFromAddress searchParams={searchParams} />
      </Suspense>
    </FitsPage>
  );
}
