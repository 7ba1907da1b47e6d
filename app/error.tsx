'use client';

import { Button } from '@/components/ui/button';
import { PlainFrame } from '@/components/layout/site-header';

export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  // Shown in place of everything under the root layout: the header comes along, without the viewer's corner.
  return (
    <PlainFrame>
      <div className="mx-auto max-w-lg py-12 text-center" role="alert">
        <h1 className="text-2xl font-bold">Something went wrong</h1>
        <p className="mt-2 text-graphite-2">The page could not be shown. Your saved work is safe; try again in a moment.</p>
        <div className="mt-6 flex justify-center">
          <Button onClick={reset}>Try again</Button>
        </div>
      </div>
    </PlainFrame>
  );
}
