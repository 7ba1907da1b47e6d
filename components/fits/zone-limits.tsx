import type { ToleranceZone } from '@/lib/fits';
import type { SizeUnit } from '@/lib/validations/fits-words';
import { formatUm, formatUmAs } from '@/lib/units/format';
import { deviationNames, limitSize, zoneTitle } from './format';
import { LimitsTable } from '@/components/ui/limits-table';

type Props = { zone: ToleranceZone; unit: SizeUnit };

/** One zone's limits: what to make it to, then its deviations and tolerance in µm, mm and inches. */
export function ZoneLimits({ zone, unit }: Props) {
  const names = deviationNames(zone);
  const max = limitSize(zone.nominalMm, zone.upperUm);
  const min = limitSize(zone.nominalMm, zone.lowerUm);
  const units: SizeUnit[] = unit === 'in' ? ['in', 'mm'] : ['mm', 'in'];
  const dev = (um: number, u: SizeUnit) => formatUmAs(um, u, { signed: true });
  const rows = [
    { label: `Upper deviation ${names.upper}`, um: formatUm(zone.upperUm, { signed: true }), mm: dev(zone.upperUm, 'mm'), in: dev(zone.upperUm, 'in') },
    { label: `Lower deviation ${names.lower}`, um: formatUm(zone.lowerUm, { signed: true }), mm: dev(zone.lowerUm, 'mm'), in: dev(zone.lowerUm, 'in') },
    { label: 'Largest size', um: '', mm: max.mm, in: max.in },
    { label: 'Smallest size', um: '', mm: min.mm, in: min.in },
    { label: `Tolerance ${zone.grade}`, um: formatUm(zone.itUm), mm: formatUmAs(zone.itUm, 'mm'), in: formatUmAs(zone.itUm, 'in') },
  ];
  const testId = `limits-${zone.kind}`;
  return (
    <section className="rounded-lg border border-rule bg-card p-4" aria-labelledby={`${testId}-title`} data-testid={testId}>
      <h3 id={`${testId}-title`} className="text-base font-bold">
        {zoneTitle(zone)}
      </h3>
      <p className="mt-1 text-sm text-graphite-2">Make it between</p>
      {units.map((u, i) => (
        <p key={u} className={`dim ${i === 0 ? 'text-xl font-semibold sm:text-2xl' : 'text-base text-graphite-2'}`}>
          {u === 'mm' ? `${min.mm} and ${max.mm} mm` : `${min.in} and ${max.in} in`}
        </p>
      ))}
      <LimitsTable caption={`${zoneTitle(zone)}: deviations, limit sizes and tolerance`} units={units} rows={rows} cell={(r, u) => r[u]} />
    </section>
  );
}
