// The clip moments a record can open at: measurement notes first, then the rest, in time order.
import { formatClock } from '@/lib/chapters';
import type { MediaView, NoteView } from '@/lib/types/log';
import type { MomentOption } from './record-form';

export function momentOptions(notes: NoteView[], media: MediaView[]): MomentOption[] {
  const clipName = new Map(media.filter((m) => m.kind === 'clip').map((m) => [m.id, m.caption || m.name]));
  const manyClips = clipName.size > 1;
  const text = (n: NoteView) => (n.text.length > 70 ? `${n.text.slice(0, 69)}…` : n.text);
  return [...notes]
    .sort((a, b) => Number(b.kind === 'measurement') - Number(a.kind === 'measurement') || a.mediaId - b.mediaId || a.startMs - b.startMs)
    .map((n) => ({ id: n.id, label: `${manyClips ? `${clipName.get(n.mediaId) ?? 'Clip'} ` : ''}${formatClock(n.startMs)} — ${text(n)}` }));
}
