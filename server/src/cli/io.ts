/** IO of the command line: the only place that touches the file system. */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { analyseDocument, languageOf, type AnalysedDocument } from '../service/document';
import { DEFAULT_SETTINGS } from '../service/settings';

export interface CliIO {
  out(text: string): void;
  err(text: string): void;
  readFile(path: string): string;
  readDir(path: string): string[];
  isDirectory(path: string): boolean;
  cwd: string;
}

export const nodeIO: CliIO = {
  out: (t) => process.stdout.write(t.endsWith('\n') ? t : t + '\n'),
  err: (t) => process.stderr.write(t.endsWith('\n') ? t : t + '\n'),
  readFile: (p) => readFileSync(p, 'utf8'),
  readDir: (p) => readdirSync(p),
  isDirectory: (p) => statSync(p).isDirectory(),
  cwd: process.cwd(),
};

export class UsageError extends Error {}

export const USAGE = `Usage:
  ionwright card <formula>... [--json]
  ionwright check <path>... [--format text|json|sarif]
  ionwright balance "<equation>" [--json]
  ionwright batch <path> [--json]
  ionwright table <path>
  ionwright demo [<folder>]
Paths may be Markdown (.md, .markdown) or notes (.fnote) files, or folders (read recursively).`;

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

/** Read and analyse files; a file that cannot be read is reported and skipped. */
export function loadFiles(paths: string[], io: CliIO, problems: FileProblem[]): LoadedFile[] {
  const out: LoadedFile[] = [];
  for (const path of collectFiles(paths, io, problems)) {
    let text: string;
    try {
      text = io.readFile(path);
    } catch {
      problems.push({ path, message: 'cannot be read' });
      continue;
    }
    const doc = analyseDocument(text, languageOf(path) ?? 'markdown', DEFAULT_SETTINGS);
    if (text.includes('\u0000')) {
      doc.diagnostics.unshift({ code: 'not-text', severity: 'warning', start: 0, end: 0, message: 'This file contains NUL bytes; it does not look like a text file.' });
    }
    out.push({ path, doc });
  }
  return out;
}

