'use client';

import dynamic from 'next/dynamic';
import { useCallback, useRef, useState } from 'react';
import { canPlay } from 'react-player/patterns';

export type PlayerEvents = {
  /** The media element (or its stand-in for a hosted video), to seek, pause and play. */
  onMedia: (el: HTMLVideoElement | null) => void;
  onTime: (ms: number) => void;
  onDuration: (ms: number) => void;
  onLoaded: () => void;
  onPlayingChange: (playing: boolean) => void;
  onFailed: () => void;
};

export type PlayerProps = PlayerEvents & {
  src: string;
  title: string;
  /** The clip's notes as a WebVTT file: offered as its captions track and its chapters. */
  chaptersUrl?: string | null;
};

type Props = PlayerProps & {
  source: 'upload' | 'link';
  aspectRatio: string;
  /** Something asked to play or seek a hosted clip (a note, a moment link): its player loads now. */
  wanted: boolean;
};

/** A clip on a video site (or a stream) plays in that site's player, through react-player; a file plays in the browser's own element. */
export function needsHostedPlayer(source: Props['source'], src: string): boolean {
  if (source === 'upload') return false;
  return (
    canPlay.hls(src) || canPlay.dash(src) || canPlay.mux(src) || canPlay.youtube(src) || canPlay.vimeo(src) ||
    canPlay.wistia(src) || canPlay.twitch(src) || canPlay.tiktok(src) || canPlay.spotify(src)
  );
}

// The player library is large: loaded only for a hosted clip, and only once the reader wants it.
const HostedPlayer = dynamic(() => import('./hosted-player').then((m) => m.HostedPlayer), {
  ssr: false,
  loading: () => (
    <div className="flex h-full w-full items-center justify-center rounded-md bg-graphite/90 text-sm text-paper" role="status">
      Loading the player…
    </div>
  ),
});

export function ClipPlayer({ source, aspectRatio, wanted, ...player }: Props) {
  if (!needsHostedPlayer(source, player.src)) return <NativeClip aspectRatio={aspectRatio} {...player} />;
  return <HostedClip aspectRatio={aspectRatio} wanted={wanted} {...player} />;
}

const secondsToMs = (s: unknown) => (typeof s === 'number' && Number.isFinite(s) ? Math.round(s * 1000) : null);

/**
 * The browser's own video element, rendered on the server with the page: the clip's metadata loads
 * while the scripts arrive, so a note can seek it as soon as the page is interactive. What the element
 * did before React took it over (metadata loaded, played, failed) is read once when it does.
 */
function NativeClip({ src, title, aspectRatio, chaptersUrl, ...events }: PlayerProps & { aspectRatio: string }) {
  const handlers = useRef(events);
  handlers.current = events;
  const readTime = useCallback((el: HTMLVideoElement) => {
    const ms = secondsToMs(el.currentTime);
    if (ms !== null) handlers.current.onTime(ms);
  }, []);
  const readDuration = useCallback((el: HTMLVideoElement) => {
    const ms = secondsToMs(el.duration);
    if (ms !== null && ms > 0) handlers.current.onDuration(ms);
  }, []);
  const ref = useCallback(
    (el: HTMLVideoElement | null) => {
      const h = handlers.current;
      if (el) {
        if (el.error) h.onFailed();
        if (el.readyState >= 1) {
          readDuration(el);
          readTime(el);
        }
        if (!el.paused) h.onPlayingChange(true);
      }
      h.onMedia(el);
    },
    [readDuration, readTime],
  );
  return (
    <video
      ref={ref}
      src={src}
      controls
      playsInline
      preload="metadata"
      aria-label={`Clip: ${title}`}
      className="block h-auto w-full rounded-md bg-black"
      style={{ aspectRatio }}
      onLoadedMetadata={(e) => {
        readDuration(e.currentTarget);
        handlers.current.onLoaded();
      }}
      onDurationChange={(e) => readDuration(e.currentTarget)}
      onTimeUpdate={(e) => readTime(e.currentTarget)}
      onSeeked={(e) => readTime(e.currentTarget)}
      onPlay={() => handlers.current.onPlayingChange(true)}
      onPause={() => handlers.current.onPlayingChange(false)}
      onEnded={() => handlers.current.onPlayingChange(false)}
      onError={() => handlers.current.onFailed()}
    >
      {chaptersUrl ? (
        <>
          <track kind="captions" label="Notes on this clip" srcLang="en" src={chaptersUrl} />
          <track kind="chapters" label="Notes on this clip" srcLang="en" src={chaptersUrl} />
        </>
      ) : null}
    </video>
  );
}

function siteOf(src: string): string {
  try {
    return new URL(src).hostname.replace(/^www\./, '');
  } catch {
    return 'its site';
  }
}

/** A stand-in of the player's size until the reader plays the clip or a note asks for a moment of it. */
function HostedClip({ aspectRatio, wanted, ...player }: PlayerProps & { aspectRatio: string; wanted: boolean }) {
  const [pressed, setPressed] = useState(false);
  return (
    <div className="w-full" style={{ aspectRatio }}>
      {wanted || pressed ? (
        <HostedPlayer {...player} autoPlay={pressed} />
      ) : (
        <button
          type="button"
          onClick={() => setPressed(true)}
          className="flex h-full w-full flex-col items-center justify-center gap-2 rounded-md bg-graphite text-paper hover:bg-graphite/90"
        >
          <svg aria-hidden="true" viewBox="0 0 24 24" className="h-12 w-12 fill-current">
            <path d="M8 5v14l11-7z" />
          </svg>
          <span className="text-base font-semibold">Play the clip</span>
          <span className="text-sm">{player.title} · from {siteOf(player.src)}</span>
        </button>
      )}
    </div>
  );
}
