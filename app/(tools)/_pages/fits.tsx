import type { Metadata } from 'next';
import Link from 'next/link';
import type { ReactNode } from 'react';

export const fitsMetadata: Metadata = {
  title: 'Limits and fits',
  description: 'ISO 286 limits and fits and the ANSI B4.1 inch classes for the home shop: type a size and a zone, fit or class, get the limits in mm and inches, drawn to scale.',
};

/** The fits page's words around its workbench (/fits and its from-address twin). */
export function FitsPage({ children }: { children: ReactNode }) {
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
      {children}
    </div>
  );
}
