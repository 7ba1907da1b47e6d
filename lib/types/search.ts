// What a search answers, shared by the server, the JSON route and the /search page.
import type { ExcerptPart } from '../search/excerpt';
import type { SearchKind } from '../validations/search';

export type { ExcerptPart };

/** A measurement record's outcome, from the measurement engine (lib/measurements). */
export type SearchRecordOutcome = {
  feature: string;
  kind: 'inside' | 'outside';
  /** "130 mm k6", "1.5 in RC4", "25 mm +0.05/−0". */
  spec: string;
  /** Limits in the record's unit, e.g. "130.003 … 130.028 mm". */
  limitsText: string;
  state: 'inside' | 'over' | 'under' | 'none';
  /** "Inside", "Outside by 0.002 mm", "No readings yet". */
  verdict: string;
  /** The last reading's deviation from nominal, in µm, and in words with its unit. */
  deviationUm: number | null;
  deviationText: string | null;
  readings: number;
};

export type SearchHit = {
  kind: SearchKind;
  id: number;
  title: string;
  /** Where it sits: project, session, entry. */
  context: string;
  href: string;
  projectTitle: string;
  operation: string | null;
  excerpt: ExcerptPart[];
  /** The same excerpt as escaped HTML with <mark>, for JSON clients. */
  excerptHtml: string;
  score: number;
  /** The viewer's own or mentored work that readers cannot find. */
  privateToYou: boolean;
  record?: SearchRecordOutcome;
};

export type SearchResult = {
  mode: 'words' | 'fit';
  hits: SearchHit[];
  page: number;
  hasMore: boolean;
  /** The words searched for, and those left out (too short or too common for the index). */
  words: string[];
  ignored: string[];
  /** What the query was read as, in words: "k6 · outside · 130 mm". */
  filters: string[];
  /** Said instead of results when nothing could be searched. */
  notice: string | null;
};
