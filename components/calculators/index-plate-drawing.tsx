type Props = {
  /** Holes in the circle used. */
  holes: number;
  /** Holes to move past the one the pin is in. */
  count: number;
  /** Whole crank turns before counting holes. */
  wholeTurns?: number;
  /** Draw the sector arms (a dividing-head plate); a spindle plate for direct indexing has none. */
  arms?: boolean;
  /** What the plate is, for the description: "18-hole circle", "24-hole spindle plate". */
  name: string;
};

const SIZE = 300;
const C = SIZE / 2;
const RH = 104; // the hole circle
const RP = 138; // the plate's rim

const rad = (deg: number) => (deg * Math.PI) / 180;
// Hole 0, where the pin sits, at the top; holes counted clockwise, the way the crank usually turns.
const angleOf = (i: number, n: number) => 90 - (360 * i) / n;
const at = (deg: number, r: number) => ({ x: C + r * Math.cos(rad(deg)), y: C - r * Math.sin(rad(deg)) });
const f = (n: number) => n.toFixed(2);

/**
 * The index plate with the circle in use: the hole the pin sits in, the holes to count (filled and
 * numbered), and the sector arms set to take them in, so the move is seen before it is made.
 */
export function IndexPlateDrawing({ holes, count, wholeTurns = 0, arms = true, name }: Props) {
  const holeR = Math.max(1.8, Math.min(7, ((2 * Math.PI * RH) / holes) * 0.3));
  const numberEvery = count > 20 ? 5 : 1;
  // The arms bracket the holes they take in: half a space before the pin's hole and after the last counted.
  const half = 180 / holes;
  const a0 = angleOf(0, holes) + half;
  const a1 = angleOf(count, holes) - half;
  const first = at(a0, RH + 26);
  const last = at(a1, RH + 26);
  const large = a0 - a1 > 180 ? 1 : 0;
  const wedgeR = RH + 20;
  const w0 = at(a0, wedgeR);
  const w1 = at(a1, wedgeR);
  const description =
    `Index plate, the ${name}: from the hole the pin is in (at the top), ` +
    `${wholeTurns ? `turn the crank ${wholeTurns} full ${wholeTurns === 1 ? 'turn' : 'turns'}, then ` : ''}` +
    `count ${count} ${count === 1 ? 'hole' : 'holes'} clockwise, drawn filled and numbered` +
    (arms ? `; the sector arms take in ${count + 1} holes, the pin's hole and the ${count} counted.` : '.');

  return (
    <svg viewBox={`0 0 ${SIZE} ${SIZE}`} role="img" aria-label={description} className="mx-auto block h-auto w-full max-w-[20rem]" data-testid="index-plate-drawing">
      <circle cx={C} cy={C} r={RP} className="fill-paper-2 stroke-graphite" strokeWidth={1.5} />
      <circle cx={C} cy={C} r={RH} fill="none" className="stroke-graphite-2" strokeWidth={0.6} strokeDasharray="4 4" />

      {arms && count > 0 ? (
        <g data-testid="sector-arms">
          <path d={`M ${C} ${C} L ${f(w0.x)} ${f(w0.y)} A ${wedgeR} ${wedgeR} 0 ${large} 1 ${f(w1.x)} ${f(w1.y)} Z`} className="fill-dye-soft" opacity={0.85} />
          <line x1={C} y1={C} x2={f(first.x)} y2={f(first.y)} className="stroke-dye" strokeWidth={4} strokeLinecap="round" />
          <line x1={C} y1={C} x2={f(last.x)} y2={f(last.y)} className="stroke-dye" strokeWidth={4} strokeLinecap="round" />
        </g>
      ) : null}

      {Array.from({ length: holes }, (_, i) => {
        const p = at(angleOf(i, holes), RH);
        const counted = i > 0 && i <= count;
        const pin = i === 0;
        return (
          <circle
            key={i}
            data-plate-hole={i}
            data-counted={counted ? 'true' : undefined}
            cx={f(p.x)}
            cy={f(p.y)}
            r={f(pin ? holeR + 1.5 : holeR)}
            className={pin ? 'fill-graphite stroke-graphite' : counted ? 'fill-dye stroke-dye' : 'fill-card stroke-graphite-2'}
            strokeWidth={1.2}
          />
        );
      })}

      {Array.from({ length: count }, (_, k) => k + 1)
        .filter((i) => i % numberEvery === 0 || i === count)
        .map((i) => {
          const p = at(angleOf(i, holes), RH - holeR - 11);
          return (
            <text key={i} x={f(p.x)} y={f(p.y)} textAnchor="middle" dominantBaseline="central" className="fill-dye" fontSize={10} fontWeight={700}>
              {i}
            </text>
          );
        })}


      <circle cx={C} cy={C} r={16} className="fill-card stroke-graphite" strokeWidth={1.5} />
      <text x={C} y={C + 38} textAnchor="middle" className="fill-graphite" fontSize={12} fontWeight={600}>
        {wholeTurns ? `${wholeTurns} ${wholeTurns === 1 ? 'turn' : 'turns'} + ${count}` : `${count} ${count === 1 ? 'hole' : 'holes'}`}
      </text>
      <text x={C} y={C + 54} textAnchor="middle" className="fill-graphite-2" fontSize={11}>
        {name}
      </text>
      <path d={`M ${C + 24} ${C - 40} a 40 40 0 0 1 28 24`} fill="none" className="stroke-graphite-2" strokeWidth={1.2} markerEnd="url(#plate-arrow)" />
      <defs>
        <marker id="plate-arrow" viewBox="0 0 10 10" refX="5" refY="5" markerWidth="6" markerHeight="6" orient="auto-start-reverse">
          <path d="M 0 1 L 9 5 L 0 9 z" className="fill-graphite-2" />
        </marker>
      </defs>
    </svg>
  );
}
