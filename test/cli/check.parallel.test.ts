/**
 * `check` over many files: worker threads give the same findings, in the same order, as one thread;
 * worker failures become one-line problems and never hang the run; the progress line is drawn only on
 * a terminal. The real worker is the built bundle (dist/cli.js; npm test builds first).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import { describe, expect, it } from 'vitest';
import { tempFolders } from '../temp';
import { generateNotes } from '../../bench/generate';
import { AUTO_MIN_CHARS, AUTO_MIN_CORES, AUTO_MIN_FILES, readJobs, workerCount } from '../../server/src/cli/check';
import { nodeIO, run, type CliIO } from '../../server/src/cli/main';
import { checkHere, checkInWorkers, WORKER_ROLE, type CheckJob, type CheckOutcome } from '../../server/src/cli/pool';

/** Temporary folders of this file, removed when it is done. */
const mkdtempSync = tempFolders();

const CLI = join(__dirname, '../../dist/cli.js');
const bundleWorker = () => new Worker(CLI, { workerData: { role: WORKER_ROLE } });

/** A folder of `n` generated notes, Markdown and .fnote, in subfolders, some with non-ASCII names. */
function notesFolder(n: number, seed = 1): string {
  const dir = mkdtempSync(join(tmpdir(), 'ionwright-many-'));
  for (let i = 0; i < n; i++) {
    const sub = join(dir, i % 3 === 0 ? 'bench' : i % 3 === 1 ? 'Prüfstand ß' : 'line-2/baths');
    mkdirSync(sub, { recursive: true });
    const text = generateNotes(2_000 + ((i * 1_733) % 9_000), seed * 1_000 + i);
    if (i % 5 === 4)
      writeFileSync(
        join(sub, `trial-${i}.fnote`),
        text
          .split('\n')
          .filter((l) => !l.startsWith('```'))
          .map((l) => (l.startsWith('- ') ? `formula: ${l.slice(2).split(' ')[1] ?? 'NaCl'}` : l))
          .join('\n'),
      );
    else writeFileSync(join(sub, `${i % 7 === 0 ? 'Bäder ' : 'notes-'}${i}.md`), text);
  }
  return dir;
}

const jobsOf = (texts: string[]): CheckJob[] => texts.map((text, i) => ({ path: `n${i}.${i % 4 === 3 ? 'fnote' : 'md'}`, text }));

describe('choosing the number of workers', () => {
  it('--jobs wins over IONWRIGHT_JOBS; auto, whole numbers from 1, nothing else', () => {
    expect(readJobs(undefined, undefined)).toBe('auto');
    expect(readJobs(undefined, '')).toBe('auto');
    expect(readJobs(undefined, '3')).toBe(3);
    expect(readJobs('1', '3')).toBe(1);
    expect(readJobs('AUTO', '3')).toBe('auto');
    for (const bad of ['0', '-2', '1.5', 'two', '']) expect(() => readJobs(bad, undefined)).toThrow(/--jobs must be/);
    expect(() => readJobs(undefined, 'x')).toThrow(/IONWRIGHT_JOBS must be/);
  });

  it('auto stays in this thread for few files, little text or few cores, else leaves one core free; a number is honoured up to the files', () => {
    expect(workerCount('auto', AUTO_MIN_FILES - 1, 10 * AUTO_MIN_CHARS, 8)).toBe(1);
    expect(workerCount('auto', 100, AUTO_MIN_CHARS - 1, 8)).toBe(1);
    expect(workerCount('auto', 100, AUTO_MIN_CHARS, AUTO_MIN_CORES - 1)).toBe(1);
    expect(workerCount('auto', 100, AUTO_MIN_CHARS, 2)).toBe(1);
    expect(workerCount('auto', 100, AUTO_MIN_CHARS, AUTO_MIN_CORES)).toBe(AUTO_MIN_CORES - 1);
    expect(workerCount('auto', AUTO_MIN_FILES, AUTO_MIN_CHARS, 64)).toBe(AUTO_MIN_FILES);
    expect(workerCount(1, 100, 10 * AUTO_MIN_CHARS, 8)).toBe(1);
    expect(workerCount(4, 3, 10, 2)).toBe(3);
    expect(workerCount(4, 1, 10, 2)).toBe(1);
  });
});

describe('the worker pool with the real worker (dist/cli.js)', () => {
  it("gives each file the findings this thread gives it, in the files' order, the work done by the workers", async () => {
    const jobs = jobsOf(Array.from({ length: 40 }, (_, i) => generateNotes(1_000 + 300 * (i % 9), 50 + i)));
    let started = 0;
    let answered = 0;
    const progress: number[] = [];
    const result = await checkInWorkers(jobs, {
      size: 2,
      start: () => {
        started++;
        const w = bundleWorker();
        w.on('message', (m: { id?: number }) => void (m.id !== undefined && answered++));
        return w;
      },
      onProgress: (done) => progress.push(done),
    });
    expect(result.notice).toBeUndefined();
    expect(started).toBe(2);
    expect(answered).toBe(jobs.length);
    expect(progress).toEqual(jobs.map((_, i) => i + 1));
    expect(result.outcomes).toEqual(jobs.map(checkHere));
    expect(result.outcomes.filter((o) => 'diagnostics' in o && o.diagnostics.length > 0).length).toBeGreaterThan(10);
  });

  it('an empty list needs no worker', async () => {
    let started = 0;
    const r = await checkInWorkers([], { size: 4, start: () => (started++, bundleWorker()) });
    expect(r.outcomes).toEqual([]);
    expect(started).toBe(0);
  });
});

/**
 * A stand-in worker that speaks the protocol: it answers each file with one finding whose message is
 * the file's path, after a random delay, and misbehaves on files whose text asks it to.
 */
const FAKE = `
const { parentPort } = require('node:worker_threads');
// Like the real worker, one file at a time, in the order they come.
const queue = [];
let busy = false;
const next = () => {
  if (busy || queue.length === 0) return;
  busy = true;
  const m = queue.shift();
  setTimeout(() => {
    if (m.text === 'EXIT') process.exit(3);
    if (m.text === 'THROW') throw new Error('stand-in worker broke on ' + m.path);
    parentPort.postMessage({ id: m.id, diagnostics: [{ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, severity: 3, code: 'seen', message: m.path, source: 'ionwright' }] });
    busy = false;
    next();
  }, Math.floor(Math.random() * 10));
};
parentPort.on('message', (m) => { queue.push(m); next(); });
parentPort.postMessage({ ready: true });
`;
const fakeWorker = () => new Worker(FAKE, { eval: true });
const messages = (o: CheckOutcome) => ('diagnostics' in o ? o.diagnostics.map((d) => d.message) : undefined);

describe('the worker pool when workers misbehave', () => {
  it("keeps the files' order whichever worker answers first", async () => {
    const jobs = jobsOf(Array.from({ length: 30 }, () => 'text'));
    const r = await checkInWorkers(jobs, { size: 3, start: fakeWorker });
    expect(r.outcomes.map(messages)).toEqual(jobs.map((j) => [j.path]));
  });

  it.each([1, 3])('a worker that exits on a file costs that file only, and is replaced (%i workers)', async (size) => {
    const texts = Array.from({ length: 12 }, (_, i) => (i === 4 || i === 9 ? 'EXIT' : 'text'));
    const jobs = jobsOf(texts);
    const r = await checkInWorkers(jobs, { size, start: fakeWorker });
    r.outcomes.forEach((o, i) => {
      if (texts[i] === 'EXIT') expect(o).toEqual({ failure: 'analysis stopped: its worker thread exited with code 3' });
      else expect(messages(o)).toEqual([jobs[i].path]);
    });
    expect(r.notice).toBeUndefined();
  });

  it("an uncaught error in a worker is that file's one-line problem", async () => {
    const jobs = jobsOf(['text', 'THROW', 'text', 'text']);
    const r = await checkInWorkers(jobs, { size: 2, start: fakeWorker });
    expect(r.outcomes[1]).toEqual({ failure: 'analysis stopped: its worker thread failed: stand-in worker broke on n1.md' });
    expect([0, 2, 3].map((i) => messages(r.outcomes[i]))).toEqual([['n0.md'], ['n2.md'], ['n3.fnote']]);
  });

  it('workers that cannot start leave the files to this thread, with a notice', async () => {
    const jobs = jobsOf(['We used `NaXx`.', 'formula: KCl', 'Plain prose.']);
    for (const start of [
      () => new Worker('throw new Error("no threads here")', { eval: true }),
      () => {
        throw new Error('no threads here');
      },
    ]) {
      const r = await checkInWorkers(jobs, { size: 2, start: start as () => Worker });
      expect(r.outcomes).toEqual(jobs.map(checkHere));
      expect(r.notice).toMatch(/^worker threads could not start \(.*no threads here.*\); the remaining files were checked in one thread$/);
    }
  });

  it('workers that die on every file end the run all the same: some files lost, the rest checked here', async () => {
    const jobs = jobsOf(Array.from({ length: 10 }, (_, i) => (i < 6 ? 'EXIT' : `formula: NaCl, Xx${i}`)));
    const r = await checkInWorkers(jobs, { size: 2, start: fakeWorker });
    expect(r.outcomes).toHaveLength(10);
    const lost = r.outcomes.filter((o) => 'failure' in o).length;
    expect(lost).toBeGreaterThanOrEqual(1);
    expect(lost).toBeLessThanOrEqual(6);
    expect(r.notice).toMatch(/worker threads kept failing/);
    // The files after the ones that killed workers were checked in this thread, with the real analysis.
    for (let i = 6; i < 10; i++) expect(r.outcomes[i]).toEqual(checkHere(jobs[i]));
  });
});

describe('ionwright check on a folder of 40 notes', () => {
  const dir = notesFolder(40);
  const cli = (args: string[], env: Record<string, string> = {}) =>
    spawnSync('node', [CLI, 'check', dir, ...args], { cwd: dir, encoding: 'utf8', env: { ...process.env, ...env } });

  it.each(['text', 'json', 'sarif'])('prints exactly the same %s in one thread, with two or three workers and with auto', (format) => {
    const one = cli(['--format', format], { IONWRIGHT_JOBS: '1' });
    expect(one.status).toBe(1);
    expect(one.stderr).toBe('');
    const runs = [
      cli(['--format', format], { IONWRIGHT_JOBS: '2' }),
      cli(['--format', format, '--jobs', '3'], { IONWRIGHT_JOBS: '1' }),
      cli(['--format', format]),
    ];
    for (const r of runs) {
      expect(r.stderr).toBe(''); // no fallback notice: the workers did the work
      expect(r.status).toBe(one.status);
      expect(r.stdout).toBe(one.stdout);
    }
    if (format === 'json') {
      const files = (JSON.parse(one.stdout) as Array<{ file: string }>).map((d) => d.file);
      expect(new Set(files).size).toBeGreaterThan(20);
      // Sorted file order, as the folder walk gives it (folder by folder, names sorted).
      const order = [...new Set(files)];
      const byFolder = (f: string) => f.slice(0, f.lastIndexOf('/'));
      for (let i = 1; i < order.length; i++) {
        if (byFolder(order[i]) === byFolder(order[i - 1])) expect(order[i] > order[i - 1]).toBe(true);
      }
    }
  });

  it('a file that cannot be read is one line on stderr and exit 2, in one thread and with workers alike', (ctx) => {
    const broken = notesFolder(12, 2);
    // A named pipe called like a note: reading it would block, so it is not read. (As root, a file
    // without read permission can still be read, so permissions cannot make an unreadable file here.)
    spawnSync('mkfifo', [join(broken, 'bench', 'pipe.md')]);
    if (!existsSync(join(broken, 'bench', 'pipe.md'))) ctx.skip('mkfifo is not available');
    const run = (jobs: string) =>
      spawnSync('node', [CLI, 'check', broken, '--format', 'json', '--jobs', jobs], { cwd: broken, encoding: 'utf8', timeout: 20_000 });
    const one = run('1');
    const two = run('2');
    for (const r of [one, two]) {
      expect(r.status).toBe(2);
      expect(r.stderr).toBe('ionwright: bench/pipe.md: cannot be read: a named pipe, not a regular file\n');
    }
    expect(two.stdout).toBe(one.stdout);
    expect(JSON.parse(one.stdout).length).toBeGreaterThan(0);
  });
});

/** The real file system, stdout and stderr captured; stderr a terminal or not; workers counted. */
function captured(tty: boolean, workers: boolean): CliIO & { outText: string; errText: string; raw: string; started: number } {
  const self = {
    ...nodeIO,
    outText: '',
    errText: '',
    raw: '',
    started: 0,
    out: (t: string) => void (self.outText += t + '\n'),
    err: (t: string) => void (self.errText += t + '\n'),
    errRaw: (t: string) => void (self.raw += t),
    errIsTTY: tty,
    env: {},
    cores: 2,
    startWorker: workers ? () => (self.started++, bundleWorker()) : undefined,
  };
  return self;
}

describe('when check starts workers', () => {
  it('auto: none on 2 cores, cores less one on 4 cores for enough text, none for a few files; --jobs 1: none', async () => {
    // Ten notes, together just over the size from which auto uses workers.
    const big = mkdtempSync(join(tmpdir(), 'ionwright-big-'));
    for (let i = 0; i < 10; i++) writeFileSync(join(big, `n${i}.md`), generateNotes(Math.ceil(AUTO_MIN_CHARS / 10) + 100, 300 + i));
    const startsOn = async (args: string[], cores: number, env: Record<string, string> = {}) => {
      const io = captured(false, true);
      io.cores = cores;
      io.env = env;
      const code = await run(['check', ...args], io);
      return { code, started: io.started, out: io.outText };
    };
    const four = await startsOn([big], 4);
    expect(four.started).toBe(3);
    expect(four.code).toBe(1);
    const two = await startsOn([big], 2);
    expect(two.started).toBe(0);
    expect(two.out).toBe(four.out);
    expect((await startsOn([big, '--jobs', '1'], 4)).started).toBe(0);
    expect((await startsOn([big], 4, { IONWRIGHT_JOBS: '1' })).started).toBe(0);
    const examples = join(__dirname, '../../examples');
    expect((await startsOn([examples], 64)).started).toBe(0);
    expect((await startsOn([examples], 2, { IONWRIGHT_JOBS: '4' })).started).toBe(3); // asked for 4, but there are three files
  });
});

describe('the progress line', () => {
  const dir = notesFolder(12, 3);

  it.each([[false], [true]])('on a terminal it counts the files up and is wiped at the end (workers: %s)', async (workers) => {
    const io = captured(true, workers);
    const code = await run(['check', dir, '--jobs', workers ? '2' : '1'], io);
    expect(code).toBe(1);
    const frames = io.raw.split('\r').filter(Boolean);
    const counts = frames
      .filter((f) => f.trim())
      .map((f) => {
        const m = /^checking (\d+)\/12 files…\s*$/.exec(f);
        expect(m, JSON.stringify(f)).not.toBeNull();
        return Number(m![1]);
      });
    expect(counts[0]).toBe(0);
    expect(counts.at(-1)).toBe(12);
    for (let i = 1; i < counts.length; i++) expect(counts[i]).toBeGreaterThan(counts[i - 1]);
    // The last frame blanks the line and returns to its start.
    expect(io.raw.endsWith('\r' + ' '.repeat('checking 12/12 files…'.length) + '\r')).toBe(true);
    expect(io.errText).toBe('');
    const plain = captured(false, false);
    await run(['check', dir, '--jobs', '1'], plain);
    expect(io.outText).toBe(plain.outText);
    expect(io.outText).not.toContain('checking');
  });

  it('is never drawn when stderr is not a terminal', async () => {
    const io = captured(false, true);
    await run(['check', dir, '--jobs', '2'], io);
    expect(io.raw).toBe('');
    expect(io.errText).toBe('');
  });

  it.skipIf(!existsSync('/usr/bin/script'))('is drawn by the real command on a pseudo-terminal', () => {
    const r = spawnSync('script', ['-qec', `node ${CLI} check ${JSON.stringify(dir)} --jobs 2`, '/dev/null'], { encoding: 'utf8', timeout: 30_000 });
    expect(r.stdout).toContain('\rchecking 0/12 files…');
    expect(r.stdout).toContain('\rchecking 12/12 files…');
    expect(r.stdout).toMatch(/12 files checked: \d+ errors?, \d+ warnings?\./);
  });
});
