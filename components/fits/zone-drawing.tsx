import { useId } from 'react';
import type { FitKind, ToleranceZone } from '@/lib/fits';
import type { SizeUnit } from '@/lib/validations/fits-words';
import { formatUm, formatUmAs } from '@/lib/units/format';

type Props = {
  /** "25 mm", for the description. */
  sizeLabel: string;
  hole?: ToleranceZone;
  shaft?: ToleranceZone;
  kind?: FitKind;
  /** Unit of the second line of each label. */
  unit: SizeUnit;
  /** Measured sizes to plot beside a single zone, as deviations from the nominal, oldest first. */
  readings?: PlottedReading[];
  /** Titles under the boxes instead of "Hole H7" / "Shaft g6" (for limits that are not ISO 286 zones). */
  titles?: Partial<Record<'hole' | 'shaft', string>>;
};

export type PlottedReading = {
  um: number;
  /** Short mark beside the point: "1", "P3". */
  label: string;
  inside: boolean;
  /** The reading as written, for the description: "130.012 mm". */
  text: string;
};

// Drawing units (the SVG scales to its box; at phone width one unit is about 0.8 px).
const W = 420;
const H = 312;
const PLOT_TOP = 36;
const PLOT_BOTTOM = 232;
const AXIS_X = 40;
const BOX_W = 54;
// A label is two lines about its shelf, 41 units tall: shelves closer than this are pushed apart.
const LABEL_GAP = 42;
const LABEL_MIN_Y = 20;
const LABEL_MAX_Y = 250;
// Text closer than this to the zero line would be crossed by it.
const ZERO_CLEAR = 21;
// Hole box, gap, shaft box, left to right (a single zone sits at ZONE_X).
const HOLE_X = 136;
const SHAFT_X = 246;
const ZONE_X = 176;

function niceStep(raw: number): number {
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
}

/**
 * Where the two shelves of a box go: level with its edges, pushed apart when the box is too thin for
 * both, kept off the zero line (unless an edge is on it) and on the drawing.
 */
function placeLabels(yUpper: number, yLower: number, y0: number): [number, number] {
  let a = yUpper;
  let b = yLower;
  if (b - a < LABEL_GAP) {
    const mid = (a + b) / 2;
    a = mid - LABEL_GAP / 2;
    b = mid + LABEL_GAP / 2;
  }
  const offZero = (ly: number, edge: number) => {
    if (Math.abs(edge - y0) < 0.5) return y0; // an edge on the zero line keeps its shelf on it
    const d = ly - y0;
    if (Math.abs(d) <= 1 || Math.abs(d) >= ZERO_CLEAR) return ly;
    return edge < y0 ? y0 - ZERO_CLEAR : y0 + ZERO_CLEAR;
  };
  const movedA = offZero(a, yUpper);
  const movedB = offZero(b, yLower);
  const aMoved = movedA !== a;
  a = movedA;
  b = movedB;
  if (b - a < LABEL_GAP) {
    if (aMoved) b = a + LABEL_GAP;
    else a = b - LABEL_GAP;
  }
  if (a < LABEL_MIN_Y) {
    b += LABEL_MIN_Y - a;
    a = LABEL_MIN_Y;
  }
  if (b > LABEL_MAX_Y) {
    a -= b - LABEL_MAX_Y;
    b = LABEL_MAX_Y;
  }
  return [a, b];
}

function sideOfZero(z: ToleranceZone): string {
  if (z.lowerUm >= 0) return z.lowerUm === 0 ? 'on and above the zero line' : 'wholly above the zero line';
  if (z.upperUm <= 0) return z.upperUm === 0 ? 'on and below the zero line' : 'wholly below the zero line';
  return 'across the zero line';
}

function zoneWords(z: ToleranceZone): string {
  return `${z.kind} ${z.zone} from ${formatUm(z.lowerUm, { signed: true })} to ${formatUm(z.upperUm, { signed: true })} µm, ${sideOfZero(z)}`;
}

const RELATION: Record<FitKind, string> = {
  clearance: 'Clearance fit: the hole zone lies wholly above the shaft zone.',
  transition: 'Transition fit: the hole and shaft zones overlap.',
  interference: 'Interference fit: the shaft zone lies wholly above the hole zone.',
};

export function describeZones({ sizeLabel, hole, shaft, kind, readings }: Pick<Props, 'sizeLabel' | 'hole' | 'shaft' | 'kind' | 'readings'>): string {
  const zones = [hole, shaft].filter((z): z is ToleranceZone => z !== undefined).map(zoneWords).join('; ');
  const relation = kind ? ` ${RELATION[kind]}` : '';
  const plotted = readings?.length
    ? ` Readings plotted, oldest first: ${readings.map((r) => `${r.label}: ${r.text} (${formatUm(r.um, { signed: true })} µm), ${r.inside ? 'inside' : 'outside'}`).join('; ')}.`
    : '';
  return `Tolerance zones drawn to scale at ${sizeLabel} against the zero line (the nominal size): ${zones}.${relation}${plotted}`;
}

const halo = 'stroke-card [paint-order:stroke] [stroke-linejoin:round]';

/**
 * The tolerance zones of a hole and/or a shaft drawn to one µm scale against the zero line
 * (the nominal size), each box labelled with its deviations.
 */
export function ZoneDrawing(props: Props) {
  const { hole, shaft, unit, titles } = props;
  const id = useId().replace(/:/g, '');
  const zones = [hole, shaft].filter((z): z is ToleranceZone => z !== undefined);
  // Readings are plotted beside a single zone only: with two boxes the labels take that room.
  const readings = zones.length === 1 ? (props.readings ?? []) : [];

  const zoneHi = Math.max(0, ...zones.map((z) => z.upperUm));
  const zoneLo = Math.min(0, ...zones.map((z) => z.lowerUm));
  // A reading within one zone-height of the drawing widens the scale; one further off is marked at the edge.
  const reach = zoneHi - zoneLo || 1;
  const onScale = readings.filter((r) => r.um <= zoneHi + reach && r.um >= zoneLo - reach);
  let hi = Math.max(zoneHi, ...onScale.map((r) => r.um));
  let lo = Math.min(zoneLo, ...onScale.map((r) => r.um));
  // Head room where a reading sits at the edge or beyond it, so its mark clears the arrows of those off the scale.
  const pad = (hi - lo) * 0.12;
  if (readings.some((r) => r.um >= hi - 1e-9)) hi += pad;
  if (readings.some((r) => r.um <= lo + 1e-9)) lo -= pad;
  const span = hi - lo || 1;
  const y = (um: number) => PLOT_TOP + ((hi - um) / span) * (PLOT_BOTTOM - PLOT_TOP);
  const y0 = y(0);

  const step = niceStep(span / 4);
  const ticks: number[] = [];
  for (let t = Math.ceil(lo / step) * step; t <= hi + 1e-9; t += step) ticks.push(Math.abs(t) < 1e-9 ? 0 : Number(t.toPrecision(6)));

  // Long tick labels (tens of millimetres of tolerance at the coarse grades) shrink to stay inside the drawing.
  const longestTick = Math.max(...ticks.map((t) => formatUm(t, { signed: true }).length));
  const tickFont = Math.min(12, (AXIS_X - 8) / (longestTick * 0.62));

  const both = hole !== undefined && shaft !== undefined;
  // Hole on the left with its labels to the left; shaft on the right with its labels to the right.
  const columns = zones.map((z) => {
    const x = both ? (z.kind === 'hole' ? HOLE_X : SHAFT_X) : ZONE_X;
    const labelsLeft = both && z.kind === 'hole';
    const yU = y(z.upperUm);
    const yL = Math.max(y(z.lowerUm), yU + 2);
    const [lu, ll] = placeLabels(yU, yL, y0);
    return { z, x, labelsLeft, yU, yL, lu, ll };
  });
  // The zero line is drawn over the labels (a label on a zero edge sits on it) unless a pushed label's text would cross it.
  const zeroOverText = columns.some(({ lu, ll }) => [lu, ll].some((ly) => Math.abs(y0 - ly) > 1 && Math.abs(y0 - ly) < 19));
  const zeroLine = <line x1={AXIS_X} y1={y0} x2={W - 6} y2={y0} className="stroke-graphite" strokeWidth="2.5" />;

  const second = (um: number) => `${formatUmAs(um, unit, { signed: true })} ${unit}`;

  // The band between the hole's lower edge and the shaft's upper edge: the smallest gap, or the largest overlap.
  let band: { top: number; bottom: number; word: string; um: number; overlap: boolean } | null = null;
  if (hole && shaft && hole.lowerUm !== shaft.upperUm) {
    const overlap = shaft.upperUm > hole.lowerUm;
    band = {
      top: y(Math.max(hole.lowerUm, shaft.upperUm)),
      bottom: y(Math.min(hole.lowerUm, shaft.upperUm)),
      word: overlap ? 'overlap' : 'gap',
      um: Math.abs(hole.lowerUm - shaft.upperUm),
      overlap,
    };
  }

  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-label={describeZones(props)}
      className="mx-auto block h-auto w-full max-w-[36rem]"
      data-testid="zone-drawing"
    >
      <defs>
        <pattern id={`${id}-hole`} width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="7" className="stroke-dye" strokeWidth="2" />
        </pattern>
        <pattern id={`${id}-shaft`} width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(-45)">
          <line x1="0" y1="0" x2="0" y2="7" className="stroke-graphite-2" strokeWidth="1.5" />
        </pattern>
      </defs>

      {/* µm scale */}
      <text x={AXIS_X - 6} y={16} textAnchor="end" fontSize="12" className="fill-graphite-2">
        µm
      </text>
      <line x1={AXIS_X} y1={PLOT_TOP - 8} x2={AXIS_X} y2={PLOT_BOTTOM + 8} className="stroke-graphite-2" strokeWidth="1" />
      {ticks.map((t) => (
        <g key={t}>
          {t !== 0 ? <line x1={AXIS_X} y1={y(t)} x2={W - 6} y2={y(t)} className="stroke-rule" strokeWidth="1" strokeDasharray="2 4" /> : null}
          <line x1={AXIS_X - 4} y1={y(t)} x2={AXIS_X} y2={y(t)} className="stroke-graphite-2" strokeWidth="1" />
          <text x={AXIS_X - 7} y={y(t) + 4} textAnchor="end" fontSize={tickFont} className={`dim ${t === 0 ? 'fill-graphite font-bold' : 'fill-graphite-2'}`}>
            {formatUm(t, { signed: true })}
          </text>
        </g>
      ))}

      {band ? (
        <g data-band={band.word}>
          <rect
            x={HOLE_X + BOX_W}
            y={band.top}
            width={SHAFT_X - HOLE_X - BOX_W}
            height={Math.max(1, band.bottom - band.top)}
            className={band.overlap ? 'fill-scribe-soft stroke-scribe' : 'fill-dye-soft stroke-dye'}
            strokeWidth="1"
            strokeDasharray="3 2"
          />
          <text x={(HOLE_X + BOX_W + SHAFT_X) / 2} y={(band.top + band.bottom) / 2 - 2} textAnchor="middle" fontSize="13" strokeWidth="4" className={`fill-graphite ${halo}`}>
            {band.word}
          </text>
          <text x={(HOLE_X + BOX_W + SHAFT_X) / 2} y={(band.top + band.bottom) / 2 + 11} textAnchor="middle" fontSize="13" strokeWidth="4" className={`dim fill-graphite ${halo}`}>
            {formatUm(band.um)} µm
          </text>
        </g>
      ) : null}

      {columns.map(({ z, x }) => {
        const top = y(z.upperUm);
        const height = Math.max(2, y(z.lowerUm) - top);
        const isHole = z.kind === 'hole';
        return (
          <g key={z.kind}>
            <rect x={x} y={top} width={BOX_W} height={height} className={isHole ? 'fill-dye-soft' : 'fill-paper-2'} />
            <rect
              x={x}
              y={top}
              width={BOX_W}
              height={height}
              fill={`url(#${id}-${z.kind})`}
              className={isHole ? 'stroke-dye' : 'stroke-graphite'}
              strokeWidth="2"
            />
          </g>
        );
      })}

      {/* the zero line: the nominal size */}
      {zeroOverText ? zeroLine : null}

      {columns.map(({ z, x, labelsLeft, yU, yL, lu, ll }) => {
        const edgeX = labelsLeft ? x : x + BOX_W;
        const textX = labelsLeft ? x - 8 : x + BOX_W + 8;
        const anchor = labelsLeft ? 'end' : 'start';
        // Each deviation is written on a shelf level with its edge: µm above the shelf, mm or in below it.
        // A thin box pushes its two shelves apart; a leader then runs from the edge to the shelf.
        const label = (um: number, edgeY: number, ly: number, which: 'upper' | 'lower') => {
          const first = `${formatUm(um, { signed: true })} µm`;
          const next = second(um);
          const width = Math.max(first.length * 10.2, next.length * 8.4) + 2;
          const near = labelsLeft ? textX + 2 : textX - 2;
          const far = labelsLeft ? textX - width : textX + width;
          return (
            <g key={which} data-label={`${z.zone}-${which}`}>
              <rect x={Math.min(near, far) - 2} y={ly - 20} width={width + 6} height={41} className="fill-card" />
              <polyline
                points={`${edgeX},${edgeY} ${labelsLeft ? edgeX - 3 : edgeX + 3},${edgeY} ${near},${ly} ${far},${ly}`}
                fill="none"
                className="stroke-graphite-2"
                strokeWidth="1"
              />
              <text x={textX} y={ly - 5} textAnchor={anchor} fontSize="17" className="dim fill-graphite font-semibold">
                {first}
              </text>
              <text x={textX} y={ly + 15} textAnchor={anchor} fontSize="14" className="dim fill-graphite-2">
                {next}
              </text>
            </g>
          );
        };
        const itText = `${z.grade} = ${formatUm(z.itUm)} µm`;
        return (
          <g key={`labels-${z.kind}`}>
            {label(z.upperUm, yU, lu, 'upper')}
            {label(z.lowerUm, yL, ll, 'lower')}
            <text x={x + BOX_W / 2} y={H - 29} textAnchor="middle" fontSize="15" className="fill-graphite font-semibold">
              {titles?.[z.kind] ?? `${z.kind === 'hole' ? 'Hole' : 'Shaft'} ${z.zone}`}
            </text>
            <text x={x + BOX_W / 2} y={H - 10} textAnchor="middle" fontSize={Math.min(12, 100 / (itText.length * 0.62))} className="dim fill-graphite-2">
              {itText}
            </text>
          </g>
        );
      })}
      {zeroOverText ? null : zeroLine}

      {readings.length ? <ReadingMarks readings={readings} y={y} hi={hi} lo={lo} boxX={ZONE_X} /> : null}
    </svg>
  );
}

// Readings sit in a row left of the box, oldest first, each at its height on the µm scale.
const READ_LEFT = AXIS_X + 16;
const READ_RIGHT = ZONE_X - 14;

function ReadingMarks({ readings, y, hi, lo, boxX }: { readings: PlottedReading[]; y: (um: number) => number; hi: number; lo: number; boxX: number }) {
  const step = Math.min(26, (READ_RIGHT - READ_LEFT) / readings.length);
  const start = READ_RIGHT - step * (readings.length - 0.5);
  return (
    <g data-readings={readings.length}>
      {readings.map((r, i) => {
        const x = start + i * step;
        const latest = i === readings.length - 1;
        const above = r.um > hi + 1e-9;
        const below = r.um < lo - 1e-9;
        const key = `${i}-${r.label}`;
        if (above || below) {
          // Off the scale: an arrow at the edge pointing the way it lies, with its deviation.
          const edge = above ? PLOT_TOP - 10 : PLOT_BOTTOM + 10;
          const tip = above ? edge - 7 : edge + 7;
          return (
            <g key={key} data-reading={r.label} data-off-scale={above ? 'above' : 'below'}>
              <polygon points={`${x - 6},${edge} ${x + 6},${edge} ${x},${tip}`} className={r.inside ? 'fill-ok stroke-card' : 'fill-bad stroke-card'} strokeWidth="1" />
              <text x={x} y={above ? edge + 12 : edge - 15} textAnchor="middle" fontSize="10" strokeWidth="3" className={`dim fill-graphite ${halo}`}>
                {r.label}
              </text>
              <text x={x} y={above ? edge + 22 : edge - 5} textAnchor="middle" fontSize="8.5" strokeWidth="3" className={`dim fill-graphite-2 ${halo}`}>
                {formatUm(r.um, { signed: true })}
              </text>
            </g>
          );
        }
        const cy = y(r.um);
        return (
          <g key={key} data-reading={r.label} data-inside={r.inside ? 'yes' : 'no'}>
            {latest ? <line x1={x} y1={cy} x2={boxX} y2={cy} className={r.inside ? 'stroke-ok' : 'stroke-bad'} strokeWidth="1.5" strokeDasharray="4 3" /> : null}
            {r.inside ? (
              <circle cx={x} cy={cy} r={latest ? 6 : 5} className="fill-ok stroke-card" strokeWidth="1.5" />
            ) : (
              <g className="stroke-bad" strokeWidth={latest ? 3 : 2.5} strokeLinecap="round">
                <line x1={x - 5} y1={cy - 5} x2={x + 5} y2={cy + 5} />
                <line x1={x - 5} y1={cy + 5} x2={x + 5} y2={cy - 5} />
              </g>
            )}
            <text x={x} y={cy - 9} textAnchor="middle" fontSize="10" strokeWidth="3" className={`dim fill-graphite ${halo}`}>
              {r.label}
            </text>
          </g>
        );
      })}
    </g>
  );
}
