import { SiteFrame } from '@/components/layout/site-frame';
import { NothingHere } from '@/components/layout/nothing-here';

// Shown in place of everything under the root layout, so it brings the header along.
export default function NotFound() {
  return (
    <SiteFrame>
      <NothingHere />
    </SiteFrame>
  );
}
