import type { Metadata } from 'next';
import { cache } from 'react';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { getBuilderProfile } from '@/lib/server/profiles';
import { orNotFound } from '@/lib/http/page';
import { AppError } from '@/lib/errors';
import { BuilderView } from '../../_reading/builder-view';

// The signed-in reader's copy (their follow state), and any page past the first (?after=), rendered for each
// request; a signed-out reader's first page is the cached copy in app/(open)/open (proxy.ts).
export const instant = false;

type Props = { params: Promise<{ handle: string }>; searchParams: Promise<{ after?: string }> };

const load = cache(async (handle: string, after?: string) => {
  const user = await getCurrentUser();
  try {
    return { user, profile: await orNotFound(getBuilderProfile(user, decodeURIComponent(handle), after)) };
  } catch (err) {
    // A page cursor that cannot be read: the 404 page, as for any address that names nothing.
    if (err instanceof AppError && err.code === 'validation') notFound();
    throw err;
  }
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { profile } = await load((await params).handle);
  return { title: `${profile.name} (@${profile.handle})` };
}

export default async function BuilderProfilePage({ params, searchParams }: Props) {
  const [{ handle }, { after }] = await Promise.all([params, searchParams]);
  const page = typeof after === 'string' ? after : undefined;
  const { profile, user } = await load(handle, page);
  return <BuilderView profile={profile} user={user} after={page} />;
}
