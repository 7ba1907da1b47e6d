import type { Summary } from '../calculators/pages/summary';
import type { CalculatorKind } from '@/lib/calculators';

/** A calculator result saved into an entry, as stored: the outputs are the record of what was computed then. */
export type SavedCalculationView = {
  id: number;
  entryId: number;
  /** The calculator kind as stored; `known` is false for a kind this version no longer has. */
  kind: CalculatorKind | string;
  known: boolean;
  /** "Tap drill", "Bolt circle"… */
  calculatorName: string;
  label: string;
  input: Record<string, unknown>;
  output: unknown;
  /** The tables version the output was computed with. */
  tablesVersion: string;
  position: number;
  createdAt: string;
  createdBy: { id: number; name: string } | null;
  /** The calculator page that recomputes it from the stored input. */
  reopenHref: string | null;
  /** What its card shows (inputs, results, a short table, warnings), or null for a stored shape this version cannot read. */
  summary: Summary | null;
};

export type EntryCalculations = {
  calculations: SavedCalculationView[];
  /** The tables version in force now, to say when a saved result was computed with other tables. */
  tablesVersion: string;
};
