import type { LengthUnit } from '@/lib/types/units';

/** Deviations, limit sizes and the band: one row each, micrometres then the shown units, aligned for reading across. */
export function LimitsTable<R extends { label: string; um: string }>({ caption, units, rows, cell }: { caption: string; units: readonly LengthUnit[]; rows: readonly R[]; cell: (row: R, unit: LengthUnit) => string }) {
  return (
    <table className="mt-3 w-full text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr className="border-b border-rule text-left text-xs text-graphite-2">
          <th scope="col" className="py-1 pr-2 font-semibold">
            <span className="sr-only">Value</span>
          </th>
          <th scope="col" className="py-1 pl-2 text-right font-semibold">µm</th>
          {units.map((u) => (
            <th key={u} scope="col" className="py-1 pl-2 text-right font-semibold">
              {u}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.label} className="border-b border-rule/60 last:border-0">
            <th scope="row" className="py-1.5 pr-2 text-left font-normal">
              {r.label}
            </th>
            <td className="dim py-1.5 pl-2 text-right">{r.um}</td>
            {units.map((u) => (
              <td key={u} className="dim py-1.5 pl-2 text-right">
                {cell(r, u)}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
