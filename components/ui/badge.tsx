const tones = {
  private: 'border-graphite-2/40 text-graphite-2',
  unlisted: 'border-dye/50 text-dye',
  published: 'border-ok/60 text-ok',
} as const;
const icons = { private: '🔒', unlisted: '🔗', published: '●' } as const;
const words = { private: 'Private', unlisted: 'Unlisted', published: 'Published' } as const;

export function VisibilityBadge({ visibility }: { visibility: keyof typeof tones }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs font-semibold ${tones[visibility]}`}>
      <span aria-hidden="true">{icons[visibility]}</span>
      {words[visibility]}
    </span>
  );
}
