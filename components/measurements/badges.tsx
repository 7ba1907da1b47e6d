import { amountText } from '@/lib/measurements/units';
import type { FeatureKind, LengthUnit, ReadingState } from '@/lib/measurements';
import { MaskIcon } from '@/components/ui/mask-icon';

type VerdictState = ReadingState | 'none';

const VERDICT_STYLE: Record<VerdictState, { box: string; icon: string }> = {
  inside: { box: 'border-ok/60 bg-ok-soft text-ok', icon: '✓' },
  over: { box: 'border-bad/60 bg-bad-soft text-bad', icon: '✕' },
  under: { box: 'border-bad/60 bg-bad-soft text-bad', icon: '✕' },
  none: { box: 'border-rule bg-paper-2 text-graphite-2', icon: '–' },
};

/** "✓ Inside" / "✕ Outside by 0.002 mm, over": the verdict in words, with an icon, never colour alone. */
export function VerdictBadge({ state, outsideByUm, unit, size = 'sm' }: { state: VerdictState; outsideByUm: number; unit: LengthUnit; size?: 'sm' | 'lg' }) {
  const s = VERDICT_STYLE[state];
  const words =
    state === 'inside' ? 'Inside' : state === 'none' ? 'No readings yet' : `Outside by ${amountText(outsideByUm, unit)} ${unit}`;
  const side = state === 'over' ? 'over' : state === 'under' ? 'under' : null;
  return (
    <span
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border font-semibold ${s.box} ${size === 'lg' ? 'px-3 py-1 text-base' : 'px-2 py-0.5 text-xs'}`}
      data-verdict={state}
    >
      <span aria-hidden="true">{s.icon}</span>
      <span className={state === 'inside' || state === 'none' ? '' : 'dim'}>{words}</span>
      {side ? <span className="font-normal">({side})</span> : null}
    </span>
  );
}

function KindIcon({ kind }: { kind: FeatureKind }) {
  // Outside: a solid bar between two arrows pointing in (measured across its outside).
  // Inside: a ring with arrows pointing out (measured across its bore).
  return <MaskIcon name={kind === 'outside' ? 'feature-outside' : 'feature-inside'} className="h-3 w-5" />;
}

export const KIND_WORDS: Record<FeatureKind, { short: string; long: string }> = {
  outside: { short: 'Shaft-like', long: 'Outside feature (shaft-like)' },
  inside: { short: 'Hole-like', long: 'Inside feature (hole-like)' },
};

/** Whether the feature is measured across its outside or across a bore, in words with a small picture. */
export function KindBadge({ kind, long = false }: { kind: FeatureKind; long?: boolean }) {
  return (
    <span className="inline-flex items-center gap-1 whitespace-nowrap text-xs font-semibold text-graphite-2" data-kind={kind}>
      <KindIcon kind={kind} />
      {long ? KIND_WORDS[kind].long : KIND_WORDS[kind].short}
    </span>
  );
}

/** A check said in words: "✓ fine enough" / "⚠ too coarse". */
export function CheckMark({ ok, good, bad }: { ok: boolean; good: string; bad: string }) {
  return ok ? (
    <span className="inline-flex items-center gap-1 text-ok">
      <span aria-hidden="true">✓</span>
      {good}
    </span>
  ) : (
    <span className="inline-flex items-center gap-1 font-semibold text-scribe">
      <span aria-hidden="true">⚠</span>
      {bad}
    </span>
  );
}
