// The units a size is given in, without the schemas of lib/validations/fits.ts, for the fits page's form.
export const SIZE_UNITS = ['mm', 'in'] as const;
export type SizeUnit = (typeof SIZE_UNITS)[number];

export const SIZE_UNIT_OPTIONS = [
  { value: 'mm', label: 'mm' },
  { value: 'in', label: 'in' },
] as const;
