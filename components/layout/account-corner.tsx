import { getCurrentUser } from '@/lib/auth/current-user';
import { canOnSite } from '@/lib/auth/policy';
import { MemberLinks, SignedInCorner, SignedOutCorner } from './corners';

/** The viewer's own links in the main navigation (a dynamic hole of the cached header). */
export async function ViewerLinks() {
  const user = await getCurrentUser();
  return user ? <MemberLinks manageUsers={canOnSite(user, 'manageUsers')} /> : null;
}

/** Signed in: name, settings, sign out; signed out: sign in and create an account (a dynamic hole of the cached header). */
export async function AccountCorner() {
  const user = await getCurrentUser();
  return user ? <SignedInCorner name={user.name} /> : <SignedOutCorner />;
}
