/**
 * Batch arithmetic against worked examples, each computed by hand here with its source beside it.
 * Molar masses in the hand calculations are sums of IUPAC/CIAAW 2021 abridged atomic weights
 * (Na 22.990, Cl 35.45, K 39.098, H 1.0080, P 30.974, O 15.999, Cu 63.546, S 32.06).
 */
import { describe, expect, it } from 'vitest';
import { analyseBatch } from '../../server/src/chem/batch';
import { batchLines } from '../fixtures/batch';

/** Lines of a block with their offsets, as the scanner hands them over (block starting at offset 0). */
const lines = batchLines;
const batch = (block: string) => analyseBatch(lines(block));

const NaCl = 22.99 + 35.45;
const KCl = 39.098 + 35.45;
const Na2HPO4 = 2 * 22.99 + 1.008 + 30.974 + 4 * 15.999;
const KH2PO4 = 39.098 + 2 * 1.008 + 30.974 + 4 * 15.999;
const CuSO4_5H2O = 63.546 + 32.06 + 4 * 15.999 + 5 * (2 * 1.008 + 15.999);

describe('standard solutions (worked examples)', () => {
  it('0.1000 M NaCl in 500 mL needs 0.05 mol, 2.922 g (common textbook example, e.g. Harris, Quantitative Chemical Analysis, ch. 1)', () => {
    const b = batch('volume: 500 mL\nNaCl 0.1000 M');
    const i = b.ingredients[0];
    expect(i.moles).toBeCloseTo(0.05, 10);
    expect(i.massG).toBeCloseTo(0.05 * NaCl, 6);
    expect(i.concentrationM).toBeCloseTo(0.1, 10);
  });

  it('the hydrate water counts in what is weighed: 0.1 M CuSO4 from CuSO4·5H2O, 1 L → 24.97 g (common textbook example)', () => {
    const b = batch('volume: 1 L\nCuSO4·5H2O 0.1 M');
    expect(b.ingredients[0].massG).toBeCloseTo(0.1 * CuSO4_5H2O, 6);
    expect(b.ingredients[0].massG).toBeCloseTo(24.97, 1);
  });

  it('an assay divides the mass to weigh, and a weighed mass times the assay gives the moles', () => {
    const b = batch('volume: 1 L\nNaCl 5.9 g @ 99.5%\nKCl 10 mmol @ 99%');
    expect(b.ingredients[0].moles).toBeCloseTo((5.9 * 0.995) / NaCl, 9);
    expect(b.ingredients[1].massG).toBeCloseTo((0.01 * KCl) / 0.99, 9);
  });

  it('wt% targets take a share of the total mass', () => {
    const b = batch('total: 250 g\nNaCl 2 wt%\nKCl 0.5 %w/w');
    expect(b.ingredients[0].massG).toBeCloseTo(5, 9);
    expect(b.ingredients[1].moles).toBeCloseTo(1.25 / KCl, 9);
    // 5 g of NaCl is 2 % of the 250 g total, and 5 / (5 + 1.25) = 80 % of what is weighed: two shares, two names.
    expect(b.ingredients[0].fractionOfTotal).toBeCloseTo(0.02, 9);
    expect(b.ingredients[0].massFraction).toBeCloseTo(5 / 6.25, 9);
  });
});

describe('phosphate-buffered saline (Cold Spring Harbor Protocols, "Phosphate-buffered saline (PBS)", 2006: 8 g NaCl, 0.2 g KCl, 1.44 g Na2HPO4, 0.24 g KH2PO4 per litre)', () => {
  const b = batch(['name: PBS 1×', 'volume: 1 L', 'NaCl 8 g', 'KCl 0.2 g', 'Na2HPO4 1.44 g', 'KH2PO4 0.24 g  # monobasic'].join('\n'));
  const c = { NaCl: 8 / NaCl, KCl: 0.2 / KCl, Na2HPO4: 1.44 / Na2HPO4, KH2PO4: 0.24 / KH2PO4 };

  it("gives the recipe's concentrations: 137 mM NaCl, 2.7 mM KCl, 10 mM Na2HPO4, 1.8 mM KH2PO4", () => {
    const conc = Object.fromEntries(b.ingredients.map((i) => [i.formulaText, i.concentrationM]));
    expect(conc.NaCl).toBeCloseTo(c.NaCl, 9);
    expect(conc.NaCl!).toBeCloseTo(0.137, 3);
    expect(conc.KCl!).toBeCloseTo(0.0027, 4);
    expect(conc.Na2HPO4!).toBeCloseTo(0.0101, 4);
    expect(conc.KH2PO4!).toBeCloseTo(0.0018, 4);
    expect(b.name).toBe('PBS 1×');
  });

  it('dissociates the salts and sums the ions; I = ½ Σ cᵢzᵢ², net charge zero', () => {
    const ion = Object.fromEntries(b.ions.map((x) => [x.key, x.concentrationM]));
    const na = c.NaCl + 2 * c.Na2HPO4;
    const k = c.KCl + c.KH2PO4;
    const cl = c.NaCl + c.KCl;
    expect(ion['Na^+']).toBeCloseTo(na, 12);
    expect(ion['K^+']).toBeCloseTo(k, 12);
    expect(ion['Cl^-']).toBeCloseTo(cl, 12);
    expect(ion['HPO4^2-']).toBeCloseTo(c.Na2HPO4, 12);
    expect(ion['H2PO4^-']).toBeCloseTo(c.KH2PO4, 12);
    const I = 0.5 * (na + k + cl + 4 * c.Na2HPO4 + c.KH2PO4);
    expect(b.ionicStrengthM).toBeCloseTo(I, 12);
    expect(b.netChargeEqPerL).toBe(0);
  });

  it('gives each ingredient its share of the weighed solids', () => {
    const total = 8 + 0.2 + 1.44 + 0.24;
    expect(b.ingredients[0].massFraction).toBeCloseTo(8 / total, 12);
    expect(b.ingredients.reduce((s, i) => s + (i.massFraction ?? 0), 0)).toBeCloseTo(1, 12);
  });
});

describe('what stays whole, and the cautions', () => {
  it('weak acids and molecular substances are not split; strong acids give up their first proton', () => {
    const b = batch('volume: 1 L\nCH3COOH 0.1 M\nC6H12O6 1 g\nHCl 0.01 M\nH2SO4 0.01 M');
    const by = Object.fromEntries(b.ingredients.map((i) => [i.formulaText, i]));
    expect(by.CH3COOH.ions).toEqual([]);
    expect(by.C6H12O6.ions).toEqual([]);
    expect(by.HCl.ions.map((x) => x.key)).toEqual(['H^+', 'Cl^-']);
    expect(by.H2SO4.ions.map((x) => x.key)).toEqual(['H^+', 'HSO4^-']);
    expect(b.cautions.map((x) => x.cls)).toContain('strong acid');
  });

  it('ions listed on their own that do not balance get a warning', () => {
    const b = batch('volume: 1 L\nNa+ 0.1 M\nCl- 0.05 M');
    const d = b.diagnostics.find((x) => x.code === 'batch-charge')!;
    expect(d.severity).toBe('warning');
    expect(d.message).toContain('+0.0500');
    expect(batch('volume: 1 L\nNa+ 0.1 M\nCl- 0.1 M').diagnostics).toEqual([]);
  });

  it('flags oxidisers and toxic salts', () => {
    const b = batch('volume: 1 L\nKMnO4 1 g\nK2Cr2O7 1 g\nKCN 1 mg');
    const classes = b.cautions.map((x) => x.cls);
    expect(classes).toEqual(expect.arrayContaining(['oxidiser', 'carcinogen', 'toxic']));
  });
});

describe('diagnostics on batch lines, on exact ranges', () => {
  const at = (block: string, code: string) => {
    const b = batch(block);
    const d = b.diagnostics.find((x) => x.code === code);
    expect(d, `${code} in ${JSON.stringify(block)}: ${JSON.stringify(b.diagnostics)}`).toBeDefined();
    return block.slice(d!.start, d!.end);
  };
  it.each([
    ['volume: 1 L\nNaCl 5 gallons', 'batch-unit', 'gallons'],
    ['volume: 1 L\nNaCl', 'batch-amount', 'NaCl'],
    ['NaCl 0.1 M', 'batch-no-volume', '0.1 M'],
    ['volume: 1 L\nNaXx 5 g', 'unknown-element', 'Xx'],
    ['volume: 1 L\nCa(NO3 5 g', 'malformed-formula', '('],
    ['volume: 1 L\nNaCl -5 g', 'batch-amount', '-5'],
    ['volume: 2 gallons\nNaCl 5 g', 'batch-unit', 'gallons'],
    ['NaCl 2 wt%', 'batch-no-total', '2 wt%'],
    ['volume: 1 L\nNaCl 5 g @ 120%', 'batch-amount', '@ 120%'],
    ['volume: 1 L\nNaCl 5 g extra', 'batch-syntax', 'extra'],
    ['volume: 1 L\nNaCl 10 mL', 'reagent-density', '10 mL'],
    ['volume: 1 L\nNaCl 10 furlongs', 'batch-unit', 'furlongs'],
  ])('%j → %s on %j', (block, code, text) => {
    expect(at(block, code)).toBe(text);
  });

  it('reads glued amounts (5g, 0.1M) and ignores comments', () => {
    const b = batch('volume: 250mL # final\n# a comment line\nNaCl 0.1M\nKCl 2g');
    expect(b.volumeL).toBeCloseTo(0.25, 12);
    expect(b.ingredients.map((i) => i.amount.unit)).toEqual(['M', 'g']);
    expect(b.diagnostics).toEqual([]);
  });

  it('never produces NaN, Infinity or negative masses', () => {
    const b = batch('volume: 1e-300 L\nNaCl 1e9 g\nKCl 0.000001 mg');
    for (const i of b.ingredients)
      for (const v of [i.moles, i.massG, i.concentrationM, i.massFraction]) if (v !== null) expect(Number.isFinite(v) && v >= 0).toBe(true);
  });
});
