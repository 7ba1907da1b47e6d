/**
 * Every calculator page, in the order of the index. To add one: a folder beside these with its
 * `definition.ts` (see `definition.ts` here) and its component, and one line below.
 */
import type { CalculatorInputs, CalculatorKind, CalculatorOutputs } from '@/lib/calculators';
import type { CalculatorDefinition, ResultKind } from './definition';
import type { Summary } from './summary';
import { tapDrillCalculator } from './tap-drill/definition';
import { clearanceHolesCalculator } from './clearance-holes/definition';
import { drillsCalculator } from './drills/definition';
import { boltCircleCalculator } from './bolt-circle/definition';
import { indexingCalculator } from './indexing/definition';
import { spurGearCalculator } from './spur-gear/definition';
import { speedsCalculator } from './speeds/definition';

// Each definition is checked against its own state type where it is written; side by side they are
// only handed their own state back (fromSearch → view, reopen → toQuery), so the list forgets the type.
export const CALCULATORS = [
  tapDrillCalculator,
  clearanceHolesCalculator,
  drillsCalculator,
  boltCircleCalculator,
  indexingCalculator,
  spurGearCalculator,
  speedsCalculator,
] as unknown as readonly CalculatorDefinition<never>[];

export function calculatorBySlug(slug: string): CalculatorDefinition<never> | null {
  return CALCULATORS.find((c) => c.slug === slug) ?? null;
}

/** The page that computes (and reopens) a kind of result. */
export function calculatorOfKind(kind: string): CalculatorDefinition<never> | null {
  return CALCULATORS.find((c) => Object.prototype.hasOwnProperty.call(c.kinds, kind)) ?? null;
}

function resultKind(kind: string): ResultKind<CalculatorKind, never> | null {
  const page = calculatorOfKind(kind);
  return page ? ((page.kinds as Record<string, ResultKind<CalculatorKind, never>>)[kind] ?? null) : null;
}

/** The name of a kind of result, by the page that computes it ("Tap drill"). */
export function resultName(kind: string): string | null {
  return resultKind(kind)?.name ?? null;
}

/**
 * A short human summary of a calculation, from its input (and its output where the input alone
 * does not name the thing, e.g. a thread written loosely). Always at most 120 characters.
 */
export function defaultLabel<K extends CalculatorKind>(kind: K, input: CalculatorInputs[K], output?: CalculatorOutputs[K]): string {
  const label = (resultKind(kind)?.label(input as never, output as never) ?? 'Calculation').replace(/\s+/g, ' ').trim();
  return label.length > 120 ? `${label.slice(0, 119)}…` : label;
}

/** The calculator page, with its query, that works a saved result out again from its stored input. */
export function calculatorHref(kind: CalculatorKind, input: unknown, output?: unknown): string {
  const page = calculatorOfKind(kind);
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
