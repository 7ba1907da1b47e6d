import { formatClock } from '@/lib/chapters';
import type { MediaView, NoteView } from '@/lib/types/log';
import { KIND_LABEL } from '@/components/clips/note-kind';

const hostOf = (url: string) => {
  try {
    return new URL(url).host;
  } catch {
    return url;
  }
};

/**
 * An entry's clips as they go on paper, shown only in print: each clip as its first frame (a video element
 * with no controls, at its opening moment) with its caption, and beneath it every moment of its notes,
 * time and words. The player and its list stay on screen only.
 */
export function ClipsOnPaper({ clips, notes }: { clips: MediaView[]; notes: NoteView[] }) {
  if (!clips.length) return null;
  return (
    <section aria-label="Clips and their moments" className="hidden space-y-4 print:block" data-testid="clips-on-paper">
      {clips.map((clip, i) => {
        const moments = notes.filter((n) => n.mediaId === clip.id).sort((a, b) => a.startMs - b.startMs || a.id - b.id);
        const title = clip.caption || clip.name || `Clip ${i + 1}`;
        return (
          <figure key={clip.id} className="break-inside-avoid space-y-2" data-testid="clip-on-paper">
            {clip.source === 'upload' ? (
              // The first frame: #t= asks the browser to show the clip's opening moment without playing it.
              <video src={`${clip.url}#t=0.1`} preload="metadata" muted playsInline tabIndex={-1} aria-label={`First frame of the clip: ${title}`} className="block h-auto max-h-[60vh] w-auto max-w-full" />
            ) : (
              <p className="text-sm">
                A clip kept on {hostOf(clip.url)}: {clip.url}
              </p>
            )}
            <figcaption className="text-sm font-semibold">{title}</figcaption>
            {moments.length ? (
              <ol aria-label={`Moments of ${title}`} className="space-y-1 text-sm">
                {moments.map((n) => (
                  <li key={n.id} className="flex gap-3" data-testid="moment-on-paper">
                    <span className="shrink-0 font-mono tabular-nums">
                      {formatClock(n.startMs)}
                      {n.endMs !== null ? `–${formatClock(n.endMs)}` : ''}
                    </span>
                    <span>
                      <span className="font-semibold">{KIND_LABEL[n.kind]}:</span> {n.text}
                    </span>
                  </li>
                ))}
              </ol>
            ) : (
              <p className="text-sm">No moments noted on this clip.</p>
            )}
          </figure>
        );
      })}
    </section>
  );
}
