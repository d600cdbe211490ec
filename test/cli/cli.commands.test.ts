/**
 * The commands beyond check as a user meets them: --jobs says what it accepts, batch and table take
 * folders as check does, demo prints findings as check does, balance says its result once, and
 * report's help says where the page goes. The real command (dist/cli.js; npm test builds first).
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tempFolders } from '../temp';

const mkdtempSync = tempFolders();
const CLI = join(__dirname, '../../dist/cli.js');
const ROOT = join(__dirname, '../..');
const cli = (args: string[], cwd = ROOT, env: Record<string, string> = {}) =>
  spawnSync('node', [CLI, ...args], { cwd, encoding: 'utf8', env: { ...process.env, ...env } });

describe('--jobs says what it accepts', () => {
  it.each([
    [['check', 'examples', '--jobs', '-3'], {}, "ionwright: --jobs must be 'auto' or a whole number from 1 (got '-3')\n"],
    [['check', 'examples', '--jobs=-3'], {}, "ionwright: --jobs must be 'auto' or a whole number from 1 (got '-3')\n"],
    [['check', 'examples', '--jobs', '-0.5'], {}, "ionwright: --jobs must be 'auto' or a whole number from 1 (got '-0.5')\n"],
    [['check', 'examples'], { IONWRIGHT_JOBS: '-3' }, "ionwright: IONWRIGHT_JOBS must be 'auto' or a whole number from 1 (got '-3')\n"],
    [['check', 'examples', '--jobs'], {}, 'ionwright: --jobs needs a value\n'],
    [['check', 'examples', '--jobs', '--format', 'json'], {}, 'ionwright: --jobs needs a value\n'],
    [['check', 'examples', '--format', '-x'], {}, "ionwright: unknown format '-x' (use text, json or sarif)\n"],
  ])('%j %j', (args, env, message) => {
    const r = cli(args as string[], ROOT, env as Record<string, string>);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe(message);
  });

  it('a value that starts with a dash is still a value where one is taken (report --html -)', () => {
    const r = cli(['report', 'examples/rinse-trials.md', '--html', '-']);
    expect(r.status).toBe(1);
    expect(r.stdout).toMatch(/^<!doctype html>/);
  });
});

describe('batch and table on a folder: every file, as check does', () => {
  const dir = mkdtempSync(join(tmpdir(), 'ionwright-folder-'));
  mkdirSync(join(dir, 'lab', 'line-2'), { recursive: true });
  writeFileSync(join(dir, 'lab', 'a.md'), 'Bath A uses `NaCl`.\n\n```batch\nname: Bath A\nvolume: 1 L\nNaCl 5.844 g\n```\n');
  writeFileSync(join(dir, 'lab', 'line-2', 'b.fnote'), 'batch\nname: Bath B\nvolume: 500 mL\nKCl 0.1 M\nend\n');
  writeFileSync(join(dir, 'lab', 'line-2', 'c.md'), 'No batches here, only `MgO` and `Xx2`.\n');

  it('batch text: each file headed by its path, in sorted order; exit as check (1: an error finding)', () => {
    const r = cli(['batch', 'lab'], dir);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('');
    const heads = r.stdout.split('\n').filter((l) => l.startsWith('════ '));
    expect(heads).toEqual(['════ lab/a.md', '════ lab/line-2/b.fnote', '════ lab/line-2/c.md']);
    const [, a, b, c] = r.stdout.split(/^════ .*$/m);
    expect(a).toContain('Bath A, final volume 1 L');
    expect(b).toContain('Bath B, final volume 500 mL');
    // 0.1 M KCl in 0.5 L: 0.05 mol × 74.548 g/mol (CIAAW abridged standard atomic weights: K 39.098, Cl 35.45) = 3.727 g.
    expect(b).toMatch(/^KCl +0\.1 M +74\.55 +3\.727 +0\.05 /m);
    expect(c).toContain('No batch blocks in this file.');
  });

  it('batch --json: one array of every batch, each with its file; the contract fields kept', () => {
    const r = cli(['batch', 'lab', '--json'], dir);
    expect(r.status).toBe(1);
    const batches = JSON.parse(r.stdout) as Array<{
      file: string;
      name: string;
      line: number;
      volumeL: number;
      ingredients: Array<{ formula: string; massG: number }>;
    }>;
    expect(batches.map((b) => [b.file, b.name, b.line, b.volumeL])).toEqual([
      ['lab/a.md', 'Bath A', 2, 1],
      ['lab/line-2/b.fnote', 'Bath B', 0, 0.5],
    ]);
    // 5.844 g NaCl: what was weighed.
    expect(batches[0].ingredients[0]).toMatchObject({ formula: 'NaCl', massG: 5.844 });
    // One file named: the same array, with the file too.
    const one = JSON.parse(cli(['batch', 'lab/a.md', '--json'], dir).stdout);
    expect(one).toEqual([batches[0]]);
  });

  it('one file named: the text as before, no heading', () => {
    const r = cli(['batch', 'lab/a.md'], dir);
    expect(r.status).toBe(0);
    expect(r.stdout.startsWith('Bath A, final volume 1 L')).toBe(true);
    expect(cli(['table', 'lab/a.md'], dir).stdout).not.toContain('════');
  });

  it('table: each file headed by its path; the tables of one file as table gives them alone', () => {
    const r = cli(['table', 'lab'], dir);
    expect(r.status).toBe(1);
    expect(r.stdout.split('\n').filter((l) => l.startsWith('════ '))).toEqual(['════ lab/a.md', '════ lab/line-2/b.fnote', '════ lab/line-2/c.md']);
    const alone = cli(['table', 'lab/line-2/b.fnote'], dir).stdout;
    expect(r.stdout).toContain(`════ lab/line-2/b.fnote\n\n${alone}`);
  });

  it('several paths, and a clean folder: exit 0; an empty folder: a usage problem', () => {
    const clean = mkdtempSync(join(tmpdir(), 'ionwright-clean-'));
    writeFileSync(join(clean, 'x.md'), '```batch\nname: X\nvolume: 1 L\nKBr 1 g\n```\n');
    writeFileSync(join(clean, 'y.md'), 'Only `KBr`.\n');
    const r = cli(['table', 'x.md', 'y.md'], clean);
    expect(r.status).toBe(0);
    expect(r.stdout.split('\n').filter((l) => l.startsWith('════ '))).toEqual(['════ x.md', '════ y.md']);
    const empty = mkdtempSync(join(tmpdir(), 'ionwright-empty-'));
    const e = cli(['batch', '.'], empty);
    expect(e.status).toBe(2);
    expect(e.stderr).toBe('ionwright: .: no notes files found\n');
  });
});

describe('demo, balance and report --help', () => {
  it('demo prints findings as check does: file:line:col severity code message', () => {
    const demo = cli(['demo', 'examples']);
    const check = cli(['check', 'examples']);
    const checkLines = check.stdout.trimEnd().split('\n').slice(0, -1);
    expect(checkLines.length).toBeGreaterThan(2);
    for (const l of checkLines) expect(demo.stdout.split('\n')).toContain(l);
    expect(demo.stdout).not.toMatch(/: \[[a-z-]+\] /);
  });

  it.each([
    ['H2 + O2 -> H2O', ['balanced: 2 H2 + O2 -> 2 H2O']],
    ['MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O', ['balanced: MnO4^- + 5 Fe^2+ + 8 H^+ -> Mn^2+ + 5 Fe^3+ + 4 H2O']],
    ['2 H2 + O2 -> 2 H2O', ['already-balanced: 2 H2 + O2 -> 2 H2O', 'Balanced as written.']],
    ['4 H2 + 2 O2 -> 4 H2O', ['already-balanced: 4 H2 + 2 O2 -> 4 H2O', 'Balanced as written; in smallest whole numbers: 2 H₂ + O₂ → 2 H₂O.']],
  ])('balance %s prints its result once', (equation, lines) => {
    // Coefficients checked by hand (atoms and charge on each side).
    const r = cli(['balance', equation]);
    expect(r.status).toBe(0);
    expect(r.stdout).toBe(lines.join('\n') + '\n');
  });

  it('report --help says --html is optional and the page goes to stdout without it', () => {
    const r = cli(['report', '--help']);
    expect(r.stdout.startsWith('Usage: ionwright report <path> [--html <out.html>]\n')).toBe(true);
    expect(r.stdout).toMatch(/without the flag \(or with --html -\) the page goes\s+to standard output/);
    expect(cli(['--help']).stdout).toContain('ionwright report <path> [--html <out.html>]');
  });
});
