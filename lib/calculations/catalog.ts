/**
 * The names shown for each kind of result and the short label a saved result gets when the
 * builder gives none, for the server and the seeders. Each calculator says its own in its
 * definition (`components/calculators/<page>/definition.ts`); this reads them from the registry.
 */
import { CALCULATOR_KINDS, type CalculatorKind } from '../calculators/registry';
import { defaultLabel, resultName } from '../../components/calculators/registry';

export { defaultLabel };

export const CALCULATOR_NAMES: Readonly<Record<CalculatorKind, string>> = Object.fromEntries(
  CALCULATOR_KINDS.map((kind) => [kind, resultName(kind) ?? kind]),
) as Record<CalculatorKind, string>;
