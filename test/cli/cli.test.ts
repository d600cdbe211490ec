/** The command line as outside checks drive it: the built dist/cli.js (npm test builds first). */
import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { COMMAND_HELP } from '../../server/src/cli/help';
import { tempFolders } from '../temp';

/** Temporary folders of this file, removed when it is done. */
const mkdtempSync = tempFolders();

const CLI = join(__dirname, '../../dist/cli.js');
const cli = (args: string[], cwd = join(__dirname, '../..')) => spawnSync('node', [CLI, ...args], { cwd, encoding: 'utf8' });

describe('ionwright card', () => {
  it('prints one JSON object per argument with the contract fields', () => {
    const out = JSON.parse(execFileSync('node', [CLI, 'card', 'CuSO4.5H2O', 'SO₄²⁻', '[Co(NH3)6]Cl3', '--json'], { encoding: 'utf8' }));
    expect(out).toHaveLength(3);
    for (const c of out) {
      for (const k of [
        'input',
        'formula',
        'hill',
        'charge',
        'atoms',
        'molarMass',
        'composition',
        'oxidationStates',
        'chargeBalance',
        'bond',
        'latticeEnergy',
        'diagnostics',
      ])
        expect(c).toHaveProperty(k);
    }
    expect(out[0]).toMatchObject({ input: 'CuSO4.5H2O', formula: 'CuSO₄·5H₂O', hill: 'CuH10O9S', charge: 0, atoms: { Cu: 1, H: 10, O: 9, S: 1 } });
    expect(out[1]).toMatchObject({ charge: -2, atoms: { O: 4, S: 1 } });
    const fractions = out[0].composition.reduce((s: number, c: { massFraction: number }) => s + c.massFraction, 0);
    expect(fractions).toBeCloseTo(1, 5);
  });

  it('gives an unreadable formula an object with a null molar mass and an error diagnostic with its range', () => {
    const r = cli(['card', 'NaXx2', '--json']);
    expect(r.status).toBe(1);
    const [c] = JSON.parse(r.stdout);
    expect(c.molarMass).toBeNull();
    expect(c.diagnostics[0]).toMatchObject({
      code: 'unknown-element',
      severity: 1,
      range: { start: { line: 0, character: 2 }, end: { line: 0, character: 4 } },
      source: 'ionwright',
    });
  });

  it('prints readable text without --json', () => {
    const r = cli(['card', 'NaCl']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/molar mass\s+58\.44/);
  });
});

describe('ionwright check', () => {
  const dir = mkdtempSync(join(tmpdir(), 'ionwright-'));
  const note = 'Intro ünïcødé 🧪 `NaXx` and `Ca(NO3`\n';
  writeFileSync(join(dir, 'a.md'), note);
  mkdirSync(join(dir, 'sub'));
  writeFileSync(join(dir, 'sub', 'b.fnote'), 'formula: NaCl, Qq2\n');
  writeFileSync(join(dir, 'ignored.txt'), '`Xx`');

  it('reports diagnostics with exact UTF-16 ranges, folders read recursively', () => {
    const r = cli(['check', dir, '--format', 'json']);
    expect(r.status).toBe(1);
    const diags = JSON.parse(r.stdout);
    const a = diags.filter((d: { file: string }) => d.file.endsWith('a.md'));
    const start = note.indexOf('Xx');
    expect(a[0]).toMatchObject({
      code: 'unknown-element',
      severity: 1,
      source: 'ionwright',
      range: { start: { line: 0, character: start }, end: { line: 0, character: start + 2 } },
    });
    expect(a[1]).toMatchObject({ code: 'malformed-formula', range: { start: { line: 0, character: note.indexOf('(') } } });
    const b = diags.filter((d: { file: string }) => d.file.endsWith('b.fnote'));
    expect(b[0]).toMatchObject({ code: 'unknown-element', range: { start: { line: 0, character: 15 }, end: { line: 0, character: 17 } } });
    expect(diags.some((d: { file: string }) => d.file.endsWith('.txt'))).toBe(false);
  });

  it('prints text as file:line:col severity code message (1-based), the same findings as json, then a summary', () => {
    const r = cli(['check', dir], dir);
    expect(r.status).toBe(1);
    const lines = r.stdout.trimEnd().split('\n');
    const start = note.indexOf('Xx');
    expect(lines[0].startsWith(`a.md:1:${start + 1} error unknown-element 'Xx' is not an element symbol.`)).toBe(true);
    const json = JSON.parse(cli(['check', dir, '--format', 'json'], dir).stdout) as Array<{
      file: string;
      range: { start: { line: number; character: number } };
      severity: number;
      code: string;
      message: string;
    }>;
    const word = ['', 'error', 'warning', 'info', 'hint'];
    expect(lines.slice(0, -1)).toEqual(
      json.map((d) => `${d.file}:${d.range.start.line + 1}:${d.range.start.character + 1} ${word[d.severity]} ${d.code} ${d.message}`),
    );
    const errors = json.filter((d) => d.severity === 1).length;
    const warnings = json.filter((d) => d.severity === 2).length;
    expect(lines.at(-1)).toBe(`2 files checked: ${errors} error${errors === 1 ? '' : 's'}, ${warnings} warning${warnings === 1 ? '' : 's'}.`);
    expect(r.stdout).not.toMatch(/: (error|warning) \[/);
    // Not a terminal: no progress line, nothing on stderr.
    expect(r.stderr).toBe('');
  });

  it('prints SARIF 2.1.0', () => {
    const sarif = JSON.parse(cli(['check', dir, '--format', 'sarif']).stdout);
    expect(sarif.version).toBe('2.1.0');
    expect(sarif.runs[0].results.length).toBeGreaterThanOrEqual(3);
    expect(sarif.runs[0].results[0].locations[0].physicalLocation.region.startLine).toBe(1);
  });

  it('exits 0 on clean notes', () => {
    const clean = mkdtempSync(join(tmpdir(), 'ionwright-'));
    writeFileSync(join(clean, 'ok.md'), 'We used `NaCl` and `H2O`.\n');
    expect(cli(['check', clean]).status).toBe(0);
  });

  it.each([
    [[]],
    [['check', dir, '--jobs', '0']],
    [['check', dir, '--jobs', 'many']],
    [['check', '/nonexistent/folder']],
    [['check', dir, '--format', 'xml']],
    [['check', dir, '--bogus']],
    [['frobnicate']],
    [['card']],
    [['check', join(dir, 'ignored.txt')]],
  ])('usage and input problems exit 2 with one line on stderr: %j', (args) => {
    const r = cli(args);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });
});

describe('ionwright --help and --version', () => {
  const pkg = JSON.parse(readFileSync(join(__dirname, '../../package.json'), 'utf8'));

  it('--version prints the version of package.json', () => {
    const r = cli(['--version']);
    expect(r.status).toBe(0);
    expect(r.stdout.trim()).toBe(`ionwright ${pkg.version}`);
  });

  it('--help lists every command, the flags of check, the environment and examples, and exits 0', () => {
    for (const args of [['--help'], ['-h'], ['help']]) {
      const r = cli(args);
      expect(r.status).toBe(0);
      expect(r.stderr).toBe('');
      for (const c of ['card', 'check', 'balance', 'batch', 'table', 'report', 'demo']) expect(r.stdout).toMatch(new RegExp(`^  ionwright ${c} `, 'm'));
      expect(r.stdout).toContain(
        'ionwright report <path> [--html <out.html>] a self-contained HTML page: formulas and batches as tables, a chart of estimated lattice energies',
      );
      for (const flag of ['--format text|json|sarif', '--jobs <n>|auto', '--json', '--version', 'IONWRIGHT_JOBS']) expect(r.stdout).toContain(flag);
      expect(r.stdout).toMatch(/^Examples.*\n {2}ionwright check examples\//m);
    }
  });

  it.each(Object.keys(COMMAND_HELP))("%s --help prints that command's usage and exits 0", (command) => {
    const r = cli([command, '--help']);
    expect(r.status).toBe(0);
    expect(r.stdout.startsWith(`Usage: ionwright ${command}`)).toBe(true);
    expect(r.stdout).toContain('-h, --help');
    expect(cli(['help', command]).stdout).toBe(r.stdout);
  });

  it('help for a command that does not exist is a usage problem', () => {
    const r = cli(['help', 'frobnicate']);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });

  /** The example lines of a help text, as argument lists (quotes honoured; '> file' and VAR=value understood). */
  function examples(help: string) {
    const out: Array<{ args: string[]; env: Record<string, string>; stdoutTo?: string }> = [];
    let inExamples = false;
    for (const line of help.split('\n')) {
      if (/^Examples?\b/.test(line)) inExamples = true;
      else if (inExamples && !line.startsWith('  ')) inExamples = false;
      else if (inExamples) {
        const words = [...line.trim().matchAll(/"([^"]*)"|(\S+)/g)].map((m) => m[1] ?? m[2]);
        const env: Record<string, string> = {};
        while (/^[A-Z_]+=/.test(words[0])) {
          const [k, v] = (words.shift() as string).split('=');
          env[k] = v;
        }
        expect(words.shift()).toBe('ionwright');
        const gt = words.indexOf('>');
        const stdoutTo = gt >= 0 ? words[gt + 1] : undefined;
        out.push({ args: gt >= 0 ? words.slice(0, gt) : words, env, stdoutTo });
      }
    }
    return out;
  }

  it('every example of every help text runs on the demo notes (exit 0 or 1, never a usage problem)', () => {
    const root = join(__dirname, '../..');
    const helps = [cli(['--help']).stdout, ...Object.keys(COMMAND_HELP).map((c) => cli([c, '--help']).stdout)];
    const all = helps.flatMap(examples);
    expect(all.length).toBeGreaterThanOrEqual(10);
    const scratch = mkdtempSync(join(tmpdir(), 'ionwright-help-'));
    for (const ex of all) {
      // Pages and SARIF logs go to the scratch folder; a log an example writes is there for the next (merge-sarif).
      const args = ex.args.map((a) => (a.endsWith('.html') || a.endsWith('.sarif') ? join(scratch, a) : a));
      const r = spawnSync('node', [CLI, ...args], { cwd: root, encoding: 'utf8', env: { ...process.env, ...ex.env } });
      if (ex.stdoutTo?.endsWith('.sarif')) writeFileSync(join(scratch, ex.stdoutTo), r.stdout);
      expect([0, 1], `${ex.args.join(' ')}: ${r.stderr}`).toContain(r.status);
      const html = args.find((a) => a.endsWith('.html'));
      if (html) expect(readFileSync(html, 'utf8'), ex.args.join(' ')).toMatch(/^<!doctype html>/);
      else expect(r.stdout.length, ex.args.join(' ')).toBeGreaterThan(0);
      if (ex.stdoutTo?.endsWith('.sarif')) expect(JSON.parse(r.stdout).version).toBe('2.1.0');
    }
  });
});

describe('ionwright report', () => {
  const scratch = mkdtempSync(join(tmpdir(), 'ionwright-report-'));
  it('writes a self-contained page and says where; exit 1 for notes with errors, 0 for clean ones', () => {
    const out = join(scratch, 'rinse.html');
    const r = cli(['report', 'examples/rinse-trials.md', '--html', out]);
    expect(r.status).toBe(1); // the demo note has an unknown element on purpose
    expect(r.stderr.trim()).toBe(`ionwright: wrote ${out}`);
    const html = readFileSync(out, 'utf8');
    expect(html).toMatch(/^<!doctype html>/);
    expect(html).toContain('<svg');
    expect(html).not.toMatch(/<script|<link/);
    writeFileSync(join(scratch, 'ok.md'), 'We used `NaCl` and `MgO`.\n');
    const clean = cli(['report', join(scratch, 'ok.md')]);
    expect(clean.status).toBe(0);
    expect(clean.stdout).toMatch(/^<!doctype html>/);
  });
  it.each([
    [['report'], /exactly one notes file/],
    [['report', 'examples'], /one notes file, not a folder/],
    [['report', 'nope.md'], /no such file/],
    [['report', 'examples/rinse-trials.md', '--html', '/nonexistent-dir/x.html'], /cannot be written/],
    [['report', 'examples/rinse-trials.md', '--pdf', 'x'], /Unknown option/],
  ])('usage and input problems exit 2 with one line: %j', (args, message) => {
    const r = cli(args as string[]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(message as RegExp);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });
});
