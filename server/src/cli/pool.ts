/**
 * Parallel `check`: a pool of worker threads. The main thread reads the files (through `CliIO`) and sends
 * each worker one file's path and text at a time (two in flight); the worker analyses it and posts back
 * the findings, which are plain objects. Outcomes are stored by file index, so the caller sees them in
 * its own order whichever worker finishes first.
 *
 * The worker is the command-line bundle itself (`dist/cli.js`), started with `workerData.role` set to
 * WORKER_ROLE: `bin.ts` then serves checks instead of running a command, so the build has no extra output.
 *
 * Failures never hang the run: a worker that dies while analysing a file costs that file (it becomes a
 * one-line problem) and is replaced; files it had been sent but had not started go to other workers. If
 * workers cannot start at all, or keep dying, the remaining files are checked in this thread.
 */
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import type { LspDiagnostic } from '../service/diagnostics';
import { checkText, type ShelfSource } from './analyse';

export const WORKER_ROLE = 'ionwright-check';

export interface CheckJob {
  path: string;
  text: string;
  /** The workspace's shelf file (its path and text), for notes without a shelf of their own. */
  shelf?: ShelfSource;
}

export type CheckOutcome = { diagnostics: LspDiagnostic[] } | { failure: string };

type ToWorker = { id: number; path: string; text: string; shelf?: ShelfSource };
type FromWorker = { ready: true } | { id: number; diagnostics: LspDiagnostic[] } | { id: number; failure: string };

/** Files sent to one worker ahead of its results, so that it never waits for the next one. */
const IN_FLIGHT = 2;
/** Worker deaths after which no replacement is started (the rest is checked in this thread). */
const MAX_DEATHS = 4;

export const oneLine = (e: unknown): string => {
  const text = e instanceof Error ? e.message : String(e);
  return (text.split('\n')[0] || 'unknown error').slice(0, 200);
};

/** One file checked in this thread; a throw becomes a failure, as in a worker. */
export function checkHere(job: CheckJob): CheckOutcome {
  try {
    return { diagnostics: checkText(job.path, job.text, job.shelf) };
  } catch (e) {
    return { failure: `analysis failed: ${oneLine(e)}` };
  }
}

/** True in a thread started by `startBundleWorker`. */
export function isCheckWorker(): boolean {
  return !isMainThread && (workerData as { role?: unknown } | null)?.role === WORKER_ROLE;
}

/** Start a check worker from the running bundle (`__filename` is dist/cli.js there). */
export function startBundleWorker(): Worker {
  return new Worker(__filename, { workerData: { role: WORKER_ROLE } });
}

/** The worker's side: answer each file with its findings, in the order they come. */
export function serveChecks(): void {
  const port = parentPort;
  if (!port) return;
  port.on('message', (m: ToWorker) => {
    const outcome = checkHere({ path: m.path, text: m.text, ...(m.shelf ? { shelf: m.shelf } : {}) });
    const reply: FromWorker = 'failure' in outcome ? { id: m.id, failure: outcome.failure } : { id: m.id, diagnostics: outcome.diagnostics };
    port.postMessage(reply);
  });
  port.postMessage({ ready: true } satisfies FromWorker);
}

export interface PoolOptions {
  /** Workers to run at once. */
  size: number;
  /** Starts one worker that speaks the protocol of `serveChecks`. */
  start: () => Worker;
  /** Called after each file's outcome, with the number done so far. */
  onProgress?: (done: number) => void;
}

export interface PoolResult {
  /** One outcome per job, in the jobs' order. */
  outcomes: CheckOutcome[];
  /** Set when some or all files had to be checked in this thread; one line. */
  notice?: string;
}

export function checkInWorkers(jobs: CheckJob[], options: PoolOptions): Promise<PoolResult> {
  return new Promise((resolve) => {
    const outcomes: Array<CheckOutcome | undefined> = new Array(jobs.length);
    const queue = jobs.map((_, i) => i);
    /** Live workers, each with its feeder once it is ready. */
    const workers = new Map<Worker, (() => void) | undefined>();
    let done = 0;
    let deaths = 0;
    let finished = false;
    let notice: string | undefined;

    const settle = (i: number, outcome: CheckOutcome) => {
      if (outcomes[i]) return;
      outcomes[i] = outcome;
      done++;
      options.onProgress?.(done);
    };
    const finishIfDone = () => {
      if (finished || done < jobs.length) return;
      finished = true;
      for (const w of workers.keys()) void w.terminate();
      resolve({ outcomes: outcomes as CheckOutcome[], notice });
    };
    /** No worker is left to take the rest: check it here. */
    const checkRestHere = (why: string) => {
      if (queue.length === 0) return;
      notice ??= `${why}; the remaining files were checked in one thread`;
      while (queue.length) {
        const i = queue.shift() as number;
        settle(i, checkHere(jobs[i]));
      }
    };

    const spawn = (): boolean => {
      let w: Worker;
      try {
        w = options.start();
      } catch (e) {
        deaths++;
        if (workers.size === 0) checkRestHere(`worker threads could not start (${oneLine(e)})`);
        return false;
      }
      workers.set(w, undefined);
      const inFlight: number[] = [];
      let ready = false;
      let reason = '';
      const feed = () => {
        while (inFlight.length < IN_FLIGHT && queue.length) {
          const i = queue.shift() as number;
          inFlight.push(i);
          w.postMessage({ id: i, path: jobs[i].path, text: jobs[i].text, ...(jobs[i].shelf ? { shelf: jobs[i].shelf } : {}) } satisfies ToWorker);
        }
      };
      w.on('message', (m: FromWorker) => {
        if ('ready' in m) {
          ready = true;
          workers.set(w, feed);
          feed();
          return;
        }
        const k = inFlight.indexOf(m.id);
        if (k >= 0) inFlight.splice(k, 1);
        settle(m.id, 'failure' in m ? { failure: m.failure } : { diagnostics: m.diagnostics });
        feed();
        finishIfDone();
      });
      w.on('error', (e) => {
        reason = oneLine(e);
      });
      w.on('exit', (code) => {
        workers.delete(w);
        if (finished) return;
        deaths++;
        const why = reason ? `failed: ${reason}` : `exited with code ${code}`;
        // A worker handles its files in order: the first one in flight is the one it died on; the
        // others had not been started and go back to the front of the queue.
        const [blamed, ...unstarted] = inFlight;
        queue.unshift(...unstarted);
        if (blamed !== undefined) settle(blamed, { failure: `analysis stopped: its worker thread ${why}` });
        // A replacement keeps the pool's size, unless this one never started (another would fail the
        // same way) or too many have died.
        if (queue.length && ready && deaths < MAX_DEATHS) spawn();
        // Idle workers take what came back to the queue.
        for (const f of workers.values()) f?.();
        if (queue.length && workers.size === 0)
          checkRestHere(ready ? `worker threads kept failing (last one ${why})` : `worker threads could not start (${why})`);
        finishIfDone();
      });
      return true;
    };

    if (jobs.length === 0) return resolve({ outcomes: [] });
    for (let n = 0; n < Math.max(1, Math.min(options.size, jobs.length)); n++) if (!spawn()) break;
    finishIfDone();
  });
}
