// Which unit a page shows first: the one in the URL (?unit=in), else the project's preference.
import type { LengthUnit } from '@/lib/measurements';
import { parseNumber } from '@/lib/units/parse';

export function displayUnit(query: string | string[] | undefined, projectUnits: LengthUnit): LengthUnit {
  return query === 'in' || query === 'mm' ? query : projectUnits;
}

/** The same path with ?unit= set to the other unit, other query parameters kept. */
export function otherUnitHref(path: string, query: Record<string, string | string[] | undefined>, unit: LengthUnit): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (typeof v === 'string' && k !== 'unit') params.set(k, v);
  params.set('unit', unit === 'mm' ? 'in' : 'mm');
  return `${path}?${params.toString()}`;
}

/** A number as typed in a form field ("130,012" too; the schema's parser), or null while it is not one yet. */
export function parseNum(text: string | undefined): number | null {
  const n = parseNumber(text);
  return n === undefined || Number.isNaN(n) ? null : n;
}
