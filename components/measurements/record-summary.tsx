import Link from 'next/link';
import { formatClock } from '@/lib/chapters';
import { amountText, deviationText, judgementSentence, otherUnit, sizeText, thouText, umText, type LengthUnit } from '@/lib/measurements';
import type { MeasurementView } from '@/lib/types/measurements';
import { VerdictBadge } from './badges';
import { LimitsTable } from '@/components/ui/limits-table';

/** The verdict of the latest reading, large, in words, with what happened before it. */
export function VerdictPanel({ record, unit }: { record: MeasurementView; unit: LengthUnit }) {
  const latest = record.readings[record.readings.length - 1];
  const v = record.verdict;
  const box = v.state === 'inside' ? 'border-ok/60 bg-ok-soft' : v.state === 'none' ? 'border-rule bg-paper-2' : 'border-bad/60 bg-bad-soft';
  const earlier = v.outsideCount - (v.state === 'over' || v.state === 'under' ? 1 : 0);
  return (
    <section aria-label="Verdict" className={`space-y-2 rounded-lg border-2 p-4 ${box}`} data-testid="record-verdict">
      <div className="flex flex-wrap items-center gap-3">
        <VerdictBadge state={v.state} outsideByUm={v.outsideByUm} unit={unit} size="lg" />
        {latest ? (
          <p className="dim text-lg font-semibold">
            Latest reading {latest.valueText} {latest.unit}
            {latest.unit !== unit ? <span className="text-graphite-2"> = {sizeText(latest.judgement.sizeUm, unit)} {unit}</span> : null}
          </p>
        ) : null}
      </div>
      {latest ? <p className="text-base">{judgementSentence(latest.judgement, unit)}</p> : <p>No readings yet.</p>}
      {latest && v.state !== 'inside' ? (
        <p className="dim text-sm text-graphite-2">
          = {amountText(v.outsideByUm, otherUnit(unit))} {otherUnit(unit)}, {thouText(v.outsideByUm)} thou
        </p>
      ) : null}
      {earlier > 0 ? (
        <p className="text-sm text-graphite-2">
          {earlier === 1 ? 'One earlier reading was' : `${earlier} earlier readings were`} outside the limits (see the readings below).
        </p>
      ) : null}
      {record.moment ? (
        <p>
          <Link href={record.moment.href} className="inline-flex min-h-11 items-center gap-2 font-semibold">
            <span aria-hidden="true">▶</span> Watch it measured: clip at {formatClock(record.moment.startMs)} — “{record.moment.text}”
          </Link>
        </p>
      ) : null}
    </section>
  );
}

/** What to make it to, in both units, and where the limits come from. */
export function LimitsCard({ record, unit }: { record: MeasurementView; unit: LengthUnit }) {
  const l = record.limits;
  const units: LengthUnit[] = [unit, otherUnit(unit)];
  const lower = l.nominalUm + l.lowerUm;
  const upper = l.nominalUm + l.upperUm;
  const rows = [
    { label: 'Largest size', um: '', v: (u: LengthUnit) => sizeText(upper, u) },
    { label: 'Smallest size', um: '', v: (u: LengthUnit) => sizeText(lower, u) },
    { label: 'Upper deviation', um: umText(l.upperUm, true), v: (u: LengthUnit) => deviationText(l.upperUm, u) },
    { label: 'Lower deviation', um: umText(l.lowerUm, true), v: (u: LengthUnit) => deviationText(l.lowerUm, u) },
    { label: 'Tolerance band', um: umText(l.bandUm), v: (u: LengthUnit) => sizeText(l.bandUm, u) },
  ];
  return (
    <section aria-labelledby="limits-title" className="rounded-lg border border-rule bg-card p-4" data-testid="record-limits">
      <h2 id="limits-title" className="text-lg font-bold">
        Limits
      </h2>
      <p className="mt-1 text-sm text-graphite-2">Make it between</p>
      {units.map((u, i) => (
        <p key={u} className={`dim ${i === 0 ? 'text-xl font-semibold sm:text-2xl' : 'text-base text-graphite-2'}`}>
          {sizeText(lower, u)} and {sizeText(upper, u)} {u}
        </p>
      ))}
      <LimitsTable caption={`Limit sizes and deviations in micrometres, ${units.join(' and ')}`} units={units} rows={rows} cell={(r, u) => r.v(u)} />
      <p className="mt-2 text-xs text-graphite-2">{l.source}. Sizes at 20 °C, the reference temperature of ISO 1.</p>
    </section>
  );
}
