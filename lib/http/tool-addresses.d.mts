export const TOOL_ADDRESS_KEYS: Record<string, readonly string[]>;
export function fromAddressPath(page: string): string;
export const TOOL_BOXES_HEADER: string;
export function holdsBoxes(page: string, search: { getAll(key: string): string[] }): boolean;
export function toolAddressRewrites(): { source: string; has: { type: 'header'; key: string }[]; destination: string }[];
