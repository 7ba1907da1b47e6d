// Plain shapes of measurement records as lib/server returns them and components render them.
// Every judged value here is computed from the stored inputs by lib/measurements on each read.
import type {
  Approach, FeatureKind, LengthUnit, Limits, PairAnalysis, ReadingJudgement, ResolutionCheck, Spec, TemperatureCheck, Verdict,
} from '../measurements';

export type ReadingView = {
  id: number;
  position: number;
  pass: number | null;
  value: number;
  /** As a machinist writes it, with as many decimals as the instrument reads: "130.40". */
  valueText: string;
  unit: LengthUnit;
  instrument: string;
  resolution: number;
  measuredBy: string;
  measuredAt: string;
  temperatureC: number | null;
  note: string;
  version: number;
  judgement: ReadingJudgement;
  resolutionCheck: ResolutionCheck;
  temperature: TemperatureCheck | null;
};

/** The clip moment a record was measured at, and the link that opens the entry there. */
export type MeasurementMoment = { noteId: number; mediaId: number; startMs: number; text: string; href: string };

export type MeasurementProject = { id: number; slug: string; title: string; units: LengthUnit };

export type MeasurementView = {
  id: number;
  project: MeasurementProject;
  entry: { id: number; title: string; sessionId: number; sessionPosition: number; sessionTitle: string };
  feature: string;
  kind: FeatureKind;
  nominal: number;
  /** "130", "1.575". */
  nominalText: string;
  unit: LengthUnit;
  spec: Spec;
  timeNoteId: number | null;
  limits: Limits;
  readings: ReadingView[];
  verdict: Verdict;
  approach: Approach | null;
  byPasses: boolean;
  moment: MeasurementMoment | null;
  /** Ids of the fits this record is part of. */
  pairIds: number[];
  version: number;
  createdAt: string;
  updatedAt: string;
};

export type PairSideView = Pick<MeasurementView, 'id' | 'feature' | 'kind' | 'nominal' | 'nominalText' | 'unit' | 'limits' | 'verdict'> & {
  entryId: number;
  /** The latest reading as typed, with its unit; null without readings. */
  latest: { valueText: string; unit: LengthUnit; sizeUm: number } | null;
};

export type PairView = { id: number; hole: PairSideView; shaft: PairSideView; analysis: PairAnalysis; createdAt: string };

/** A record that could be paired with another: opposite kind, same nominal size, same project. */
export type PairCandidate = { id: number; feature: string; kind: FeatureKind; nominalText: string; unit: LengthUnit; specLabel: string; entryTitle: string };

export type MeasurementPageData = {
  record: MeasurementView;
  pairs: PairView[];
  canEdit: boolean;
  /** Only for the builder. */
  candidates: PairCandidate[];
};

export type ProjectMeasurements = { project: MeasurementProject; records: MeasurementView[]; pairs: PairView[]; canEdit: boolean };
