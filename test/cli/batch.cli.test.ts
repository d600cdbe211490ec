/**
 * `ionwright batch` and `ionwright table` on an invented desmut bath, as a user runs them: the built
 * dist/cli.js (npm test builds first). Every line shows in the text; the JSON lists the lines not counted
 * in `skipped` and gives `fractionOfTotal` where the batch has a total.
 */
import { spawnSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tempFolders } from '../temp';

const mkdtempSync = tempFolders();
const CLI = join(__dirname, '../../dist/cli.js');
const cli = (args: string[], cwd: string) => spawnSync('node', [CLI, ...args], { cwd, encoding: 'utf8' });

const NOTE = [
  '# Desmut line 3 (Kestrel Anodising, invented)',
  '',
  '```batch',
  'name: Desmut D-4',
  'volume: 2 L',
  'HNO3 120 gal @ 68%',
  '(NH4)HF2 30 g',
  'H2SO4 80 gal',
  'Fe2(SO4)3 33 g',
  '```',
  '',
  '```batch',
  'name: Seal S-1',
  'total: 250 g',
  'NaCl 2 wt%',
  'KCl 0.5 wt%',
  '```',
  '',
].join('\n');

const dir = mkdtempSync(join(tmpdir(), 'ionwright-batch-cli-'));
writeFileSync(join(dir, 'desmut.md'), NOTE);

describe('ionwright batch', () => {
  it('prints every line: the counted ones in the table, the others listed with the reason, the batch marked incomplete', () => {
    const r = cli(['batch', 'desmut.md'], dir);
    expect(r.status).toBe(1);
    expect(r.stdout).toContain('Desmut D-4, final volume 2 L — INCOMPLETE: 2 lines not counted');
    expect(r.stdout).toContain("not counted: HNO3 120 gal @ 68% — Unknown unit 'gal'");
    expect(r.stdout).toContain("not counted: H2SO4 80 gal — Unknown unit 'gal'");
    expect(r.stdout).toContain('HNO₃ (line not counted), H₂SO₄ (line not counted): strong acid');
    expect(r.stdout).toMatch(
      /^Ingredient +Amount +Molar mass \(g\/mol\) +To weigh \(g\) +Moles \(mol\) +Concentration \(M\) +Share of weighed mass +Share of total$/m,
    );
  });

  it('--json: skipped [{line, text, reason}] with 0-based document lines; massFraction of the weighed mass, fractionOfTotal where a total is given', () => {
    const r = cli(['batch', 'desmut.md', '--json'], dir);
    const [desmut, seal] = JSON.parse(r.stdout);
    expect(desmut.skipped.map((s: { line: number; text: string }) => [s.line, s.text])).toEqual([
      [5, 'HNO3 120 gal @ 68%'],
      [7, 'H2SO4 80 gal'],
    ]);
    expect(desmut.skipped[0].reason).toContain("Unknown unit 'gal'");
    expect(desmut.incomplete).toBe(true);
    expect(desmut.ingredients.map((i: { formula: string }) => i.formula)).toEqual(['(NH4)HF2', 'Fe2(SO4)3']);
    expect(desmut.ingredients[0].massFraction).toBeCloseTo(30 / 63, 9);
    expect(desmut.ingredients[0]).not.toHaveProperty('fractionOfTotal');
    expect(desmut.cautions.join(' ')).toContain('strong acid');
    // 5 g NaCl and 1.25 g KCl: 80 % of what is weighed, 2 % of the 250 g total.
    expect(seal.skipped).toEqual([]);
    expect(seal.incomplete).toBe(false);
    expect(seal.ingredients[0].massFraction).toBeCloseTo(0.8, 9);
    expect(seal.ingredients[0].fractionOfTotal).toBeCloseTo(0.02, 9);
  });
});

describe('ionwright table and check on the same notes', () => {
  it('table shows the same lines not counted', () => {
    const r = cli(['table', 'desmut.md'], dir);
    expect(r.stdout).toContain('**incomplete: 2 lines not counted**');
    expect(r.stdout).toContain("- `H2SO4 80 gal` — Unknown unit 'gal'");
  });

  it('check reports a solubility warning on the amount', () => {
    writeFileSync(join(dir, 'brine.md'), '```batch\nname: Brine B-1\nvolume: 100 mL\nNaCl 500 g\n```\n');
    const r = cli(['check', 'brine.md', '--format', 'json'], dir);
    const [d] = JSON.parse(r.stdout);
    expect(d).toMatchObject({ code: 'batch-solubility', severity: 2, range: { start: { line: 3, character: 5 }, end: { line: 3, character: 10 } } });
    expect(r.status).toBe(0);
  });
});
