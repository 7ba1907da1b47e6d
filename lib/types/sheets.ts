// The shop sheet as lib/server/sheets.ts returns it and components/sheets renders it: plain data,
// every size already worked out (lib/measurements/shop-sheet.ts) from the stored inputs.
import type { InstrumentAdvice, SheetSizes } from '../measurements/shop-sheet';
import type { Summary } from '../calculators/pages/summary';
import type { FlagHazard, FlagSeverity, FlagStatus } from '../validations/flags';
import type { LengthUnit } from './units';

export type SheetRecord = {
  id: number;
  feature: string;
  kind: 'outside' | 'inside';
  entryTitle: string;
  /** "130 mm k6", "1.575 in ±0.002 in". */
  nominalText: string;
  unit: LengthUnit;
  specLabel: string;
  /** Where the limits come from ("ISO 286-2 zone k6 at 130 mm"). */
  source: string;
  /** In the record's own unit first, then the other (rounded inward). */
  sizes: [SheetSizes, SheetSizes];
  instrument: InstrumentAdvice;
  /** The instrument of the latest reading, when it differs from the one advised. */
  lastInstrument: string | null;
  latest: { valueText: string; unit: LengthUnit; verdict: string } | null;
  readingCount: number;
};

export type SheetCalculation = {
  id: number;
  entryTitle: string;
  label: string;
  calculatorName: string;
  kind: string;
  /** Null when this version cannot read the stored result. */
  summary: Summary | null;
  /** Worked out with tables older than today's. */
  olderTables: string | null;
};

export type SheetFlag = {
  id: number;
  entryTitle: string;
  /** "Note at 0:42", "Measurement: Spigot diameter", or null for the entry itself. */
  target: string | null;
  severity: FlagSeverity;
  hazard: FlagHazard;
  status: FlagStatus;
  mentor: string;
  concern: string;
  instead: string;
};

export type SheetCaution = { id: string; title: string; text: string; operations: string[] };

export type SessionSheet = {
  project: { id: number; slug: string; title: string; units: LengthUnit };
  session: { id: number; title: string; position: number; heldOn: string; planned: string };
  entries: { id: number; title: string; operation: string }[];
  /** Every record of the session, for choosing; `records` holds the chosen ones (all by default). */
  allRecords: { id: number; feature: string; entryTitle: string }[];
  chosen: number[] | null;
  records: SheetRecord[];
  calculations: SheetCalculation[];
  flags: SheetFlag[];
  cautions: SheetCaution[];
  deferral: string;
  tablesVersion: string;
};
