/** IO of the command line: the only place that touches the file system. */
import { readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import type { Worker } from 'node:worker_threads';
import { languageOf, type AnalysedDocument } from '../service/document';
import { analyseFile } from './analyse';
import { startBundleWorker } from './pool';

export interface CliIO {
  /** One line (or lines) to stdout; a newline is added when missing. */
  out(text: string): void;
  /** One line to stderr; a newline is added when missing. */
  err(text: string): void;
  readFile(path: string): string;
  /** Write a file the user named (the report's --html); absent: writing is not possible. */
  writeFile?(path: string, text: string): void;
  readDir(path: string): string[];
  isDirectory(path: string): boolean;
  cwd: string;
  /** Whether stderr is a terminal: only then does `check` draw its progress line (absent: no). */
  errIsTTY?: boolean;
  /** Raw write to stderr, no newline added (the progress line uses it with \r). */
  errRaw?(text: string): void;
  /** Environment variables (IONWRIGHT_JOBS); absent: none set. */
  env?: Record<string, string | undefined>;
  /** CPU cores to use at most (absent: 1). */
  cores?: number;
  /** Start one check worker; absent: everything is checked in this thread. */
  startWorker?(): Worker;
}

export const nodeIO: CliIO = {
  out: (t) => process.stdout.write(t.endsWith('\n') ? t : t + '\n'),
  err: (t) => process.stderr.write(t.endsWith('\n') ? t : t + '\n'),
  readFile: (p) => {
    // A named pipe or device named like a note would block the read: only regular files are read.
    if (!statSync(p).isFile()) throw new Error('not a regular file');
    return readFileSync(p, 'utf8');
  },
  writeFile: (p, t) => writeFileSync(p, t, 'utf8'),
  readDir: (p) => readdirSync(p),
  isDirectory: (p) => statSync(p).isDirectory(),
  cwd: process.cwd(),
  errIsTTY: process.stderr.isTTY === true,
  errRaw: (t) => process.stderr.write(t),
  env: process.env,
  cores: availableParallelism(),
  startWorker: startBundleWorker,
};

export class UsageError extends Error {}

export function parse(args: string[], options: Record<string, { type: 'boolean' | 'string'; short?: string }>) {
  try {
    return parseArgs({ args, options, allowPositionals: true, strict: true });
  } catch (e) {
    const msg = (e as Error).message.split('\n')[0].replace(/\. To specify.*$/, '');
    throw new UsageError(msg);
  }
}

export interface FileProblem {
  path: string;
  message: string;
}

/** Expand paths into notes files; folders recursively (hidden folders and node_modules skipped). */
export function collectFiles(paths: string[], io: CliIO, problems: FileProblem[]): string[] {
  const files: string[] = [];
  const walk = (p: string, top: boolean) => {
    let dir: boolean;
    try {
      dir = io.isDirectory(p);
    } catch {
      if (top) throw new UsageError(`${p}: no such file or folder`);
      problems.push({ path: p, message: 'cannot be read' });
      return;
    }
    if (dir) {
      let names: string[];
      try {
        names = io.readDir(p).sort();
      } catch {
        if (top) throw new UsageError(`${p}: folder cannot be read`);
        problems.push({ path: p, message: 'folder cannot be read' });
        return;
      }
      for (const n of names) {
        if (n.startsWith('.') || n === 'node_modules') continue;
        const child = join(p, n);
        let childDir = false;
        try {
          childDir = io.isDirectory(child);
        } catch {
          problems.push({ path: child, message: 'cannot be read' });
          continue;
        }
        if (childDir) walk(child, false);
        else if (languageOf(n)) files.push(child);
      }
    } else if (languageOf(p)) files.push(p);
    else if (top) throw new UsageError(`${p}: not a Markdown (.md, .markdown) or notes (.fnote) file`);
  };
  for (const p of paths) walk(p, true);
  return files;
}

export interface LoadedFile {
  path: string;
  doc: AnalysedDocument;
}

export interface ReadFile {
  path: string;
  text: string;
}

/** Read the notes files the paths name; a file that cannot be read is reported and skipped. */
export function readFiles(paths: string[], io: CliIO, problems: FileProblem[]): ReadFile[] {
  const out: ReadFile[] = [];
  for (const path of collectFiles(paths, io, problems)) {
    try {
      out.push({ path, text: io.readFile(path) });
    } catch {
      problems.push({ path, message: 'cannot be read' });
    }
  }
  return out;
}

/** Read and analyse files; a file that cannot be read is reported and skipped. */
export function loadFiles(paths: string[], io: CliIO, problems: FileProblem[]): LoadedFile[] {
  return readFiles(paths, io, problems).map((f) => ({ path: f.path, doc: analyseFile(f.path, f.text) }));
}

