import Link from 'next/link';
import type { SizeUnit } from '@/lib/validations/fits-words';
import { entryQuery, type Nominal, type PreferredRow } from './read-entry';
import { FitKindLabel } from './fit-kind';
import { formatUmAs } from '@/lib/units/format';
import { nominalText } from './format';

type Props = { nominal: Nominal; rows: PreferredRow[]; round: boolean; currentFit?: string };

function Clearance({ um, unit }: { um: number; unit: SizeUnit }) {
  const units: SizeUnit[] = unit === 'in' ? ['in', 'mm'] : ['mm', 'in'];
  return (
    <span className="flex flex-col items-end max-sm:items-start">
      {units.map((u, i) => (
        <span key={u} className={`dim whitespace-nowrap ${i === 0 ? '' : 'text-xs text-graphite-2'}`}>
          {formatUmAs(um, u, { signed: true })} {u}
        </span>
      ))}
    </span>
  );
}

const cellLabel = 'block text-xs font-semibold text-graphite-2 sm:hidden';

/** The common hole-basis fits worked out at the size entered, each a link to its own page. */
export function PreferredFitsTable({ nominal, rows, round, currentFit }: Props) {
  const size = nominalText(nominal);
  return (
    <section aria-labelledby="preferred-fits" className="space-y-3">
      <div>
        <h2 id="preferred-fits" className="text-xl font-bold">
          Common hole-basis fits at {size.typed}
        </h2>
        <p className="text-sm text-graphite-2">
          The preferred fits of ISO 286-1 with an H hole, loosest first. Clearance is hole minus shaft; a negative clearance is an interference.
          The notes on use are Scribeline&apos;s own rules of thumb.
        </p>
      </div>
      <table className="w-full text-sm max-sm:block">
        <caption className="sr-only">Common hole-basis fits at {size.typed}</caption>
        <thead className="max-sm:sr-only">
          <tr className="border-b-2 border-rule text-left text-xs text-graphite-2">
            <th scope="col" className="py-2 pr-3">Fit</th>
            <th scope="col" className="py-2 pr-3">Kind</th>
            <th scope="col" className="py-2 pr-3 text-right">Max clearance</th>
            <th scope="col" className="py-2 pr-3 text-right">Min clearance</th>
            <th scope="col" className="py-2">Where a shop uses it</th>
          </tr>
        </thead>
        <tbody className="max-sm:block max-sm:space-y-3">
          {rows.map((row) => {
            const current = row.preferred.fit === currentFit;
            const href = `/fits${entryQuery({ text: `${nominal.text} ${row.preferred.fit}`, unit: nominal.unit, round })}`;
            return (
              <tr
                key={row.preferred.fit}
                data-fit={row.preferred.fit}
                className={`border-b border-rule align-top max-sm:grid max-sm:grid-cols-2 max-sm:gap-x-3 max-sm:gap-y-2 max-sm:rounded-lg max-sm:border max-sm:p-3 ${
                  current ? 'bg-dye-soft' : 'max-sm:bg-card'
                }`}
              >
                <th scope="row" className="py-2 pr-3 text-left">
                  <Link href={href} className="dim inline-flex min-h-11 items-center text-base font-bold sm:min-h-0">
                    {row.preferred.fit}
                    <span className="sr-only"> at {size.typed}</span>
                  </Link>
                  <span className="block text-xs font-normal text-graphite-2">{row.preferred.name}</span>
                  {current ? <span className="block text-xs font-semibold text-dye">▸ shown above</span> : null}
                </th>
                {row.ok ? (
                  <>
                    <td className="whitespace-nowrap py-2 pr-3 max-sm:self-center">
                      <FitKindLabel kind={row.fit.kind} />
                    </td>
                    <td className="py-2 pr-3 text-right max-sm:block max-sm:text-left">
                      <span className={cellLabel}>Max clearance</span>
                      <Clearance um={row.fit.maxClearanceUm} unit={nominal.unit} />
                    </td>
                    <td className="py-2 pr-3 text-right max-sm:block max-sm:text-left">
                      <span className={cellLabel}>Min clearance</span>
                      <Clearance um={row.fit.minClearanceUm} unit={nominal.unit} />
                    </td>
                  </>
                ) : (
                  <td colSpan={3} className="py-2 pr-3 text-graphite-2 max-sm:col-span-2">
                    <span aria-hidden="true">✕ </span>Not defined at this size: {row.message}
                  </td>
                )}
                <td className="py-2 text-graphite-2 max-sm:col-span-2">{row.preferred.use}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </section>
  );
}
