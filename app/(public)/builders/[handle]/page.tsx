import type { Metadata } from 'next';
import { cache } from 'react';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { getBuilderProfile } from '@/lib/server/profiles';
import { orNotFound } from '@/lib/http/page';
import { AppError } from '@/lib/errors';
import { BuilderView } from '../../_reading/builder-view';

// The signed-in reader's copy (their follow state), and any page past the first (?after=), rendered for each
// request; a signed-out reader's first page is the cached copy in app/(open)/open (next.config.mjs rewrites).
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

// The same two arguments for the metadata and the page: React cache() tells load(h) from load(h, undefined),
// and a second load would read the profile twice.
async function argsOf({ params, searchParams }: Props): Promise<[handle: string, after: string | undefined]> {
  const [{ handle }, { after }] = await Promise.all([params, searchParams]);
  return [handle, typeof after === 'string' ? after : undefined];
}

export async function generateMetadata(props: Props): Promise<Metadata> {
  const { profile } = await load(...(await argsOf(props)));
  return { title: `${profile.name} (@${profile.handle})` };
}

export default async function BuilderProfilePage(props: Props) {
  const [handle, page] = await argsOf(props);
  const { profile, user } = await load(handle, page);
  return <BuilderView profile={profile} user={user} after={page} />;
}
