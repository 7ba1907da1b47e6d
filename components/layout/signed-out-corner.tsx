import Link from 'next/link';
import { navLink } from './nav-link';

/** What a signed-out reader sees in the corner; static, so the signed-out copies of the log have no hole. */
export function SignedOutCorner() {
  return (
    <>
      <Link href="/sign-in" className={navLink}>
        Sign in
      </Link>
      <Link href="/sign-up" className={`${navLink} bg-dye !text-on-accent hover:bg-dye-2`}>
        Create account
      </Link>
    </>
  );
}
