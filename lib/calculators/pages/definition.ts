/**
 * What one calculator page is, in one object: its words, the boxes it keeps in the URL, the
 * calculations it asks for, and for each kind of result it can save, the name, the default label,
 * the way back to the page and what a saved card shows. Pure (no React): the server's saved-result
 * views, the seeders and the tests read it too. The page's component is paired with it in
 * components/calculators/registry.ts.
 */
import type { CalculatorInputs, CalculatorKind, CalculatorOutputs } from '../registry';
import type { CautionTopic } from '../cautions';
import type { CalcRequest, SearchLike } from './url-state';
import type { Summary } from './summary';

type Loose = Record<string, unknown>;

export interface ResultKind<K extends CalculatorKind, S> {
  /** Shown on a saved card: "Tap drill". */
  name: string;
  /** The default label of a saved result (cut to 120 characters by the caller). */
  label(input: CalculatorInputs[K], output?: CalculatorOutputs[K]): string;
  /** The page's boxes that work the stored input out again (the output only helps to name it). */
  reopen(input: Loose, output: Loose): S;
  /** What a saved card shows, from the stored output: the record of what was worked out then. */
  summary(input: Loose, output: CalculatorOutputs[K]): Summary;
}

export type ResultKinds<S> = { [K in CalculatorKind]?: ResultKind<K, S> };

export interface CalculatorPage<S = unknown> {
  /** The page's address: /calculators/<slug>. Never change it: links and saved results point there. */
  slug: string;
  title: string;
  /** One line: what it is for, in shop words (the index card and the page's description). */
  blurb: string;
  /** A second sentence on the page, under the blurb. */
  note: string;
  /** A glyph for the index card (decoration only). */
  icon: string;
  cautions: readonly CautionTopic[];
  /** Each kind of result this page computes and can save. */
  kinds: ResultKinds<S>;
  /** The boxes, from the URL (a half-typed value survives a reload). */
  fromSearch(p: SearchLike): S;
  /** The boxes as a query: only what differs from the defaults. */
  toQuery(s: S): string;
  /** Everything the page would work out from these boxes. Throws CalculatorError for a box it cannot read. */
  requests(s: S): CalcRequest[];
  /** A calculator's field → the box its refusal is said beside. */
  fields: Record<string, keyof S & string>;
}

/** Checks a definition against its own state type; the registry holds them side by side. */
export function defineCalculatorPage<S>(definition: CalculatorPage<S>): CalculatorPage<S> {
  return definition;
}

/** The label a result of this page is saved under when none is typed: its `label`, whitespace folded, at most 120 characters. */
export function resultLabel<S, K extends CalculatorKind>(page: CalculatorPage<S>, kind: K, input: CalculatorInputs[K], output?: CalculatorOutputs[K]): string {
  const label = (page.kinds[kind]?.label(input, output) ?? 'Calculation').replace(/\s+/g, ' ').trim();
  return label.length > 120 ? `${label.slice(0, 119)}…` : label;
}
