import { NothingHere } from '@/components/layout/nothing-here';

// A notFound() inside this group is shown within the group's own layout, which already has the header.
export default function GroupNotFound() {
  return <NothingHere />;
}
