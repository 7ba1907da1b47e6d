import Link from 'next/link';
import { inchClassMaxIn, INCH_FAMILY_TITLES, type InchFamily } from '@/lib/fits';
import { entryQuery, type InchClassRow, type Nominal } from './read-entry';
import { FitKindLabel } from './fit-kind';
import { inchClearanceWords } from './inch-format';

type Props = { nominal: Nominal; rows: InchClassRow[]; currentClass?: string };

/** Every ANSI B4.1 class at the size entered, grouped by family, each a link to its own result. */
export function InchClassesTable({ nominal, rows, currentClass }: Props) {
  const families = [...new Set(rows.map((r) => r.fitClass.slice(0, 2)))] as InchFamily[];
  return (
    <section aria-labelledby="inch-classes" className="space-y-3">
      <div>
        <h2 id="inch-classes" className="text-xl font-bold">
          Inch classes at {nominal.text} in
        </h2>
        <p className="text-sm text-graphite-2">
          ANSI B4.1, basic hole, limits in thousandths of an inch. Clearance is hole minus shaft; a negative clearance is an interference.
        </p>
      </div>
      <div className="grid gap-4 md:grid-cols-2">
        {families.map((family) => (
          <table key={family} className="w-full text-sm">
            <caption className="text-left font-semibold">{INCH_FAMILY_TITLES[family]}</caption>
            <thead className="sr-only">
              <tr>
                <th scope="col">Class</th>
                <th scope="col">Kind</th>
                <th scope="col">Limits</th>
              </tr>
            </thead>
            <tbody>
              {rows
                .filter((r) => r.fitClass.startsWith(family))
                .map((r) => (
                  <tr key={r.fitClass} className={`border-b border-rule/60 ${r.fitClass === currentClass ? 'bg-dye-soft' : ''}`}>
                    <th scope="row" className="py-1.5 pr-2 text-left">
                      <Link href={`/fits${entryQuery({ text: `${nominal.text} ${r.fitClass}`, unit: 'in', round: false })}`} className="dim font-semibold">
                        {r.fitClass}
                      </Link>
                    </th>
                    {r.ok ? (
                      <>
                        <td className="py-1.5 pr-2">
                          <FitKindLabel kind={r.fit.kind} />
                        </td>
                        <td className="dim py-1.5 text-right">{inchClearanceWords(r.fit)}</td>
                      </>
                    ) : (
                      <td colSpan={2} className="py-1.5 text-xs text-graphite-2" title={r.message}>
                        {nominal.input > inchClassMaxIn(r.fitClass) ? `Table ends at ${inchClassMaxIn(r.fitClass)} in` : 'No value at this size in the table'}
                      </td>
                    )}
                  </tr>
                ))}
            </tbody>
          </table>
        ))}
      </div>
    </section>
  );
}
