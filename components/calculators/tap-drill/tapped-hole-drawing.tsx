import { useId } from 'react';
import { formatPercent, type Length } from '@/lib/calculators/units';
import { formatIn, readoutMm } from '@/lib/units/format';

type Props = {
  designation: string;
  major: Length;
  pitchMm: number;
  drill: Length;
  /** Drill name, if it is a chart drill ("6.8 mm", "#7"). */
  drillName?: string | null;
  percent: number;
};

const W = 360;
const H = 320;
const CX = W / 2;
const TOP = 70;
const BOTTOM = 250;
const EDGE = 8;

/**
 * A section through the tapped hole, to scale across the hole: the part hatched, the thread the
 * tap cuts shaded between the drilled hole and the major diameter, and a dashed line where a full
 * (100 %) thread would end. Vertically the pitch is to the same scale, so coarse and fine threads
 * look like what they are.
 */
export function TappedHoleDrawing({ designation, major, pitchMm, drill, drillName, percent }: Props) {
  const hatchId = `${useId()}-hatch`;
  const s = 200 / major.mm; // px per mm: the major diameter spans 200 units
  const R = (major.mm / 2) * s;
  const rd = (drill.mm / 2) * s;
  const P = pitchMm * s;
  const Hf = (Math.sqrt(3) / 2) * P; // fundamental triangle height
  const r100 = R - 0.75 * Hf; // the 1.299·P double depth of the percentage relation
  const radiusAt = (y: number) => {
    const phase = (((y - TOP) % P) + P) % P; // 0..P, tooth crest at P/2
    const u = Math.abs(phase - P / 2);
    return Math.max(rd, R - Hf + (2 * Hf * u) / P);
  };
  const steps = Math.ceil((BOTTOM - TOP) / 1);
  const side = (sign: 1 | -1) => {
    const pts: string[] = [];
    for (let i = 0; i <= steps; i++) {
      const y = TOP + ((BOTTOM - TOP) * i) / steps;
      pts.push(`${(CX + sign * radiusAt(y)).toFixed(2)},${y.toFixed(2)}`);
    }
    pts.push(`${(CX + sign * R).toFixed(2)},${BOTTOM}`, `${(CX + sign * R).toFixed(2)},${TOP}`);
    return pts.join(' ');
  };
  const pct = formatPercent(percent);
  const description =
    `Section through the ${designation} tapped hole: major diameter ${readoutMm(major.mm)} mm, drilled ${readoutMm(drill.mm)} mm` +
    `${drillName ? ` (${drillName})` : ''}, leaving ${pct} of thread. The shaded teeth between the drilled hole and the major diameter are the thread the tap cuts.`;

  const dim = (y: number, half: number, text: string, sub: string, above: boolean) => (
    <g>
      <line x1={CX - half} y1={y} x2={CX + half} y2={y} className="stroke-graphite" strokeWidth={1} markerStart={`url(#${hatchId}-arrow)`} markerEnd={`url(#${hatchId}-arrow)`} />
      <line x1={CX - half} y1={above ? y - 4 : y + 4} x2={CX - half} y2={above ? TOP : BOTTOM} className="stroke-graphite-2" strokeWidth={0.7} />
      <line x1={CX + half} y1={above ? y - 4 : y + 4} x2={CX + half} y2={above ? TOP : BOTTOM} className="stroke-graphite-2" strokeWidth={0.7} />
      <text x={CX} y={above ? y - 22 : y + 16} textAnchor="middle" className="fill-graphite" fontSize={12} fontWeight={600}>
        {text}
      </text>
      <text x={CX} y={above ? y - 8 : y + 30} textAnchor="middle" className="fill-graphite-2" fontSize={11}>
        {sub}
      </text>
    </g>
  );

  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={description} className="mx-auto block h-auto w-full max-w-[24rem]" data-testid="tapped-hole-drawing">
      <defs>
        <pattern id={hatchId} width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width="7" height="7" className="fill-paper-2" />
          <line x1="0" y1="0" x2="0" y2="7" className="stroke-graphite-2" strokeWidth="1" opacity="0.6" />
        </pattern>
        <marker id={`${hatchId}-arrow`} viewBox="0 0 10 10" refX="5" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse">
          <path d="M 0 1 L 9 5 L 0 9 z" className="fill-graphite" />
        </marker>
      </defs>

      {/* The part, cut through the hole's axis. */}
      <rect x={EDGE} y={TOP} width={CX - R - EDGE} height={BOTTOM - TOP} fill={`url(#${hatchId})`} className="stroke-graphite" strokeWidth={1} />
      <rect x={CX + R} y={TOP} width={W - EDGE - CX - R} height={BOTTOM - TOP} fill={`url(#${hatchId})`} className="stroke-graphite" strokeWidth={1} />

      {/* The thread the tap cuts: the engaged depth, drill to major diameter. */}
      <g data-testid="engaged-thread">
        <polygon points={side(-1)} className="fill-dye-soft stroke-dye" strokeWidth={1.2} />
        <polygon points={side(1)} className="fill-dye-soft stroke-dye" strokeWidth={1.2} />
      </g>

      {/* Where 100 % of thread would end. */}
      <g className="stroke-scribe" strokeWidth={1} strokeDasharray="5 4">
        <line x1={CX - r100} y1={TOP - 4} x2={CX - r100} y2={BOTTOM + 4} />
        <line x1={CX + r100} y1={TOP - 4} x2={CX + r100} y2={BOTTOM + 4} />
      </g>

      {/* Axis. */}
      <line x1={CX} y1={TOP - 10} x2={CX} y2={BOTTOM + 10} className="stroke-graphite-2" strokeWidth={0.8} strokeDasharray="14 4 2 4" />

      <text x={CX} y={(TOP + BOTTOM) / 2 - 6} textAnchor="middle" className="fill-graphite" fontSize={24} fontWeight={700} data-testid="drawing-percent">
        {pct}
      </text>
      <text x={CX} y={(TOP + BOTTOM) / 2 + 14} textAnchor="middle" className="fill-graphite-2" fontSize={12}>
        of thread
      </text>

      {dim(TOP - 14, R, `Major Ø ${readoutMm(major.mm)} mm`, `${formatIn(major.in)} in`, true)}
      {dim(BOTTOM + 16, rd, `Drill Ø ${readoutMm(drill.mm)} mm${drillName && !drillName.endsWith('mm') ? ` (${drillName})` : ''}`, `${formatIn(drill.in)} in`, false)}
    </svg>
  );
}
