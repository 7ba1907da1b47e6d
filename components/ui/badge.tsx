import { VISIBILITY_LABEL } from '@/lib/validations/visibility';

import type { Visibility } from '@/lib/types/visibility';

const tones = {
  private: 'border-graphite-2/40 text-graphite-2',
  unlisted: 'border-dye/50 text-dye',
  published: 'border-ok/60 text-ok',
} as const;


// Drawn, not emoji: emoji fonts are missing on some shop computers, and the words carry the meaning anyway.
export function VisibilityIcon({ visibility }: { visibility: Visibility }) {
  const common = { width: 14, height: 14, viewBox: '0 0 16 16', fill: 'none', stroke: 'currentColor', strokeWidth: 1.6, 'aria-hidden': true } as const;
  // On the bench: a bench vice (jaws, screw and handle).
  if (visibility === 'private')
    return (
      <svg {...common}>
        <path d="M2.5 13.5h11" />
        <path d="M4 13.5V8h3v5.5M9 13.5V8h3v5.5" />
        <path d="M3.5 8V5.5h4V8M8.5 8V5.5h4V8" />
        <path d="M12.5 10.5H15M15 9v3" />
      </svg>
    );
  // By link: a parcel tag on its string.
  if (visibility === 'unlisted')
    return (
      <svg {...common}>
        <path d="M7 3.5h5.5V14H7L4.5 11.5V6z" />
        <circle cx="7" cy="8.75" r="0.9" />
        <path d="M6.1 8.75C4 8.5 2 6.5 2.5 2.5" />
      </svg>
    );
  // In the open log: an open logbook with ruled pages.
  return (
    <svg {...common}>
      <path d="M8 4.5C6.5 3.3 4.2 3 1.5 3.2v9.3c2.7-.2 5 .1 6.5 1.3 1.5-1.2 3.8-1.5 6.5-1.3V3.2C11.8 3 9.5 3.3 8 4.5z" />
      <path d="M8 4.5v9.3" />
      <path d="M3.5 6.2h2.8M3.5 8.4h2.8M9.7 6.2h2.8M9.7 8.4h2.8" />
    </svg>
  );
}

export function VisibilityBadge({ visibility }: { visibility: Visibility }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs font-semibold ${tones[visibility]}`}>
      <VisibilityIcon visibility={visibility} />
      {VISIBILITY_LABEL[visibility]}
    </span>
  );
}
