import { route } from '@/lib/http/route';
import { AppError } from '@/lib/errors';
import { authorizePublic } from '@/lib/auth/policy';
import { fitsQuerySchema, type FitsEntry } from '@/lib/validations/fits';
import {
  analyseFit, inchFit, inchFitIsoComparison, isFitError, toleranceZone, type FitError, type InchFit, type ToleranceZone,
} from '@/lib/fits';
import { formatIn, formatMm, formatMmAs, formatUmAs } from '@/lib/units/format';


/** A length in µm, in mm (to 0.001, finer only for half micrometres) and in inches (to 0.0001), 25.4 mm to the inch. */
function amount(um: number) {
  return { um, mm: Number(formatUmAs(um, 'mm')), in: Number(formatUmAs(um, 'in')) };
}

function size(mm: number) {
  return { mm: Number(formatMmAs(mm, 'mm')), in: Number(formatMmAs(mm, 'in')) };
}

function zoneJson(z: ToleranceZone) {
  // Limit sizes from exact µm sums, rounded once for display.
  const nominalUm = z.nominalMm * 1000;
  return {
    zone: z.zone,
    kind: z.kind,
    letter: z.letter,
    grade: z.grade,
    tolerance: amount(z.itUm),
    fundamentalDeviation: amount(z.fundamentalUm),
    upperDeviation: amount(z.upperUm),
    lowerDeviation: amount(z.lowerUm),
    maxSize: size((nominalUm + z.upperUm) / 1000),
    minSize: size((nominalUm + z.lowerUm) / 1000),
  };
}

/** A length in thousandths of an inch, with its mm equivalent (0.0254 mm to the thou). */
function thou(t: number) {
  return { thou: t, in: Number(formatIn(t / 1000)), mm: Number(formatMm((t * 254) / 10_000)) };
}

function inchJson(f: InchFit) {
  const side = (s: InchFit['hole']) => ({
    grade: s.grade,
    upperDeviation: thou(s.upperThou),
    lowerDeviation: thou(s.lowerThou),
    tolerance: thou(s.toleranceThou),
    maxSize: { in: Number(formatIn(f.nominalIn + s.upperThou / 1000)), mm: Number(formatMm(f.nominalMm + (s.upperThou * 254) / 10_000)) },
    minSize: { in: Number(formatIn(f.nominalIn + s.lowerThou / 1000)), mm: Number(formatMm(f.nominalMm + (s.lowerThou * 254) / 10_000)) },
  });
  const iso = inchFitIsoComparison(f);
  return {
    fitClass: f.fitClass,
    family: f.family,
    familyTitle: f.familyTitle,
    kind: f.kind,
    step: f.step,
    source: f.source,
    hole: side(f.hole),
    shaft: side(f.shaft),
    maxClearance: thou(f.maxClearanceThou),
    minClearance: thou(f.minClearanceThou),
    // A comparison only: another standard, other limits.
    isoNearest: {
      fit: iso.fit,
      approximate: true,
      ...(iso.analysis
        ? { kind: iso.analysis.kind, maxClearance: amount(iso.analysis.maxClearanceUm), minClearance: amount(iso.analysis.minClearanceUm) }
        : { notDefined: iso.reason }),
    },
  };
}

/** Which query field an engine refusal belongs to. */
function fieldFor(err: FitError, entry: FitsEntry): string {
  if (entry.source === 'q') return 'q';
  if (err.code === 'SIZE_OUT_OF_RANGE' || err.code === 'INCH_SIZE_OUT_OF_RANGE' || err.code === 'INCH_CLASS_NOT_AT_SIZE') return 'size';
  return entry.fit !== undefined ? 'fit' : 'zone';
}

/**
 * GET /api/fits?size=25&fit=H7/g6 (or zone=H7; unit=in; round=1), or ?q=25+H7/g6.
 * ANSI B4.1 inch classes: ?q=1.5+RC4 or ?size=1.5&fit=RC4 (sizes in inches).
 * Answers { input, zone }, { input, fit } or { input, inchFit }; a refused entry is a 400 naming the field.
 */
export const GET = route(async ({ req, user }) => {
  authorizePublic(user, 'useCalculators');
  const entry = fitsQuerySchema.parse(Object.fromEntries(req.nextUrl.searchParams));
  const input = {
    ...(entry.source === 'q' ? { q: req.nextUrl.searchParams.get('q') } : {}),
    size: entry.nominalText,
    unit: entry.unit,
    ...(entry.inchClass !== undefined ? { fit: entry.inchClass } : entry.fit !== undefined ? { fit: entry.fit } : { zone: entry.zone }),
    roundJs: entry.roundJs,
    // The size the engine used, exactly (1 in is 25.4 mm), and in inches.
    nominal: { mm: entry.nominalMm, in: entry.unit === 'in' ? entry.nominalInput : size(entry.nominalMm).in },
  };
  try {
    if (entry.inchClass !== undefined) return { input, inchFit: inchJson(inchFit(entry.nominalInput, entry.inchClass)) };
    if (entry.fit !== undefined) {
      const f = analyseFit(entry.nominalMm, entry.fit, { roundJs: entry.roundJs });
      return {
        input,
        fit: {
          fit: f.fit,
          kind: f.kind,
          hole: zoneJson(f.hole),
          shaft: zoneJson(f.shaft),
          maxClearance: amount(f.maxClearanceUm),
          minClearance: amount(f.minClearanceUm),
        },
      };
    }
    return { input, zone: zoneJson(toleranceZone(entry.nominalMm, entry.zone as string, { roundJs: entry.roundJs })) };
  } catch (err) {
    if (!isFitError(err)) throw err;
    const field = fieldFor(err, entry);
    throw new AppError('validation', err.message, { [field]: [err.message] });
  }
});
