import { IndexingCalculator } from '@/components/calculators/indexing-calculator';
import { calculatorRoute } from '../../_pages/calculator';

const route = calculatorRoute('indexing', IndexingCalculator);
export const metadata = route.metadata;
export default route.Page;
