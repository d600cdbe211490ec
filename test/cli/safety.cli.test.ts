/**
 * The safety reading through the command line, as a user runs it on an invented tank-room note (the built
 * dist/cli.js; npm test builds first): `check` raises batch-incompatible on the later line and batch-heat on
 * the caustic line, `batch --json` gives every batch `hazards` and `heat` in the contract's shape, `batch`
 * and `report` show the safety section with its notice.
 *
 * Reference figure: ΔsolH°(NaOH) = −44.51 kJ/mol at infinite dilution (CRC Handbook, "Enthalpy of solution of
 * electrolytes"; from memory), so 200 g (5.0 mol) give about −210 to −225 kJ.
 */
import { spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tempFolders } from '../temp';

const mkdtempSync = tempFolders();
const CLI = join(__dirname, '../../dist/cli.js');
const cli = (args: string[], cwd: string) => spawnSync('node', [CLI, ...args], { cwd, encoding: 'utf8' });

const NOTE = [
  '# Tank room, week 49 (Kestrel Finishing, invented)',
  '',
  '```batch',
  'name: Cyanide strike top-up',
  'volume: 20 L',
  'NaCN 600 g',
  'CuCN 400 g',
  'H2SO4 100 g   # a mistake: acid into cyanide',
  '```',
  '',
  '```batch',
  'name: Soak caustic',
  'volume: 1 L',
  'NaOH 200 g',
  '```',
  '',
  '```batch',
  'name: Brine',
  'volume: 1 L',
  'NaCl 5.84 g',
  '```',
  '',
].join('\n');
const lineOf = (prefix: string) => NOTE.split('\n').findIndex((l) => l.startsWith(prefix));

const dir = mkdtempSync(join(tmpdir(), 'ionwright-safety-cli-'));
writeFileSync(join(dir, 'tanks.md'), NOTE);

interface Diag {
  code: string;
  severity: number;
  message: string;
  range: { start: { line: number; character: number }; end: { line: number; character: number } };
}

describe('ionwright check', () => {
  it('batch-incompatible: warnings on the acid line (the later one), naming both; batch-heat on the NaOH line', () => {
    const r = cli(['check', 'tanks.md', '--format', 'json'], dir);
    expect(r.status).toBe(0);
    const diags = JSON.parse(r.stdout) as Diag[];
    const inc = diags.filter((d) => d.code === 'batch-incompatible');
    expect(inc.length).toBe(2);
    for (const d of inc) {
      expect(d.severity).toBe(2);
      expect(d.range.start).toEqual({ line: lineOf('H2SO4'), character: 0 });
      expect(d.message).toMatch(/sulfuric acid \(H₂SO₄\) gives hydrogen cyanide gas/);
      expect(d.message).toMatch(/SDS/);
    }
    expect(inc.map((d) => /\((NaCN|CuCN)\)/.exec(d.message)?.[1]).sort()).toEqual(['CuCN', 'NaCN']);
    const heat = diags.filter((d) => d.code === 'batch-heat');
    expect(heat.length).toBe(1);
    expect(heat[0].severity).toBe(2);
    expect(heat[0].range.start.line).toBe(lineOf('NaOH'));
  });
});

describe('ionwright batch --json', () => {
  it('every object has hazards [{kind, message, ingredients}] and heat {kJ, temperatureRiseK, method}', () => {
    const r = cli(['batch', 'tanks.md', '--json'], dir);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as Array<{
      name: string;
      hazards: Array<{ kind: string; message: string; ingredients: string[] }>;
      heat: { kJ: number; temperatureRiseK: number | null; method: string } | null;
    }>;
    expect(out.map((b) => b.name)).toEqual(['Cyanide strike top-up', 'Soak caustic', 'Brine']);
    for (const b of out) {
      expect(Array.isArray(b.hazards)).toBe(true);
      expect('heat' in b).toBe(true);
    }
    expect(out[0].hazards.map((h) => [h.kind, h.ingredients])).toEqual([
      ['hydrogen-cyanide', ['NaCN', 'H₂SO₄']],
      ['hydrogen-cyanide', ['CuCN', 'H₂SO₄']],
    ]);
    expect(out[1].hazards).toEqual([]);
    expect(out[1].heat!.kJ).toBeLessThan(-200);
    expect(out[1].heat!.kJ).toBeGreaterThan(-225);
    expect(out[1].heat!.temperatureRiseK).toBeGreaterThan(40);
    expect(out[1].heat!.method).toMatch(/an estimate$/);
    expect(out[2].hazards).toEqual([]);
    // NaCl takes up heat (CRC Handbook: +3.88 kJ/mol, from memory): a slight cooling, a negative rise.
    expect(out[2].heat!.temperatureRiseK).toBeLessThan(0);
  });
});

describe('ionwright batch and report', () => {
  it('the text shows the safety section with the advice and the notice', () => {
    const r = cli(['batch', 'tanks.md'], dir);
    expect(r.stdout).toContain('Safety (an aid, not a safety assessment):');
    expect(r.stdout).toContain('⚠ NaCN + H₂SO₄ → hydrogen cyanide (toxic gas)');
    expect(r.stdout).toMatch(/Heat of making up: ΔH ≈ −2\d\d kJ, ΔT ≈ \+5\d K .* — estimate, over the 15 K setting\./);
    expect(r.stdout).toContain('Follow the safety data sheets (SDS)');
  });

  it('the report holds a safety box per batch', () => {
    const r = cli(['report', 'tanks.md', '--html', 'tanks.html'], dir);
    expect(r.status).toBe(0);
    const page = readFileSync(join(dir, 'tanks.html'), 'utf8');
    // The weighing sheet at the top of the page; the notes below render the batches again.
    const bench = page.slice(page.indexOf('<h2 id="batches">'), page.indexOf('</section>', page.indexOf('<h2 id="batches">')));
    expect(bench.match(/<div class="iw-safety" role="note">/g)).toHaveLength(3);
    expect(page).toContain('hydrogen cyanide');
  });
});
