import type { FitKind } from '@/lib/fits';
import { KIND_WORDS } from './format';

// The icon repeats the drawing in miniature: hole zone (hatched, left) against shaft zone (solid, right).
const BARS: Record<FitKind, { hole: [number, number]; shaft: [number, number] }> = {
  clearance: { hole: [2, 10], shaft: [14, 22] },
  transition: { hole: [4, 15], shaft: [10, 21] },
  interference: { hole: [14, 22], shaft: [2, 10] },
};

export const KIND_TONE: Record<FitKind, string> = {
  clearance: 'text-dye',
  transition: 'text-graphite',
  interference: 'text-scribe',
};

export function FitKindIcon({ kind, className = 'h-6 w-6' }: { kind: FitKind; className?: string }) {
  const b = BARS[kind];
  return (
    <svg viewBox="0 0 24 24" aria-hidden="true" className={`shrink-0 ${className}`} fill="none" stroke="currentColor">
      <line x1="1" y1="12" x2="23" y2="12" strokeWidth="1.5" strokeDasharray="2 2" />
      <rect x="3" y={b.hole[0]} width="8" height={b.hole[1] - b.hole[0]} strokeWidth="2" />
      <line x1="3" y1={b.hole[1]} x2="11" y2={b.hole[0]} strokeWidth="1.5" />
      <rect x="13" y={b.shaft[0]} width="8" height={b.shaft[1] - b.shaft[0]} strokeWidth="2" fill="currentColor" />
    </svg>
  );
}

/** "Clearance fit" with its icon: the kind is always said in words. */
export function FitKindLabel({ kind }: { kind: FitKind }) {
  return (
    <span className={`inline-flex items-center gap-1.5 font-semibold ${KIND_TONE[kind]}`}>
      <FitKindIcon kind={kind} className="h-5 w-5" />
      {KIND_WORDS[kind].title}
    </span>
  );
}
