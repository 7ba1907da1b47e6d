/**
 * Lets something outside a clip's workbench follow its playhead and move it: the comment form pins
 * to the moment on screen, and a pinned comment further down the page jumps the player there.
 */
export type PlayheadLink = {
  report: (clipId: number, nowMs: number, durationMs: number | null) => void;
  /** The workbench hands over its seek while it is mounted, and null when it goes. */
  bind: (clipId: number, seek: ((ms: number) => void) | null) => void;
};
