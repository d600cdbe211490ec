/**
 * Batch lines as written at the bench (chem/batch/read.ts → substance.ts → amounts.ts, over chem/reagents
 * and chem/names): names and shelf labels instead of formulas, liquids by volume with density and assay,
 * the volume to pour for a target, amounts per volume, normality, dilution from a stock or from another
 * batch, and `water to` / `make up to` lines.
 *
 * Sources: atomic weights IUPAC/CIAAW 2021 (abridged); densities of the concentrated reagents at 20 °C from
 * the CRC Handbook's table of concentrative properties of aqueous solutions (from memory: 96 % H2SO4
 * 1.8355 g/mL, 37 % HCl 1.184 g/mL); "96 % sulfuric acid is about 18 M, 37 % hydrochloric about 12 M" is
 * the usual handbook figure (CRC, from memory). The arithmetic of dilution (c₁V₁ = c₂V₂) and normality
 * (equivalents = moles × protons given up) is done by hand in the comments. The baths are invented (a
 * fictional finishing shop, Harrow Lane Plating).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseBatch, type BatchContext } from '../../server/src/chem/batch';
import { parseShelf } from '../../server/src/chem/reagents';
import { DEFAULT_CHEM_SETTINGS } from '../../server/src/chem/settings';
import { batchLines } from '../fixtures/batch';

const batch = (block: string, context: BatchContext = {}) => analyseBatch(batchLines(block), null, DEFAULT_CHEM_SETTINGS, undefined, context);
const only = (block: string, context?: BatchContext) => {
  const b = batch(block, context);
  expect(b.skipped, JSON.stringify(b.skipped)).toEqual([]);
  return b.ingredients[b.ingredients.length - 1];
};
// IUPAC/CIAAW 2021 abridged atomic weights.
const W = { H: 1.008, O: 15.999, S: 32.06, Cl: 35.45, Na: 22.99, K: 39.098, Ni: 58.693, Cu: 63.546, B: 10.81, Mg: 24.305, C: 12.011 };
const H2SO4 = 2 * W.H + W.S + 4 * W.O;
const HCl = W.H + W.Cl;
const at = (block: string, d: { start: number; end: number }) => block.slice(d.start, d.end);

describe('liquids by volume and assay', () => {
  it('10 mL of 96 % sulfuric acid: its mass by the density, the acid by the assay', () => {
    const i = only('volume: 1 L\nH2SO4 10 mL @ 96%');
    // CRC (from memory): 96 % H2SO4 at 20 °C is 1.8355 g/mL → 18.355 g poured, 17.62 g of acid.
    expect(i.measure).toBe('pour');
    expect(i.volumeML).toBe(10);
    expect(i.massG).toBeCloseTo(18.355, 2);
    expect(i.moles).toBeCloseTo((18.355 * 0.96) / H2SO4, 3);
    // Handbook figure: 96 % sulfuric acid is about 18 M (CRC, from memory): 10 mL hold about 0.18 mol.
    expect((i.moles as number) / 0.01).toBeGreaterThan(17.5);
    expect((i.moles as number) / 0.01).toBeLessThan(18.5);
    expect(i.density).toMatch(/1\.83/);
    expect(i.handling.join(' ')).toMatch(/add the acid/i);
    // Each caution once: no line repeats another or holds it whole.
    for (const [k, h] of i.handling.entries()) for (const [j, other] of i.handling.entries()) if (j !== k) expect(other.includes(h), h).toBe(false);
  });

  it('a target with an assay gives the volume of the reagent to pour', () => {
    const i = only('volume: 500 mL\nHCl 0.5 M @ 37%');
    // 0.25 mol HCl; 37 % hydrochloric acid is about 12 M (CRC, from memory) → about 20.7 mL.
    expect(i.moles).toBeCloseTo(0.25, 12);
    expect(i.volumeML as number).toBeGreaterThan((0.25 / 12.3) * 1000);
    expect(i.volumeML as number).toBeLessThan((0.25 / 11.8) * 1000);
    // By hand from the density: 0.25 × 36.458 g ÷ 0.37 ÷ 1.184 g/mL = 20.81 mL (CRC, from memory: 1.184).
    expect(i.volumeML as number).toBeCloseTo((0.25 * HCl) / 0.37 / 1.184, 0);
    expect(i.massG).toBeCloseTo((0.25 * HCl) / 0.37, 6);
  });

  it('a reagent sold as a solution, given without its assay, is counted as the pure substance with a warning on the line', () => {
    const block = 'volume: 1 L\nHCl 20 g';
    const b = batch(block);
    expect(b.ingredients).toHaveLength(1);
    const d = b.diagnostics.find((x) => x.code === 'reagent-assay')!;
    expect(d.severity).toBe('warning');
    expect(at(block, d)).toBe('HCl 20 g');
    expect(d.message).toMatch(/assay/);
  });

  it('a solid by volume has no density to pour by: not counted, said on the amount', () => {
    const block = 'volume: 1 L\nNaCl 10 mL';
    const b = batch(block);
    expect(b.ingredients).toHaveLength(0);
    expect(b.skipped[0].code).toBe('reagent-density');
    expect(
      at(
        block,
        b.diagnostics.find((x) => x.code === 'reagent-density')!,
      ),
    ).toBe('10 mL');
  });

  it('sodium hydroxide weighed is a solid (no volume); at 50 % it is the liquid and is poured', () => {
    expect(only('volume: 1 L\nNaOH 40 g').volumeML).toBeNull();
    const i = only('volume: 1 L\nNaOH 0.1 M @ 50%');
    expect(i.measure).toBe('pour');
    // 0.1 mol × 39.997 g ÷ 0.5 = 8.0 g of the 50 % solution, about 1.53 g/mL (CRC, from memory) → about 5.2 mL.
    expect(i.volumeML as number).toBeGreaterThan(5.0);
    expect(i.volumeML as number).toBeLessThan(5.4);
  });
});

describe('amounts per volume and normality', () => {
  it('g/L, mg/L and %w/v are per final volume (by hand)', () => {
    expect(only('volume: 500 mL\nKCl 5 g/L').massG).toBeCloseTo(2.5, 12); // 5 g/L × 0.5 L
    expect(only('volume: 2 L\nMgSO4 200 mg/L').massG).toBeCloseTo(0.4, 12); // 0.2 g/L × 2 L
    expect(only('volume: 250 mL\nNaCl 0.9 %w/v').massG).toBeCloseTo(2.25, 12); // 0.9 g per 100 mL × 250 mL
    expect(only('volume: 250 mL\nNaCl 0.9 % w/v').massG).toBeCloseTo(2.25, 12);
    expect(only('volume: 250 mL\nNaCl 0.9%w/v').massG).toBeCloseTo(2.25, 12);
    expect(only('volume: 1 L\nKCl 5 g/L').moles).toBeCloseTo(5 / (W.K + W.Cl), 9);
  });

  it('a unit per volume needs the final volume', () => {
    const b = batch('KCl 5 g/L');
    expect(b.skipped[0].code).toBe('batch-no-volume');
  });

  it('normality: sulfuric acid gives up two protons, so 0.1 N is 0.05 M; the role is said', () => {
    const i = only('volume: 1 L\nH2SO4 0.1 N @ 96%');
    expect(i.moles).toBeCloseTo(0.05, 12); // 0.1 eq/L × 1 L ÷ 2 eq/mol
    expect(i.notes.join(' ')).toMatch(/2 H⁺/);
    expect(i.volumeML as number).toBeCloseTo((0.05 * H2SO4) / 0.96 / 1.8355, 2);
  });

  it('ppm in a batch denser than water says which basis it read', () => {
    const block = 'volume: 1 L\ntotal: 1.3 kg\nKCl 5 ppm';
    const b = batch(block);
    const d = b.diagnostics.find((x) => x.code === 'reagent-basis')!;
    expect(d.severity).toBe('warning');
    expect(b.ingredients[0].massG).toBeCloseTo(0.005, 12); // 5 mg/L × 1 L
  });
});

describe('dilution from a stock', () => {
  it('NiSO4 0.1 M from 1.5 M in 500 mL: 33.3 mL of the stock (c₁V₁ = c₂V₂)', () => {
    const i = only('volume: 500 mL\nNiSO4 0.1 M from 1.5 M');
    expect(i.measure).toBe('stock');
    expect(i.volumeML).toBeCloseTo((0.1 * 500) / 1.5, 9);
    expect(i.moles).toBeCloseTo(0.05, 12);
    expect(i.concentrationM).toBeCloseTo(0.1, 12);
    expect(i.stock).toBe('from 1.5 M');
  });

  it('a stronger target than the stock is not made, and said on the stock', () => {
    const block = 'volume: 1 L\nNiSO4 2 M from 1.5 M';
    const b = batch(block);
    expect(b.skipped[0].code).toBe('batch-stock');
    expect(b.diagnostics.find((d) => d.code === 'batch-stock')!.message).toMatch(/stronger than the stock/);
  });

  it('from another batch of the document: its computed concentration is the stock', () => {
    const stock = {
      name: 'Nickel stock',
      volumeL: 1,
      ingredients: [{ formula: 'NiSO4·6H2O', hill: 'H12NiO10S', anhydrousHill: 'NiO4S', concentrationM: 1.2 }],
    };
    const ctx: BatchContext = { stockOf: (n) => (n.toLowerCase() === 'nickel stock' ? stock : undefined) };
    const i = only('volume: 2 L\nNiSO4 0.3 M from batch "Nickel stock"', ctx);
    // 0.3 M × 2 L ÷ 1.2 M = 0.5 L of the stock.
    expect(i.volumeML).toBeCloseTo(500, 9);
    expect(i.notes.join(' ')).toMatch(/Nickel stock/);
    const block = 'volume: 2 L\nNiSO4 0.3 M from batch "Cobalt stock"';
    const b = batch(block, ctx);
    const d = b.diagnostics.find((x) => x.code === 'batch-stock')!;
    expect(at(block, d)).toBe('from batch "Cobalt stock"');
    expect(b.skipped).toHaveLength(1);
  });
});

describe('names and shelf labels instead of formulas', () => {
  it('reads systematic and shelf names, and weighs what they name (hydrate water included)', () => {
    expect(only('sodium chloride 5 g').analysis.hill).toBe('ClNa');
    const cu = only('copper(II) sulfate pentahydrate 25 g');
    expect(cu.analysis.hill).toBe('CuH10O9S');
    // CuSO4·5H2O: 63.546 + 32.06 + 9 × 15.999 + 10 × 1.008 = 249.68 g/mol (CIAAW 2021).
    expect(cu.moles).toBeCloseTo(25 / (W.Cu + W.S + 9 * W.O + 10 * W.H), 3);
    expect(only('borax 2 g').analysis.hill).toBe('B4H20Na2O17'); // sodium tetraborate decahydrate
    expect(only('caustic soda 40 g').analysis.hill).toBe('HNaO');
    expect(only('Epsom salt 10 g').analysis.hill).toBe('H14MgO11S');
    expect(only('soda ash 10 g').analysis.hill).toBe('CNa2O3');
    const i = only('volume: 1 L\nnickel sulfate hexahydrate 0.5 M');
    expect(i.via).toBe('name');
    expect(i.name).toMatch(/nickel\(II\) sulfate hexahydrate/);
  });

  it('a name one letter from another compound is never taken: a finding on the name that offers the readings', () => {
    const block = 'volume: 1 L\nsodium chlorade 5 g\nNaCl 1 g';
    const b = batch(block);
    expect(b.ingredients.map((x) => x.analysis.hill)).toEqual(['ClNa']);
    const d = b.diagnostics.find((x) => x.code === 'batch-name')!;
    expect(at(block, d)).toBe('sodium chlorade');
    expect(d.message).toMatch(/chlorate|chloride/);
  });

  it('a name of thousands of characters is quoted short in its finding', () => {
    const long = 'x'.repeat(5000);
    const d = batch(`${long} 5 g`).diagnostics.find((x) => x.code === 'batch-name')!;
    expect(d.end - d.start).toBe(5000);
    expect(d.message.length).toBeLessThan(200);
  });

  it('an exact name a letter from another says which one it is not', () => {
    const i = only('sodium chlorite 5 g');
    expect(i.analysis.hill).toBe('ClNaO2');
    expect(i.notes.join(' ')).toMatch(/not .*chlorate/);
  });

  it('a shelf label names the jar: its formula, assay and density are used, and the entry is on the ingredient', () => {
    const shelf = parseShelf('Acid A: H2SO4 @ 96 %; density 1.84 g/mL; lot SA-2231\nNickel jar 3: nickel sulfate hexahydrate @ 99.0 %; lot N-0447', 0);
    const b = batch('volume: 1 L\nAcid A 10 mL\nNickel jar 3 100 g', { shelf });
    expect(b.skipped).toEqual([]);
    const [acid, ni] = b.ingredients;
    expect(acid.via).toBe('shelf');
    expect(acid.shelf?.lot).toBe('SA-2231');
    // The label's density (1.84 g/mL) wins over the table's.
    expect(acid.massG).toBeCloseTo(18.4, 9);
    expect(acid.moles).toBeCloseTo((18.4 * 0.96) / H2SO4, 6);
    expect(ni.assay).toBeCloseTo(0.99, 12);
    expect(ni.moles).toBeCloseTo((100 * 0.99) / (W.Ni + W.S + 10 * W.O + 12 * W.H), 3);
  });
});

describe('water to and make up to', () => {
  it('set the final volume as volume: does, and are not ingredients', () => {
    const b = batch('NaCl 0.1 M\nwater to 500 mL');
    expect(b.volumeL).toBe(0.5);
    expect(b.skipped).toEqual([]);
    expect(b.ingredients[0].massG).toBeCloseTo(0.05 * (W.Na + W.Cl), 9);
    expect(batch('KCl 1 g\nmake up to 2 L with DI water').volumeL).toBe(2);
    expect(batch('KCl 1 g\nDI water to 250 mL').volumeL).toBe(0.25);
  });

  it('without a volume are a finding on the line, not a name', () => {
    const b = batch('KCl 1 g\nmake up to');
    expect(b.skipped.map((x) => x.code)).toEqual(['batch-amount']);
    expect(b.skipped[0].reason).toMatch(/needs the volume to make up to/);
  });

  it('agree with a volume: header, or the first counts with a warning', () => {
    expect(batch('volume: 1 L\nKCl 1 g\nwater to 1 L').diagnostics).toEqual([]);
    const block = 'volume: 1 L\nKCl 1 g\nwater to 2 L';
    const b = batch(block);
    expect(b.volumeL).toBe(1);
    const d = b.diagnostics.find((x) => x.code === 'batch-header')!;
    expect(d.severity).toBe('warning');
    expect(at(block, d)).toBe('water to 2 L');
  });
});

describe('property: bench lines never throw, and every line is counted, read as a header, or listed as not counted', () => {
  const piece = fc.constantFrom(
    'sodium chloride 5 g',
    'borax 2 g',
    'sodium chlorade 5 g',
    'H2SO4 10 mL @ 96%',
    'HCl 0.5 M @ 37%',
    'KCl 5 g/L',
    'NaBr 1 %w/v',
    'H2SO4 0.1 N',
    'H2SO4 0.1 N as base',
    'NiSO4 0.1 M from 1.5 M',
    'NiSO4 0.1 M from batch "X"',
    'NiSO4 0.1 M from batch "unclosed',
    'NaCl 10 mL',
    'water to 1 L',
    'make up to 2 furlongs',
    'KCl 5 ppm',
    'NaCl 5 g @',
    'caustic soda 1 mol/kg',
  );
  it('holds for random blocks of them', () => {
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 8 }), fc.boolean(), (ps, withVolume) => {
        const text = [...(withVolume ? ['volume: 1 L'] : []), ...ps].join('\n');
        const b = batch(text);
        const counted = b.ingredients.length + b.skipped.length;
        const makeUps = ps.filter((p) => /^(water|make up) to/.test(p)).length;
        // Each non-header line is counted or listed (a `water to` line that reads is a header).
        expect(counted).toBeGreaterThanOrEqual(ps.length - makeUps);
        expect(counted).toBeLessThanOrEqual(ps.length + (withVolume ? 1 : 0));
        for (const d of b.diagnostics) {
          expect(d.start).toBeGreaterThanOrEqual(0);
          expect(d.end).toBeLessThanOrEqual(text.length);
          expect(d.end).toBeGreaterThan(d.start);
        }
      }),
      { seed: 20261203, numRuns: 300 },
    );
  });
});
