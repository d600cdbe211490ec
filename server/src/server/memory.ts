/**
 * Garbage the server makes on purpose: every keystroke in a note makes a new version of its whole text,
 * and the old versions are garbage at once. V8 collects them only when its heap has grown by a margin
 * proportional to what is live, so a 1 MB note typed into for a while holds well over 100 MB of dead text
 * until the collector runs or the process goes idle for many seconds. When the host can collect on
 * request (Node: see `nodeCollector`), the server asks for a collection once the texts it has analysed
 * since the last one add up to a budget, and shortly after a document is closed.
 */
import type { Timers } from './validator';

/** Characters of analysed text between two requested collections. */
export const COLLECT_AFTER_CHARS = 48 * 1024 * 1024;
/** Delay after a close before collecting (closing several notes at once collects once). */
export const COLLECT_AFTER_CLOSE_MS = 200;

export class CollectionBudget {
  private since = 0;
  private pending: unknown = undefined;

  constructor(
    private readonly collect: (() => void) | undefined,
    private readonly timers: Timers,
    private readonly budgetChars = COLLECT_AFTER_CHARS,
  ) {}

  /** A text of `chars` characters was analysed; 0: a document was closed. */
  note(chars: number) {
    if (!this.collect) return;
    if (chars === 0) return this.soon(COLLECT_AFTER_CLOSE_MS);
    this.since += chars;
    if (this.since >= this.budgetChars) this.soon(0);
  }

  private soon(ms: number) {
    if (this.pending !== undefined) return;
    this.pending = this.timers.set(() => {
      this.pending = undefined;
      this.since = 0;
      this.collect?.();
    }, ms);
  }
}
