type Visibility = 'private' | 'unlisted' | 'published';

const tones = {
  private: 'border-graphite-2/40 text-graphite-2',
  unlisted: 'border-dye/50 text-dye',
  published: 'border-ok/60 text-ok',
} as const;
const words = { private: 'Private', unlisted: 'Unlisted', published: 'Published' } as const;

// Drawn, not emoji: emoji fonts are missing on some shop computers, and the words carry the meaning anyway.
export function VisibilityIcon({ visibility }: { visibility: Visibility }) {
  const common = { width: 14, height: 14, viewBox: '0 0 16 16', fill: 'none', stroke: 'currentColor', strokeWidth: 1.6, 'aria-hidden': true } as const;
  if (visibility === 'private')
    return (
      <svg {...common}>
        <rect x="3" y="7" width="10" height="7" rx="1.5" />
        <path d="M5.5 7V5a2.5 2.5 0 0 1 5 0v2" />
      </svg>
    );
  if (visibility === 'unlisted')
    return (
      <svg {...common}>
        <path d="M6.5 9.5l3-3" />
        <path d="M7 5l1-1a2.8 2.8 0 0 1 4 4l-1 1" />
        <path d="M9 11l-1 1a2.8 2.8 0 0 1-4-4l1-1" />
      </svg>
    );
  return (
    <svg {...common}>
      <circle cx="8" cy="8" r="5.5" />
      <path d="M2.5 8h11M8 2.5c1.8 1.6 2.6 3.4 2.6 5.5S9.8 11.9 8 13.5C6.2 11.9 5.4 10.1 5.4 8S6.2 4.1 8 2.5z" />
    </svg>
  );
}

export function VisibilityBadge({ visibility }: { visibility: Visibility }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs font-semibold ${tones[visibility]}`}>
      <VisibilityIcon visibility={visibility} />
      {words[visibility]}
    </span>
  );
}
