type PageValue = { kind: string; html?: string | Buffer; [field: string]: unknown };
type Entry = { value: PageValue | null; [field: string]: unknown };
export function withPageBytes(data: Entry | null | undefined): Entry | null | undefined;
export function pageValueAsBytes(value: PageValue | null | undefined): PageValue | null | undefined;
