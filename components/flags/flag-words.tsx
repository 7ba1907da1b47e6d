import Link from 'next/link';
import { FLAG_STATUS_LABEL, severityLabel, severityMeaning } from '@/lib/validations/flag-words';
import { formatClock } from '@/lib/chapters';
import type { FlagSeverity, FlagStatus, FlagTargetView, FlagView } from '@/lib/types/flags';

/** Colour only repeats what the word and the shape already say. */
export const SEVERITY_TONE: Record<FlagSeverity, { text: string; box: string; edge: string }> = {
  caution: { text: 'text-dye', box: 'bg-dye-soft', edge: 'border-dye/50' },
  warning: { text: 'text-scribe', box: 'bg-scribe-soft', edge: 'border-scribe' },
  stop: { text: 'text-bad', box: 'bg-bad-soft', edge: 'border-bad' },
};

/** Three shapes of our own: an open diamond, a diamond with a bar, a solid square with a cross-bar. */
export function SeverityIcon({ severity, className = 'h-4 w-4' }: { severity: FlagSeverity; className?: string }) {
  const common = { viewBox: '0 0 20 20', 'aria-hidden': true, className: `shrink-0 ${className}`, strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const };
  switch (severity) {
    case 'caution':
      return (
        <svg {...common} fill="none" stroke="currentColor" strokeWidth={1.8}>
          <path d="M10 2.5 17.5 10 10 17.5 2.5 10z" />
          <circle cx="10" cy="10" r="1.2" fill="currentColor" />
        </svg>
      );
    case 'warning':
      return (
        <svg {...common} fill="none" stroke="currentColor" strokeWidth={2}>
          <path d="M10 2 18 10 10 18 2 10z" />
          <path d="M10 6.2v4.6" />
          <circle cx="10" cy="13.6" r="0.6" fill="currentColor" />
        </svg>
      );
    case 'stop':
      return (
        <svg {...common}>
          <rect x="2.5" y="2.5" width="15" height="15" rx="2.5" fill="currentColor" />
          <path d="M6 10h8" stroke="white" strokeWidth={2.6} />
        </svg>
      );
  }
}

export function SeverityBadge({ severity, withMeaning = false }: { severity: FlagSeverity; withMeaning?: boolean }) {
  const tone = SEVERITY_TONE[severity];
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full border px-2 py-0.5 text-xs font-bold uppercase tracking-wide ${tone.text} ${tone.edge} ${tone.box}`} data-severity={severity}>
      <SeverityIcon severity={severity} className="h-3.5 w-3.5" />
      {severityLabel(severity)}
      {withMeaning ? <span className="font-normal normal-case tracking-normal text-graphite">— {severityMeaning(severity)}</span> : null}
    </span>
  );
}

/**
 * A flag that changes with its status, drawn here: raised on its pole while it waits for the builder,
 * with an eye beside it once the builder has seen it, lowered and folded with a tick once answered.
 */
export function FlagStatusMark({ status, className = 'h-4 w-4' }: { status: FlagStatus; className?: string }) {
  const common = {
    viewBox: '0 0 20 20',
    'aria-hidden': true,
    className: `shrink-0 ${className}`,
    fill: 'none',
    stroke: 'currentColor',
    strokeLinecap: 'round' as const,
    strokeLinejoin: 'round' as const,
    'data-flag-mark': status,
  };
  switch (status) {
    case 'open':
      return (
        <svg {...common}>
          <path d="M4.5 2.5v15" strokeWidth={1.8} />
          <path d="M5.4 3.2h10.4l-2.6 3.4 2.6 3.4H5.4z" fill="currentColor" strokeWidth={1.2} />
        </svg>
      );
    case 'acknowledged':
      return (
        <svg {...common}>
          <path d="M3.5 2.5v15" strokeWidth={1.8} />
          <path d="M4.4 3.2h8l-2 2.6 2 2.6h-8z" fill="currentColor" strokeWidth={1.2} />
          <path d="M8.6 14.2c1.7-2.4 6.7-2.4 8.4 0-1.7 2.4-6.7 2.4-8.4 0z" strokeWidth={1.5} />
          <circle cx="12.8" cy="14.2" r="1.2" fill="currentColor" stroke="none" />
        </svg>
      );
    case 'resolved':
      return (
        <svg {...common}>
          <path d="M4.5 2.5v15" strokeWidth={1.8} />
          <path d="M5.4 12.4h4.2v4.4H5.4z" fill="currentColor" strokeWidth={1.2} />
          <path d="M5.4 12.4l4.2 2.2" stroke="var(--color-card)" strokeWidth={0.9} />
          <path d="M9.6 6.4l2.5 2.5 5.2-5.4" strokeWidth={2} />
        </svg>
      );
  }
}

const STATUS_TONE: Record<FlagStatus, string> = { open: 'text-scribe', acknowledged: 'text-dye', resolved: 'text-ok' };

export function FlagStatusBadge({ status }: { status: FlagStatus }) {
  return (
    <span className={`inline-flex items-center gap-1 text-xs font-semibold ${STATUS_TONE[status]}`} data-flag-status={status}>
      <FlagStatusMark status={status} />
      {FLAG_STATUS_LABEL[status]}
    </span>
  );
}

/** Where on the entry the flag points, in words. */
export function targetText(target: FlagTargetView): string {
  if (target.kind === 'note') return `On the note at ${formatClock(target.startMs)}`;
  if (target.kind === 'measurement') return `On the measurement “${target.feature}”`;
  return 'On this entry';
}

/** The most severe of some flags: what a single marker should say. */
export function worstSeverity(flags: Pick<FlagView, 'severity'>[]): FlagSeverity | null {
  const order: FlagSeverity[] = ['stop', 'warning', 'caution'];
  return order.find((s) => flags.some((f) => f.severity === s)) ?? null;
}

/**
 * The small mark beside a note or a measurement record that carries flags: the most severe open one in
 * words, how many there are, and a link to the flag's full text on the page.
 */
export function FlagMarker({ flags }: { flags: FlagView[] }) {
  const open = flags.filter((f) => f.status !== 'resolved');
  const shown = open.length ? open : flags;
  const worst = worstSeverity(shown);
  if (!worst) return null;
  const tone = open.length ? SEVERITY_TONE[worst] : { text: 'text-ok', box: 'bg-ok-soft', edge: 'border-ok/50' };
  const words = open.length
    ? `${severityLabel(worst)} flag${open.length > 1 ? ` (+${open.length - 1})` : ''}`
    : `${flags.length === 1 ? 'Flag' : `${flags.length} flags`} answered`;
  return (
    <Link
      href={`#flag-${shown[0].id}`}
      className={`inline-flex min-h-7 items-center gap-1 rounded-full border px-2 text-xs font-semibold no-underline ${tone.text} ${tone.edge} ${tone.box}`}
      data-flag-marker={open.length ? worst : 'resolved'}
    >
      {open.length ? <SeverityIcon severity={worst} className="h-3.5 w-3.5" /> : <FlagStatusMark status="resolved" className="h-3.5 w-3.5" />}
      {words}
      <span className="sr-only">: read the risk flag</span>
    </Link>
  );
}

/** "⚠ 2 open risk flags", or nothing when there are none. */
export function OpenFlagCount({ count, href, className = '' }: { count: number; href?: string; className?: string }) {
  if (!count) return null;
  const body = (
    <>
      <SeverityIcon severity="warning" className="h-3.5 w-3.5" />
      {count === 1 ? '1 open risk flag' : `${count} open risk flags`}
    </>
  );
  const cls = `inline-flex items-center gap-1.5 rounded-full border border-scribe bg-scribe-soft px-2.5 py-0.5 text-xs font-semibold text-scribe no-underline ${className}`;
  return href ? (
    <Link href={href} className={cls} data-testid="open-flag-count">
      {body}
    </Link>
  ) : (
    <span className={cls} data-testid="open-flag-count">
      {body}
    </span>
  );
}
