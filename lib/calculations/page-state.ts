/**
 * From a saved result back to its calculator page. Each page keeps its own boxes in the URL (its
 * definition's `fromSearch` / `toQuery`); this is the way in for the server's saved-result views.
 */
export { calculatorHref } from '../../components/calculators/registry';
export type { CalcRequest } from './url-state';
