/**
 * The solution model against pH values measured or worked out elsewhere.
 *
 * - IUPAC primary standard buffers: R. P. Buck et al., "Measurement of pH. Definition, standards, and
 *   procedures", Pure Appl. Chem. 74 (2002) 2169, Table 3 (pH(PS) at 25 °C; values recalled, from memory).
 *   The standards are molal; each batch here is made at the same number of mol per litre (the solutions are
 *   dilute, ρ ≈ 1 kg/L, and a pH depends on ratios and on I, which move by well under 0.003 pH this way).
 *   The model's pH is −log a(H⁺) with Davies coefficients; pH(PS) follows the Bates–Guggenheim convention.
 *   Both are activity scales from the same Debye–Hückel limiting law: required within ±0.03.
 * - Textbook worked examples (ideal solutions, as the textbooks work them): D. C. Harris, Quantitative
 *   Chemical Analysis, chapters on monoprotic and polyprotic equilibria (from memory), within ±0.05.
 * - Temperature: the ion product of water at 50 °C (CRC Handbook, "Ion product of water": pKw 13.262;
 *   from memory) and TRIS at 37 °C (Bates & Hetzer 1961: pKa 7.72; from memory), by van 't Hoff.
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { analyseBatch } from '../../server/src/chem/batch';
import { batchSolution } from '../../server/src/chem/solution/batch';
import { batchLines } from '../fixtures/batch';

const pHOf = (block: string) => {
  const b = analyseBatch(batchLines(block));
  expect(b.solution, block).not.toBeNull();
  expect(b.solution!.converged).toBe(true);
  return b.solution!.pH;
};

const idealPH = (ingredients: Array<[string, number]>) =>
  batchSolution({ volumeL: 1, temperatureC: 25, ingredients: ingredients.map(([f, moles]) => ({ analysis: analyseFormula(f), moles })), activity: 'ideal' }).pH;

describe('IUPAC primary standard buffers at 25 °C (Buck et al., Pure Appl. Chem. 74 (2002) 2169, Table 3), within ±0.03', () => {
  const standards: Array<[string, string[], number]> = [
    // Saturated potassium hydrogen tartrate: 0.0341 mol/kg at 25 °C (the standard's own note).
    ['potassium hydrogen tartrate, saturated (0.0341 mol/kg)', ['KHC4H4O6 0.0341 M'], 3.557],
    ['potassium dihydrogen citrate, 0.05 mol/kg', ['KH2C6H5O7 0.05 M'], 3.776],
    ['potassium hydrogen phthalate, 0.05 mol/kg', ['KHC8H4O4 0.05 M'], 4.005],
    ['phosphate 1:1, 0.025 + 0.025 mol/kg', ['KH2PO4 0.025 M', 'Na2HPO4 0.025 M'], 6.865],
    ['phosphate 1:3.5, 0.008695 + 0.03043 mol/kg', ['KH2PO4 0.008695 M', 'Na2HPO4 0.03043 M'], 7.413],
    ['borax, 0.01 mol/kg', ['Na2B4O7·10H2O 0.01 M'], 9.18],
    ['sodium hydrogen carbonate + sodium carbonate, 0.025 + 0.025 mol/kg', ['NaHCO3 0.025 M', 'Na2CO3 0.025 M'], 10.012],
  ];
  for (const [name, lines, pHPS] of standards) {
    it(`${name}: pH(PS) ${pHPS}`, () => {
      expect(Math.abs(pHOf(['volume: 1 L', ...lines].join('\n')) - pHPS)).toBeLessThanOrEqual(0.03);
    });
  }

  it('the KHP standard reads the same however the salt is written (KHC8H4O4, C8H5KO4)', () => {
    expect(pHOf('volume: 1 L\nC8H5KO4 0.05 M')).toBeCloseTo(pHOf('volume: 1 L\nKHC8H4O4 0.05 M'), 10);
  });
});

describe('textbook worked examples, ideal solutions (Harris, Quantitative Chemical Analysis; from memory), within ±0.05', () => {
  it('weak acid: 0.100 M acetic acid, pH 2.88', () => expect(Math.abs(idealPH([['CH3COOH', 0.1]]) - 2.88)).toBeLessThanOrEqual(0.05));
  it('weak base: 0.10 M ammonia, pH 11.12', () => expect(Math.abs(idealPH([['NH3', 0.1]]) - 11.12)).toBeLessThanOrEqual(0.05));
  it('buffer: 0.10 M acetic acid with 0.10 M sodium acetate, pH = pKa = 4.76', () =>
    expect(
      Math.abs(
        idealPH([
          ['CH3COOH', 0.1],
          ['CH3COONa', 0.1],
        ]) - 4.76,
      ),
    ).toBeLessThanOrEqual(0.05));
  it('polyprotic salt: 0.10 M NaHCO3, pH ≈ ½(pKa1 + pKa2) = 8.34', () => expect(Math.abs(idealPH([['NaHCO3', 0.1]]) - 8.34)).toBeLessThanOrEqual(0.05));
  it('polyprotic salt: 0.10 M Na2HPO4, pH ≈ ½(pKa2 + pKa3) = 9.77', () => expect(Math.abs(idealPH([['Na2HPO4', 0.1]]) - 9.77)).toBeLessThanOrEqual(0.05));
  it('a base of a diprotic acid: 0.10 M Na2CO3, pH 11.66', () => expect(Math.abs(idealPH([['Na2CO3', 0.1]]) - 11.66)).toBeLessThanOrEqual(0.05));

  it('with activities the same buffer at 0.1 M sits lower than Henderson–Hasselbalch says (Davies: about −0.1)', () => {
    const withActivities = pHOf('volume: 1 L\nCH3COOH 0.1 M\nCH3COONa 0.1 M');
    const shift =
      withActivities -
      idealPH([
        ['CH3COOH', 0.1],
        ['CH3COONa', 0.1],
      ]);
    // log γ(acetate) at I = 0.1 by Davies with A = 0.5108: −0.107 (computed by hand).
    expect(shift).toBeGreaterThan(-0.13);
    expect(shift).toBeLessThan(-0.08);
  });
});

describe('temperature (van t Hoff with the tabulated enthalpies)', () => {
  it('pure water at 50 °C: pH ½ pKw = 6.63 (CRC Handbook "Ion product of water", pKw 13.262; from memory), within 0.03', () => {
    expect(Math.abs(pHOf('volume: 1 L\ntemperature: 50 °C\nNaCl 1 mM') - 13.262 / 2)).toBeLessThanOrEqual(0.03);
  });

  it('TRIS 1:1 at 37 °C: pKa 7.72 (Bates & Hetzer 1961; from memory), within 0.06 (no heat-capacity term)', () => {
    const pH = pHOf('volume: 1 L\ntemperature: 37 °C\nC4H11NO3 1 mM\nC4H11NO3·HCl 1 mM');
    expect(Math.abs(pH - 7.72)).toBeLessThanOrEqual(0.06);
    // And colder is more basic: the same buffer at 25 °C is higher (Bates & Hetzer: 8.07).
    expect(pHOf('volume: 1 L\nC4H11NO3 1 mM\nC4H11NO3·HCl 1 mM')).toBeGreaterThan(pH + 0.25);
  });

  it('away from 25 °C the constants without an enthalpy are named as used at their 25 °C value', () => {
    const b = analyseBatch(batchLines('volume: 1 L\ntemperature: 40 °C\nNiSO4 0.1 M'));
    expect(b.solution!.at25).toContain('NiOH^+');
    expect(b.solution!.notes.join(' ')).toMatch(/At 40 °C; no enthalpy is tabulated for \d+ of the constants used \(.*NiOH⁺/);
  });
});
