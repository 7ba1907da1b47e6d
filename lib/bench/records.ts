import type { BenchRecord } from '../types/bench';
import type { MeasurementView } from '../types/measurements';
import type { JudgedAgainst } from './queue';

/** A record as the bench view keeps it: only its inputs (everything else is computed on the phone). */
export function toBenchRecord(r: MeasurementView): BenchRecord {
  return {
    id: r.id,
    version: r.version,
    feature: r.feature,
    kind: r.kind,
    nominal: r.nominal,
    nominalText: r.nominalText,
    unit: r.unit,
    spec: r.spec,
    entryTitle: r.entry.title,
    readings: r.readings.map((x) => ({ value: x.value, unit: x.unit, resolution: x.resolution, instrument: x.instrument, valueText: x.valueText, measuredAt: x.measuredAt })),
  };
}

/** What a queued reading remembers of its record, to show both sides if the record changes meanwhile. */
export const judgedAgainst = (r: BenchRecord): JudgedAgainst => ({ id: r.id, version: r.version, feature: r.feature, kind: r.kind, nominal: r.nominal, unit: r.unit, spec: r.spec });
