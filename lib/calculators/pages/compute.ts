import { isCalculatorError } from '../errors';
import type { CalculatorInputs, CalculatorKind, CalculatorOutputs, Runners } from '../registry';
import type { CalcRequest } from './url-state';

export type OkOutcome = { [K in CalculatorKind]: { status: 'ok'; kind: K; input: CalculatorInputs[K]; output: CalculatorOutputs[K] } }[CalculatorKind];
export type Outcome = { status: 'empty' } | OkOutcome | { status: 'error'; field: string | null; message: string };

/**
 * Builds a page's request and runs it with the page's own calculators (`runners`, such as THREAD_RUNNERS from
 * lib/calculators/threads.ts, so the page loads no other calculator's code), in the browser on every keystroke
 * (the calculators are pure). A refusal comes back with the box it belongs to, from the page's map of
 * calculator field → box.
 */
export function attempt(build: () => CalcRequest | null, fields: Record<string, string>, runners: Partial<Runners<CalculatorKind>>): Outcome {
  try {
    const request = build();
    if (!request) return { status: 'empty' };
    const run = runners[request.kind] as ((input: never) => unknown) | undefined;
    if (!run) throw new Error(`This page does not work out ${request.kind}.`);
    const output = run(request.input as never);
    return { status: 'ok', kind: request.kind, input: request.input, output } as OkOutcome;
  } catch (err) {
    if (isCalculatorError(err)) {
      const box = fields[err.field] ?? (Object.values(fields).includes(err.field) ? err.field : null);
      return { status: 'error', field: box, message: err.message };
    }
    return { status: 'error', field: null, message: 'These inputs cannot be worked out. Check each box.' };
  }
}

/** The error for one box, if the outcome names it. */
export const errorFor = (o: Outcome, box: string) => (o.status === 'error' && o.field === box ? o.message : undefined);
/** An error that names no box on the page. */
export const looseError = (o: Outcome) => (o.status === 'error' && o.field === null ? o.message : undefined);
