'use client';

import { useState } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { fromUm, sizeText, type LengthUnit } from '@/lib/measurements/units';
import type { MeasurementView } from '@/lib/types/measurements';
import { formatNumber } from '@/lib/units/format';

function niceStep(raw: number): number {
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
}

type Point = { label: string; size: number; inside: boolean; text: string };

function ReadingDot({ cx, cy, payload }: { cx?: number; cy?: number; payload?: Point }) {
  if (cx === undefined || cy === undefined || !payload) return <g />;
  // Inside: a filled dot; outside: a cross, so the verdict does not rest on colour.
  return payload.inside ? (
    <circle cx={cx} cy={cy} r={6} fill="var(--color-ok)" stroke="var(--color-card)" strokeWidth={1.5} />
  ) : (
    <g stroke="var(--color-bad)" strokeWidth={2.5} strokeLinecap="round">
      <line x1={cx - 5} y1={cy - 5} x2={cx + 5} y2={cy + 5} />
      <line x1={cx - 5} y1={cy + 5} x2={cx + 5} y2={cy - 5} />
    </g>
  );
}

/** The readings pass by pass, coming down (or up) onto the shaded tolerance band. */
export function ApproachChart({ record, unit }: { record: MeasurementView; unit: LengthUnit }) {
  const [close, setClose] = useState(false);
  const l = record.limits;
  const decimals = unit === 'mm' ? 3 : 4;
  const toUnit = (um: number) => Number(fromUm(um, unit).toFixed(decimals + 1));
  const lower = toUnit(l.nominalUm + l.lowerUm);
  const upper = toUnit(l.nominalUm + l.upperUm);
  const data: Point[] = record.readings.map((r, i) => ({
    label: r.pass != null ? `Pass ${r.pass}` : `#${i + 1}`,
    size: toUnit(r.judgement.sizeUm),
    inside: r.judgement.state === 'inside',
    text: `${sizeText(r.judgement.sizeUm, unit)} ${unit}`,
  }));
  const band = upper - lower;
  const all = [lower, upper, ...data.map((d) => d.size)];
  const [rawMin, rawMax] = close ? [lower - band * 1.5, upper + band * 1.5] : [Math.min(...all) - band * 0.5, Math.max(...all) + band * 0.5];
  // Round ticks (130.100, 130.200…) rather than wherever the data happens to end.
  const step = niceStep((rawMax - rawMin) / 5);
  const min = Math.floor(rawMin / step) * step;
  const max = Math.ceil(rawMax / step) * step;
  const ticks: number[] = [];
  for (let t = min; t <= max + step / 1000; t += step) ticks.push(Number(t.toFixed(decimals + 2)));
  // The two limit labels need the band to be a fair share of the chart's height, or they print over each other.
  const labelsFit = band / (max - min) > 0.12;
  const summary = `Readings by pass against the tolerance band ${sizeText(l.nominalUm + l.lowerUm, unit)} to ${sizeText(l.nominalUm + l.upperUm, unit)} ${unit}: ${data
    .map((d) => `${d.label} ${d.text} ${d.inside ? 'inside' : 'outside'}`)
    .join('; ')}.`;

  return (
    <figure className="space-y-2 rounded-lg border border-rule bg-card p-3" data-testid="approach-chart">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <figcaption className="text-sm font-semibold">Readings approaching the band</figcaption>
        <div role="group" aria-label="Chart scale" className="flex gap-1">
          {[false, true].map((c) => (
            <button
              key={String(c)}
              type="button"
              aria-pressed={close === c}
              onClick={() => setClose(c)}
              className="min-h-11 rounded-md border border-rule px-3 text-sm font-semibold aria-pressed:border-dye aria-pressed:bg-dye-soft"
            >
              {c ? 'Close to the band' : 'Whole approach'}
            </button>
          ))}
        </div>
      </div>
      <div role="img" aria-label={summary} className="h-72 w-full">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 12, right: 16, bottom: 4, left: 8 }}>
            <CartesianGrid stroke="var(--color-rule)" strokeDasharray="2 4" />
            <XAxis dataKey="label" padding={{ left: 24, right: 24 }} tick={{ fill: 'var(--color-graphite-2)', fontSize: 12 }} stroke="var(--color-graphite-2)" />
            <YAxis
              domain={[min, max]}
              ticks={ticks}
              allowDataOverflow
              type="number"
              width={unit === 'mm' ? 72 : 64}
              tickFormatter={(v: number) => formatNumber(v, { decimals })}
              tick={{ fill: 'var(--color-graphite-2)', fontSize: 12, fontFamily: 'var(--font-geist-mono)' }}
              stroke="var(--color-graphite-2)"
            />
            <ReferenceArea y1={lower} y2={upper} fill="var(--color-ok)" fillOpacity={0.18} stroke="var(--color-ok)" strokeOpacity={0.6} ifOverflow="hidden" />
            <ReferenceLine y={upper} stroke="var(--color-ok)" strokeDasharray="4 3" label={labelsFit ? { value: `upper ${formatNumber(upper, { decimals })}`, position: 'insideTopLeft', fill: 'var(--color-graphite)', fontSize: 11 } : undefined} />
            <ReferenceLine y={lower} stroke="var(--color-ok)" strokeDasharray="4 3" label={labelsFit ? { value: `lower ${formatNumber(lower, { decimals })}`, position: 'insideBottomLeft', fill: 'var(--color-graphite)', fontSize: 11 } : undefined} />
            <Tooltip
              formatter={(value) => [`${formatNumber(Number(value), { decimals })} ${unit}`, 'Reading']}
              contentStyle={{ background: 'var(--color-card)', border: '1px solid var(--color-rule)', color: 'var(--color-graphite)' }}
            />
            <Line type="linear" dataKey="size" stroke="var(--color-dye)" strokeWidth={2} dot={(p: { cx?: number; cy?: number; payload?: Point; index?: number }) => <ReadingDot key={p.index} {...p} />} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <p className="text-xs text-graphite-2">
        The shaded strip is the tolerance band, {sizeText(l.nominalUm + l.lowerUm, unit)} to {sizeText(l.nominalUm + l.upperUm, unit)} {unit}; a dot is a
        reading inside it, a cross one outside. “Close to the band” zooms in on the last passes.
      </p>
    </figure>
  );
}
