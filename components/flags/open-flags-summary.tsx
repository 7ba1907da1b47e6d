import Link from 'next/link';
import { hazardLabel } from '@/lib/validations/flag-words';
import type { FlagView } from '@/lib/types/flags';
import { FlagStatusBadge, FlagStatusMark, SeverityBadge, targetText } from './flag-words';

/**
 * The open flags of a whole project in one short list, each linking to the entry where it is answered:
 * for the builder above their log, so none is forgotten.
 */
export function OpenFlagsSummary({ flags, hrefFor }: { flags: FlagView[]; hrefFor: (flag: FlagView) => string }) {
  if (!flags.length) return null;
  return (
    <section aria-labelledby="open-flags-heading" className="rounded-lg border-2 border-scribe/70 bg-scribe-soft/50 p-4" data-testid="open-flags-summary">
      <h2 id="open-flags-heading" className="flex items-center gap-2 font-bold">
        <span className="text-scribe">
          <FlagStatusMark status="open" className="h-5 w-5" />
        </span>
        {flags.length === 1 ? '1 open risk flag from a mentor' : `${flags.length} open risk flags from mentors`}
      </h2>
      <p className="mt-1 text-sm text-graphite-2">Say you have seen each one, and answer it once you have acted on it.</p>
      <ul className="mt-3 space-y-2">
        {flags.map((f) => (
          <li key={f.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 rounded-md bg-card px-3 py-2 text-sm">
            <SeverityBadge severity={f.severity} />
            <Link href={hrefFor(f)} className="font-semibold">
              {f.entryTitle}
            </Link>
            <span className="text-graphite-2">
              {hazardLabel(f.hazard)} · {f.target.kind === 'entry' ? 'the whole entry' : targetText(f.target).replace(/^On the /, '')} · from {f.mentor.name}
            </span>
            <span className="ml-auto">
              <FlagStatusBadge status={f.status} />
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
