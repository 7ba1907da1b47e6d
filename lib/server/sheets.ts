import 'server-only';
import { initModels } from '../../db/models';
import { AppError } from '../errors';
import type { Actor } from '../auth/policy';
import { authorizeLog, withReadMemo } from './log-scope';
import { getSession } from './sessions';
import { listEntryMeasurements } from './measurements';
import { listEntryCalculations } from './calculations';
import { listEntryFlags } from './flags';
import { formatClock } from '../chapters';
import { instrumentFor, sheetLimits } from '../measurements/shop-sheet';
import { instrumentLabel, verdictShort } from '../measurements';
import { savedSummary } from '../calculators/pages/registry';
import { formatAngle, TABLES_VERSION } from '../calculators';
import { cautionsFor, DEFERRAL_LINE } from '../safety/cautions';
import { OPERATIONS, type Operation } from '../validations/log';
import type { BoltCircleResult } from '../calculators';
import type { Summary } from '../calculators/pages/summary';
import type { FlagView } from '../types/flags';
import type { MeasurementView } from '../types/measurements';
import type { SavedCalculationView } from '../types/calculations';
import type { SessionSheet, SheetCalculation, SheetCaution, SheetFlag, SheetRecord } from '../types/sheets';

/** A sheet names at most this many chosen records (a query string is no place for more). */
export const SHEET_MAX_RECORDS = 100;

/**
 * Reads `?records=3,7,12` (or repeated `records=`): the records a sheet is narrowed to. Empty or absent is
 * every record of the session. Anything else than positive whole numbers is a 400 naming `records`.
 */
function parseRecordChoice(values: string | string[] | null | undefined): number[] | null {
  const list = (Array.isArray(values) ? values : values ? [values] : []).flatMap((v) => v.split(',')).map((v) => v.trim()).filter(Boolean);
  if (!list.length) return null;
  const bad = () => new AppError('validation', 'Records must be a list of record numbers, e.g. 3,7.', { records: ['Records must be a list of record numbers, e.g. 3,7.'] });
  if (list.length > SHEET_MAX_RECORDS) {
    const message = `Choose at most ${SHEET_MAX_RECORDS} records for one sheet.`;
    throw new AppError('validation', message, { records: [message] });
  }
  const ids = list.map((v) => (/^\d{1,10}$/.test(v) ? Number(v) : NaN));
  if (ids.some((id) => !Number.isSafeInteger(id) || id <= 0)) throw bad();
  return [...new Set(ids)];
}

function toSheetRecord(r: MeasurementView): SheetRecord {
  const last = r.readings[r.readings.length - 1];
  const instrument = instrumentFor(r.limits, r.kind, r.unit);
  const lastInstrument = last ? instrumentLabel(last.instrument) : null;
  return {
    id: r.id,
    feature: r.feature,
    kind: r.kind,
    entryTitle: r.entry.title,
    nominalText: `${r.nominalText} ${r.unit}`,
    unit: r.unit,
    specLabel: r.limits.label,
    source: r.limits.source,
    sizes: sheetLimits(r.limits, r.unit),
    instrument,
    lastInstrument: lastInstrument && last!.instrument !== instrument.instrument ? lastInstrument : null,
    latest: last ? { valueText: last.valueText, unit: last.unit, verdict: verdictShort(r.verdict, r.unit) } : null,
    readingCount: r.readings.length,
  };
}

/** The saved card's summary; a bolt circle lists every hole (the card stops at twelve), since the sheet is worked from. */
function sheetSummary(c: SavedCalculationView): Summary | null {
  const summary = savedSummary(String(c.kind), c.input, c.output);
  if (!summary || c.kind !== 'bolt-circle' || !summary.table) return summary;
  const o = c.output as BoltCircleResult;
  const holes = [...o.holes.map((h) => ({ h, mark: '' })), ...(o.midwayHoles ?? []).map((h) => ({ h, mark: '′' }))];
  return {
    ...summary,
    table: {
      caption: `${summary.table.caption} (${o.convention})`,
      head: [...summary.table.head, 'Turn from hole 1'],
      rows: holes.map(({ h, mark }) => ({
        key: `${h.index}${mark}`,
        cells: [`${h.index}${mark}`, formatAngle(h.angleDeg), h.x, h.y, formatAngle(h.turnFromFirstDeg)],
      })),
      more: 0,
    },
  };
}

function toSheetCalculation(c: SavedCalculationView, entryTitle: string): SheetCalculation {
  let summary: Summary | null;
  try {
    summary = sheetSummary(c);
  } catch {
    summary = null;
  }
  return {
    id: c.id,
    entryTitle,
    label: c.label,
    calculatorName: c.calculatorName,
    kind: String(c.kind),
    summary,
    olderTables: c.tablesVersion !== TABLES_VERSION ? c.tablesVersion : null,
  };
}

function toSheetFlag(f: FlagView): SheetFlag {
  const t = f.target;
  const target = t.kind === 'note' ? `Note at ${formatClock(t.startMs)}` : t.kind === 'measurement' ? `Measurement: ${t.feature}` : null;
  return {
    id: f.id, entryTitle: f.entryTitle, target, severity: f.severity, hazard: f.hazard, status: f.status, mentor: f.mentor.name, concern: f.concern, instead: f.instead,
  };
}

/** Each caution once, naming the operations of this session that call for it, in the order they first come. */
function sessionCautions(operations: Operation[]): SheetCaution[] {
  const out = new Map<string, SheetCaution>();
  for (const op of operations) {
    const found = cautionsFor(op);
    const opLabel = OPERATIONS.find((o) => o.value === op)?.label ?? op;
    for (const c of found?.cautions ?? []) {
      const have = out.get(c.id);
      if (have) {
        if (!have.operations.includes(opLabel)) have.operations.push(opLabel);
      } else out.set(c.id, { id: c.id, title: c.title, text: c.text, operations: [opLabel] });
    }
  }
  return [...out.values()];
}

/**
 * A session's shop sheet: its records' sizes in both units with the instrument to use, the saved results
 * (bolt circles, indexing, holes), the open mentor flags and the usual cautions of its operations. For the
 * builder's circle only (policy `printSheet`); `records` ("3,7" or a list) narrows the records to those chosen, each of
 * which must be one of the session's (else a 400 naming `records`).
 */
export async function loadSessionSheet(actor: Actor, sessionId: number, records: string | string[] | null = null): Promise<SessionSheet> {
  initModels();
  return withReadMemo(async () => {
    // Who asks comes before what they sent.
    const scope = await authorizeLog(actor, 'printSheet', { sessionId });
    const recordIds = parseRecordChoice(records);
    const { session } = await getSession(actor, sessionId);
    const entries = session.entries;
    const [measurements, calculations, flags] = await Promise.all([
      Promise.all(entries.map((e) => listEntryMeasurements(actor, e.id))),
      Promise.all(entries.map((e) => listEntryCalculations(actor, e.id))),
      Promise.all(entries.map((e) => listEntryFlags(actor, e.id))),
    ]);
    const allRecords = measurements.flat();
    if (recordIds) {
      const known = new Set(allRecords.map((r) => r.id));
      const strangers = recordIds.filter((id) => !known.has(id));
      if (strangers.length) {
        const message = `Record ${strangers.join(', ')} is not one of this session’s records.`;
        throw new AppError('validation', message, { records: [message] });
      }
    }
    const chosen = recordIds ? allRecords.filter((r) => recordIds.includes(r.id)) : allRecords;
    const titleOf = new Map(entries.map((e) => [e.id, e.title]));
    return {
      project: { id: scope.projectId, slug: scope.projectSlug, title: scope.projectTitle, units: scope.units },
      session: { id: session.id, title: session.title, position: session.position, heldOn: session.heldOn, planned: session.planned },
      entries: entries.map((e) => ({ id: e.id, title: e.title, operation: e.operation })),
      allRecords: allRecords.map((r) => ({ id: r.id, feature: r.feature, entryTitle: r.entry.title })),
      chosen: recordIds,
      records: chosen.map(toSheetRecord),
      calculations: calculations.flatMap((list) => list.calculations.map((c) => toSheetCalculation(c, titleOf.get(c.entryId) ?? ''))),
      flags: flags.flat().filter((f) => f.status !== 'resolved').map(toSheetFlag),
      cautions: sessionCautions(entries.map((e) => e.operation)),
      deferral: DEFERRAL_LINE,
      tablesVersion: TABLES_VERSION,
    };
  });
}
