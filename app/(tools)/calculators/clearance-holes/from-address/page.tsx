import { ClearanceCalculator } from '@/components/calculators/clearance-holes/calculator';
import { calculatorRoute } from '../../../_pages/calculator';

const route = calculatorRoute('clearance-holes', ClearanceCalculator);
export const metadata = route.metadata;
export default route.FromAddressPage;
