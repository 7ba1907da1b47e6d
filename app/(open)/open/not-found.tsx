import { NothingHere } from '@/components/layout/nothing-here';

// A missing or private page of the signed-out copies: inside their own header, so the cached 404 has no hole either.
export default function OpenNotFound() {
  return <NothingHere />;
}
