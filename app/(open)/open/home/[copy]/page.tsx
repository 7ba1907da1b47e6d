import { notFound } from 'next/navigation';
import { publicHomeLists } from '@/lib/server/public-reads';
import { HomeHero, HomeLists } from '@/app/(public)/_reading/home-view';
import { PLACEHOLDER, refusePlaceholder } from '@/app/(public)/_reading/open';
import { SharedFirstStep } from '@/components/layout/shared-first-step';

// The home page for signed-out readers and members outside every circle (next.config.mjs rewrites / here, as
// /open/home/all): built on the first request, not at build (the build never needs the database), and
// then sent whole from the cache until a publish, an unpublish or a change to a listed log expires 'home'.
export function generateStaticParams() {
  return [{ copy: PLACEHOLDER }];
}

/** The one address the rewrite names. */
const COPY = 'all';

export default async function OpenHomePage({ params }: { params: Promise<{ copy: string }> }) {
  const { copy } = await params;
  refusePlaceholder(copy);
  if (copy !== COPY) notFound();
  return (
    <div className="space-y-10">
      <HomeHero firstStep={<SharedFirstStep />} />
      <HomeLists lists={await publicHomeLists()} />
    </div>
  );
}
