/** The command line as outside checks drive it: the built dist/cli.js (npm test builds first). */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const CLI = join(__dirname, '../dist/cli.js');
const cli = (args: string[], cwd = join(__dirname, '..')) => spawnSync('node', [CLI, ...args], { cwd, encoding: 'utf8' });

describe('ionwright card', () => {
  it('prints one JSON object per argument with the contract fields', () => {
    const out = JSON.parse(execFileSync('node', [CLI, 'card', 'CuSO4.5H2O', 'SO₄²⁻', '[Co(NH3)6]Cl3', '--json'], { encoding: 'utf8' }));
    expect(out).toHaveLength(3);
    for (const c of out) {
      for (const k of ['input', 'formula', 'hill', 'charge', 'atoms', 'molarMass', 'composition', 'oxidationStates', 'chargeBalance', 'bond', 'latticeEnergy', 'diagnostics']) expect(c).toHaveProperty(k);
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
    expect(c.diagnostics[0]).toMatchObject({ code: 'unknown-element', severity: 1, range: { start: { line: 0, character: 2 }, end: { line: 0, character: 4 } }, source: 'ionwright' });
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
    expect(a[0]).toMatchObject({ code: 'unknown-element', severity: 1, source: 'ionwright', range: { start: { line: 0, character: start }, end: { line: 0, character: start + 2 } } });
    expect(a[1]).toMatchObject({ code: 'malformed-formula', range: { start: { line: 0, character: note.indexOf('(') } } });
    const b = diags.filter((d: { file: string }) => d.file.endsWith('b.fnote'));
    expect(b[0]).toMatchObject({ code: 'unknown-element', range: { start: { line: 0, character: 15 }, end: { line: 0, character: 17 } } });
    expect(diags.some((d: { file: string }) => d.file.endsWith('.txt'))).toBe(false);
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
