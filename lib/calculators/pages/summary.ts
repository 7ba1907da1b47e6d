/**
 * The shape of what a saved result's card shows, and the small helpers each calculator's
 * `summary` uses to fill it. Pure; the card (`entry-calculations.tsx`) draws it.
 */
import { lengthFromMm, type Length } from '../units';
import type { DrillSize } from '../drills';
import type { LengthUnit } from '@/lib/types/units';

export type SummaryValue = { text?: string; len?: Length; first?: LengthUnit; note?: string };
export type SummaryRow = { label: string; value: SummaryValue; strong?: boolean };
export type SummaryTable = { caption: string; head: string[]; rows: { key: string; cells: (string | Length)[] }[]; more: number };
export type Summary = { inputs: { label: string; value: SummaryValue }[]; results: SummaryRow[]; table?: SummaryTable; warnings: string[] };

/** A length, with the unit to read first. */
export const len = (l: Length, first: LengthUnit = 'mm'): SummaryValue => ({ len: l, first });
/** A stored input length in mm, as a Length. */
export const mmLength = (mm: unknown): Length => lengthFromMm(Number(mm));
export const warningsOf = (o: { warnings?: { message: string }[] }) => (o.warnings ?? []).map((w) => w.message);
/** A metric drill is read in mm first, any other in inches. */
export const firstOf = (d: DrillSize): LengthUnit => (d.kind === 'metric' ? 'mm' : 'in');
/** A card lists at most this many rows of a table; the calculator has the rest. */
export const SUMMARY_TABLE_ROWS = 12;
