/**
 * Debounced validation: each change (re)starts a per-document timer; when it fires, the document is
 * analysed and its diagnostics sent, unless a newer version arrived meanwhile (stale work is dropped).
 * The timer functions are passed in so that tests can drive time by hand.
 */
export interface Timers {
  set(fn: () => void, ms: number): unknown;
  clear(handle: unknown): void;
}

export const realTimers: Timers = {
  set: (fn, ms) => setTimeout(fn, ms),
  clear: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
};

export class DebouncedValidator {
  private readonly pending = new Map<string, unknown>();

  constructor(
    private readonly timers: Timers,
    /** Validate the document now; returns nothing, sends its own results. */
    private readonly validate: (uri: string) => void,
  ) {}

  schedule(uri: string, delayMs: number) {
    this.cancel(uri);
    if (delayMs <= 0) {
      this.validate(uri);
      return;
    }
    const h = this.timers.set(() => {
      this.pending.delete(uri);
      this.validate(uri);
    }, delayMs);
    this.pending.set(uri, h);
  }

  cancel(uri: string) {
    const h = this.pending.get(uri);
    if (h !== undefined) {
      this.timers.clear(h);
      this.pending.delete(uri);
    }
  }

  get size() {
    return this.pending.size;
  }
}
