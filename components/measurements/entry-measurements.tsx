import Link from 'next/link';
import type { ReactNode } from 'react';
import { formatClock } from '@/lib/chapters';
import { otherUnit, sizeText, type LengthUnit } from '@/lib/measurements';
import type { MeasurementView } from '@/lib/types/measurements';
import { KindBadge, VerdictBadge } from './badges';
import { MomentLink } from '@/components/clips/moment-link';

type Props = {
  records: MeasurementView[];
  unit: LengthUnit;
  slug: string;
  /** Small marks shown with a record, by record id (e.g. a mentor's risk flag). */
  markers?: Record<number, ReactNode>;
};

const limitsText = (r: MeasurementView, unit: LengthUnit) =>
  `${sizeText(r.limits.nominalUm + r.limits.lowerUm, unit)} – ${sizeText(r.limits.nominalUm + r.limits.upperUm, unit)} ${unit}`;

/** The entry's critical dimensions at a glance: what was asked, what was read, and whether it is in. */
export function EntryMeasurementsTable({ records, unit, slug, markers }: Props) {
  const other = otherUnit(unit);
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-card">
      <table className="w-full text-sm" data-testid="entry-measurements">
        <caption className="sr-only">Measurements of this entry: feature, specification, limits, latest reading and verdict</caption>
        <thead>
          <tr className="border-b border-rule text-left text-xs text-graphite-2">
            <th scope="col" className="px-3 py-2 font-semibold">Feature</th>
            <th scope="col" className="hidden px-3 py-2 font-semibold md:table-cell">Limits</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Latest reading</th>
            <th scope="col" className="px-3 py-2 font-semibold">Verdict</th>
          </tr>
        </thead>
        <tbody>
          {records.map((r) => {
            const latest = r.readings[r.readings.length - 1];
            return (
              <tr key={r.id} className="border-b border-rule/60 align-top last:border-0" data-record={r.feature}>
                <th scope="row" className="px-3 py-2 text-left font-normal">
                  <Link href={`/logs/${slug}/records/${r.id}${unit !== r.project.units ? `?unit=${unit}` : ''}`} className="font-semibold">
                    {r.feature}
                  </Link>
                  <span className="mt-0.5 flex flex-wrap items-center gap-x-2 gap-y-0.5">
                    <span className="dim text-graphite">
                      {r.nominalText} {r.unit} {r.limits.label}
                    </span>
                    <KindBadge kind={r.kind} />
                    {markers?.[r.id] ?? null}
                  </span>
                  {r.moment ? (
                    <MomentLink href={r.moment.href} clipId={r.moment.mediaId} ms={r.moment.startMs} className="mt-1 inline-flex min-h-8 items-center gap-1 text-xs font-semibold">
                      <span aria-hidden="true">▶</span> In the clip at {formatClock(r.moment.startMs)}
                    </MomentLink>
                  ) : null}
                </th>
                <td className="hidden px-3 py-2 md:table-cell">
                  <span className="dim block">{limitsText(r, unit)}</span>
                  <span className="dim block text-xs text-graphite-2">{limitsText(r, other)}</span>
                </td>
                <td className="px-3 py-2 text-right">
                  {latest ? (
                    <>
                      <span className="dim block whitespace-nowrap">
                        {sizeText(latest.judgement.sizeUm, unit)} {unit}
                      </span>
                      <span className="block text-xs text-graphite-2">
                        {r.readings.length === 1 ? '1 reading' : `${r.readings.length} readings`}
                      </span>
                    </>
                  ) : (
                    <span className="text-graphite-2">—</span>
                  )}
                </td>
                <td className="px-3 py-2">
                  <VerdictBadge state={r.verdict.state} outsideByUm={r.verdict.outsideByUm} unit={unit} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
