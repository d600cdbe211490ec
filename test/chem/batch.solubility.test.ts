/**
 * Solubility in water: the table (chem/data/solubility.ts) and the `batch-solubility` warning of a batch
 * (chem/batch/solubility.ts), against the estimated water of the batch (final volume × 1 g/mL less the dissolved
 * mass, anhydrous). Recipes are invented; molar masses in hand calculations are sums of IUPAC/CIAAW 2021
 * abridged atomic weights (H 1.0080, O 15.999, Na 22.990, S 32.06, Cl 35.45, Ca 40.078, Cu 63.546).
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { analyseBatch } from '../../server/src/chem/batch';
import { batchLines } from '../fixtures/batch';
import { SOLUBILITY } from '../../server/src/chem/data/solubility';

const lines = batchLines;
const batch = (block: string) => analyseBatch(lines(block));
const warnings = (block: string) => batch(block).diagnostics.filter((d) => d.code === 'batch-solubility');
const row = (formula: string) => SOLUBILITY.find((r) => r.formula === formula)!;

const CuSO4 = 63.546 + 32.06 + 4 * 15.999;
const H2O = 2 * 1.008 + 15.999;

describe('the solubility table', () => {
  it('has at least 60 rows, each readable, at 20 or 25 °C, with a source (every one says it is from memory)', () => {
    expect(SOLUBILITY.length).toBeGreaterThanOrEqual(60);
    const hills = new Set<string>();
    for (const r of SOLUBILITY) {
      const a = analyseFormula(r.formula);
      expect(a.ok, r.formula).toBe(true);
      expect(
        a.diagnostics.filter((d) => d.severity === 'error'),
        r.formula,
      ).toEqual([]);
      expect(hills.has(a.hill), `${r.formula} twice`).toBe(false);
      hills.add(a.hill);
      expect([20, 25]).toContain(r.temperatureC);
      expect(r.gPer100gWater).toBeGreaterThan(0);
      expect(r.source).toMatch(/from memory/);
    }
  });

  it('covers the salts of plating, cleaning, buffers and water treatment', () => {
    const have = new Set(SOLUBILITY.map((r) => r.formula));
    for (const f of [
      'NaCl',
      'KCl',
      'NH4Cl',
      'CaCl2',
      'MgCl2',
      'NiCl2',
      'CuCl2',
      'ZnCl2',
      'FeCl3',
      'CoCl2',
      'Na2SO4',
      'K2SO4',
      '(NH4)2SO4',
      'MgSO4',
      'CaSO4',
      'NiSO4',
      'CuSO4',
      'ZnSO4',
      'FeSO4',
      'CoSO4',
      'NaNO3',
      'KNO3',
      'NH4NO3',
      'Ca(NO3)2',
      'Ni(NO3)2',
      'Cu(NO3)2',
      'Zn(NO3)2',
      'Na2CO3',
      'K2CO3',
      'NaHCO3',
      'CaCO3',
      'Na3PO4',
      'Na2HPO4',
      'NaH2PO4',
      'KH2PO4',
      'K2HPO4',
      'CH3COONa',
      'CH3COOK',
      'Na3C6H5O7',
      'C6H8O7',
      'Na2B4O7',
      'H3BO3',
      'Na2C10H14N2O8',
      'Na4C10H12N2O8',
      'BaSO4',
      'AgCl',
      'CaF2',
    ])
      expect(have.has(f), f).toBe(true);
  });

  it.each([
    // CRC Handbook, aqueous solubility table, mass percent of the saturated solution at 25 °C (from memory),
    // converted to g per 100 g water as 100·w / (100 − w): two recalled forms of the same figure must agree.
    ['NaCl', 26.45],
    ['KCl', 26.22],
    ['NiSO4', 28.8],
    ['ZnSO4', 36.6],
    ['KH2PO4', 20.0],
  ])('%s agrees with its mass percent %d % within 3 %', (formula, w) => {
    const expected = (100 * w) / (100 - w);
    expect(Math.abs(row(formula).gPer100gWater / expected - 1)).toBeLessThan(0.03);
  });

  it.each([
    // Solubility products at 25 °C, CRC Handbook "Solubility product constants" (from memory). In dilute
    // solution a litre holds about 1000 g water, so g per 100 g water ≈ s · M / 10 with s in mol/L:
    // AB: s = √Ksp; AB₂ or A₂B... here AB₂: s = ∛(Ksp / 4). Activities and ion pairs are ignored: a factor of 2.
    ['AgCl', 1.77e-10, 'AB'],
    ['BaSO4', 1.08e-10, 'AB'],
    ['PbSO4', 2.53e-8, 'AB'],
    ['CaF2', 3.45e-11, 'AB2'],
    ['Mg(OH)2', 5.61e-12, 'AB2'],
  ])('%s is consistent with Ksp %d within a factor of 2', (formula, ksp, kind) => {
    const s = kind === 'AB' ? Math.sqrt(ksp as number) : Math.cbrt((ksp as number) / 4);
    const fromKsp = (s * analyseFormula(formula as string).molarMass!.value) / 10;
    const ratio = row(formula as string).gPer100gWater / fromKsp;
    expect(ratio).toBeGreaterThan(0.5);
    expect(ratio).toBeLessThan(2);
  });
});

describe('the batch-solubility warning', () => {
  it('500 g of NaCl in 100 mL: no water left by the estimate — a warning on the amount, naming the salt and its solubility', () => {
    const block = 'name: Brine test\nvolume: 100 mL\nNaCl 500 g';
    const [d] = warnings(block);
    expect(d.severity).toBe('warning');
    expect(block.slice(d.start, d.end)).toBe('500 g');
    expect(d.message).toContain('NaCl');
    expect(d.message).toContain('no water is left');
    // 36 g per 100 g water at 25 °C: the table value (from memory).
    expect(d.message).toContain('36 g per 100 g water at 25 °C');
    expect(d.message).toContain('Estimate: water ≈ final volume × 1 g/mL less the dissolved mass');
  });

  it('40 g of NaCl in 100 mL: water ≈ 100 − 40 = 60 g, so 66.7 g per 100 g water against 36; about 18.4 g stays undissolved', () => {
    const b = batch('volume: 100 mL\nNaCl 40 g');
    expect(b.waterG).toBeCloseTo(60, 9);
    const s = b.ingredients[0].solubility!;
    expect(s.per100gWater).toBeCloseTo((40 / 60) * 100, 9);
    expect(s.exceeds).toBe(true);
    const d = b.diagnostics.find((x) => x.code === 'batch-solubility')!;
    expect(d.message).toMatch(
      /^NaCl: about 66\.7 g per 100 g water, above its solubility of 36 g per 100 g water at 25 °C: about 18\.4 g would not dissolve\./,
    );
    expect(d.message).toContain('60 g of water in 100 mL, with 40 g dissolved');
    expect(d.message).not.toContain('Near saturation');
  });

  it('33 g of NaCl in 100 mL is over by the estimate (49 g per 100 g water) but under if all 100 mL were water: said to be near saturation', () => {
    const [d] = warnings('volume: 100 mL\nNaCl 33 g');
    expect(d.message).toContain('about 49.3 g per 100 g water');
    expect(d.message).toContain('Near saturation');
  });

  it('30 g of NaCl in 1 L, and a Watts-type nickel bath (300 g/L NiSO4·6H2O, 45 g/L NiCl2·6H2O, 40 g/L H3BO3; common practice), get no warning', () => {
    expect(warnings('volume: 1 L\nNaCl 30 g')).toEqual([]);
    expect(batch('volume: 1 L\nNaCl 30 g').ingredients[0].solubility?.exceeds).toBe(false);
    const b = batch('name: Nickel N-7\nvolume: 1 L\nNiSO4·6H2O 300 g\nNiCl2·6H2O 45 g\nH3BO3 40 g');
    expect(b.ingredients.map((i) => i.solubility?.row.formula)).toEqual(['NiSO4', 'NiCl2', 'H3BO3']);
    expect(b.diagnostics.filter((d) => d.code === 'batch-solubility')).toEqual([]);
    // Boric acid is the closest: 40 g in about 759 g of water is 5.3 g per 100 g against 5.7 at 25 °C.
    const boric = b.ingredients[2].solubility!;
    expect(boric.per100gWater!).toBeGreaterThan(5);
    expect(boric.per100gWater!).toBeLessThan(5.7);
  });

  it('compares a hydrate in anhydrous terms, its water joining the solvent: 40 g CuSO4·5H2O in 100 mL is 34.4 g CuSO4 per 100 g water', () => {
    const anhydrous = (40 * CuSO4) / (CuSO4 + 5 * H2O);
    const water = 100 - anhydrous;
    const b = batch('volume: 100 mL\nCuSO4·5H2O 40 g');
    const s = b.ingredients[0].solubility!;
    expect(s.anhydrousG).toBeCloseTo(anhydrous, 2);
    expect(s.per100gWater!).toBeCloseTo((anhydrous / water) * 100, 1);
    expect(s.salt).toBe('CuSO₄');
    const d = b.diagnostics.find((x) => x.code === 'batch-solubility')!;
    expect(d.message).toContain('(anhydrous; the hydrate water is counted as solvent)');
    // 25 g of the pentahydrate in 100 mL is 19.0 g CuSO4 per 100 g water: under 22, no warning (a naive
    // 25 g per 75 g water would have warned).
    expect(warnings('volume: 100 mL\nCuSO4·5H2O 25 g')).toEqual([]);
  });

  it('a practically insoluble salt in any meaningful amount: 5 g CaCO3 in 1 L; not 0.5 mg', () => {
    const [d] = warnings('volume: 1 L\nCaCO3 5 g');
    expect(d.message).toMatch(
      /^CaCO₃ is practically insoluble in water \(0\.0013 g per 100 g water at 25 °C\): about 4\.99 g of the 5 g would stay undissolved unless another ingredient dissolves it/,
    );
    expect(warnings('volume: 1 L\nCaCO3 0.5 mg')).toEqual([]);
    expect(warnings('volume: 1 L\nBaSO4 1 g')).toHaveLength(1);
    expect(warnings('volume: 1 L\nAgCl 100 mg')).toHaveLength(1);
  });

  it('is silent without a final volume, for substances not in the table, and for lines not counted', () => {
    expect(warnings('NaCl 500 g')).toEqual([]);
    expect(warnings('volume: 1 L\nK2[PtCl6] 500 g')).toEqual([]);
    expect(batch('volume: 1 L\nK2[PtCl6] 500 g').ingredients).toHaveLength(1);
    expect(warnings('volume: 100 mL\nNaCl 500 g @ 120%')).toEqual([]);
  });

  it('where the solids outweigh the volume and none is in the table, one warning on the largest amount', () => {
    const block = 'volume: 10 mL\nK2[PtCl6] 5 g\nNa2[PdCl4] 20 g';
    const d = warnings(block);
    expect(d).toHaveLength(1);
    expect(block.slice(d[0].start, d[0].end)).toBe('20 g');
    expect(d[0].message).toContain('no water is left');
  });
});
