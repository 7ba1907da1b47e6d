/**
 * Each calculator page (lib/calculators/pages/registry.ts) with its component, loaded only where it
 * is shown. A new calculator adds its component's line here.
 */
import type { ComponentType } from 'react';
import { CALCULATOR_PAGES } from '@/lib/calculators/pages/registry';
import type { CalculatorPage } from '@/lib/calculators/pages/definition';

export interface CalculatorProps<S> {
  initial: S;
  signedIn: boolean;
}

type View = () => Promise<ComponentType<CalculatorProps<never>>>;

const VIEWS: Record<string, View> = {
  'tap-drill': () => import('./tap-drill/calculator').then((m) => m.TapDrillCalculator),
  'clearance-holes': () => import('./clearance-holes/calculator').then((m) => m.ClearanceCalculator),
  drills: () => import('./drills/calculator').then((m) => m.DrillsCalculator),
  'bolt-circle': () => import('./bolt-circle/calculator').then((m) => m.BoltCircleCalculator),
  indexing: () => import('./indexing-calculator').then((m) => m.IndexingCalculator),
  'spur-gear': () => import('./spur-gear/calculator').then((m) => m.SpurGearCalculator),
  speeds: () => import('./speeds/calculator').then((m) => m.SpeedsCalculator),
};

export type CalculatorDefinition = CalculatorPage<never> & { view: View };

export const CALCULATORS: readonly CalculatorDefinition[] = CALCULATOR_PAGES.map((page) => {
  const view = VIEWS[page.slug];
  if (!view) throw new Error(`The calculator page ${page.slug} has no component in components/calculators/registry.ts.`);
  return { ...page, view };
});

export function calculatorBySlug(slug: string): CalculatorDefinition | null {
  return CALCULATORS.find((c) => c.slug === slug) ?? null;
}
