import { TapDrillCalculator } from '@/components/calculators/tap-drill/calculator';
import { calculatorRoute } from '../../_pages/calculator';

const route = calculatorRoute('tap-drill', TapDrillCalculator);
export const metadata = route.metadata;
export default route.Page;
