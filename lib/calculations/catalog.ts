/**
 * The calculator pages, the names shown for each calculator kind, and the short label a saved
 * result gets when the builder gives none. Pure: used by pages, components, handlers and seeders.
 */
import type { CalculatorInputs, CalculatorKind, CalculatorOutputs } from '../calculators/registry';
import { CAUTIONS, type CautionTopic } from '../calculators/cautions';

export type CalculatorPageSlug = 'tap-drill' | 'clearance-holes' | 'drills' | 'bolt-circle' | 'indexing' | 'spur-gear' | 'speeds';

export interface CalculatorPage {
  slug: CalculatorPageSlug;
  title: string;
  /** One line: what it is for, in shop words. */
  blurb: string;
  /** Kinds of result this page computes (and can save). */
  kinds: readonly CalculatorKind[];
  cautions: readonly CautionTopic[];
}

export const CALCULATOR_PAGES: readonly CalculatorPage[] = [
  {
    slug: 'tap-drill',
    title: 'Tap drills and thread engagement',
    blurb: 'The drill for a thread at the percentage of thread you want, or the engagement a drill you have will give.',
    kinds: ['tap-drill', 'thread-percent', 'thread-spec'],
    cautions: ['tapping', 'drilling'],
  },
  {
    slug: 'clearance-holes',
    title: 'Clearance holes and counterbores',
    blurb: 'Close, normal and loose clearance holes for a screw, and the counterbore for a socket head cap screw with the wall it leaves.',
    kinds: ['clearance-hole', 'counterbore'],
    cautions: ['drilling', 'thinWalls'],
  },
  {
    slug: 'drills',
    title: 'Drill chart',
    blurb: 'Any fractional, number, letter or metric drill in both units, or the drills nearest to a size.',
    kinds: ['drill-size', 'nearest-drills'],
    cautions: ['drilling'],
  },
  {
    slug: 'bolt-circle',
    title: 'Bolt circle',
    blurb: 'X/Y coordinates and rotary-table angles for holes on a pitch circle, drawn, with a second pattern midway if you need one.',
    kinds: ['bolt-circle'],
    cautions: ['drilling', 'rotatingWork'],
  },
  {
    slug: 'indexing',
    title: 'Dividing head indexing',
    blurb: 'Crank turns and holes on your own index plates, the sector-arm setting, direct indexing, and a differential set-up when no plate serves.',
    kinds: ['simple-indexing', 'direct-indexing'],
    cautions: ['rotatingWork'],
  },
  {
    slug: 'spur-gear',
    title: 'Spur gear blank',
    blurb: 'Blank diameter, pitch diameter, depth of cut and the involute cutter number for a spur gear by module or diametral pitch.',
    kinds: ['spur-gear'],
    cautions: ['rotatingWork'],
  },
  {
    slug: 'speeds',
    title: 'Spindle speeds',
    blurb: 'Spindle speed from cutting speed and diameter, with starting cutting speeds for common materials and tools.',
    kinds: ['spindle-speed', 'speed-range'],
    cautions: ['rotatingWork', 'drilling'],
  },
];

export const CALCULATOR_NAMES: Readonly<Record<CalculatorKind, string>> = {
  'thread-spec': 'Thread',
  'thread-percent': 'Thread engagement',
  'tap-drill': 'Tap drill',
  'clearance-hole': 'Clearance hole',
  counterbore: 'Counterbore',
  'drill-size': 'Drill size',
  'nearest-drills': 'Nearest drills',
  'bolt-circle': 'Bolt circle',
  'simple-indexing': 'Indexing',
  'direct-indexing': 'Direct indexing',
  'spur-gear': 'Spur gear blank',
  'spindle-speed': 'Spindle speed',
  'speed-range': 'Starting speeds',
};

export function pageOfKind(kind: string): CalculatorPage | null {
  return CALCULATOR_PAGES.find((p) => (p.kinds as readonly string[]).includes(kind)) ?? null;
}

export function pageBySlug(slug: string): CalculatorPage | null {
  return CALCULATOR_PAGES.find((p) => p.slug === slug) ?? null;
}

export function cautionsOf(page: CalculatorPage) {
  return page.cautions.map((t) => CAUTIONS[t]);
}

const trimNumber = (n: number, decimals = 3) => String(Number(n.toFixed(decimals)));

const mmText = (mm: unknown) => (typeof mm === 'number' && Number.isFinite(mm) ? `${trimNumber(mm)} mm` : '?');

/**
 * A short human summary of a calculation, from its input (and its output where the input alone
 * does not name the thing, e.g. a thread written loosely). Always at most 120 characters.
 */
export function defaultLabel<K extends CalculatorKind>(kind: K, input: CalculatorInputs[K], output?: CalculatorOutputs[K]): string {
  const i = input as Record<string, unknown>;
  const o = (output ?? {}) as Record<string, unknown>;
  const thread = () => {
    const t = o.thread as { designationWithPitch?: string } | undefined;
    return t?.designationWithPitch ?? String(i.designation ?? '').trim();
  };
  let label: string;
  switch (kind) {
    case 'thread-spec':
      label = `Thread ${(o as { designationWithPitch?: string }).designationWithPitch ?? String(i.designation ?? '').trim()}`;
      break;
    case 'tap-drill':
      label = `Tap drill for ${thread()}`;
      break;
    case 'thread-percent': {
      const d = (o.drillSize as { name?: string } | null | undefined)?.name ?? mmText(i.drillDiameterMm);
      label = `Engagement of ${d} in ${thread()}`;
      break;
    }
    case 'clearance-hole':
      label = `Clearance hole for ${String(i.size ?? '').trim()} (${String(i.fit ?? 'normal')})`;
      break;
    case 'counterbore':
      label = `Counterbore for ${String(i.size ?? '').trim()} socket head cap screw`;
      break;
    case 'drill-size':
      label = `Drill ${String(i.name ?? '').trim()}`;
      break;
    case 'nearest-drills':
      label = `Drills nearest ${mmText(i.diameterMm)}`;
      break;
    case 'bolt-circle':
      label = `Bolt circle: ${i.holes} holes on ${mmText(i.diameterMm)}${i.midway ? ', with midway holes' : ''}`;
      break;
    case 'simple-indexing':
      label = `Indexing ${i.divisions} divisions on a ${i.ratio ?? 40}:1 head`;
      break;
    case 'direct-indexing':
      label = `Direct indexing ${i.divisions} divisions on a ${i.plateHoles ?? 24}-hole plate`;
      break;
    case 'spur-gear':
      label =
        i.module !== undefined
          ? `Spur gear blank: ${i.teeth} teeth, module ${trimNumber(Number(i.module), 4)}`
          : `Spur gear blank: ${i.teeth} teeth, ${trimNumber(Number(i.diametralPitch), 4)} DP`;
      break;
    case 'spindle-speed':
      label = `Spindle speed at ${trimNumber(Number(i.cuttingSpeed), 1)} ${String(i.unit)} on ${mmText(i.diameterMm)}`;
      break;
    case 'speed-range': {
      const row = o.row as { name?: string } | undefined;
      label = `Starting speeds: ${row?.name ?? String(i.material)}, ${i.tool === 'carbide' ? 'carbide' : 'HSS'}, ${mmText(i.diameterMm)}`;
      break;
    }
    default:
      label = 'Calculation';
  }
  label = label.replace(/\s+/g, ' ').trim();
  return label.length > 120 ? `${label.slice(0, 119)}…` : label;
}
