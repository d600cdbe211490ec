/** IO of the command line: the only place that touches the file system. */
import { isUtf8 } from 'node:buffer';
import { randomBytes } from 'node:crypto';
import {
  closeSync,
  fsyncSync,
  lstatSync,
  openSync,
  readdirSync,
  readFileSync,
  realpathSync,
  renameSync,
  statSync,
  unlinkSync,
  writeSync,
  type BigIntStats,
} from 'node:fs';
import { availableParallelism } from 'node:os';
import { basename, dirname, join, resolve, sep } from 'node:path';
import { parseArgs } from 'node:util';
import type { Worker } from 'node:worker_threads';
import { languageOf, type AnalysedDocument } from '../service/document';
import { analyseFile, type ShelfSource } from './analyse';
import { isShelfFile } from '../service/document';
import { startBundleWorker } from './pool';

/** What is at a path: the path itself (a final symbolic link not followed) and what it leads to. */
export interface PathInfo {
  kind: 'file' | 'dir' | 'link' | 'other';
  /** What the path leads to once every link is followed; 'missing' for a broken link. */
  target: 'file' | 'dir' | 'other' | 'missing';
  /** The path with every symbolic link resolved (absent for a broken link). */
  real?: string;
  /** Device and inode of the target, `dev:ino` (absent for a broken link). */
  id?: string;
}

export interface CliIO {
  /**
   * One line (or lines) to stdout; a newline is added when missing. May return a promise when the
   * output asks the writer to wait (a pipe whose reader is slower): callers of large outputs await it.
   * Throws OutputClosed once the reader has gone.
   */
  out(text: string): void | Promise<void>;
  /** One line to stderr; a newline is added when missing. */
  err(text: string): void;
  /** A notes file's text; throws InputProblem (or an errno error) for a file that is not read. */
  readFile(path: string): string;
  /** Write a file the user named (the report's --html), replacing it whole; absent: writing is not possible. */
  writeFile?(path: string, text: string): void;
  readDir(path: string): string[];
  isDirectory(path: string): boolean;
  /** What is at a path, links not followed (throws the errno error when nothing is there); absent: no links. */
  inspect?(path: string): PathInfo;
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

/** The reader of stdout has gone (`ionwright check … | head -1`): stop quietly. */
export class OutputClosed extends Error {
  constructor() {
    super('standard output was closed');
  }
}

/** The exit status of a command whose output pipe closed early: 128 + SIGPIPE, as the shell shows for a process the signal ends. */
export const EXIT_OUTPUT_CLOSED = 141;

/**
 * Write to a stream; a promise when its buffer is full, settled on 'drain' or when the stream closes
 * or fails (never rejected: nobody need await it; the next write throws OutputClosed instead).
 */
export function writeTo(stream: NodeJS.WritableStream & { destroyed?: boolean }, text: string): void | Promise<void> {
  if (stream.destroyed) throw new OutputClosed();
  if (stream.write(text)) return;
  return new Promise((resolve) => {
    const done = () => {
      stream.removeListener('drain', done);
      stream.removeListener('close', done);
      stream.removeListener('error', done);
      resolve();
    };
    stream.once('drain', done);
    stream.once('close', done);
    stream.once('error', done);
  });
}

/** A file that is not checked, with the reason, as its one-line message ("skipped: …", "cannot be read: …"). */
export class InputProblem extends Error {}

const KIND_WORDS = { fifo: 'a named pipe', socket: 'a socket', device: 'a device' } as const;

function otherKind(s: { isFIFO(): boolean; isSocket(): boolean }): string {
  if (s.isFIFO()) return KIND_WORDS.fifo;
  if (s.isSocket()) return KIND_WORDS.socket;
  return KIND_WORDS.device;
}

/** The first byte at which `bytes` stops being UTF-8 (RFC 3629: no overlong forms, no surrogates, at most U+10FFFF); -1 when it is UTF-8 throughout. */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  const n = bytes.length;
  let i = 0;
  while (i < n) {
    const b = bytes[i];
    if (b < 0x80) {
      i++;
      continue;
    }
    let need: number;
    let lo = 0x80;
    let hi = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) need = 1;
    else if (b >= 0xe0 && b <= 0xef) {
      need = 2;
      if (b === 0xe0) lo = 0xa0;
      if (b === 0xed) hi = 0x9f;
    } else if (b >= 0xf0 && b <= 0xf4) {
      need = 3;
      if (b === 0xf0) lo = 0x90;
      if (b === 0xf4) hi = 0x8f;
    } else return i;
    if (i + need >= n) return i;
    const c = bytes[i + 1];
    if (c < lo || c > hi) return i;
    for (let k = 2; k <= need; k++) if ((bytes[i + k] & 0xc0) !== 0x80) return i;
    i += need + 1;
  }
  return -1;
}

/** The 1-based line of a byte offset. */
function lineAt(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset; i++) if (bytes[i] === 0x0a) line++;
  return line;
}

const hex = (b: number) => '0x' + b.toString(16).toUpperCase().padStart(2, '0');

/** A notes file's bytes as text; InputProblem ("skipped: …") for what is not UTF-8 text. */
export function decodeNote(bytes: Uint8Array): string {
  if (bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))) {
    throw new InputProblem(`skipped: UTF-16 text (byte-order mark ${hex(bytes[0])} ${hex(bytes[1])}); save it as UTF-8`);
  }
  const nul = bytes.indexOf(0);
  if (nul >= 0) throw new InputProblem(`skipped: binary (NUL byte at offset ${nul}, line ${lineAt(bytes, nul)})`);
  if (!isUtf8(bytes)) {
    const at = firstInvalidUtf8(bytes);
    throw new InputProblem(`skipped: not UTF-8 text (invalid byte ${hex(bytes[at])} at offset ${at}, line ${lineAt(bytes, at)})`);
  }
  try {
    const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('utf8');
    // A UTF-8 byte-order mark is not part of the note: editors drop it, and columns must agree with theirs.
    return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ERR_STRING_TOO_LONG') throw new InputProblem(`skipped: too large to read as one text (${bytes.length} bytes)`);
    throw e;
  }
}

/** Why a file system call failed, in words with its code: "permission denied (EACCES)". */
export function reasonOf(e: unknown): string {
  if (e instanceof InputProblem) return e.message;
  const err = e as NodeJS.ErrnoException;
  const message = (err instanceof Error ? err.message : String(e)).split('\n')[0];
  // Node's file system errors read "CODE: description, syscall 'path'".
  const m = /^([A-Z][A-Z0-9_]+): ([^,]+)/.exec(message);
  if (m) return `${m[2]} (${m[1]})`;
  if (err?.code && err.code !== message) return `${message} (${err.code})`;
  return message || 'unknown error';
}

/** The one-line message of a file that was not read: InputProblems say it themselves. */
export function problemOf(e: unknown): string {
  return e instanceof InputProblem ? e.message : `cannot be read: ${reasonOf(e)}`;
}

function kindOf(s: BigIntStats): 'file' | 'dir' | 'other' {
  return s.isFile() ? 'file' : s.isDirectory() ? 'dir' : 'other';
}

/** What is at a path, from the real file system. */
function inspectPath(p: string): PathInfo {
  const l = lstatSync(p, { bigint: true });
  const link = l.isSymbolicLink();
  let s = l;
  if (link) {
    try {
      s = statSync(p, { bigint: true });
    } catch {
      return { kind: 'link', target: 'missing' };
    }
  }
  let real: string;
  try {
    real = realpathSync.native(p);
  } catch {
    return { kind: link ? 'link' : kindOf(l), target: 'missing' };
  }
  return { kind: link ? 'link' : kindOf(l), target: kindOf(s), real, id: `${s.dev}:${s.ino}` };
}

/**
 * Replace a file whole: the text goes to a new file in the same folder, which then takes the name
 * (rename is atomic), so a failed write leaves the old file as it was and no partial file behind. A
 * symbolic link is followed: its target gets the new text, the link stays. An existing file keeps its
 * permissions.
 */
export function replaceFile(path: string, text: string): void {
  let target = path;
  try {
    target = realpathSync.native(path);
  } catch {
    // Not there yet: written under its own name.
  }
  let mode = 0o666;
  try {
    mode = Number(statSync(target).mode) & 0o7777;
  } catch {
    // A new file: the usual mode, less the umask.
  }
  const temp = join(dirname(target), `.${basename(target)}.${process.pid}-${randomBytes(4).toString('hex')}.tmp`);
  const fd = openSync(temp, 'wx', mode);
  let ok = false;
  try {
    const data = Buffer.from(text, 'utf8');
    let written = 0;
    while (written < data.length) written += writeSync(fd, data, written, data.length - written);
    fsyncSync(fd);
    closeSync(fd);
    renameSync(temp, target);
    ok = true;
  } finally {
    if (!ok) {
      try {
        closeSync(fd);
      } catch {
        // Closed already.
      }
      try {
        unlinkSync(temp);
      } catch {
        // Nothing to remove.
      }
    }
  }
}

export const nodeIO: CliIO = {
  out: (t) => writeTo(process.stdout, t.endsWith('\n') ? t : t + '\n'),
  err: (t) => void process.stderr.write(t.endsWith('\n') ? t : t + '\n'),
  readFile: (p) => {
    // A named pipe or device named like a note would block the read: only regular files are read.
    const s = statSync(p);
    if (!s.isFile()) throw new InputProblem(`cannot be read: ${s.isDirectory() ? 'a folder' : otherKind(s)}, not a regular file`);
    return decodeNote(readFileSync(p));
  },
  writeFile: replaceFile,
  readDir: (p) => readdirSync(p),
  isDirectory: (p) => statSync(p).isDirectory(),
  inspect: inspectPath,
  cwd: process.cwd(),
  errIsTTY: process.stderr.isTTY === true,
  errRaw: (t) => void process.stderr.write(t),
  env: process.env,
  cores: availableParallelism(),
  startWorker: startBundleWorker,
};

export class UsageError extends Error {}

type Options = Record<string, { type: 'boolean' | 'string'; short?: string }>;

/**
 * A string flag followed by a value that starts with '-' (`--jobs -3`) is joined to it (`--jobs=-3`),
 * so that the command, not the argument parser, says what it accepts; a flag followed by another flag
 * or by nothing needs a value.
 */
function joinValues(args: string[], options: Options): string[] {
  const flagName = (a: string): string | undefined => {
    if (a.startsWith('--') && a.length > 2) return a.slice(2);
    if (/^-[^-]$/.test(a)) return Object.entries(options).find(([, o]) => o.short === a[1])?.[0];
    return undefined;
  };
  const isFlag = (a: string) => {
    if (a === '--' || a === '-h' || a.startsWith('--help')) return true;
    const name = flagName(a.split('=')[0]);
    return name !== undefined && Object.hasOwn(options, name);
  };
  const out: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === '--') {
      out.push(...args.slice(i));
      break;
    }
    const name = a.includes('=') ? undefined : flagName(a);
    if (name === undefined || !Object.hasOwn(options, name) || options[name].type !== 'string') {
      out.push(a);
      continue;
    }
    const next = args[i + 1];
    if (next === undefined || isFlag(next)) throw new UsageError(`--${name} needs a value`);
    out.push(`--${name}=${next}`);
    i++;
  }
  return out;
}

export function parse(args: string[], options: Options) {
  const joined = joinValues(args, options);
  try {
    return parseArgs({ args: joined, options, allowPositionals: true, strict: true });
  } catch (e) {
    const msg = (e as Error).message.split('\n')[0].replace(/\. To specify.*$/, '');
    throw new UsageError(msg);
  }
}

export interface FileProblem {
  path: string;
  message: string;
}

/** A symbolic link the folder walk did not follow, and why. */
export interface SkippedLink {
  path: string;
  /** outside: it leads out of the folder named on the command line; again: to what was already read; broken: to nothing. */
  why: 'outside' | 'again' | 'broken';
  /** The folder named on the command line it was found in. */
  tree: string;
}

/** What a walk met besides the files it returns. */
export interface InputReport {
  problems: FileProblem[];
  links: SkippedLink[];
}

const isInside = (real: string, root: string) => real === root || real.startsWith(root.endsWith(sep) ? root : root + sep);

/** Paths in the order a walk of sorted folders gives them: compared segment by segment. */
function walkOrder(a: string, b: string): number {
  const x = a.split(sep);
  const y = b.split(sep);
  for (let i = 0; i < Math.min(x.length, y.length); i++) if (x[i] !== y[i]) return x[i] < y[i] ? -1 : 1;
  return x.length - y.length;
}

/**
 * Expand paths into notes files; folders recursively (hidden folders and node_modules skipped), in
 * sorted order. Each file and folder is read once, by its real path, so links cannot make a loop or a
 * file be checked twice. Symbolic links inside a folder are followed only to places inside the folder
 * named on the command line (a path named there is itself followed); links are taken after the files
 * reached without them, so a file reachable both ways is reported under its own path. Links not
 * followed go to `report.links`, files and folders that could not be read to `report.problems`.
 */
export function collectFiles(paths: string[], io: CliIO, report: InputReport): string[] {
  const files: string[] = [];
  const seenFiles = new Set<string>();
  const seenDirs = new Set<string>();
  const info = (p: string): PathInfo => {
    if (io.inspect) return io.inspect(p);
    const kind = io.isDirectory(p) ? 'dir' : 'file';
    return { kind, target: kind, real: resolve(io.cwd, p) };
  };
  const keyOf = (p: string, i: PathInfo) => i.real ?? resolve(io.cwd, p);

  for (const top of paths) {
    let t: PathInfo;
    try {
      t = info(top);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      throw new UsageError(code === 'ENOENT' || code === undefined ? `${top}: no such file or folder` : `${top}: cannot be read: ${reasonOf(e)}`);
    }
    if (t.target === 'missing') throw new UsageError(`${top}: a symbolic link that leads nowhere`);
    if (t.target !== 'dir') {
      if (!languageOf(top)) throw new UsageError(`${top}: not a Markdown (.md, .markdown) or notes (.fnote) file`);
      const key = keyOf(top, t);
      if (!seenFiles.has(key)) {
        seenFiles.add(key);
        files.push(top);
      }
      continue;
    }

    const root = keyOf(top, t);
    const mine: string[] = [];
    const links: Array<{ path: string; name: string; info: PathInfo }> = [];
    /** Read a folder's entries; false when it was read before. */
    const visitDir = (dir: string, di: PathInfo, isTop: boolean): boolean => {
      const key = keyOf(dir, di);
      if (seenDirs.has(key) || (di.id !== undefined && seenDirs.has(di.id))) return false;
      seenDirs.add(key);
      if (di.id !== undefined) seenDirs.add(di.id);
      let names: string[];
      try {
        names = io.readDir(dir).sort();
      } catch (e) {
        if (isTop) throw new UsageError(`${dir}: folder cannot be read: ${reasonOf(e)}`);
        report.problems.push({ path: dir, message: `folder cannot be read: ${reasonOf(e)}` });
        return true;
      }
      for (const n of names) {
        if (n.startsWith('.') || n === 'node_modules') continue;
        const child = join(dir, n);
        let ci: PathInfo;
        try {
          ci = info(child);
        } catch (e) {
          report.problems.push({ path: child, message: `cannot be read: ${reasonOf(e)}` });
          continue;
        }
        if (ci.kind === 'link') links.push({ path: child, name: n, info: ci });
        else if (ci.kind === 'dir') visitDir(child, ci, false);
        else if (languageOf(n)) addFile(child, ci);
      }
      return true;
    };
    const addFile = (p: string, fi: PathInfo): boolean => {
      const key = keyOf(p, fi);
      if (seenFiles.has(key)) return false;
      seenFiles.add(key);
      mine.push(p);
      return true;
    };

    visitDir(top, t, true);
    // Links last (the ones found by following a link are appended as they are found).
    for (let i = 0; i < links.length; i++) {
      const { path, name, info: li } = links[i];
      if (li.target === 'missing') {
        if (languageOf(name)) report.problems.push({ path, message: 'cannot be read: a symbolic link that leads nowhere' });
        else report.links.push({ path, why: 'broken', tree: top });
        continue;
      }
      if (li.target !== 'dir' && !languageOf(name)) continue; // not a note: never read, link or not
      if (!isInside(keyOf(path, li), root)) {
        report.links.push({ path, why: 'outside', tree: top });
        continue;
      }
      const followed = li.target === 'dir' ? visitDir(path, li, false) : addFile(path, li);
      if (!followed) report.links.push({ path, why: 'again', tree: top });
    }
    files.push(...mine.sort(walkOrder));
  }
  return files;
}

const WHY = {
  outside: (n: number) => `${n} lead${n === 1 ? 's' : ''} outside the folder checked`,
  again: (n: number) => `${n} lead${n === 1 ? 's' : ''} to what was already read`,
  broken: (n: number) => `${n} lead${n === 1 ? 's' : ''} nowhere`,
};
/** Names shown for each reason; the rest are counted. */
const NAMES_SHOWN = 3;

/** The one line that says which links were not followed and why (undefined when none). */
export function skippedLinksLine(links: SkippedLink[], display: (p: string) => string): string | undefined {
  if (links.length === 0) return undefined;
  const parts: string[] = [];
  for (const why of ['outside', 'again', 'broken'] as const) {
    const these = links.filter((l) => l.why === why).sort((a, b) => walkOrder(a.path, b.path));
    if (these.length === 0) continue;
    const names = these.slice(0, NAMES_SHOWN).map((l) => display(l.path));
    const more = these.length - names.length;
    parts.push(`${WHY[why](these.length)} (${names.join(', ')}${more ? `, ${more} more` : ''})`);
  }
  const n = links.length;
  return `note: ${n} symbolic link${n === 1 ? '' : 's'} not followed: ${parts.join('; ')}`;
}

export interface LoadedFile {
  path: string;
  doc: AnalysedDocument;
}

export interface ReadFile {
  path: string;
  text: string;
}

/** A notes file's text through the IO; a text with NUL characters is binary (an IO that hands over strings cannot say more). */
function readNote(io: CliIO, path: string): string {
  const text = io.readFile(path);
  const nul = text.indexOf('\u0000');
  if (nul >= 0) throw new InputProblem(`skipped: binary (NUL character at offset ${nul})`);
  return text;
}

/** Read the notes files the paths name (those `keep` keeps); a file that cannot be read, or is not text, is reported and skipped. */
export function readFiles(paths: string[], io: CliIO, report: InputReport, keep: (path: string) => boolean = () => true): ReadFile[] {
  const out: ReadFile[] = [];
  for (const path of collectFiles(paths, io, report)) {
    if (!keep(path)) continue;
    try {
      out.push({ path, text: readNote(io, path) });
    } catch (e) {
      report.problems.push({ path, message: problemOf(e) });
    }
  }
  return out;
}

/** Read and analyse files; a file that cannot be read is reported and skipped. */
export function loadFiles(paths: string[], io: CliIO, report: InputReport): LoadedFile[] {
  const files = readFiles(paths, io, report);
  const shelf = shelfSourceIn(files, io);
  return files.map((f) => ({ path: f.path, doc: analyseFile(f.path, f.text, shelf) }));
}

/**
 * The workspace's shelf file (`shelf.md`, `*.shelf.md`, `shelf.fnote`): the first in path order among the
 * files read, else among `others` (files the walk found but this run does not check, such as another
 * shard's), else beside a file read (a file named on its own), once per folder.
 */
export function shelfSourceIn(read: readonly ReadFile[], io: CliIO, others: readonly string[] = []): ShelfSource | undefined {
  const hit = read.find((f) => isShelfFile(f.path));
  if (hit) return { path: hit.path, text: hit.text };
  const other = others.find(isShelfFile);
  if (other !== undefined) {
    try {
      return { path: other, text: readNote(io, other) };
    } catch {
      return undefined;
    }
  }
  for (const dir of new Set(read.map((f) => dirname(f.path))))
    for (const name of ['shelf.md', 'shelf.markdown', 'shelf.fnote']) {
      const path = join(dir, name);
      try {
        if (io.isDirectory(path)) continue;
        return { path, text: readNote(io, path) };
      } catch {
        // none there
      }
    }
  return undefined;
}

export const emptyReport = (): InputReport => ({ problems: [], links: [] });

/**
 * Refuse to write a page over what the user wrote: an output path that is one of the inputs, a notes
 * file (.md, .markdown, .fnote), or a link (symbolic or hard) to one. Compares real paths and device
 * and inode numbers.
 */
export function guardOutputPath(out: string, inputs: string[], io: CliIO): void {
  const refuse = (why: string) => {
    throw new UsageError(`${out}: will not write the page there: ${why}`);
  };
  if (languageOf(out)) refuse('it is a notes file (.md, .markdown, .fnote); name the page .html');
  const sameName = inputs.find((p) => resolve(io.cwd, p) === resolve(io.cwd, out));
  if (sameName !== undefined) refuse('it is the notes file read');
  if (!io.inspect) return;
  let o: PathInfo;
  try {
    o = io.inspect(out);
  } catch {
    return; // Nothing there yet.
  }
  if (o.target === 'missing') refuse('it is a symbolic link that leads nowhere');
  if (o.target === 'dir') refuse('it is a folder');
  if (o.real && languageOf(o.real)) refuse(`it is a link to the notes file ${o.real}`);
  for (const p of inputs) {
    let i: PathInfo;
    try {
      i = io.inspect(p);
    } catch {
      continue;
    }
    if ((o.real && o.real === i.real) || (o.id && o.id === i.id)) refuse(`it is the notes file read (${p}) under another name`);
  }
}
