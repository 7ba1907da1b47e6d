// Plain shapes of the build log, as lib/server returns them and components render them.
import type { Operation, NoteKind } from '../validations/log';
import type { Visibility } from './visibility';

export type MediaView = {
  id: number;
  entryId: number;
  kind: 'photo' | 'clip';
  source: 'upload' | 'link';
  url: string;
  name: string;
  mime: string | null;
  sizeBytes: number | null;
  width: number | null;
  height: number | null;
  durationMs: number | null;
  caption: string;
  position: number;
};

export type NoteView = {
  id: number;
  mediaId: number;
  startMs: number;
  endMs: number | null;
  kind: NoteKind;
  text: string;
  author: { id: number; name: string } | null;
  version: number;
  createdAt: string;
};

export type EntrySummary = {
  id: number;
  sessionId: number;
  position: number;
  title: string;
  operation: Operation;
  photoCount: number;
  clipCount: number;
  noteCount: number;
  updatedAt: string;
};

export type EntryView = EntrySummary & {
  /** ProseMirror JSON. */
  body: Record<string, unknown>;
  version: number;
  media: MediaView[];
  notes: NoteView[];
};

export type SessionView = {
  id: number;
  projectId: number;
  position: number;
  title: string;
  heldOn: string;
  minutesSpent: number;
  planned: string;
  done: string;
  nextSteps: string;
  version: number;
  /** The session's own visibility; its project's caps it (see effectiveSessionVisibility). */
  visibility: Visibility;
  /** When it was first set to published, if ever. */
  publishedAt: string | null;
  entries: EntrySummary[];
  /** A photo to show for the session on the timeline, if it has any. */
  thumbnail: { url: string; width: number | null; height: number | null; name: string } | null;
  counts: { entries: number; photos: number; clips: number; notes: number };
};
