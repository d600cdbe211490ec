/**
 * The solution stage of a batch (chem/batch/solution.ts): `to pH` lines solved, buffer lines designed, the
 * `pH:` and `temperature:` headers, the findings on lines that cannot be solved, and the model's notes.
 * Recipes are invented (a fictional buffer prep room and plating line). Checks of the chemistry name
 * their source; masses from IUPAC/CIAAW 2021 abridged atomic weights.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseBatch, type BatchAnalysis } from '../../server/src/chem/batch';
import { batchLines } from '../fixtures/batch';

const batch = (text: string, settings?: Parameters<typeof analyseBatch>[2]) => analyseBatch(batchLines(text), null, settings);
const codes = (b: BatchAnalysis) => b.diagnostics.map((d) => d.code);

describe('a `to pH` line', () => {
  it('is solved: the amount that brings the batch to that pH, with the mass to weigh (assay included)', () => {
    const b = batch('volume: 2 L\nCH3COOH 0.1 M\nNaOH to pH 4.76');
    const naoh = b.ingredients[1];
    expect(naoh.amount.text).toBe('to pH 4.76');
    expect(b.solution!.pH).toBeCloseTo(4.76, 6);
    expect(naoh.solvedFor).toMatchObject({ targetPH: 4.76 });
    // With activities at I ≈ 0.05 M the half-neutralisation point (pKa 4.756, CRC) moves: acetate is about 60 %
    // of the acid at pH 4.76, not the ideal 50 %.
    expect(naoh.moles! / 0.2).toBeGreaterThan(0.52);
    expect(naoh.moles! / 0.2).toBeLessThan(0.66);
    expect(naoh.massG).toBeCloseTo(naoh.moles! * 39.997, 6);
    const assayed = batch('volume: 2 L\nCH3COOH 0.1 M\nNaOH to pH 4.76 @ 50%');
    expect(assayed.ingredients[1].massG).toBeCloseTo(2 * naoh.massG!, 6);
  });

  it('with an acid lowers the pH of a base: ammonia to pH 9.25 with HCl is half neutralised (pKa 9.245, CRC; ideal ± activities)', () => {
    const b = batch('volume: 1 L\nNH3 0.1 M\nHCl to pH 9.25');
    expect(b.solution!.pH).toBeCloseTo(9.25, 6);
    expect(b.ingredients[1].moles!).toBeGreaterThan(0.04);
    expect(b.ingredients[1].moles!).toBeLessThan(0.06);
  });

  it('cannot be solved where the ingredient moves the pH the wrong way, not at all, or not far enough: not counted, with why', () => {
    const wrong = batch('volume: 1 L\nCH3COOH 0.1 M\nHCl to pH 7');
    expect(codes(wrong)).toContain('batch-ph-target');
    expect(wrong.skipped[0].reason).toMatch(/HCl lowers the pH, and the batch without it is already at pH 2\.\d\d, below 7\.00: a base is needed/);
    expect(batch('volume: 1 L\nNaCl to pH 7').skipped[0].reason).toMatch(/does not move the pH/);
    expect(batch('volume: 1 L\nC2H6O to pH 7').skipped[0].reason).toMatch(/not in the equilibrium model/);
    // Ammonia alone cannot reach pH 13.5 (pKa 9.245): even 20 M of it stops short.
    expect(batch('volume: 1 L\nNH3 to pH 13.5').skipped[0].reason).toMatch(/^Even 20 mol\/L of NH₃ brings the batch only to pH 1[12]\.\d\d, not 13\.50/);
  });

  it('needs the final volume, and only one line of a batch is solved for the pH', () => {
    expect(codes(batch('NaOH to pH 7'))).toEqual(['batch-no-volume']);
    const two = batch('volume: 1 L\nCH3COOH 0.1 M\nNaOH to pH 4\nKOH to pH 5');
    expect(two.skipped.map((s) => s.text)).toEqual(['KOH to pH 5']);
    expect(two.skipped[0].reason).toMatch(/^Only one line of a batch can be solved for its pH/);
  });

  it('reads `to pH7`, and flags a pH it cannot read on its characters', () => {
    expect(batch('volume: 1 L\nCH3COOH 0.1 M\nNaOH to pH4.5').solution!.pH).toBeCloseTo(4.5, 6);
    const bad = batch('volume: 1 L\nNaOH to pH seven');
    const d = bad.diagnostics.find((x) => x.code === 'batch-amount')!;
    expect('volume: 1 L\nNaOH to pH seven'.slice(d.start, d.end)).toBe('seven');
  });
});

describe('a buffer line', () => {
  it('gives the acid and the base form to weigh: phosphate 0.1 M at pH 7.40, far from the ideal Henderson–Hasselbalch ratio', () => {
    const b = batch('volume: 1 L\nphosphate buffer 0.1 M to pH 7.40');
    expect(b.ingredients.map((i) => i.formulaText)).toEqual(['NaH2PO4', 'Na2HPO4']);
    const [acid, base] = b.ingredients;
    expect(acid.moles! + base.moles!).toBeCloseTo(0.1, 9);
    expect(b.solution!.pH).toBeCloseTo(7.4, 6);
    const design = base.buffer!.design;
    // Ideal: 10^(7.40 − 7.198) = 1.59 (pKa2 of Bates & Acree); with activities at I ≈ 0.26 M far more base.
    expect(design.idealRatio).toBeCloseTo(Math.pow(10, 7.4 - 7.198), 6);
    expect(design.ratio).toBeGreaterThan(2.2);
    // The step's two species in the batch made up: HPO₄²⁻ : H₂PO₄⁻, nearly the ratio of the two salts weighed.
    expect(design.forms).toEqual(['H2PO4^-', 'HPO4^2-']);
    expect(design.ratio / (base.moles! / acid.moles!)).toBeCloseTo(1, 2);
    // Masses: NaH2PO4 119.98 g/mol, Na2HPO4 141.96 g/mol.
    expect(acid.massG).toBeCloseTo(acid.moles! * 119.976, 3);
    expect(base.massG).toBeCloseTo(base.moles! * 141.957, 3);
  });

  it('is made in the batch it is in: with 150 mM NaCl beside it the ratio moves further (the activities)', () => {
    const alone = batch('volume: 1 L\nphosphate buffer 0.1 M to pH 7.40').ingredients[1].buffer!.design.ratio;
    const saline = batch('volume: 1 L\nNaCl 150 mM\nphosphate buffer 0.1 M to pH 7.40').ingredients[2].buffer!.design.ratio;
    expect(saline).toBeGreaterThan(alone);
  });

  it('picks the pair of the system that holds the pH, with its counter-ion; TRIS from TRIS·HCl and base', () => {
    expect(batch('volume: 1 L\npotassium phosphate buffer 50 mM to pH 6.5').ingredients.map((i) => i.formulaText)).toEqual(['KH2PO4', 'K2HPO4']);
    expect(batch('volume: 1 L\nphosphate buffer 50 mM to pH 11.8').ingredients.map((i) => i.formulaText)).toEqual(['Na2HPO4', 'Na3PO4']);
    const tris = batch('volume: 500 mL\nTRIS buffer 50 mM to pH 8.0');
    expect(tris.ingredients.map((i) => i.formulaText)).toEqual(['C4H11NO3·HCl', 'C4H11NO3']);
    expect(tris.solution!.pH).toBeCloseTo(8, 6);
    const glycine = batch('volume: 1 L\nglycine buffer 0.1 M to pH 9.6');
    expect(glycine.ingredients.map((i) => i.formulaText)).toEqual(['C2H5NO2', 'NaOH']);
  });

  it('warns far from the pKa, and cannot be made outside the system’s reach or for a system it does not know', () => {
    expect(codes(batch('volume: 1 L\nacetate buffer 0.1 M to pH 6.3'))).toEqual(['batch-buffer-range']);
    const out = batch('volume: 1 L\nacetate buffer 0.1 M to pH 11');
    expect(codes(out)).toEqual(['batch-buffer']);
    expect(out.skipped[0].reason).toMatch(/^A acetate buffer of 0\.1 M in this batch spans pH \d\.\d\d to \d\.\d\d; 11\.00 is outside it\./);
    const unknown = batch('volume: 1 L\nbrine buffer 0.1 M to pH 7');
    expect(unknown.skipped[0].reason).toMatch(/^'brine' is no buffer system of the tables; one of: phosphate, citrate, acetate/);
    expect(codes(batch('volume: 1 L\nphosphate buffer 5 g to pH 7'))).toEqual(['batch-unit']);
    expect(codes(batch('volume: 1 L\nphosphate buffer 0.1 M'))).toEqual(['batch-buffer']);
    expect(codes(batch('phosphate buffer 0.1 M to pH 7'))).toEqual(['batch-no-volume']);
  });
});

describe('the headers', () => {
  it('`pH:` is an expectation: a warning beyond the setting (0.3 by default), none within it', () => {
    const text = 'pH: 6.5\nvolume: 1 L\nKH2PO4 10 mM\nNa2HPO4 10 mM';
    const b = batch(text);
    expect(b.statedPH).toBe(6.5);
    const d = b.diagnostics.find((x) => x.code === 'batch-ph')!;
    expect(text.slice(d.start, d.end)).toBe('6.5');
    expect(d.message).toMatch(/^The computed pH is 6\.9\d, 0\.4\d above the 6\.50 stated \(tolerance 0\.3\); an estimate: measure it\.$/);
    expect(codes(batch(text, { nonpolarBelow: 0.4, ionicAbove: 1.8, latticePreference: 'best', phTolerance: 1 }))).toEqual([]);
    expect(codes(batch('pH: 7\nNaCl 1 g'))).toEqual(['batch-ph']);
    expect(codes(batch('pH: 17\nvolume: 1 L'))).toEqual(['batch-amount']);
  });

  it('`temperature:` in °C or K, 0 to 100 °C; else a finding on its characters', () => {
    expect(batch('temperature: 40 °C\nvolume: 1 L\nNaCl 1 g').solution!.temperatureC).toBe(40);
    expect(batch('temperature: 313.15 K\nvolume: 1 L\nNaCl 1 g').temperatureC).toBeCloseTo(40, 9);
    expect(batch('temperature: 40°C\nvolume: 1 L').temperatureC).toBe(40);
    expect(batch('volume: 1 L').temperatureC).toBe(25);
    expect(codes(batch('temperature: 140 °C'))).toEqual(['batch-amount']);
    expect(codes(batch('temperature: 40'))).toEqual(['batch-unit']);
    expect(codes(batch('temperature: 40 °C\ntemperature: 50 °C'))).toEqual(['batch-header']);
  });
});

describe('the batch as the model sees it', () => {
  it('has no solution without a final volume, and says so', () => {
    const b = batch('NaCl 5 g');
    expect(b.solution).toBeNull();
    expect(b.notes.join(' ')).toMatch(/pH are not computed/);
  });

  it('says when the Davies equation is outside its range, and lists what it left out', () => {
    const b = batch('volume: 1 L\nNiSO4·6H2O 260 g\nC6H12O6 10 g\nKMnO4 1 g');
    const s = b.solution!;
    expect(s.outOfRange).toBe(true);
    expect(s.notes[0]).toMatch(/above the Davies equation's range/);
    expect(s.ingredients[1].leftOut).toMatch(/molecule/);
    expect(s.inert).toEqual(['MnO4^-']);
  });

  it('reads any line as a buffer or a `to pH` line without throwing, and never counts what it cannot read (fast-check)', () => {
    const word = fc.constantFrom(
      'phosphate',
      'potassium',
      'buffer',
      'to',
      'pH',
      'pH7',
      '0.1',
      'M',
      'mM',
      'g',
      '@',
      '50%',
      'NaOH',
      'TRIS',
      '-3',
      '7.40',
      'x',
      '',
    );
    fc.assert(
      fc.property(fc.array(word, { maxLength: 8 }), (words) => {
        const line = words.join(' ');
        const b = batch(`volume: 1 L\n${line}`);
        for (const i of b.ingredients) expect(Number.isFinite(i.moles!)).toBe(true);
        const counted = b.ingredients.length > 0;
        const skipped = b.skipped.length > 0;
        if (line.trim()) expect(counted || skipped).toBe(true);
      }),
      { numRuns: 300 },
    );
  });
});
