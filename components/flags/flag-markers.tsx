import type { ReactNode } from 'react';
import type { EntryView } from '@/lib/types/log';
import type { FlagView } from '@/lib/types/flags';
import type { FlagTargets } from './flag-form';
import { FlagMarker } from './flag-words';

/** A marker per flagged note (by note id) or measurement record (by record id), for the lists that show them. */
export function flagMarkers(flags: FlagView[], kind: 'note' | 'measurement'): Record<number, ReactNode> {
  const groups = new Map<number, FlagView[]>();
  for (const f of flags) {
    const id = f.target.kind === 'note' && kind === 'note' ? f.target.noteId : f.target.kind === 'measurement' && kind === 'measurement' ? f.target.recordId : null;
    if (id !== null) groups.set(id, [...(groups.get(id) ?? []), f]);
  }
  return Object.fromEntries([...groups].map(([id, group]) => [id, <FlagMarker key={id} flags={group} />]));
}

/** What a mentor can point a flag at on this entry: its notes (with their clip) and its measurement records. */
export function flagTargetsOf(entry: EntryView, records: { id: number; feature: string }[]): FlagTargets {
  const clipName = new Map(entry.media.map((m) => [m.id, m.caption || m.name]));
  return {
    notes: entry.notes.map((n) => ({ id: n.id, startMs: n.startMs, text: n.text, clipName: clipName.get(n.mediaId) ?? '' })),
    records: records.map((r) => ({ id: r.id, feature: r.feature })),
  };
}
