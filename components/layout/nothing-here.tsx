import { ButtonLink } from '@/components/ui/button';

/** The 404 page's words: a page that does not exist and one the reader may not see look the same. */
export function NothingHere() {
  return (
    <div className="mx-auto max-w-lg py-12 text-center">
      <p className="dim text-5xl font-bold text-scribe">404</p>
      <h1 className="mt-2 text-2xl font-bold">Nothing here</h1>
      <p className="mt-2 text-graphite-2">This page does not exist, or it belongs to a project you cannot see.</p>
      <div className="mt-6 flex justify-center">
        <ButtonLink href="/">Back to the logs</ButtonLink>
      </div>
    </div>
  );
}
