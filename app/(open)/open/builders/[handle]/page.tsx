import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { publicBuilderProfile } from '@/lib/server/public-reads';
import { BuilderView } from '@/app/(public)/_reading/builder-view';
import { PLACEHOLDER, refusePlaceholder } from '@/app/(public)/_reading/open';

// A signed-out reader's first page of a builder's profile (next.config.mjs rewrites send them here; later pages stay per request).
export function generateStaticParams() {
  return [{ handle: PLACEHOLDER }];
}

type Props = { params: Promise<{ handle: string }> };

async function load(handle: string) {
  refusePlaceholder(handle);
  const profile = await publicBuilderProfile(decodeURIComponent(handle));
  if (!profile) notFound();
  return profile;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const profile = await load((await params).handle);
  return { title: `${profile.name} (@${profile.handle})` };
}

export default async function OpenBuilderPage({ params }: Props) {
  return <BuilderView profile={await load((await params).handle)} user={null} />;
}
