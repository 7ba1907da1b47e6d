export const TOOL_ADDRESS_KEYS: Record<string, readonly string[]>;
export function fromAddressPath(page: string): string;
export function toolAddressRewrites(): { source: string; has: { type: 'query'; key: string }[]; destination: string }[];
