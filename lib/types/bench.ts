// Plain shapes of the bench view (the phone at the machine), as lib/server returns them.
import type { FeatureKind, LengthUnit, Spec } from '../measurements';

export type BenchReading = {
  value: number;
  unit: LengthUnit;
  resolution: number;
  instrument: string;
  /** As typed, with the instrument's decimals. */
  valueText: string;
  measuredAt: string;
};

/** Only the record's inputs: every limit, verdict and cut is computed on the phone by lib/measurements. */
export type BenchRecord = {
  id: number;
  version: number;
  feature: string;
  kind: FeatureKind;
  nominal: number;
  nominalText: string;
  unit: LengthUnit;
  spec: Spec;
  entryTitle: string;
  readings: BenchReading[];
};

export type BenchData = {
  member: { id: number; name: string };
  project: { id: number; slug: string; title: string; units: LengthUnit };
  session: { id: number; title: string; position: number; heldOn: string; minutesSpent: number };
  /** Records in the order they are worked: the entries' order, then each entry's records. */
  records: BenchRecord[];
  /** Where photos, clips and notes from the bench go: the session's last entry (null when it has none). */
  entry: { id: number; title: string } | null;
  /** Only the builder writes; the rest of the circle reads. */
  canWrite: boolean;
  /** When the server read this (the phone keeps whichever of this and its own copy is newer). */
  loadedAt: string;
};

export type BenchSessionLink = { id: number; title: string; heldOn: string; projectTitle: string };
