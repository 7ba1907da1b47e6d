import { route } from '@/lib/http/route';
import { AppError } from '@/lib/errors';
import { authorizePublic } from '@/lib/auth/policy';
import { isCalculatorError, isCalculatorKind, TABLES_VERSION } from '@/lib/calculators';
import { inputFromQuery } from '@/lib/validations/calculations';
import { computeForClient } from '@/lib/server/calculations';


type Params = { kind: string };

/**
 * GET /api/calculators/tap-drill?designation=M8x1.25&targetPercent=75 → { kind, input, output, tablesVersion }.
 * Query names are the calculator's input names; lists comma separated, yes/no as 1/0.
 * A refused input is a 400 naming its field; an unknown calculator a 404.
 */
export const GET = route<Params>(async ({ req, user, params }) => {
  authorizePublic(user, 'useCalculators');
  const kind = params.kind;
  if (!isCalculatorKind(kind)) throw new AppError('not_found', `There is no calculator called "${String(kind).slice(0, 40)}".`);
  let input: Record<string, unknown>;
  try {
    input = inputFromQuery(kind, req.nextUrl.searchParams);
  } catch (err) {
    if (isCalculatorError(err)) throw new AppError('validation', err.message, { [err.field]: [err.message] });
    throw err;
  }
  const output = computeForClient(kind, input);
  return { kind, input, output, tablesVersion: TABLES_VERSION };
});
