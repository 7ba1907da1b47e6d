import type { ServerResponse } from 'node:http';

/** What the app's route handler registers for a batch of presigned uploads. */
export interface RouteMetadata {
  fileKeys: string[];
  metadata: Record<string, unknown>;
  isDev: boolean;
  callbackUrl: string;
  callbackSlug: string;
  awaitServerData: boolean;
}

export interface Registration extends RouteMetadata {
  /** Dev mode only: the still-open /route-metadata response. */
  stream: ServerResponse | null;
  /** Keys whose callback (or error) has not been delivered yet. */
  pending: Set<string>;
}

/**
 * Route metadata by file key. A dev-mode registration keeps its stream open
 * until every one of its files has been handled, or until `ttlMs` passes so
 * an app that never uploads does not hold a connection forever.
 */
export class RegistrationTable {
  private readonly byKey = new Map<string, Registration>();
  private readonly waiters = new Map<string, Set<(reg: Registration | null) => void>>();
  private readonly timers = new Set<NodeJS.Timeout>();

  constructor(private readonly ttlMs: number) {}

  register(meta: RouteMetadata, stream: ServerResponse | null): Registration {
    const reg: Registration = { ...meta, stream, pending: new Set(meta.fileKeys) };
    for (const key of meta.fileKeys) {
      this.byKey.set(key, reg);
      const waiting = this.waiters.get(key);
      this.waiters.delete(key);
      if (waiting) for (const wake of [...waiting]) wake(reg);
    }
    if (meta.fileKeys.length === 0) this.endStream(reg);
    const timer = setTimeout(() => {
      this.timers.delete(timer);
      for (const key of reg.pending) this.finish(reg, key);
    }, this.ttlMs);
    timer.unref();
    this.timers.add(timer);
    stream?.once('close', () => {
      // The app went away: later uploads of this batch must fail, not hang.
      reg.stream = null;
    });
    return reg;
  }

  get(key: string): Registration | null {
    return this.byKey.get(key) ?? null;
  }

  /** The browser may PUT before the app's registration has arrived. */
  waitFor(key: string, timeoutMs: number): Promise<Registration | null> {
    const existing = this.byKey.get(key);
    if (existing) return Promise.resolve(existing);
    return new Promise((resolve) => {
      const set = this.waiters.get(key) ?? new Set<(reg: Registration | null) => void>();
      this.waiters.set(key, set);
      const wake = (reg: Registration | null): void => {
        clearTimeout(timer);
        this.timers.delete(timer);
        set.delete(wake);
        if (set.size === 0 && this.waiters.get(key) === set) this.waiters.delete(key);
        resolve(reg);
      };
      const timer = setTimeout(() => wake(null), timeoutMs);
      this.timers.add(timer);
      set.add(wake);
    });
  }

  /** Marks a key handled; the dev stream ends once its batch is done. */
  finish(reg: Registration, key: string): void {
    reg.pending.delete(key);
    if (this.byKey.get(key) === reg) this.byKey.delete(key);
    if (reg.pending.size === 0) this.endStream(reg);
  }

  writeLine(reg: Registration, line: unknown): boolean {
    const stream = reg.stream;
    if (!stream || stream.writableEnded || stream.destroyed) return false;
    stream.write(JSON.stringify(line) + '\n');
    return true;
  }

  private endStream(reg: Registration): void {
    if (reg.stream && !reg.stream.writableEnded) reg.stream.end();
    reg.stream = null;
  }

  closeAll(): void {
    for (const timer of this.timers) clearTimeout(timer);
    this.timers.clear();
    for (const reg of new Set(this.byKey.values())) this.endStream(reg);
    this.byKey.clear();
    for (const [, set] of this.waiters) for (const wake of [...set]) wake(null);
    this.waiters.clear();
  }
}

export type CallbackOutcome = { ok: true; serverData: unknown } | { ok: false; error: string };

/**
 * Waiters for the app's POST /callback-result, keyed by file key. Each one
 * settles by itself after its timeout so an upload never waits forever.
 */
export class CallbackResults {
  private readonly waiters = new Map<string, { settle: (o: CallbackOutcome) => void }>();

  expect(key: string, timeoutMs: number): Promise<CallbackOutcome> {
    this.waiters.get(key)?.settle({ ok: false, error: 'superseded by a newer upload of the same key' });
    return new Promise((resolve) => {
      const entry = {
        settle: (outcome: CallbackOutcome): void => {
          clearTimeout(timer);
          if (this.waiters.get(key) === entry) this.waiters.delete(key);
          resolve(outcome);
        },
      };
      const timer = setTimeout(
        () => entry.settle({ ok: false, error: `the app did not report the upload-complete result within ${timeoutMs} ms` }),
        timeoutMs,
      );
      this.waiters.set(key, entry);
    });
  }

  /** Returns false when nobody is waiting for this key. */
  deliver(key: string, outcome: CallbackOutcome): boolean {
    const entry = this.waiters.get(key);
    if (!entry) return false;
    entry.settle(outcome);
    return true;
  }

  cancelAll(reason: string): void {
    for (const [, entry] of [...this.waiters]) entry.settle({ ok: false, error: reason });
  }
}
