import { BoltCircleCalculator } from '@/components/calculators/bolt-circle/calculator';
import { calculatorRoute } from '../../../_pages/calculator';

const route = calculatorRoute('bolt-circle', BoltCircleCalculator);
export const metadata = route.metadata;
export default route.FromAddressPage;
