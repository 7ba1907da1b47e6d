'use client';

// Only ever loaded through next/dynamic (ssr: false): react-player and its streaming libraries are large.
import ReactPlayer from 'react-player';
import { useCallback } from 'react';

export type PlayerEvents = {
  /** The media element (or its stand-in for a hosted video), to seek, pause and play. */
  onMedia: (el: HTMLVideoElement | null) => void;
  onTime: (ms: number) => void;
  onDuration: (ms: number) => void;
  onLoaded: () => void;
  onPlayingChange: (playing: boolean) => void;
  onFailed: () => void;
};

type Props = PlayerEvents & {
  src: string;
  title: string;
  aspectRatio: string;
  /** The clip's notes as a WebVTT file: offered as its captions track and its chapters. */
  chaptersUrl?: string | null;
};

const secondsToMs = (s: unknown) => (typeof s === 'number' && Number.isFinite(s) ? Math.round(s * 1000) : null);

export function ClipPlayer({ src, title, aspectRatio, chaptersUrl, onMedia, onTime, onDuration, onLoaded, onPlayingChange, onFailed }: Props) {
  const ref = useCallback(
    (el: HTMLVideoElement | null) => {
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
      height="auto"
      style={{ aspectRatio, background: '#000', display: 'block' }}
      className="rounded-md"
      onLoadedMetadata={(e) => {
        readDuration(e);
        onLoaded();
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
