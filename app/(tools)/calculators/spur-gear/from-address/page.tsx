import { SpurGearCalculator } from '@/components/calculators/spur-gear/calculator';
import { calculatorRoute } from '../../../_pages/calculator';

const route = calculatorRoute('spur-gear', SpurGearCalculator);
export const metadata = route.metadata;
export default route.FromAddressPage;
