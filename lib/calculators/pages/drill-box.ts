/** The tap-drill page's "drill you have" box: a drill by its chart name, or a diameter with its unit. */
import { drillSize, type DrillSize } from '../drills';
import { CalculatorError } from '../errors';
import { parseNumber } from '../../units/parse';
import { MM_PER_INCH } from '../../units/format';

export interface DrillReading {
  diameterMm: number;
  /** The chart drill, when the text named one. */
  drill: DrillSize | null;
}

/**
 * A drill you have: a chart name (#7, F, 27/64, 6.8 mm) or any diameter with its unit (6.75 mm,
 * 0.2 in). A bare number is refused, as the drill chart refuses it: #7 and 7 mm differ by 1.9 mm.
 */
export function readDrill(text: string, field = 'drill'): DrillReading {
  try {
    const drill = drillSize(text);
    return { diameterMm: drill.diameterMm, drill };
  } catch (err) {
    const m = /^\s*(\d*[.,]?\d+)\s*(mm|in|inch|")\s*$/i.exec(text ?? '');
    if (m) {
      const n = parseNumber(m[1]) ?? Number.NaN;
      if (n > 0) return { diameterMm: m[2].toLowerCase() === 'mm' ? n : n * MM_PER_INCH, drill: null };
    }
    if (/^\s*\d*[.,]\d+\s*$/.test(text ?? '')) {
      throw new CalculatorError('UNREADABLE', field, `Give the unit: ${text.trim()} mm or ${text.trim()} in.`);
    }
    if (err instanceof CalculatorError) throw new CalculatorError(err.code, field, err.message);
    throw err;
  }
}
