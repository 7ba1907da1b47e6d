import Link from 'next/link';
import type { MediaView } from '@/lib/types/log';

/** When an entry has several clips: links that open each one (the page keeps one player). */
export function ClipPicker({ clips, currentId, basePath }: { clips: MediaView[]; currentId: number; basePath: string }) {
  return (
    <nav aria-label="Clips of this entry" className="flex flex-wrap gap-2">
      {clips.map((c, i) => (
        <Link
          key={c.id}
          href={`${basePath}?clip=${c.id}`}
          aria-current={c.id === currentId ? 'true' : undefined}
          className="inline-flex min-h-10 items-center rounded-full border border-rule px-3 text-sm no-underline aria-[current=true]:border-dye aria-[current=true]:bg-dye-soft"
        >
          ▶ {c.caption || c.name || `Clip ${i + 1}`}
        </Link>
      ))}
    </nav>
  );
}
