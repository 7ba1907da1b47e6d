'use client';

// Loaded on demand only (next/dynamic, ssr: false), for a clip on a video site: react-player and its
// streaming libraries are large, and a file plays in the browser's own element (clip-player.tsx).
import ReactPlayer from 'react-player';
import { useCallback, useRef } from 'react';
import type { PlayerProps } from './clip-player';

const secondsToMs = (s: unknown) => (typeof s === 'number' && Number.isFinite(s) ? Math.round(s * 1000) : null);

export function HostedPlayer({ src, title, chaptersUrl, onMedia, onTime, onDuration, onLoaded, onPlayingChange, onFailed, autoPlay }: PlayerProps & { autoPlay: boolean }) {
  const media = useRef<HTMLVideoElement | null>(null);
  // The reader pressed play on the stand-in: start once, as soon as the site's player can.
  const startOnce = useRef(autoPlay);
  const ref = useCallback(
    (el: HTMLVideoElement | null) => {
      media.current = el;
      // react-player passes no ARIA props through to the media element: name it here.
      el?.setAttribute?.('aria-label', `Clip: ${title}`);
      onMedia(el);
    },
    [onMedia, title],
  );
  const readTime = (e: { currentTarget: EventTarget }) => {
    const ms = secondsToMs((e.currentTarget as HTMLVideoElement).currentTime);
    if (ms !== null) onTime(ms);
  };
  const readDuration = (e: { currentTarget: EventTarget }) => {
    const ms = secondsToMs((e.currentTarget as HTMLVideoElement).duration);
    if (ms !== null && ms > 0) onDuration(ms);
  };
  return (
    <ReactPlayer
      ref={ref}
      src={src}
      controls
      playsInline
      preload="metadata"
      width="100%"
      height="100%"
      style={{ background: '#000', display: 'block' }}
      className="rounded-md"
      onLoadedMetadata={(e) => {
        readDuration(e);
        onLoaded();
        if (startOnce.current) {
          startOnce.current = false;
          void media.current?.play()?.catch(() => undefined);
        }
      }}
      onDurationChange={readDuration}
      onTimeUpdate={readTime}
      onSeeked={readTime}
      onPlay={() => onPlayingChange(true)}
      onPause={() => onPlayingChange(false)}
      onEnded={() => onPlayingChange(false)}
      onError={() => onFailed()}
    >
      {chaptersUrl ? (
        <>
          <track kind="captions" label="Notes on this clip" srcLang="en" src={chaptersUrl} />
          <track kind="chapters" label="Notes on this clip" srcLang="en" src={chaptersUrl} />
        </>
      ) : null}
    </ReactPlayer>
  );
}
