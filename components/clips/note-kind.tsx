import { NOTE_KIND_OPTIONS, type NoteKind } from '@/lib/validations/log-words';
import { MaskIcon } from '@/components/ui/mask-icon';

export const KIND_LABEL: Record<NoteKind, string> = Object.fromEntries(NOTE_KIND_OPTIONS.map((o) => [o.value, o.label])) as Record<NoteKind, string>;

/** Colour only repeats what the word and the icon already say. */
export const KIND_TONE: Record<NoteKind, string> = {
  note: 'text-graphite-2',
  measurement: 'text-ok',
  caution: 'text-scribe',
  question: 'text-dye',
};

export const KIND_HINT: Record<NoteKind, string> = {
  note: 'What is happening here',
  measurement: 'A reading off a gauge',
  caution: 'Something that can hurt or spoil the part',
  question: 'Something to find out',
};

/** The kind's icon (a scribed line on a plate, a dimension line, a warning triangle, a question), drawn by the stylesheet. */
export function NoteKindIcon({ kind, className = 'h-5 w-5' }: { kind: NoteKind; className?: string }) {
  return <MaskIcon name={`note-${kind}`} className={className} />;
}

/** The kind in words with its icon. */
export function NoteKindLabel({ kind, className = '' }: { kind: NoteKind; className?: string }) {
  return (
    <span className={`inline-flex items-center gap-1 text-xs font-semibold uppercase tracking-wide ${KIND_TONE[kind]} ${className}`}>
      <NoteKindIcon kind={kind} className="h-4 w-4" />
      {KIND_LABEL[kind]}
    </span>
  );
}
