import { DrillsCalculator } from '@/components/calculators/drills/calculator';
import { calculatorRoute } from '../../_pages/calculator';

const route = calculatorRoute('drills', DrillsCalculator);
export const metadata = route.metadata;
export default route.Page;
