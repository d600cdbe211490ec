/**
 * `ionwright check <path>... [--format text|json|sarif] [--jobs <n>|auto] [--shard <i>/<n>]`: the findings
 * of notes files (of the i-th of n parts of them with --shard: shard.ts).
 *
 * Files are read here (through `CliIO`) and analysed either in this thread or, for larger inputs, in a
 * pool of worker threads (see pool.ts); both give the same findings, printed in the sorted file order.
 * `--jobs` (or the environment variable IONWRIGHT_JOBS when the flag is absent) chooses: `auto` (the
 * default) uses workers only on a machine with AUTO_MIN_CORES cores and for at least AUTO_MIN_FILES
 * files and AUTO_MIN_CHARS characters in all, `1` always checks in this thread, `n` > 1 uses up to n
 * workers whatever the input's size.
 */
import { relative, resolve } from 'node:path';
import type { LspDiagnostic } from '../service/diagnostics';
import { emptyReport, parse, readFiles, shelfSourceIn, skippedLinksLine, UsageError, type CliIO, type InputReport } from './io';
import { checkHere, checkInWorkers, type CheckJob, type CheckOutcome } from './pool';
import { inShard, readShard } from './shard';
import { writeSarif } from './sarif';
import { diagnosticJson, findingLine, OutputWriter, visibleLine, writeJsonArray } from './text';

/**
 * When `auto` uses workers. Measured on a 2-core machine (folders of 200 generated notes, 0.4 to
 * 20 MB): one thread already keeps about 1.5 cores busy (V8 collects garbage and compiles on
 * background threads), and each worker repeats the warm-up (compiling the analysis, filling its
 * caches), so two workers used 40-50 % more CPU time and took 13-38 % longer than one thread at every
 * size. Where cores are free, the warm-up measured there (about 0.1 s a worker, plus 0.05 s to start
 * it, against about 80 ms per MB once warm) would be paid back from roughly 1-2 MB of notes on; that
 * is an estimate, not measured on more cores. Hence: at least 4 cores, 8 files and 2 million
 * characters, and one core left to the main thread and the collector.
 */
export const AUTO_MIN_CORES = 4;
export const AUTO_MIN_FILES = 8;
export const AUTO_MIN_CHARS = 2_000_000;
/** Most workers `auto` starts, and most that `--jobs` may ask for. */
export const AUTO_MAX_WORKERS = 8;
export const MAX_WORKERS = 32;

export type JobsSetting = 'auto' | number;

/** `--jobs` wins over IONWRIGHT_JOBS; either is `auto` or a whole number from 1. */
export function readJobs(flag: string | undefined, env: string | undefined): JobsSetting {
  const [text, where] = flag !== undefined ? [flag, '--jobs'] : env !== undefined && env.trim() !== '' ? [env, 'IONWRIGHT_JOBS'] : ['auto', ''];
  const t = text.trim().toLowerCase();
  if (t === 'auto') return 'auto';
  if (!/^\d+$/.test(t) || Number(t) < 1) throw new UsageError(`${where} must be 'auto' or a whole number from 1 (got '${text}')`);
  return Number(t);
}

/** How many workers to use for this input; 1 means: in this thread. */
export function workerCount(setting: JobsSetting, files: number, chars: number, cores: number): number {
  if (setting === 'auto') {
    if (files < AUTO_MIN_FILES || chars < AUTO_MIN_CHARS || cores < AUTO_MIN_CORES) return 1;
    return Math.min(cores - 1, files, AUTO_MAX_WORKERS);
  }
  return Math.max(1, Math.min(setting, files, MAX_WORKERS));
}

/** `checking 12/40 files…` on stderr, redrawn in place; only on a terminal. */
export function progressLine(io: CliIO, total: number) {
  const write = io.errIsTTY && io.errRaw && total > 1 ? io.errRaw.bind(io) : undefined;
  let shown = '';
  let lastPercent = -1;
  const draw = (done: number) => {
    if (!write) return;
    // At most about a hundred redraws, whatever the number of files.
    const percent = Math.floor((done * 100) / total);
    if (percent === lastPercent && done !== total) return;
    lastPercent = percent;
    const text = `checking ${done}/${total} files…`;
    write('\r' + text + ' '.repeat(Math.max(0, shown.length - text.length)));
    shown = text;
  };
  return {
    start: () => draw(0),
    tick: draw,
    /** Wipe the line, so that whatever is printed next starts on a clean line. */
    end: () => {
      if (write && shown) write('\r' + ' '.repeat(shown.length) + '\r');
      shown = '';
    },
  };
}

export async function cmdCheck(args: string[], io: CliIO): Promise<number> {
  const { values, positionals } = parse(args, { format: { type: 'string' }, jobs: { type: 'string' }, shard: { type: 'string' } });
  const format = values.format ?? 'text';
  if (format !== 'text' && format !== 'json' && format !== 'sarif') throw new UsageError(`unknown format '${format}' (use text, json or sarif)`);
  const setting = readJobs(values.jobs as string | undefined, io.env?.IONWRIGHT_JOBS);
  if (positionals.length === 0) throw new UsageError('check needs at least one file or folder');

  const shard = values.shard !== undefined ? readShard(values.shard as string) : undefined;

  const report = emptyReport();
  const mine = (path: string) => inShard(shard, path, io.cwd);
  let found = 0;
  // The files of the other shards: the shelf file may be among them.
  const others: string[] = [];
  const jobs: CheckJob[] = readFiles(positionals, io, report, (path) => {
    found++;
    if (mine(path)) return true;
    others.push(path);
    return false;
  });
  const shelf = shelfSourceIn(jobs, io, others);
  if (shelf) for (const job of jobs) job.shelf = shelf;
  // What the walk reports about a path is reported by the part the path falls in.
  if (shard) {
    report.problems = report.problems.filter((p) => mine(p.path));
    report.links = report.links.filter((l) => mine(l.path));
  }
  const problems = report.problems;
  const chars = jobs.reduce((n, job) => n + job.text.length, 0);

  const progress = progressLine(io, jobs.length);
  progress.start();
  const workers = io.startWorker ? workerCount(setting, jobs.length, chars, io.cores ?? 1) : 1;
  let outcomes: CheckOutcome[];
  let notice: string | undefined;
  if (workers > 1 && io.startWorker) {
    ({ outcomes, notice } = await checkInWorkers(jobs, { size: workers, start: io.startWorker.bind(io), onProgress: progress.tick }));
  } else {
    outcomes = jobs.map((job, i) => {
      const o = checkHere(job);
      progress.tick(i + 1);
      return o;
    });
  }
  progress.end();

  const results: Array<{ path: string; diagnostics: LspDiagnostic[] }> = [];
  jobs.forEach((job, i) => {
    const o = outcomes[i];
    // The texts are no longer needed: let the collector have them while the output is written.
    job.text = '';
    if ('failure' in o) problems.push({ path: job.path, message: o.failure });
    else results.push({ path: job.path, diagnostics: o.diagnostics });
  });

  const display = displayPath(io);
  const w = new OutputWriter((t) => io.out(t));
  if (format === 'json') {
    await writeJsonArray(w, jsonItems(results, display), { render: ([file, d], inner) => diagnosticJson(file, d, inner) });
  } else if (format === 'sarif') {
    const abs = (p: string) => resolve(io.cwd, p);
    await writeSarif(
      w,
      results.map((r) => ({ path: abs(r.path), diagnostics: r.diagnostics })),
      {
        cwd: io.cwd,
        problems: problems.map((p) => ({ path: abs(p.path), message: p.message })),
        notes: report.links.map((l) => ({ path: abs(l.path), message: `symbolic link not followed: ${LINK_WHY[l.why]}` })),
      },
    );
  } else {
    let errors = 0;
    let warnings = 0;
    for (const r of results) {
      const file = display(r.path);
      for (const d of r.diagnostics) {
        if (d.severity === 1) errors++;
        if (d.severity === 2) warnings++;
        const p = w.line(findingLine(file, d));
        if (p) await p;
      }
    }
    const n = results.length;
    const part = shard ? ` (part ${shard.index} of ${shard.count}; ${found} file${found === 1 ? '' : 's'} found in all)` : '';
    w.line(`${n} file${n === 1 ? '' : 's'} checked${part}: ${errors} error${errors === 1 ? '' : 's'}, ${warnings} warning${warnings === 1 ? '' : 's'}.`);
  }
  await w.flush();
  if (notice) io.err(`ionwright: note: ${notice}`);
  reportInputs(io, report, display);
  if (problems.length) return 2;
  return results.some((r) => r.diagnostics.some((d) => d.severity === 1)) ? 1 : 0;
}

const LINK_WHY = {
  outside: 'it leads out of the folder named on the command line',
  again: 'it leads to what was already read',
  broken: 'it leads nowhere',
} as const;

/** The json items, one finding at a time, with its file: written as `{file, range, severity, code, message, source}`. */
function* jsonItems(results: Array<{ path: string; diagnostics: LspDiagnostic[] }>, display: (p: string) => string): Generator<[string, LspDiagnostic]> {
  for (const r of results) {
    const file = display(r.path);
    for (const d of r.diagnostics) yield [file, d];
  }
}

/** A path as the outputs show it: relative to the working folder where it is inside it. */
export const displayPath = (io: CliIO) => (p: string) => relative(io.cwd, resolve(io.cwd, p)) || p;

/** The links not followed (one line) and the files not read (one line each), on stderr. */
export function reportInputs(io: CliIO, report: InputReport, display: (p: string) => string): void {
  const links = skippedLinksLine(report.links, (p) => visibleLine(display(p)));
  if (links) io.err(`ionwright: ${links}`);
  for (const p of report.problems) io.err(`ionwright: ${visibleLine(display(p.path))}: ${p.message}`);
}
