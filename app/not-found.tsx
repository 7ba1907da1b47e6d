import { SiteFrame } from '@/components/layout/site-frame';
import { NothingHere } from '@/components/layout/nothing-here';

// An address that matches no page: shown inside the root layout alone, so it brings the header along.
// (A notFound() inside a route group is caught by that group's own not-found.tsx, within its layout.)
export default function NotFound() {
  return (
    <SiteFrame>
      <NothingHere />
    </SiteFrame>
  );
}
