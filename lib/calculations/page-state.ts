/**
 * What each calculator page keeps in its URL, and how that becomes a calculator input.
 *
 * A page's state is its boxes as typed (strings), so a half-typed value survives a reload. The URL
 * holds only what differs from the defaults. `calculatorHref` goes the other way, from a saved
 * result's stored input to the page that reopens it.
 */
import { INCH_DRILL_KINDS, METRIC_DRILL_KINDS, type DrillKind } from '../calculators/drills';
import { CalculatorError } from '../calculators/errors';
import type { CalculatorInputs, CalculatorKind, CalculatorOutputs } from '../calculators/registry';
import { CLEARANCE_FITS, type ClearanceFit } from '../calculators/holes';
import { CUTTING_SPEEDS, type CuttingSpeedUnit, type ToolMaterial, type WorkMaterial } from '../calculators/speeds';
import { lengthText, numberText, readDrill, readLengthMm, readNumber, type LengthUnitChoice } from './numbers';
import type { CalculatorPageSlug } from './catalog';

export interface SearchLike {
  get(name: string): string | null;
}

/** A page's searchParams record as URLSearchParams (the first value of a repeated key). */
export function searchFromRecord(record: Record<string, string | string[] | undefined>): URLSearchParams {
  const out = new URLSearchParams();
  for (const [k, v] of Object.entries(record)) {
    const value = Array.isArray(v) ? v[0] : v;
    if (typeof value === 'string') out.set(k, value);
  }
  return out;
}

/** "?a=1&b=2" from the pairs that hold something, or "". */
function query(pairs: Array<[string, string | false | null | undefined]>): string {
  const out = new URLSearchParams();
  // '' is kept: a box emptied on purpose must not come back with its default on reload.
  for (const [k, v] of pairs) if (v !== false && v !== null && v !== undefined) out.set(k, v);
  const s = out.toString();
  return s ? `?${s}` : '';
}

const text = (p: SearchLike, key: string, max = 80) => (p.get(key) ?? '').slice(0, max);
function choice<T extends string>(p: SearchLike, key: string, options: readonly T[], fallback: T): T {
  const v = p.get(key);
  return (options as readonly string[]).includes(v ?? '') ? (v as T) : fallback;
}
const unitOf = (p: SearchLike, key = 'unit') => choice<LengthUnitChoice>(p, key, ['mm', 'in'], 'mm');

/** A calculation a page asks for: which calculator, with which input. */
export type CalcRequest = { [K in CalculatorKind]: { kind: K; input: CalculatorInputs[K] } }[CalculatorKind];

/** Drops keys whose value is undefined, so stored inputs hold only what was given. */
function defined<T extends object>(o: T): T {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;
}

/** A number box: undefined when empty (the calculator's default then applies), NaN when unreadable. */
const num = (s: string) => readNumber(s);

// ─── Tap drill ────────────────────────────────────────────────────────────────────────────────
export type DrillSet = 'all' | 'inch' | 'metric';
export interface TapDrillState {
  thread: string;
  mode: 'pick' | 'check';
  target: string;
  drill: string;
  drills: DrillSet;
}
export const TAP_DRILL_FIELDS: Record<string, keyof TapDrillState> = { designation: 'thread', targetPercent: 'target', drillDiameterMm: 'drill', kinds: 'drills' };

export function tapDrillFromSearch(p: SearchLike): TapDrillState {
  return {
    thread: text(p, 'thread'),
    mode: p.get('mode') === 'check' ? 'check' : 'pick',
    target: p.get('target') ?? '75',
    drill: text(p, 'drill'),
    drills: choice<DrillSet>(p, 'drills', ['all', 'inch', 'metric'], 'all'),
  };
}

export function tapDrillQuery(s: TapDrillState): string {
  return query([
    ['thread', s.thread || null],
    ['mode', s.mode === 'check' && 'check'],
    ['target', s.target !== '75' && s.target],
    ['drill', s.drill || null],
    ['drills', s.drills !== 'all' && s.drills],
  ]);
}

const kindsOf = (set: DrillSet): DrillKind[] | undefined => (set === 'inch' ? [...INCH_DRILL_KINDS] : set === 'metric' ? [...METRIC_DRILL_KINDS] : undefined);
function setOf(kinds: readonly string[] | undefined): DrillSet {
  if (!kinds) return 'all';
  const k = [...kinds].sort().join(',');
  if (k === [...INCH_DRILL_KINDS].sort().join(',')) return 'inch';
  if (k === 'metric') return 'metric';
  return 'all';
}

/** null while the thread box is empty. Throws CalculatorError (field 'drill') for a drill it cannot read. */
export function tapDrillRequest(s: TapDrillState): CalcRequest | null {
  if (!s.thread.trim()) return null;
  if (s.mode === 'check') {
    if (!s.drill.trim()) return null;
    const drill = readDrill(s.drill, 'drill');
    return { kind: 'thread-percent', input: { designation: s.thread, drillDiameterMm: drill.diameterMm } };
  }
  const target = s.target.trim() === '' ? undefined : num(s.target);
  return { kind: 'tap-drill', input: defined({ designation: s.thread, targetPercent: target, kinds: kindsOf(s.drills) }) };
}

// ─── Clearance holes and counterbores ─────────────────────────────────────────────────────────
export interface ClearanceState {
  size: string;
  fit: ClearanceFit;
  edge: string;
  spacing: string;
  unit: LengthUnitChoice;
}
export const CLEARANCE_FIELDS: Record<string, keyof ClearanceState> = { size: 'size', fit: 'fit', holeCentreToEdgeMm: 'edge', holeSpacingMm: 'spacing' };

export function clearanceFromSearch(p: SearchLike): ClearanceState {
  return {
    size: text(p, 'size'),
    fit: choice<ClearanceFit>(p, 'fit', CLEARANCE_FITS, 'normal'),
    edge: text(p, 'edge', 20),
    spacing: text(p, 'spacing', 20),
    unit: unitOf(p),
  };
}

export function clearanceQuery(s: ClearanceState): string {
  return query([
    ['size', s.size || null],
    ['fit', s.fit !== 'normal' && s.fit],
    ['edge', s.edge || null],
    ['spacing', s.spacing || null],
    ['unit', s.unit !== 'mm' && s.unit],
  ]);
}

export function clearanceRequests(s: ClearanceState): { clearance: CalcRequest; counterbore: CalcRequest } | null {
  if (!s.size.trim()) return null;
  return {
    clearance: { kind: 'clearance-hole', input: { size: s.size, fit: s.fit } },
    counterbore: {
      kind: 'counterbore',
      input: defined({ size: s.size, fit: s.fit, holeCentreToEdgeMm: readLengthMm(s.edge, s.unit), holeSpacingMm: readLengthMm(s.spacing, s.unit) }),
    },
  };
}

// ─── Drill chart ──────────────────────────────────────────────────────────────────────────────
export type DrillSide = 'any' | 'above' | 'below';
export interface DrillsState {
  mode: 'name' | 'size';
  name: string;
  d: string;
  unit: LengthUnitChoice;
  side: DrillSide;
}
export const DRILLS_FIELDS: Record<string, keyof DrillsState> = { name: 'name', diameterMm: 'd', side: 'side' };
export const NEAREST_COUNT = 8;

export function drillsFromSearch(p: SearchLike): DrillsState {
  return {
    mode: p.get('mode') === 'size' ? 'size' : 'name',
    name: text(p, 'name'),
    d: text(p, 'd', 20),
    unit: unitOf(p),
    side: choice<DrillSide>(p, 'side', ['any', 'above', 'below'], 'any'),
  };
}

export function drillsQuery(s: DrillsState): string {
  return query([
    ['mode', s.mode === 'size' && 'size'],
    ['name', s.name || null],
    ['d', s.d || null],
    ['unit', s.unit !== 'mm' && s.unit],
    ['side', s.side !== 'any' && s.side],
  ]);
}

export function drillsRequest(s: DrillsState): CalcRequest | null {
  if (s.mode === 'name') return s.name.trim() ? { kind: 'drill-size', input: { name: s.name } } : null;
  if (!s.d.trim()) return null;
  return { kind: 'nearest-drills', input: defined({ diameterMm: readLengthMm(s.d, s.unit) as number, count: NEAREST_COUNT, side: s.side === 'any' ? undefined : s.side }) };
}

// ─── Bolt circle ──────────────────────────────────────────────────────────────────────────────
export interface BoltCircleState {
  d: string;
  unit: LengthUnitChoice;
  holes: string;
  start: string;
  midway: boolean;
}
export const BOLT_CIRCLE_FIELDS: Record<string, keyof BoltCircleState> = { diameterMm: 'd', holes: 'holes', startAngleDeg: 'start' };

export function boltCircleFromSearch(p: SearchLike): BoltCircleState {
  return { d: text(p, 'd', 20), unit: unitOf(p), holes: text(p, 'holes', 10), start: text(p, 'start', 20), midway: p.get('midway') === '1' };
}

export function boltCircleQuery(s: BoltCircleState): string {
  return query([
    ['d', s.d || null],
    ['unit', s.unit !== 'mm' && s.unit],
    ['holes', s.holes || null],
    ['start', s.start && s.start !== '0' ? s.start : null],
    ['midway', s.midway && '1'],
  ]);
}

export function boltCircleRequest(s: BoltCircleState): CalcRequest | null {
  if (!s.d.trim() && !s.holes.trim()) return null;
  return {
    kind: 'bolt-circle',
    input: defined({
      diameterMm: readLengthMm(s.d, s.unit) as number,
      holes: num(s.holes) as number,
      startAngleDeg: num(s.start),
      midway: s.midway || undefined,
    }),
  };
}

// ─── Indexing ─────────────────────────────────────────────────────────────────────────────────
export interface IndexingState {
  n: string;
  ratio: string;
  /** The user's own hole circles, comma separated; empty for the commonly supplied set. */
  circles: string;
  plate: string;
}
export const INDEXING_FIELDS: Record<string, keyof IndexingState> = { divisions: 'n', ratio: 'ratio', circles: 'circles', plateHoles: 'plate', gears: 'circles' };

export function indexingFromSearch(p: SearchLike): IndexingState {
  return { n: text(p, 'n', 10), ratio: p.get('ratio') ?? '40', circles: text(p, 'circles', 400), plate: p.get('plate') ?? '24' };
}

export function indexingQuery(s: IndexingState): string {
  return query([
    ['n', s.n || null],
    ['ratio', s.ratio !== '40' && s.ratio],
    ['circles', s.circles || null],
    ['plate', s.plate !== '24' && s.plate],
  ]);
}

/** "15, 16, 17" → [15, 16, 17]; undefined for an empty box. Throws CalculatorError (field 'circles'). */
export function readCircles(textValue: string): number[] | undefined {
  const parts = textValue.split(/[\s,;]+/).filter(Boolean);
  if (!parts.length) return undefined;
  return parts.map((part) => {
    const n = Number(part);
    if (!Number.isInteger(n)) {
      throw new CalculatorError('NOT_WHOLE', 'circles', `Write the hole circles as whole numbers separated by commas: "${part}" is not one.`);
    }
    return n;
  });
}

const boxNumber = (s: string) => (s.trim() === '' ? undefined : num(s));

export function indexingRequests(s: IndexingState): { simple: CalcRequest; direct: CalcRequest } | null {
  if (!s.n.trim()) return null;
  const divisions = num(s.n) as number;
  return {
    simple: { kind: 'simple-indexing', input: defined({ divisions, ratio: boxNumber(s.ratio), circles: readCircles(s.circles) }) },
    direct: { kind: 'direct-indexing', input: defined({ divisions, plateHoles: boxNumber(s.plate) }) },
  };
}

// ─── Spur gear ────────────────────────────────────────────────────────────────────────────────
export interface SpurGearState {
  teeth: string;
  by: 'module' | 'dp';
  m: string;
  dp: string;
  pa: '20' | '14.5';
}
export const SPUR_GEAR_FIELDS: Record<string, keyof SpurGearState> = { teeth: 'teeth', module: 'm', diametralPitch: 'dp', pressureAngleDeg: 'pa' };

export function spurGearFromSearch(p: SearchLike): SpurGearState {
  return {
    teeth: text(p, 'teeth', 10),
    by: p.get('by') === 'dp' ? 'dp' : 'module',
    m: text(p, 'm', 20),
    dp: text(p, 'dp', 20),
    pa: p.get('pa') === '14.5' ? '14.5' : '20',
  };
}

export function spurGearQuery(s: SpurGearState): string {
  return query([
    ['teeth', s.teeth || null],
    ['by', s.by === 'dp' && 'dp'],
    ['m', s.by === 'module' && (s.m || null)],
    ['dp', s.by === 'dp' && (s.dp || null)],
    ['pa', s.pa !== '20' && s.pa],
  ]);
}

export function spurGearRequest(s: SpurGearState): CalcRequest | null {
  if (!s.teeth.trim() && !(s.by === 'module' ? s.m : s.dp).trim()) return null;
  const teeth = num(s.teeth) as number;
  const pressureAngleDeg = s.pa === '14.5' ? 14.5 : 20;
  return s.by === 'module'
    ? { kind: 'spur-gear', input: { teeth, module: num(s.m) as number, pressureAngleDeg } }
    : { kind: 'spur-gear', input: { teeth, diametralPitch: num(s.dp) as number, pressureAngleDeg } };
}

// ─── Speeds ───────────────────────────────────────────────────────────────────────────────────
export interface SpeedsState {
  d: string;
  unit: LengthUnitChoice;
  v: string;
  vunit: CuttingSpeedUnit;
  material: WorkMaterial | '';
  tool: ToolMaterial;
}
export const SPEEDS_FIELDS: Record<string, keyof SpeedsState> = { diameterMm: 'd', cuttingSpeed: 'v', unit: 'vunit', material: 'material', tool: 'tool' };
const MATERIALS = CUTTING_SPEEDS.map((r) => r.material);

export function speedsFromSearch(p: SearchLike): SpeedsState {
  return {
    d: text(p, 'd', 20),
    unit: unitOf(p),
    v: text(p, 'v', 20),
    vunit: choice<CuttingSpeedUnit>(p, 'vunit', ['m/min', 'sfm'], 'm/min'),
    material: choice<WorkMaterial | ''>(p, 'material', MATERIALS, ''),
    tool: choice<ToolMaterial>(p, 'tool', ['hss', 'carbide'], 'hss'),
  };
}

export function speedsQuery(s: SpeedsState): string {
  return query([
    ['d', s.d || null],
    ['unit', s.unit !== 'mm' && s.unit],
    ['v', s.v || null],
    ['vunit', s.vunit !== 'm/min' && s.vunit],
    ['material', s.material || null],
    ['tool', s.tool !== 'hss' && s.tool],
  ]);
}

export function speedsRequests(s: SpeedsState): { speed: CalcRequest | null; range: CalcRequest | null } {
  const diameterMm = readLengthMm(s.d, s.unit) as number;
  if (!s.d.trim()) return { speed: null, range: null };
  return {
    speed: s.v.trim() ? { kind: 'spindle-speed', input: { cuttingSpeed: num(s.v) as number, unit: s.vunit, diameterMm } } : null,
    range: s.material ? { kind: 'speed-range', input: { material: s.material, tool: s.tool, diameterMm } } : null,
  };
}

// ─── From a saved result back to its page ─────────────────────────────────────────────────────
const n = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? numberText(v) : '');
const s = (v: unknown) => (typeof v === 'string' ? v : '');
const mm = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? lengthText(v, 'mm') : '');

function pageQuery(kind: CalculatorKind, input: Record<string, unknown>, output: Record<string, unknown>): [CalculatorPageSlug, string] {
  switch (kind) {
    case 'thread-spec':
      return ['tap-drill', tapDrillQuery({ thread: s(input.designation), mode: 'pick', target: '75', drill: '', drills: 'all' })];
    case 'tap-drill':
      return [
        'tap-drill',
        tapDrillQuery({
          thread: s(input.designation),
          mode: 'pick',
          target: input.targetPercent === undefined ? '75' : n(input.targetPercent),
          drill: '',
          drills: setOf(Array.isArray(input.kinds) ? (input.kinds as string[]) : undefined),
        }),
      ];
    case 'thread-percent': {
      const named = output.drillSize as { name?: string; diameterMm?: number } | null | undefined;
      const exact = named?.name && typeof named.diameterMm === 'number' && Math.abs(named.diameterMm - Number(input.drillDiameterMm)) < 1e-4;
      const drill = exact ? named!.name! : input.drillDiameterMm === undefined ? '' : `${mm(input.drillDiameterMm)} mm`;
      return ['tap-drill', tapDrillQuery({ thread: s(input.designation), mode: 'check', target: '75', drill, drills: 'all' })];
    }
    case 'clearance-hole':
    case 'counterbore':
      return [
        'clearance-holes',
        clearanceQuery({
          size: s(input.size),
          fit: (CLEARANCE_FITS as readonly unknown[]).includes(input.fit) ? (input.fit as ClearanceFit) : 'normal',
          edge: mm(input.holeCentreToEdgeMm),
          spacing: mm(input.holeSpacingMm),
          unit: 'mm',
        }),
      ];
    case 'drill-size':
      return ['drills', drillsQuery({ mode: 'name', name: s(input.name), d: '', unit: 'mm', side: 'any' })];
    case 'nearest-drills':
      return [
        'drills',
        drillsQuery({ mode: 'size', name: '', d: mm(input.diameterMm), unit: 'mm', side: input.side === 'above' || input.side === 'below' ? input.side : 'any' }),
      ];
    case 'bolt-circle':
      return ['bolt-circle', boltCircleQuery({ d: mm(input.diameterMm), unit: 'mm', holes: n(input.holes), start: n(input.startAngleDeg ?? 0), midway: input.midway === true })];
    case 'simple-indexing':
      return [
        'indexing',
        indexingQuery({
          n: n(input.divisions),
          ratio: input.ratio === undefined ? '40' : n(input.ratio),
          circles: Array.isArray(input.circles) ? input.circles.join(', ') : '',
          plate: '24',
        }),
      ];
    case 'direct-indexing':
      return ['indexing', indexingQuery({ n: n(input.divisions), ratio: '40', circles: '', plate: input.plateHoles === undefined ? '24' : n(input.plateHoles) })];
    case 'spur-gear': {
      const byDp = input.module === undefined && input.diametralPitch !== undefined;
      return [
        'spur-gear',
        spurGearQuery({ teeth: n(input.teeth), by: byDp ? 'dp' : 'module', m: n(input.module), dp: n(input.diametralPitch), pa: input.pressureAngleDeg === 14.5 ? '14.5' : '20' }),
      ];
    }
    case 'spindle-speed':
      return [
        'speeds',
        speedsQuery({ d: mm(input.diameterMm), unit: 'mm', v: n(input.cuttingSpeed), vunit: input.unit === 'sfm' ? 'sfm' : 'm/min', material: '', tool: 'hss' }),
      ];
    case 'speed-range':
      return [
        'speeds',
        speedsQuery({
          d: mm(input.diameterMm),
          unit: 'mm',
          v: '',
          vunit: 'm/min',
          material: (MATERIALS as readonly unknown[]).includes(input.material) ? (input.material as WorkMaterial) : '',
          tool: input.tool === 'carbide' ? 'carbide' : 'hss',
        }),
      ];
  }
}

/** The calculator page, with its query, that recomputes a saved result from its stored input. */
export function calculatorHref<K extends CalculatorKind>(kind: K, input: CalculatorInputs[K] | Record<string, unknown>, output?: CalculatorOutputs[K] | unknown): string {
  const [slug, q] = pageQuery(kind, (input ?? {}) as Record<string, unknown>, ((output ?? {}) as Record<string, unknown>) ?? {});
  return `/calculators/${slug}${q}`;
}
