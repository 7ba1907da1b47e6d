// A project's measurements as a spreadsheet: one row per reading, limits and readings in both units.
import type { MeasurementView } from '../types/measurements';
import { textCell, toCsv, type CsvCell } from './csv';
import { instrumentLabel } from './readings';
import { asEntered, sizeText, thouText, umText } from './units';
import { STATE_WORDS } from './words';

export const CSV_HEADER = [
  'Record', 'Session', 'Entry', 'Feature', 'Kind', 'Nominal', 'Unit', 'Specification',
  'Lower limit (mm)', 'Upper limit (mm)', 'Lower limit (in)', 'Upper limit (in)',
  'Reading #', 'Pass', 'Reading', 'Reading unit', 'Reading (mm)', 'Reading (in)', 'Deviation (µm)', 'Deviation (thou)',
  'Verdict', 'Outside by (mm)', 'Outside by (in)', 'Margin to nearest limit (µm)', 'Latest reading',
  'Instrument', 'Resolution', 'Resolution fine enough (tenth of the band)', 'Measured by', 'Measured at', 'Temperature (°C)', 'Temperature warning', 'Note',
] as const;

/**
 * One row per reading (a record without readings gets one row), both units, RFC 4180. `header: false` gives
 * the rows alone, so a long list can be written in parts (the archive writes it session by session).
 */
export function measurementsCsv(records: MeasurementView[], { header = true }: { header?: boolean } = {}): string {
  const rows: CsvCell[][] = header ? [[...CSV_HEADER]] : [];
  for (const r of records) {
    const lower = r.limits.nominalUm + r.limits.lowerUm;
    const upper = r.limits.nominalUm + r.limits.upperUm;
    const base: CsvCell[] = [
      r.id, `${r.entry.sessionPosition + 1}: ${textCell(r.entry.sessionTitle)}`, textCell(r.entry.title), textCell(r.feature), r.kind, r.nominalText, r.unit, r.limits.label,
      sizeText(lower, 'mm'), sizeText(upper, 'mm'), sizeText(lower, 'in'), sizeText(upper, 'in'),
    ];
    if (!r.readings.length) {
      rows.push([...base, '', '', '', '', '', '', '', '', STATE_WORDS.none, '', '', '', '', '', '', '', '', '', '', '', '']);
      continue;
    }
    r.readings.forEach((x, i) => {
      const j = x.judgement;
      rows.push([
        ...base,
        i + 1, x.pass ?? '', x.valueText, x.unit, sizeText(j.sizeUm, 'mm'), sizeText(j.sizeUm, 'in'), umText(j.deviationUm, true), thouText(j.deviationUm, true),
        STATE_WORDS[j.state], j.state === 'inside' ? '' : sizeText(j.outsideByUm, 'mm'), j.state === 'inside' ? '' : sizeText(j.outsideByUm, 'in'), umText(j.marginUm, true),
        i === r.readings.length - 1 ? 'yes' : 'no',
        instrumentLabel(x.instrument), `${asEntered(x.resolution)} ${x.unit}`, x.resolutionCheck.ok ? 'yes' : 'no (common practice: a tenth of the band)',
        textCell(x.measuredBy), x.measuredAt, x.temperatureC ?? '', x.temperature?.warn ? `yes: ${x.temperature.offC > 0 ? '+' : ''}${x.temperature.offC.toFixed(1)} °C from 20 °C (ISO 1)` : '',
        textCell(x.note),
      ]);
    });
  }
  return rows.length ? toCsv(rows) : '';
}
