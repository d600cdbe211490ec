/**
 * When the language server runs: it starts when the first note it serves is open (not when the
 * extension activates, which VS Code does for any Markdown file, the preview included), and stops a
 * while after the last such note is closed, so that an editor with no notes open runs no server.
 * Needs no VS Code: extension.ts feeds it the open documents and the client's start and stop.
 */
import { NOTES_LANGUAGES } from '../../server/src/shared/commands';

export interface OpenDocument {
  languageId: string;
  uri: { scheme: string };
  isClosed?: boolean;
}

/** Documents the server serves: Markdown and .fnote notes, of any scheme but output and settings panes. */
const IGNORED_SCHEMES = new Set(['output', 'vscode', 'vscode-userdata', 'debug']);
export const servesDocument = (d: OpenDocument): boolean =>
  !d.isClosed && (NOTES_LANGUAGES as readonly string[]).includes(d.languageId) && !IGNORED_SCHEMES.has(d.uri.scheme);

export interface LifecycleHost {
  start(): Promise<void>;
  stop(): Promise<void>;
  openDocuments(): readonly OpenDocument[];
  setTimer(fn: () => void, ms: number): unknown;
  clearTimer(handle: unknown): void;
  log(line: string): void;
}

/** How long the server stays up once no note is open (reopening a note soon after needs no new start). */
export const STOP_AFTER_MS = 60_000;

export class ServerLifecycle {
  private running = false;
  private pending: Promise<void> = Promise.resolve();
  private stopTimer: unknown = undefined;

  constructor(
    private readonly host: LifecycleHost,
    private readonly stopAfterMs = STOP_AFTER_MS,
  ) {}

  get isRunning(): boolean {
    return this.running;
  }

  /** Re-read the open documents: start if a note is open, plan to stop if none is. */
  update(): Promise<void> {
    const wanted = this.host.openDocuments().some(servesDocument);
    if (wanted) {
      this.cancelStop();
      if (!this.running) return this.serialise(() => this.startNow());
    } else if (this.running && this.stopTimer === undefined) {
      this.stopTimer = this.host.setTimer(() => {
        this.stopTimer = undefined;
        if (!this.host.openDocuments().some(servesDocument)) void this.serialise(() => this.stopNow('no notes are open'));
      }, this.stopAfterMs);
    }
    return this.pending;
  }

  /** Make sure the server runs (a command needs it), whatever is open. */
  ensureRunning(): Promise<void> {
    this.cancelStop();
    return this.running ? this.pending : this.serialise(() => this.startNow());
  }

  dispose(): Promise<void> {
    this.cancelStop();
    return this.serialise(() => this.stopNow('the extension is deactivated'));
  }

  private cancelStop() {
    if (this.stopTimer !== undefined) this.host.clearTimer(this.stopTimer);
    this.stopTimer = undefined;
  }

  /** Starts and stops one after the other, never two at once. */
  private serialise(step: () => Promise<void>): Promise<void> {
    this.pending = this.pending.then(step, step);
    return this.pending;
  }

  private async startNow() {
    if (this.running) return;
    this.running = true;
    try {
      await this.host.start();
      this.host.log('Ionwright server started.');
    } catch (e) {
      this.running = false;
      this.host.log(`The Ionwright server did not start: ${(e as Error).message}`);
    }
  }

  private async stopNow(why: string) {
    if (!this.running) return;
    this.running = false;
    try {
      await this.host.stop();
      this.host.log(`Ionwright server stopped: ${why}.`);
    } catch (e) {
      this.host.log(`The Ionwright server did not stop cleanly: ${(e as Error).message}`);
    }
  }
}
