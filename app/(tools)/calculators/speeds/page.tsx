import { SpeedsCalculator } from '@/components/calculators/speeds/calculator';
import { calculatorRoute } from '../../_pages/calculator';

const route = calculatorRoute('speeds', SpeedsCalculator);
export const metadata = route.metadata;
export default route.Page;
