import 'server-only';
import type { Transaction } from 'sequelize';
import { initModels, Entry, SavedCalculation, User } from '../../db/models';
import { withTransaction } from '../../db/connection';
import { AppError } from '../errors';
import type { Actor } from '../auth/policy';
import { authorizeLog } from './log-scope';
import { isCalculatorError, isCalculatorKind, runCalculator, TABLES_VERSION, type CalculatorInputs, type CalculatorKind } from '../calculators';
import { CALCULATOR_NAMES, calculatorHref, defaultLabel, savedSummary } from '../calculators/pages/registry';
import { sanitizeInput, saveCalculationSchema } from '../validations/calculations';
import type { EntryCalculations, SavedCalculationView } from '../types/calculations';

type Loaded = SavedCalculation & { createdBy?: User | null };

function parse(json: string): unknown {
  try {
    return JSON.parse(json);
  } catch {
    return null;
  }
}

function toView(row: Loaded, creator: { id: number; name: string } | null): SavedCalculationView {
  const input = (parse(row.inputs) ?? {}) as Record<string, unknown>;
  const output = parse(row.outputs);
  const known = isCalculatorKind(row.calculator);
  let reopenHref: string | null = null;
  if (known) {
    try {
      reopenHref = calculatorHref(row.calculator as CalculatorKind, input, output);
    } catch {
      reopenHref = null;
    }
  }
  return {
    id: row.id,
    entryId: row.entryId,
    kind: row.calculator,
    known,
    calculatorName: known ? CALCULATOR_NAMES[row.calculator as CalculatorKind] : row.calculator,
    label: row.label,
    input,
    output,
    tablesVersion: row.tablesVersion,
    position: row.position,
    createdAt: row.createdAt.toISOString(),
    createdBy: creator,
    reopenHref,
    // Drawn here, so the page that shows the card needs none of the calculators' code.
    summary: savedSummary(String(row.calculator), input, output),
  };
}

async function creatorsOf(rows: SavedCalculation[], transaction?: Transaction): Promise<Map<number, { id: number; name: string }>> {
  const ids = [...new Set(rows.map((r) => r.createdById).filter((id): id is number => typeof id === 'number'))];
  if (!ids.length) return new Map();
  const users = await User.findAll({ where: { id: ids }, attributes: ['id', 'name'], transaction });
  return new Map(users.map((u) => [u.id, { id: u.id, name: u.name }]));
}

/**
 * Runs a calculator for a client's input. A refusal is a 400 naming the field (under `prefix`);
 * anything else the calculator trips over on odd input is a 400 too, never a 500.
 */
export function computeForClient<K extends CalculatorKind>(kind: K, input: Record<string, unknown>, prefix = '') {
  try {
    return runCalculator(kind, input as unknown as CalculatorInputs[K]);
  } catch (err) {
    if (isCalculatorError(err)) {
      const field = `${prefix}${err.field}`;
      throw new AppError('validation', err.message, { [field]: [err.message] });
    }
    if (err instanceof TypeError || err instanceof RangeError) {
      console.error('[scribeline] calculator could not read its input', kind, err);
      throw new AppError('validation', 'The calculator inputs could not be read.', { input: ['The calculator inputs could not be read.'] });
    }
    throw err;
  }
}

/** Saved calculations of an entry, in the order they were saved. */
export async function listEntryCalculations(actor: Actor, entryId: number): Promise<EntryCalculations> {
  initModels();
  await authorizeLog(actor, 'view', { entryId });
  const rows = await SavedCalculation.findAll({ where: { entryId }, order: [['position', 'ASC'], ['id', 'ASC']] });
  const creators = await creatorsOf(rows);
  return { calculations: rows.map((r) => toView(r, r.createdById ? creators.get(r.createdById) ?? null : null)), tablesVersion: TABLES_VERSION };
}

/**
 * Saves a calculation into an entry. The output is always computed here from the input, with the
 * tables of this version; whatever output a client sends is ignored.
 */
export async function saveCalculation(actor: Actor, entryId: number, body: unknown): Promise<SavedCalculationView> {
  initModels();
  return withTransaction(async (transaction) => {
    // The policy first: signed out is a 401 and someone else's entry a 403/404, whatever was sent.
    await authorizeLog(actor, 'editLog', { entryId }, transaction);
    const data = saveCalculationSchema.parse(body);
    let input: Record<string, unknown>;
    try {
      input = sanitizeInput(data.kind, data.input);
    } catch (err) {
      if (isCalculatorError(err)) throw new AppError('validation', err.message, { [`input.${err.field}`]: [err.message] });
      throw err;
    }
    const output = computeForClient(data.kind, input, 'input.');
    const label = data.label || defaultLabel(data.kind, input as never, output as never);
    // Saves into one entry take turns on its row; the locking read sees the positions the others committed
    // (a plain read would see the snapshot taken before the lock). Positions are also unique per entry.
    await Entry.findByPk(entryId, { attributes: ['id'], transaction, lock: transaction.LOCK.UPDATE });
    const last = await SavedCalculation.findOne({ where: { entryId }, attributes: ['position'], order: [['position', 'DESC']], transaction, lock: transaction.LOCK.UPDATE });
    const row = await SavedCalculation.create(
      {
        entryId,
        calculator: data.kind,
        label,
        inputs: JSON.stringify(input),
        outputs: JSON.stringify(output),
        tablesVersion: TABLES_VERSION,
        position: last ? last.position + 1 : 0,
        createdById: actor!.id,
      },
      { transaction },
    );
    // The answer is built inside the transaction: a save that committed is never reported as failed.
    const saved = (await SavedCalculation.findByPk(row.id, { transaction }))!;
    const creators = await creatorsOf([saved], transaction);
    return toView(saved, creators.get(saved.createdById ?? -1) ?? null);
  });
}

export async function deleteCalculation(actor: Actor, id: number): Promise<void> {
  initModels();
  await withTransaction(async (transaction) => {
    const row = await SavedCalculation.findByPk(id, { attributes: ['id', 'entryId'], transaction });
    if (!row) throw new AppError('not_found', 'That saved calculation was not found.');
    await authorizeLog(actor, 'editLog', { entryId: row.entryId }, transaction);
    await row.destroy({ transaction });
  });
}
