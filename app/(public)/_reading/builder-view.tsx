import Link from 'next/link';
import { format } from 'date-fns';
import type { CurrentUser } from '@/lib/auth/current-user';
import type { BuilderProfile } from '@/lib/types/following';
import { FollowButton } from '@/components/following/follow-button';
import { formatDate, plural } from '@/lib/format';

/** A builder's public page: who they are and one page of their published build logs. */
export function BuilderView({ profile, user, after }: { profile: BuilderProfile; user: CurrentUser | null; after?: string }) {
  return (
    <article className="space-y-8">
      <header className="flex flex-col gap-4 rounded-xl border border-rule bg-card p-5 sm:flex-row sm:items-center sm:justify-between">
        <div className="flex items-center gap-4">
          <span aria-hidden="true" className="flex h-14 w-14 shrink-0 items-center justify-center rounded-full border-2 border-dye bg-dye-soft text-xl font-bold text-dye">
            {profile.name.trim().charAt(0).toUpperCase() || '?'}
          </span>
          <div>
            <h1 className="text-2xl font-bold leading-tight">{profile.name}</h1>
            <p className="text-sm text-graphite-2">
              <span className="dim">@{profile.handle}</span> · member since <time dateTime={profile.memberSince}>{format(new Date(profile.memberSince), 'MMMM yyyy')}</time>
            </p>
          </div>
        </div>
        <FollowButton
          target={{ handle: profile.handle }}
          what={profile.name}
          initial={profile.follow}
          signedIn={!!user}
          shared={!user}
          canFollow={profile.canFollow}
          returnTo={`/builders/${profile.handle}`}
        />
      </header>

      <section aria-labelledby="projects-heading">
        <h2 id="projects-heading" className="mb-4 text-xl font-bold">
          Published build logs
        </h2>
        {profile.projects.length ? (
          <ul className="grid gap-4 sm:grid-cols-2">
            {profile.projects.map((p) => (
              <li key={p.id} className="flex flex-col gap-2 rounded-lg border border-rule bg-card p-4 shadow-sm" data-testid="profile-project">
                <h3 className="text-lg font-bold leading-snug">
                  <Link href={`/logs/${p.slug}`} className="text-graphite">
                    {p.title}
                  </Link>
                </h3>
                {p.summary ? <p className="line-clamp-3 text-sm text-graphite-2">{p.summary}</p> : null}
                <p className="mt-auto text-xs text-graphite-2">
                  {plural(p.publishedSessions, 'published session')}
                  {p.lastPublishedAt ? <> · latest {formatDate(p.lastPublishedAt)}</> : null} · sizes in {p.units === 'mm' ? 'mm' : 'inches'}
                </p>
              </li>
            ))}
          </ul>
        ) : after ? (
          <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">No older build logs.</p>
        ) : (
          <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">
            {profile.isSelf ? (
              <>
                You have no published build logs yet. Publish a project from its settings, then publish its sessions in the <Link href="/projects">log</Link>.
              </>
            ) : (
              `${profile.name} has not published a build log yet.`
            )}
          </p>
        )}
        {profile.nextCursor || after ? (
          <nav aria-label="More build logs" className="mt-4 flex flex-wrap gap-3">
            {after ? <Link href={`/builders/${profile.handle}`}>Newest build logs</Link> : null}
            {profile.nextCursor ? <Link href={`/builders/${profile.handle}?after=${profile.nextCursor}`}>Older build logs</Link> : null}
          </nav>
        ) : null}
      </section>
    </article>
  );
}
