/**
 * The safety reading's own pH estimate (ideal solution), against textbook equilibrium calculations with the
 * CRC Handbook's pKa values (acetic acid 4.76, NH4⁺ 9.25, H3PO4 2.15/7.20/12.35, H2CO3 6.35/10.33,
 * HSO4⁻ 1.99): the quadratic for a weak acid or base, Henderson–Hasselbalch for a buffer.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseFormula } from '../../server/src/chem/analyse';
import { acidBaseShare, addShare, emptyAmounts, solvePH } from '../../server/src/chem/safety/ph';

function pH(parts: Array<[string, number]>, volumeL = 1): number {
  const amounts = emptyAmounts();
  for (const [f, mol] of parts) addShare(amounts, acidBaseShare(analyseFormula(f)), mol);
  return solvePH(amounts, volumeL)!;
}

/** Weak acid HA at C: [H⁺] = (−Ka + √(Ka² + 4 Ka C)) / 2. */
const weakAcid = (pKa: number, c: number) => {
  const ka = 10 ** -pKa;
  return -Math.log10((-ka + Math.sqrt(ka * ka + 4 * ka * c)) / 2);
};

describe('pH estimates', () => {
  it('strong acid and base: 0.01 M HCl pH 2.00, 0.1 M NaOH pH 13.00', () => {
    expect(pH([['HCl', 0.01]])).toBeCloseTo(2.0, 3);
    expect(pH([['NaOH', 0.1]])).toBeCloseTo(13.0, 3);
  });
  it('0.1 M acetic acid pH 2.88; 0.1 M H3PO4 pH 1.63 (first step, quadratic)', () => {
    expect(pH([['CH3COOH', 0.1]])).toBeCloseTo(weakAcid(4.76, 0.1), 2);
    expect(pH([['CH3COOH', 0.1]])).toBeCloseTo(2.88, 1);
    expect(pH([['H3PO4', 0.1]])).toBeCloseTo(weakAcid(2.15, 0.1), 2);
  });
  it('0.1 M ammonia pH 11.13 (pKb 4.75)', () => {
    expect(pH([['NH3', 0.1]])).toBeCloseTo(14 - weakAcid(4.75, 0.1), 2);
  });
  it('buffers at their pKa: acetate 4.76, phosphate 7.20, and Henderson–Hasselbalch for PBS (ideal, 7.96)', () => {
    expect(
      pH([
        ['CH3COOH', 0.1],
        ['CH3COONa', 0.1],
      ]),
    ).toBeCloseTo(4.76, 2);
    expect(
      pH([
        ['NaH2PO4', 0.05],
        ['Na2HPO4', 0.05],
      ]),
    ).toBeCloseTo(7.2, 2);
    expect(
      pH([
        ['KH2PO4', 0.00176],
        ['Na2HPO4', 0.0101],
      ]),
    ).toBeCloseTo(7.2 + Math.log10(0.0101 / 0.00176), 1);
  });
  it('0.1 M NaHCO3 pH 8.34 (mean of the two pKa); 0.1 M Na2CO3 pH 11.66', () => {
    expect(pH([['NaHCO3', 0.1]])).toBeCloseTo((6.35 + 10.33) / 2, 1);
    expect(pH([['Na2CO3', 0.1]])).toBeCloseTo(14 - weakAcid(14 - 10.33, 0.1), 2);
  });
  it('0.05 M H2SO4: the second proton in part, pH 1.24 (HSO4⁻ pKa 1.99)', () => {
    const ka = 10 ** -1.99;
    // x(0.05 + x)/(0.05 − x) = Ka
    const x = (-(0.05 + ka) + Math.sqrt((0.05 + ka) ** 2 + 4 * ka * 0.05)) / 2;
    expect(pH([['H2SO4', 0.05]])).toBeCloseTo(-Math.log10(0.05 + x), 2);
  });
  it('a salt of a strong acid and base, or nothing at all, is neutral', () => {
    expect(pH([['NaCl', 0.1]])).toBeCloseTo(7, 3);
  });
  it('more acid never raises the pH (property test)', () => {
    const pool = ['NaOH', 'CH3COONa', 'NH4Cl', 'Na2HPO4', 'NaHCO3', 'C6H8O7', 'NaCN', 'H3BO3', 'Na2CO3', 'KH2PO4'];
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.constantFrom(...pool), fc.double({ min: 1e-5, max: 1, noNaN: true })), { maxLength: 6 }),
        fc.double({ min: 1e-5, max: 1, noNaN: true }),
        (parts, acid) => {
          const before = pH(parts);
          const after = pH([...parts, ['HCl', acid]]);
          expect(after).toBeLessThanOrEqual(before + 1e-5);
        },
      ),
      { numRuns: 200 },
    );
  });
});
