/** Next's file-system page cache, handing pages back as bytes (route-cache-local.mjs); Next's cache handler interface. */
export default class RouteCacheLocal {
  constructor(ctx: {
    fs: unknown;
    dev: boolean;
    flushToDisk: boolean;
    serverDistDir: string;
    revalidatedTags: string[];
    maxMemoryCacheSize?: number;
  });
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  get(key: string, ctx: Record<string, unknown>): Promise<any>;
  set(key: string, data: unknown, ctx: Record<string, unknown>): Promise<void>;
}
