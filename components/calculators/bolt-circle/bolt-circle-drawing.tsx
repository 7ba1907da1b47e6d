import type { BoltCircleResult, BoltHole } from '@/lib/calculators/bolt-circle';
import { formatIn, readoutMm } from '@/lib/units/format';

const SIZE = 400;
const C = SIZE / 2;
const R = 138;

const rad = (deg: number) => (deg * Math.PI) / 180;
/** Drawing coordinates of a point at an angle (from +X, counter-clockwise) and a radius: Y up, so SVG y flips. */
const at = (deg: number, r: number) => ({ x: C + r * Math.cos(rad(deg)), y: C - r * Math.sin(rad(deg)) });
const f = (n: number) => n.toFixed(2);

/** Which holes get a number: all of them while there is room, else every k-th (hole 1 always). */
function labelled(n: number, total: number): boolean {
  const every = Math.ceil(total / 24);
  return n === 1 || (n - 1) % every === 0;
}

/**
 * The bolt circle as drawn on a layout: the pitch circle as a chain line, the centre cross, each
 * hole numbered counter-clockwise from hole 1, the start angle measured from +X, and the midway
 * pattern as squares so it reads without colour.
 */
export function BoltCircleDrawing({ result }: { result: BoltCircleResult }) {
  const n = result.holeCount;
  const all = n + (result.midwayHoles?.length ?? 0);
  // Holes as big as the spacing allows, so 3 holes read as holes and 120 do not touch.
  const spacing = 2 * R * Math.sin(Math.PI / all);
  const holeR = Math.max(2, Math.min(13, spacing * 0.32));
  const start = result.startAngleDeg;
  const arcR = 46;
  const arcEnd = at(start, arcR);
  const largeArc = start > 180 ? 1 : 0;
  const labelAt = at(start / 2, arcR + 16);
  const description =
    `Bolt circle drawing: ${n} holes, drawn as circles and numbered counter-clockwise, on a ${readoutMm(result.diameter.mm)} mm (${formatIn(result.diameter.in)} in) circle; ` +
    `hole 1 at ${Number(start.toFixed(3))}° from +X` +
    (result.midwayHoles ? `; ${result.midwayHoles.length} midway holes drawn as squares` : '') +
    '.';

  const holeLabel = (h: BoltHole, text: string, r: number) => {
    const p = at(h.angleDeg, r);
    return (
      <text x={f(p.x)} y={f(p.y)} textAnchor="middle" dominantBaseline="central" className="fill-graphite" fontSize={n > 24 ? 10 : 13} fontWeight={h.index === 1 ? 700 : 500}>
        {text}
      </text>
    );
  };

  return (
    <svg viewBox={`0 0 ${SIZE} ${SIZE}`} role="img" aria-label={description} className="mx-auto block h-auto w-full max-w-[26rem]" data-testid="bolt-circle-drawing">
      {/* Axes through the centre, labelled in the convention the coordinates use. */}
      <g className="stroke-graphite-2" strokeWidth={0.8} opacity={0.55}>
        <line x1={16} y1={C} x2={SIZE - 22} y2={C} />
        <line x1={C} y1={SIZE - 16} x2={C} y2={22} />
      </g>
      <text x={SIZE - 18} y={C + 4} className="fill-graphite-2" fontSize={12}>
        +X
      </text>
      <text x={C - 10} y={16} className="fill-graphite-2" fontSize={12}>
        +Y
      </text>

      {/* Pitch circle as a chain line. */}
      <circle cx={C} cy={C} r={R} fill="none" className="stroke-dye" strokeWidth={1.2} strokeDasharray="14 4 2 4" />

      {/* Centre cross. */}
      <g className="stroke-graphite" strokeWidth={1.6}>
        <line x1={C - 10} y1={C} x2={C + 10} y2={C} />
        <line x1={C} y1={C - 10} x2={C} y2={C + 10} />
      </g>

      {/* Start angle, from +X to hole 1. */}
      <g data-testid="start-angle">
        <line x1={C} y1={C} x2={f(at(start, R).x)} y2={f(at(start, R).y)} className="stroke-dye" strokeWidth={1} strokeDasharray="3 3" />
        {start > 0.0005 ? (
          <path d={`M ${C + arcR} ${C} A ${arcR} ${arcR} 0 ${largeArc} 0 ${f(arcEnd.x)} ${f(arcEnd.y)}`} fill="none" className="stroke-dye" strokeWidth={1.5} />
        ) : null}
        <text x={f(start > 0.0005 ? labelAt.x : C + arcR + 16)} y={f(start > 0.0005 ? labelAt.y : C - 10)} textAnchor="middle" dominantBaseline="central" className="fill-dye" fontSize={12} fontWeight={600}>
          {Number(start.toFixed(3))}°
        </text>
      </g>

      {result.holes.map((h) => {
        const p = at(h.angleDeg, R);
        return (
          <g key={`h${h.index}`}>
            <circle
              data-hole={h.index}
              cx={f(p.x)}
              cy={f(p.y)}
              r={f(holeR)}
              className={h.index === 1 ? 'fill-dye-soft stroke-dye' : 'fill-card stroke-graphite'}
              strokeWidth={h.index === 1 ? 2.4 : 1.6}
            />
            {labelled(h.index, n) ? holeLabel(h, String(h.index), R + holeR + 12) : null}
          </g>
        );
      })}

      {result.midwayHoles?.map((h) => {
        const p = at(h.angleDeg, R);
        const s = holeR * 1.6;
        return (
          <g key={`m${h.index}`}>
            <rect data-midway-hole={h.index} x={f(p.x - s / 2)} y={f(p.y - s / 2)} width={f(s)} height={f(s)} className="fill-scribe-soft stroke-scribe" strokeWidth={1.6} />
            {labelled(h.index, n) ? holeLabel(h, `${h.index}′`, R - holeR - 14) : null}
          </g>
        );
      })}
    </svg>
  );
}
