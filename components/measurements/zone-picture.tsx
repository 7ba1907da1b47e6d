'use client';

import type { ToleranceZone } from '@/lib/fits';
import type { Limits, FeatureKind, LengthUnit } from '@/lib/measurements';
import type { MeasurementView } from '@/lib/types/measurements';
import { ZoneDrawing, type PlottedReading } from '@/components/fits/zone-drawing';
import { KIND_WORDS } from './badges';

/** Limits that are not an ISO 286 zone, drawn the same way: a box from the lower to the upper deviation. */
export function zoneOf(limits: Limits, kind: FeatureKind): ToleranceZone {
  if (limits.zone) return limits.zone;
  return {
    zone: limits.label,
    kind: kind === 'outside' ? 'shaft' : 'hole',
    letter: '',
    grade: 'Band',
    nominalMm: limits.nominalMm,
    upperUm: limits.upperUm,
    lowerUm: limits.lowerUm,
    upperMm: limits.upperUm / 1000,
    lowerMm: limits.lowerUm / 1000,
    itUm: limits.bandUm,
    fundamentalUm: limits.upperUm,
  };
}

/** The record's tolerance zone to scale, with every reading plotted beside it, oldest first. */
export function RecordZonePicture({ record, unit }: { record: MeasurementView; unit: LengthUnit }) {
  const zone = zoneOf(record.limits, record.kind);
  const readings: PlottedReading[] = record.readings.map((r, i) => ({
    um: r.judgement.deviationUm,
    label: r.pass != null ? `P${r.pass}` : String(i + 1),
    inside: r.judgement.state === 'inside',
    text: `${r.valueText} ${r.unit}`,
  }));
  const title = `${record.kind === 'outside' ? 'Outside' : 'Inside'} ${record.limits.label}`;
  return (
    <figure className="rounded-lg border border-rule bg-card p-2 sm:p-4" data-testid="record-zone-picture">
      <ZoneDrawing
        sizeLabel={`${record.nominalText} ${record.unit}`}
        hole={zone.kind === 'hole' ? zone : undefined}
        shaft={zone.kind === 'shaft' ? zone : undefined}
        unit={unit}
        readings={readings}
        titles={{ [zone.kind]: title }}
      />
      <figcaption className="mt-2 space-y-1 text-xs text-graphite-2">
        <p>
          To scale, in micrometres from the nominal size {record.nominalText} {record.unit} (the heavy zero line). The box is the tolerance zone of this{' '}
          {KIND_WORDS[record.kind].long.toLowerCase()}.
        </p>
        <p>
          Readings left of the box, oldest first, labelled by pass (P1, P2…) or in order: <span aria-hidden="true">●</span> a dot is inside the limits,{' '}
          <span aria-hidden="true">✕</span> a cross is outside; an arrow at the edge is off the scale that way. The dashed line marks the latest reading.
        </p>
      </figcaption>
    </figure>
  );
}
