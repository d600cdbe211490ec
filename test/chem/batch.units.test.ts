/**
 * The units of a batch (chem/batch/units.ts): one table read by every stage and by the messages that list
 * the accepted units. Prefixes are the SI's (BIPM, The International System of Units, 9th ed. 2019,
 * Table 7: k = 10³, m = 10⁻³, µ = 10⁻⁶); NaCl is 58.44 g/mol from IUPAC/CIAAW 2021 abridged atomic weights
 * (Na 22.990, Cl 35.45). Recipes are invented (a fictional plating line).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseBatch } from '../../server/src/chem/batch';
import { batchLines } from '../fixtures/batch';
import { BATCH_UNITS, unitIn, unitList } from '../../server/src/chem/batch/units';

const lines = batchLines;
const batch = (block: string) => analyseBatch(lines(block));
const NACL = 22.99 + 35.45;

describe('the table of units', () => {
  it('gives every spelling the SI factor of its unit', () => {
    // BIPM SI Brochure, Table 7: the prefixes; base units g, mol, mol/L, L.
    const want: Record<string, number> = {
      g: 1,
      mg: 1e-3,
      µg: 1e-6,
      ug: 1e-6,
      kg: 1e3,
      mol: 1,
      mmol: 1e-3,
      µmol: 1e-6,
      umol: 1e-6,
      M: 1,
      'mol/L': 1,
      mM: 1e-3,
      'mmol/L': 1e-3,
      µM: 1e-6,
      uM: 1e-6,
      L: 1,
      l: 1,
      mL: 1e-3,
      ml: 1e-3,
      µL: 1e-6,
      uL: 1e-6,
    };
    for (const [spelling, factor] of Object.entries(want)) {
      const u = unitIn('ingredient', spelling) ?? unitIn('volume', spelling);
      expect(u?.factor, spelling).toBe(factor);
    }
    for (const s of ['wt%', '%w/w', '%']) expect(unitIn('ingredient', s)?.unit).toBe('wt%');
  });

  it('makes the lists the messages offer', () => {
    expect(unitList('ingredient')).toBe('g, mg, kg, mol, mmol, M, mM or wt%');
    expect(unitList('volume')).toBe('L, mL or µL');
    expect(unitList('total')).toBe('g or kg');
  });

  it('knows no unit named like an object property', () => {
    for (const s of ['toString', 'constructor', '__proto__', 'hasOwnProperty', 'valueOf']) {
      for (const place of ['ingredient', 'volume', 'total'] as const) expect(unitIn(place, s), `${place} ${s}`).toBeUndefined();
    }
  });
});

describe('the units on batch lines', () => {
  it('reads each ingredient unit and its aliases to the same amount: 2.5 mmol NaCl is 0.1461 g', () => {
    const mass = 2.5e-3 * NACL;
    for (const [amount, spelled] of [
      ['2.5', 'mmol'],
      ['2500', 'µmol'],
      ['2500', 'umol'],
      ['0.1461', 'g'],
      ['146.1', 'mg'],
      ['146100', 'µg'],
      ['146100', 'ug'],
      ['0.0001461', 'kg'],
    ]) {
      const b = batch(`volume: 1 L\nNaCl ${amount} ${spelled}`);
      expect(b.skipped, spelled).toEqual([]);
      expect(b.ingredients[0].massG!, spelled).toBeCloseTo(mass, 3);
    }
    for (const [amount, spelled] of [
      ['2.5', 'mM'],
      ['2.5', 'mmol/L'],
      ['2500', 'µM'],
      ['2500', 'uM'],
      ['0.0025', 'M'],
      ['0.0025', 'mol/L'],
    ]) {
      const b = batch(`volume: 1 L\nNaCl ${amount} ${spelled}`);
      expect(b.ingredients[0].moles!, spelled).toBeCloseTo(2.5e-3, 12);
    }
  });

  it('writes the unit of an alias as the results do (`ug` → µg, `mol/L` → M, `%w/w` → wt%)', () => {
    const b = batch('volume: 1 L\ntotal: 100 g\nNaCl 5 ug\nKCl 0.1 mol/L\nKBr 2 %w/w\nNaBr 1 %');
    expect(b.ingredients.map((i) => i.amount.unit)).toEqual(['µg', 'M', 'wt%', 'wt%']);
    expect(b.ingredients.map((i) => i.amount.text)).toEqual(['5 µg', '0.1 M', '2 wt%', '1 wt%']);
  });

  it('reads every volume spelling: 250 mL, 250 ml, 0.25 L, 0.25 l, 250000 µL and 250000 uL are 0.25 L', () => {
    for (const v of ['250 mL', '250 ml', '0.25 L', '0.25 l', '250000 µL', '250000 uL', '250mL'])
      expect(batch(`volume: ${v}\nNaCl 1 g`).volumeL, v).toBeCloseTo(0.25, 12);
    for (const t of ['250 g', '0.25 kg', '250000 mg']) expect(batch(`total: ${t}`).totalMassG, t).toBeCloseTo(250, 9);
  });

  it('a unit named like an object property is unknown in a header too (it gave a volume of NaN before)', () => {
    const block = 'volume: 1 toString\ntotal: 5 constructor\nNaCl 0.1 M';
    const b = batch(block);
    expect(b.volumeL).toBeNull();
    expect(b.totalMassG).toBeNull();
    expect(b.diagnostics.filter((d) => d.code === 'batch-unit').map((d) => [block.slice(d.start, d.end), d.message])).toEqual([
      ['toString', "Unknown unit 'toString' for volume; use L, mL or µL."],
      ['constructor', "Unknown unit 'constructor' for total; use g or kg."],
    ]);
    expect(b.skipped.map((s) => s.code)).toEqual(['batch-unit', 'batch-unit', 'batch-no-volume']);
  });

  it('a volume on an ingredient line names the density it would need; a total unit is not a volume one', () => {
    // A solid by volume: no density to pour it by (chem/reagents knows the liquids' densities only).
    for (const u of ['mL', 'ml', 'L', 'µL', 'uL']) expect(batch(`NaCl 5 ${u}`).skipped[0].reason, u).toMatch(/No density is known for NaCl/);
    expect(batch('volume: 5 g').skipped[0].reason).toBe("Unknown unit 'g' for volume; use L, mL or µL.");
    expect(batch('total: 5 mL').skipped[0].reason).toBe("Unknown unit 'mL' for total; use g or kg.");
  });

  it('property: a line in any accepted spelling is counted, with the unit as the table writes it', () => {
    const ingredientUnits = BATCH_UNITS.filter((u) => (u.places as readonly string[]).includes('ingredient'));
    const spelling = fc.constantFrom(...ingredientUnits.flatMap((u) => [u.unit, ...u.aliases].map((s) => [s, u.unit] as const)));
    fc.assert(
      fc.property(spelling, fc.integer({ min: 1, max: 99 }), fc.boolean(), ([s, unit], n, glued) => {
        const b = batch(`volume: 1 L\ntotal: 1 kg\nKCl ${n}${glued ? '' : ' '}${s}`);
        expect(b.skipped).toEqual([]);
        expect(b.ingredients[0].amount.unit).toBe(unit);
      }),
      { seed: 20261203, numRuns: 200 },
    );
  });
});
