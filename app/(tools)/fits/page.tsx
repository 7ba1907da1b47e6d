import { FitsWorkbench } from '@/components/fits/fits-workbench';
import { entryFromSearch } from '@/components/fits/read-entry';
import { FitsPage, fitsMetadata } from '../_pages/fits';

export const metadata = fitsMetadata;

// Prerendered whole at build, with empty boxes. An address with a look-up (?q=25+H7/g6) is rewritten to
// ./from-address (next.config.mjs), which fills the boxes on the server.
export default function FitsLookUp() {
  return (
    <FitsPage>
      <FitsWorkbench initial={entryFromSearch({})} />
    </FitsPage>
  );
}
