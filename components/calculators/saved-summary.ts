/**
 * What a saved result's card shows, read from its stored input and output (the record of what was
 * computed then, whatever the tables say now). Pure; a stored shape it cannot read gives null.
 */
import {
  formatAngle, formatPercent, formatRpm, TOOL_MATERIAL_NAMES, type BoltCircleResult, type ClearanceHoleResult, type CounterboreResult,
  type DirectIndexingResult, type DrillMatch, type DrillSize, type Length, type SimpleIndexingResult, type SpeedRangeResult,
  type SpindleSpeedResult, type SpurGearResult, type TapDrillResult, type ThreadPercentResult, type ThreadSpec,
} from '@/lib/calculators';
import { numberText } from '@/lib/calculations/numbers';

export type SummaryValue = { text?: string; len?: Length; first?: 'mm' | 'in'; note?: string };
export type SummaryRow = { label: string; value: SummaryValue; strong?: boolean };
export type SummaryTable = { caption: string; head: string[]; rows: { key: string; cells: (string | Length)[] }[]; more: number };
export type Summary = { inputs: { label: string; value: SummaryValue }[]; results: SummaryRow[]; table?: SummaryTable; warnings: string[] };

type In = Record<string, unknown>;
const len = (l: Length, first: 'mm' | 'in' = 'mm'): SummaryValue => ({ len: l, first });
const mmLen = (mm: number): Length => ({ mm, in: mm / 25.4 });
const warningsOf = (o: { warnings?: { message: string }[] }) => (o.warnings ?? []).map((w) => w.message);
const firstOf = (d: DrillSize): 'mm' | 'in' => (d.kind === 'metric' ? 'mm' : 'in');
const TABLE_ROWS = 12;

function threadRows(t: ThreadSpec): SummaryRow[] {
  const first = t.system === 'unified' ? 'in' : 'mm';
  return [
    { label: 'Major diameter', value: len(t.major, first) },
    { label: t.tpi ? `Pitch (${t.tpi} TPI)` : 'Pitch', value: len(t.pitch, first) },
  ];
}

function summarize(kind: string, input: In, output: unknown): Summary | null {
  switch (kind) {
    case 'tap-drill': {
      const o = output as TapDrillResult;
      const c = o.choice;
      const results: SummaryRow[] = [
        { label: 'Tap drill', value: { text: c.drill.name, len: c.drill.diameter, first: firstOf(c.drill), note: `${formatPercent(c.percent)} of thread` }, strong: true },
      ];
      if (o.bestInch && o.bestInch.drill.name !== c.drill.name) {
        results.push({ label: 'Best inch drill', value: { text: o.bestInch.drill.name, len: o.bestInch.drill.diameter, first: 'in', note: formatPercent(o.bestInch.percent) } });
      }
      if (o.bestMetric && o.bestMetric.drill.name !== c.drill.name) {
        results.push({ label: 'Best metric drill', value: { text: o.bestMetric.drill.name, len: o.bestMetric.drill.diameter, first: 'mm', note: formatPercent(o.bestMetric.percent) } });
      }
      return {
        inputs: [
          { label: 'Thread', value: { text: o.thread.designationWithPitch } },
          { label: 'Target', value: { text: `${numberText(o.targetPercent, 1)} %` } },
        ],
        results,
        warnings: warningsOf(o),
      };
    }
    case 'thread-percent': {
      const o = output as ThreadPercentResult;
      return {
        inputs: [
          { label: 'Thread', value: { text: o.thread.designationWithPitch } },
          { label: 'Drill', value: { text: o.drillSize?.name, len: o.drill } },
        ],
        results: [
          { label: 'Thread engagement', value: { text: `${formatPercent(o.percent)} of thread` }, strong: true },
          { label: 'Thread depth each side', value: len(o.threadDepth) },
        ],
        warnings: warningsOf(o),
      };
    }
    case 'thread-spec': {
      const o = output as ThreadSpec;
      return {
        inputs: [{ label: 'Thread', value: { text: o.designationWithPitch } }],
        results: [...threadRows(o), { label: 'Basic minor diameter of the nut', value: len(o.minorDiameterInternal, o.system === 'unified' ? 'in' : 'mm') }],
        warnings: [],
      };
    }
    case 'clearance-hole': {
      const o = output as ClearanceHoleResult;
      return {
        inputs: [
          { label: 'Screw', value: { text: o.screw.size } },
          { label: 'Class', value: { text: `${o.fit}${o.isoSeries ? ` (ISO 273 ${o.isoSeries})` : ''}` } },
        ],
        results: [
          { label: 'Clearance hole', value: { text: o.drill.kind === 'metric' ? undefined : o.drill.name, len: o.diameter, first: firstOf(o.drill) }, strong: true },
          ...(o.drillOtherSystem ? [{ label: 'Other system, not smaller', value: { text: o.drillOtherSystem.name, len: o.drillOtherSystem.diameter, first: firstOf(o.drillOtherSystem) } }] : []),
        ],
        warnings: [],
      };
    }
    case 'counterbore': {
      const o = output as CounterboreResult;
      const first = o.screw.system === 'metric' ? 'mm' : 'in';
      const inputs: Summary['inputs'] = [
        { label: 'Screw', value: { text: `${o.screw.size} socket head cap screw` } },
        { label: 'Through hole', value: { text: o.throughHole.fit } },
      ];
      if (typeof input.holeCentreToEdgeMm === 'number') inputs.push({ label: 'Centre to edge', value: len(mmLen(input.holeCentreToEdgeMm)) });
      if (typeof input.holeSpacingMm === 'number') inputs.push({ label: 'Hole spacing', value: len(mmLen(input.holeSpacingMm)) });
      return {
        inputs,
        results: [
          { label: 'Counterbore Ø', value: len(o.counterbore.diameter, first), strong: true },
          { label: 'Counterbore depth', value: len(o.counterbore.depth, first), strong: true },
          { label: 'Through hole', value: { text: o.throughHole.drill.kind === 'metric' ? undefined : o.throughHole.drill.name, len: o.throughHole.diameter, first } },
          ...(o.wall.toEdge ? [{ label: 'Wall to the edge', value: len(o.wall.toEdge, first) }] : []),
          ...(o.wall.betweenHoles ? [{ label: 'Wall between holes', value: len(o.wall.betweenHoles, first) }] : []),
        ],
        warnings: warningsOf(o),
      };
    }
    case 'drill-size': {
      const o = output as DrillSize;
      return {
        inputs: [{ label: 'Drill', value: { text: o.name } }],
        results: [{ label: 'Diameter', value: len(o.diameter, firstOf(o)), strong: true }],
        warnings: [],
      };
    }
    case 'nearest-drills': {
      const o = output as DrillMatch[];
      return {
        inputs: [{ label: 'Diameter', value: len(mmLen(Number(input.diameterMm))) }],
        results: o.slice(0, 3).map((m, i) => ({
          label: i === 0 ? 'Nearest drill' : 'Next',
          value: { text: m.drill.name, len: m.drill.diameter, first: firstOf(m.drill), note: `${m.difference.mm >= 0 ? '+' : '−'}${Math.abs(m.difference.mm).toFixed(3)} mm` },
          strong: i === 0,
        })),
        warnings: [],
      };
    }
    case 'bolt-circle': {
      const o = output as BoltCircleResult;
      const holes = [...o.holes.map((h) => ({ h, mark: '' })), ...(o.midwayHoles ?? []).map((h) => ({ h, mark: '′' }))];
      return {
        inputs: [
          { label: 'Diameter', value: len(o.diameter) },
          { label: 'Holes', value: { text: `${o.holeCount}${o.midwayHoles ? ` + ${o.midwayHoles.length} midway` : ''}` } },
          { label: 'Hole 1 at', value: { text: formatAngle(o.startAngleDeg) } },
        ],
        results: [
          { label: 'Between holes', value: { text: formatAngle(o.stepDeg) } },
          { label: 'Chord', value: len(o.chord) },
        ],
        table: {
          caption: 'Hole positions from the centre',
          head: ['Hole', 'Angle', 'X', 'Y'],
          rows: holes.slice(0, TABLE_ROWS).map(({ h, mark }) => ({ key: `${h.index}${mark}`, cells: [`${h.index}${mark}`, formatAngle(h.angleDeg), h.x, h.y] })),
          more: Math.max(0, holes.length - TABLE_ROWS),
        },
        warnings: [],
      };
    }
    case 'simple-indexing': {
      const o = output as SimpleIndexingResult;
      const results: SummaryRow[] = [];
      if (o.move) {
        results.push({ label: 'Each division', value: { text: o.move.description }, strong: true });
        if (o.move.sector) results.push({ label: 'Sector arms', value: { text: `take in ${o.move.sector.holesBetweenArms} holes (${o.move.sector.spaces} spaces)` } });
      } else if (o.differential) {
        results.push({ label: 'Differential', value: { text: o.differential.description }, strong: true });
      } else {
        results.push({ label: 'Not possible', value: { text: o.message } });
      }
      return {
        inputs: [
          { label: 'Divisions', value: { text: String(o.divisions) } },
          { label: 'Head', value: { text: `${o.ratio}:1` } },
          { label: 'Hole circles', value: { text: Array.isArray(input.circles) ? (input.circles as number[]).join(', ') : 'commonly supplied plates' } },
        ],
        results,
        warnings: o.possible ? [] : [o.message],
      };
    }
    case 'direct-indexing': {
      const o = output as DirectIndexingResult;
      return {
        inputs: [
          { label: 'Divisions', value: { text: String(o.divisions) } },
          { label: 'Spindle plate', value: { text: `${o.plateHoles} holes` } },
        ],
        results: [{ label: 'Each division', value: { text: `${o.holesToMove} ${o.holesToMove === 1 ? 'hole' : 'holes'}` }, strong: true }],
        warnings: [],
      };
    }
    case 'spur-gear': {
      const o = output as SpurGearResult;
      const first = o.system === 'module' ? 'mm' : 'in';
      return {
        inputs: [
          { label: 'Teeth', value: { text: String(o.teeth) } },
          { label: o.system === 'module' ? 'Module' : 'Diametral pitch', value: { text: o.system === 'module' ? numberText(o.module, 4) : numberText(o.diametralPitch, 4) } },
          { label: 'Pressure angle', value: { text: `${o.pressureAngleDeg}°` } },
        ],
        results: [
          { label: 'Blank (outside) Ø', value: len(o.outsideDiameter, first), strong: true },
          { label: 'Pitch Ø', value: len(o.pitchDiameter, first) },
          { label: 'Whole depth', value: len(o.wholeDepth, first) },
          ...(o.cutter ? [{ label: 'Involute cutter', value: { text: o.cutter.label } }] : []),
        ],
        warnings: warningsOf(o),
      };
    }
    case 'spindle-speed': {
      const o = output as SpindleSpeedResult;
      return {
        inputs: [
          { label: 'Cutting speed', value: { text: `${numberText(o.cuttingSpeed.mPerMin, 1)} m/min (${numberText(o.cuttingSpeed.sfm, 0)} ft/min)` } },
          { label: 'Diameter', value: len(o.diameter) },
        ],
        results: [{ label: 'Spindle speed', value: { text: formatRpm(o.rpm) }, strong: true }],
        warnings: [],
      };
    }
    case 'speed-range': {
      const o = output as SpeedRangeResult;
      return {
        inputs: [
          { label: 'Material', value: { text: o.row.name } },
          { label: 'Tool', value: { text: TOOL_MATERIAL_NAMES[o.tool] } },
          { label: 'Diameter', value: len(o.diameter) },
        ],
        results: [
          { label: 'Start at', value: { text: `${Math.round(o.rpm[0])}–${Math.round(o.rpm[1])} rev/min` }, strong: true },
          { label: 'Cutting speed', value: { text: `${o.cuttingSpeed.mPerMin[0]}–${o.cuttingSpeed.mPerMin[1]} m/min (${o.cuttingSpeed.sfm[0]}–${o.cuttingSpeed.sfm[1]} ft/min)` } },
        ],
        warnings: [],
      };
    }
    default:
      return null;
  }
}

export function savedSummary(kind: string, input: In, output: unknown): Summary | null {
  if (!output || typeof output !== 'object') return null;
  try {
    return summarize(kind, input ?? {}, output);
  } catch {
    // A stored shape this version cannot read: the card still shows its label and the reopen link.
    return null;
  }
}
