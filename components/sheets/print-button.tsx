'use client';

import { Button } from '@/components/ui/button';

/** Opens the browser's print dialog for the page (the sheet's own @page size applies). */
export function PrintButton() {
  return (
    <Button type="button" onClick={() => window.print()}>
      Print this sheet
    </Button>
  );
}
