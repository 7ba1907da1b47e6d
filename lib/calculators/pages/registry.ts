/**
 * Every calculator page, in the order of the index, and what the rest of the app asks of them: the
 * page for a slug or a kind of result, a saved result's name, default label, reopen link and card.
 * To add a calculator: its page file beside these (see `definition.ts`), its component in
 * components/calculators/<slug>/, one line here, its two routes in app/(tools)/calculators/<slug>/ and its
 * query keys in lib/http/tool-addresses.mjs.
 */
import { CALCULATOR_KINDS, type CalculatorInputs, type CalculatorKind, type CalculatorOutputs } from '../registry';
import { resultLabel, type CalculatorPage, type ResultKind } from './definition';
import type { Summary } from './summary';
import { tapDrillCalculator } from './tap-drill';
import { clearanceHolesCalculator } from './clearance-holes';
import { drillsCalculator } from './drills';
import { boltCircleCalculator } from './bolt-circle';
import { indexingCalculator } from './indexing';
import { spurGearCalculator } from './spur-gear';
import { speedsCalculator } from './speeds';

// Each page is checked against its own state type where it is written; side by side they are only
// handed their own state back (fromSearch → view, reopen → toQuery), so the list forgets the type.
export const CALCULATOR_PAGES = [
  tapDrillCalculator,
  clearanceHolesCalculator,
  drillsCalculator,
  boltCircleCalculator,
  indexingCalculator,
  spurGearCalculator,
  speedsCalculator,
] as unknown as readonly CalculatorPage<never>[];

/** The page at /calculators/<slug>, or null. */
export function calculatorPageBySlug(slug: string): CalculatorPage<never> | null {
  return CALCULATOR_PAGES.find((c) => c.slug === slug) ?? null;
}

/** The page that computes (and reopens) a kind of result. */
function calculatorPageOfKind(kind: string): CalculatorPage<never> | null {
  return CALCULATOR_PAGES.find((c) => Object.prototype.hasOwnProperty.call(c.kinds, kind)) ?? null;
}

function resultKind(kind: string): ResultKind<CalculatorKind, never> | null {
  const page = calculatorPageOfKind(kind);
  return page ? ((page.kinds as Record<string, ResultKind<CalculatorKind, never>>)[kind] ?? null) : null;
}

/** The name shown for each kind of result ("Tap drill"), by the page that computes it. */
export const CALCULATOR_NAMES: Readonly<Record<CalculatorKind, string>> = Object.fromEntries(
  CALCULATOR_KINDS.map((kind) => [kind, resultKind(kind)?.name ?? kind]),
) as Record<CalculatorKind, string>;

/**
 * A short human summary of a calculation, from its input (and its output where the input alone
 * does not name the thing, e.g. a thread written loosely). Always at most 120 characters.
 */
export function defaultLabel<K extends CalculatorKind>(kind: K, input: CalculatorInputs[K], output?: CalculatorOutputs[K]): string {
  const page = calculatorPageOfKind(kind);
  return page ? resultLabel(page, kind, input, output) : 'Calculation';
}

/** The calculator page, with its query, that works a saved result out again from its stored input. */
export function calculatorHref(kind: CalculatorKind, input: unknown, output?: unknown): string {
  const page = calculatorPageOfKind(kind);
  const result = resultKind(kind);
  if (!page || !result) throw new Error(`No calculator page computes ${kind}.`);
  const state = result.reopen((input ?? {}) as Record<string, unknown>, (output ?? {}) as Record<string, unknown>);
  return `/calculators/${page.slug}${page.toQuery(state)}`;
}

/** What a saved result's card shows; null for a kind or a stored shape this version cannot read. */
export function savedSummary(kind: string, input: Record<string, unknown>, output: unknown): Summary | null {
  if (!output || typeof output !== 'object') return null;
  const result = resultKind(kind);
  if (!result) return null;
  try {
    return result.summary(input ?? {}, output as never);
  } catch {
    // A stored shape this version cannot read: the card still shows its label and the reopen link.
    return null;
  }
}
