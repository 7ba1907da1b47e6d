// The clip moments a record can open at, in time order (clip by clip, in the entry's clip order);
// measurement notes say so in their label rather than jumping the queue.
import { formatClock } from '@/lib/chapters';
import type { MediaView, NoteView } from '@/lib/types/log';
import type { MomentOption } from './record-form';

export function momentOptions(notes: NoteView[], media: MediaView[]): MomentOption[] {
  const clips = media.filter((m) => m.kind === 'clip').sort((a, b) => a.position - b.position || a.id - b.id);
  const clipName = new Map(clips.map((m) => [m.id, m.caption || m.name]));
  const clipOrder = new Map(clips.map((m, i) => [m.id, i]));
  const manyClips = clipName.size > 1;
  const text = (n: NoteView) => (n.text.length > 70 ? `${n.text.slice(0, 69)}…` : n.text);
  return [...notes]
    .sort((a, b) => (clipOrder.get(a.mediaId) ?? 0) - (clipOrder.get(b.mediaId) ?? 0) || a.startMs - b.startMs || a.id - b.id)
    .map((n) => ({ id: n.id, label: `${manyClips ? `${clipName.get(n.mediaId) ?? 'Clip'} ` : ''}${formatClock(n.startMs)} — ${n.kind === 'measurement' ? 'Measurement: ' : ''}${text(n)}` }));
}
