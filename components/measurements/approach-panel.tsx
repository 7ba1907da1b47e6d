'use client';

import { useId, useState } from 'react';
import dynamic from 'next/dynamic';
import { approachToSize, USUAL_FINISH_DEPTH } from '@/lib/measurements/approach';
import { dialText, asEntered, sizeText, type LengthUnit } from '@/lib/measurements/units';
import type { MeasurementView } from '@/lib/types/measurements';
import { Notice } from '@/components/ui/notice';
import { inputClass } from '@/components/ui/field';
import { parseNum } from './units';

// The chart library is only needed on this panel.
const ApproachChart = dynamic(() => import('./approach-chart').then((m) => m.ApproachChart), {
  ssr: false,
  loading: () => <div className="h-80 animate-pulse rounded-lg border border-rule bg-paper-2" aria-hidden="true" />,
});

/** Stock still to remove, the depth of the next cut, and whether the usual finishing cut would go too far. */
export function ApproachPanel({ record, unit }: { record: MeasurementView; unit: LengthUnit }) {
  const id = useId();
  const usual = USUAL_FINISH_DEPTH[record.unit];
  const [depthText, setDepthText] = useState(asEntered(usual));
  const latest = record.readings[record.readings.length - 1];
  if (!latest) return null;
  const parsed = parseNum(depthText);
  const depthOk = parsed !== null && parsed > 0 && parsed <= (record.unit === 'mm' ? 5 : 0.2);
  const depth = depthOk ? parsed : usual;
  const a = approachToSize(record.kind, record.limits, latest.judgement.deviationUm, depth, record.unit);
  const u = unit;
  // Rounded to what a dial shows: a machinist sets 0.042 mm, not 0.04225.
  const amt = (um: number) => `${dialText(um, u)} ${u}`;
  const size = (deviationUm: number) => `${sizeText(record.limits.nominalUm + deviationUm, u)} ${u}`;
  const cutWord = record.kind === 'outside' ? 'take off' : 'open up';
  const nearWord = record.kind === 'outside' ? 'upper' : 'lower';
  const farWord = record.kind === 'outside' ? 'lower' : 'upper';
  const showChart = record.byPasses || record.readings.length > 1;

  return (
    <section aria-labelledby={`${id}-title`} className="space-y-3" data-testid="approach">
      <h2 id={`${id}-title`} className="text-xl font-bold">
        Approach to size
      </h2>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,22rem)_1fr]">
        <div className="space-y-3">
          {a.state === 'stock-left' ? (
            <div className="space-y-2 rounded-lg border border-rule bg-card p-4" data-testid="stock-left">
              <p className="text-sm text-graphite-2">From the latest reading, {latest.valueText} {latest.unit}, still to {cutWord}:</p>
              <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 text-sm">
                <dt>To the middle of the band, on the diameter</dt>
                <dd className="dim text-right font-semibold">{amt(a.toMiddleUm)}</dd>
                <dt>Depth of the next cut, per side</dt>
                <dd className="dim text-right text-lg font-bold">{amt(a.cutPerSideToMiddleUm)}</dd>
                <dt>To the {nearWord} limit, on the diameter</dt>
                <dd className="dim text-right">{amt(a.toNearLimitUm)}</dd>
                <dt>… per side</dt>
                <dd className="dim text-right">{amt(a.cutPerSideToNearLimitUm)}</dd>
              </dl>
              <p className="text-xs text-graphite-2">On a turned or bored diameter the depth of cut is half the change in diameter.</p>
            </div>
          ) : a.state === 'in-size' ? (
            <Notice kind="success" title="In size">
              Nothing more to {cutWord}: the latest reading, {latest.valueText} {latest.unit}, is within the limits.
            </Notice>
          ) : (
            <Notice kind="error" title={`Past the ${farWord} limit`}>
              The latest reading is {amt(-a.toFarLimitUm)} past the {farWord} limit. Cutting cannot put material back: consider whether the mating part can
              be made to suit, or make the part again.
            </Notice>
          )}

          {a.state === 'stock-left' ? (
            <>
              <div className="flex flex-col gap-1">
                <label htmlFor={`${id}-depth`} className="text-sm font-semibold">
                  Usual finishing depth per side ({record.unit})
                </label>
                <input
                  id={`${id}-depth`}
                  inputMode="decimal"
                  value={depthText}
                  onChange={(e) => setDepthText(e.target.value)}
                  className={`${inputClass} dim max-w-40`}
                  aria-invalid={!depthOk || undefined}
                  aria-describedby={`${id}-depth-hint`}
                />
                <p id={`${id}-depth-hint`} className={`text-xs ${depthOk ? 'text-graphite-2' : 'font-semibold text-bad'}`}>
                  {depthOk
                    ? `Common practice: about ${asEntered(usual)} ${record.unit} per side for a finishing cut; set your own.`
                    : `Give a depth greater than zero; showing ${asEntered(usual)} ${record.unit}.`}
                </p>
              </div>
              {a.finishOvershoots ? (
                <Notice kind="caution" title="The usual finishing cut would overshoot" role="status">
                  <p data-testid="overshoot">
                    A cut of {asEntered(depth)} {record.unit} per side would leave {size(a.afterFinishUm)}, {amt(a.overshootUm)} past the {farWord} limit.
                    Take about {amt(a.cutPerSideToMiddleUm)} per side instead (a light or spring pass) to land in the middle of the band.
                  </p>
                </Notice>
              ) : (
                <p className="text-sm">
                  <span aria-hidden="true">✓ </span>A finishing cut of {asEntered(depth)} {record.unit} per side would leave {size(a.afterFinishUm)}, still short of
                  the {farWord} limit.
                </p>
              )}
              <Notice kind="caution" title="Measuring on the machine">
                Stop the spindle and let it come to rest before you measure; take the chuck key out and keep hands clear of the chuck and the tool. Follow
                your machine&apos;s manual, local rules and qualified instruction.
              </Notice>
            </>
          ) : null}
        </div>
        {showChart ? <ApproachChart record={record} unit={unit} /> : null}
      </div>
    </section>
  );
}
