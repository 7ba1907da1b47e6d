import { NOTE_KIND_OPTIONS, type NoteKind } from '@/lib/validations/log-words';

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

export function NoteKindIcon({ kind, className = 'h-5 w-5' }: { kind: NoteKind; className?: string }) {
  const common = { viewBox: '0 0 20 20', 'aria-hidden': true, className: `shrink-0 ${className}`, fill: 'none', stroke: 'currentColor', strokeWidth: 1.8, strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const };
  switch (kind) {
    case 'note':
      // A scribed line on a plate.
      return (
        <svg {...common}>
          <rect x="3" y="3" width="14" height="14" rx="1.5" />
          <path d="M6 8h8M6 12h5" />
        </svg>
      );
    case 'measurement':
      // A dimension line between two extension lines.
      return (
        <svg {...common}>
          <path d="M3 4v12M17 4v12M5 10h10M5 10l2.5-2M5 10l2.5 2M15 10l-2.5-2M15 10l-2.5 2" />
        </svg>
      );
    case 'caution':
      return (
        <svg {...common}>
          <path d="M10 2.8 18 17H2z" />
          <path d="M10 8v4" />
          <circle cx="10" cy="14.6" r="0.4" fill="currentColor" />
        </svg>
      );
    case 'question':
      return (
        <svg {...common}>
          <circle cx="10" cy="10" r="7.5" />
          <path d="M7.8 7.8a2.3 2.3 0 1 1 3.2 2.1c-.7.3-1 .8-1 1.5v.4" />
          <circle cx="10" cy="14.4" r="0.4" fill="currentColor" />
        </svg>
      );
  }
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
