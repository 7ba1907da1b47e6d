import { z } from 'zod';
import { CALCULATOR_KINDS, CalculatorError, type CalculatorKind } from '@/lib/calculators';
import { parseNumber } from '@/lib/units/parse';
import { BOX_NUMBER } from '@/lib/calculators/pages/numbers';

type FieldType = 'string' | 'number' | 'boolean' | 'numbers' | 'strings';

/**
 * The inputs each calculator reads, by the names of its input type. A query string or a saved
 * input is cut down to these, so nothing else is ever stored; the calculator itself judges the values.
 */
export const CALCULATOR_INPUT_FIELDS: { readonly [K in CalculatorKind]: Readonly<Record<string, FieldType>> } = {
  'thread-spec': { designation: 'string' },
  'thread-percent': { designation: 'string', drillDiameterMm: 'number' },
  'tap-drill': { designation: 'string', targetPercent: 'number', kinds: 'strings' },
  'clearance-hole': { size: 'string', fit: 'string' },
  counterbore: { size: 'string', fit: 'string', holeCentreToEdgeMm: 'number', holeSpacingMm: 'number' },
  'drill-size': { name: 'string' },
  'nearest-drills': { diameterMm: 'number', count: 'number', kinds: 'strings', side: 'string' },
  'bolt-circle': { diameterMm: 'number', holes: 'number', startAngleDeg: 'number', midway: 'boolean' },
  'simple-indexing': { divisions: 'number', ratio: 'number', circles: 'numbers', gears: 'numbers' },
  'direct-indexing': { divisions: 'number', plateHoles: 'number' },
  'spur-gear': { teeth: 'number', module: 'number', diametralPitch: 'number', pressureAngleDeg: 'number' },
  'spindle-speed': { cuttingSpeed: 'number', unit: 'string', diameterMm: 'number' },
  'speed-range': { material: 'string', tool: 'string', diameterMm: 'number' },
};

const MAX_LIST = 60;
const MAX_TEXT = 120;
const MAX_INPUT_JSON = 4000;

const TRUE = ['1', 'true', 'yes', 'on'];
const FALSE = ['0', 'false', 'no', 'off', ''];

/**
 * GET /api/calculators/<kind>?designation=M8x1.25&targetPercent=75 → the calculator's input.
 * Lists are comma separated (circles=15,16,17); yes/no as 1/0. Empty values are left out, so the
 * calculator's defaults apply. Throws CalculatorError naming the field for what cannot be read.
 */
export function inputFromQuery(kind: CalculatorKind, params: URLSearchParams): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [field, type] of Object.entries(CALCULATOR_INPUT_FIELDS[kind])) {
    const raw = params.get(field);
    if (raw === null || raw.trim() === '') continue;
    if (raw.length > 400) throw new CalculatorError('UNREADABLE', field, `${field} is too long.`);
    switch (type) {
      case 'string':
        out[field] = raw;
        break;
      case 'number':
        out[field] = parseNumber(raw, BOX_NUMBER);
        break;
      case 'boolean': {
        const v = raw.trim().toLowerCase();
        if (!TRUE.includes(v) && !FALSE.includes(v)) throw new CalculatorError('UNREADABLE', field, `Write ${field} as 1 (yes) or 0 (no).`);
        out[field] = TRUE.includes(v);
        break;
      }
      case 'numbers':
      case 'strings': {
        const parts = raw.split(',').map((p) => p.trim()).filter(Boolean);
        if (parts.length > MAX_LIST) throw new CalculatorError('OUT_OF_RANGE', field, `Give at most ${MAX_LIST} values for ${field}.`);
        if (type === 'strings') {
          out[field] = parts;
          break;
        }
        out[field] = parts.map((p) => {
          const n = parseNumber(p, BOX_NUMBER);
          if (n === undefined || Number.isNaN(n)) throw new CalculatorError('NOT_A_NUMBER', field, `Write ${field} as numbers separated by commas: "${p}" is not a number.`);
          return n;
        });
        break;
      }
    }
  }
  return out;
}

/**
 * A saved calculation's input as sent by a client, cut down to the fields its calculator reads.
 * Values keep their types (the calculator refuses wrong ones, naming the field); only what could
 * bloat the stored row is refused here.
 */
export function sanitizeInput(kind: CalculatorKind, raw: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [field, type] of Object.entries(CALCULATOR_INPUT_FIELDS[kind])) {
    const v = raw[field];
    if (v === undefined || v === null) continue;
    if (type === 'boolean' && typeof v !== 'boolean') throw new CalculatorError('UNREADABLE', field, `${field} must be true or false.`);
    if ((type === 'numbers' || type === 'strings') && Array.isArray(v) && v.length > MAX_LIST) {
      throw new CalculatorError('OUT_OF_RANGE', field, `Give at most ${MAX_LIST} values for ${field}.`);
    }
    if (typeof v === 'string' && v.length > MAX_TEXT) throw new CalculatorError('UNREADABLE', field, `${field} is too long.`);
    out[field] = v;
  }
  if (JSON.stringify(out).length > MAX_INPUT_JSON) throw new CalculatorError('OUT_OF_RANGE', 'input', 'The calculator inputs are too large to save.');
  return out;
}

export const calculationKindSchema = z.enum(CALCULATOR_KINDS as [CalculatorKind, ...CalculatorKind[]], {
  error: `Choose a calculator: ${CALCULATOR_KINDS.join(', ')}.`,
});

/** POST /api/entries/[id]/calculations. Any output sent along is ignored: the server computes it. */
export const saveCalculationSchema = z.object({
  kind: calculationKindSchema,
  input: z
    .record(z.string(), z.unknown(), { error: 'Send the calculator inputs as an object.' })
    .refine((v) => !Array.isArray(v), 'Send the calculator inputs as an object.'),
  label: z.string({ error: 'The label must be text.' }).trim().max(120, 'Keep the label under 120 characters.').optional(),
});
