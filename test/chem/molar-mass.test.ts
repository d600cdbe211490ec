/**
 * Molar masses checked against sources outside the project:
 * - the npm package `chemical-elements` (2.3.3), whose element masses come from isotopic compositions
 *   (standard atomic weights at full precision), for every element with a standard weight and for
 *   compounds summed from its masses;
 * - handbook molar masses of hydrates and salts (CRC Handbook of Chemistry and Physics, "Physical Constants
 *   of Inorganic Compounds"; values from memory, so compared with a tolerance of 0.05 g/mol, which also
 *   covers the CRC's older atomic weights).
 */
import { describe, expect, it } from 'vitest';
import { elementsObject } from 'chemical-elements';
import { analyseFormula } from '../../server/src/chem/analyse';
import { ELEMENTS } from '../../server/src/chem/data/elements';

const ref = elementsObject as Record<string, { mass: number | null }>;

describe('molar mass of every element', () => {
  for (const e of ELEMENTS.filter((x) => x.hasStandardWeight)) {
    it(`${e.symbol} agrees with chemical-elements within the CIAAW 2021 abridged uncertainty`, () => {
      const a = analyseFormula(e.symbol);
      const theirs = ref[e.symbol].mass as number;
      // Source: chemical-elements; tolerance: the abridged uncertainty (plus rounding of the last digit).
      // Known difference: CIAAW revised Se in 2013 from 78.96(3) to 78.971(8); chemical-elements still
      // carries the older value, so for Se the older uncertainty (0.03) applies.
      const tol = e.symbol === 'Se' ? 0.03 : (e.massUncertainty as number) + 0.0006;
      expect(Math.abs((a.molarMass?.value as number) - theirs)).toBeLessThanOrEqual(tol);
    });
  }
});

/** Molar mass from chemical-elements' element masses and counts we state by hand, not by our parser. */
function refMass(counts: Record<string, number>): number {
  return Object.entries(counts).reduce((s, [el, n]) => s + n * (ref[el].mass as number), 0);
}

// Counts written out by hand from the formula (so the parser is checked, not reused).
const COMPOUNDS: Array<[string, Record<string, number>]> = [
  ['H2O', { H: 2, O: 1 }],
  ['NaCl', { Na: 1, Cl: 1 }],
  ['CaCO3', { Ca: 1, C: 1, O: 3 }],
  ['H2SO4', { H: 2, S: 1, O: 4 }],
  ['(NH4)2SO4', { N: 2, H: 8, S: 1, O: 4 }],
  ['Ca3(PO4)2', { Ca: 3, P: 2, O: 8 }],
  ['K4[Fe(CN)6]', { K: 4, Fe: 1, C: 6, N: 6 }],
  ['[Co(NH3)6]Cl3', { Co: 1, N: 6, H: 18, Cl: 3 }],
  ['CuSO4·5H2O', { Cu: 1, S: 1, O: 9, H: 10 }],
  ['CuSO4.5H2O', { Cu: 1, S: 1, O: 9, H: 10 }],
  ['MgSO4*7H2O', { Mg: 1, S: 1, O: 11, H: 14 }],
  ['CaSO4·0.5H2O', { Ca: 1, S: 1, O: 4.5, H: 1 }],
  ['Na2B4O7·10H2O', { Na: 2, B: 4, O: 17, H: 20 }],
  ['KAl(SO4)2·12H2O', { K: 1, Al: 1, S: 2, O: 20, H: 24 }],
  ['C6H12O6', { C: 6, H: 12, O: 6 }],
  ['CH3COOH', { C: 2, H: 4, O: 2 }],
  ['C2H5OH', { C: 2, H: 6, O: 1 }],
  ['Fe0.95O', { Fe: 0.95, O: 1 }],
  ['La0.8Sr0.2MnO3', { La: 0.8, Sr: 0.2, Mn: 1, O: 3 }],
  ['Fe3O4', { Fe: 3, O: 4 }],
  ['Pb3O4', { Pb: 3, O: 4 }],
  ['KMnO4', { K: 1, Mn: 1, O: 4 }],
  ['K2Cr2O7', { K: 2, Cr: 2, O: 7 }],
  ['Na2S2O3·5H2O', { Na: 2, S: 2, O: 8, H: 10 }],
  ['Al2(SO4)3·18H2O', { Al: 2, S: 3, O: 30, H: 36 }],
  ['Mg(OH)2', { Mg: 1, O: 2, H: 2 }],
  ['Ca5(PO4)3OH', { Ca: 5, P: 3, O: 13, H: 1 }],
  ['NaHCO3', { Na: 1, H: 1, C: 1, O: 3 }],
  ['KH2PO4', { K: 1, H: 2, P: 1, O: 4 }],
  ['Na2HPO4·7H2O', { Na: 2, H: 15, P: 1, O: 11 }],
  ['H₂O', { H: 2, O: 1 }],
  ['SO₄²⁻', { S: 1, O: 4 }],
  ['Fe2(SO4)3', { Fe: 2, S: 3, O: 12 }],
  ['[Cu(NH3)4(H2O)2]SO4', { Cu: 1, N: 4, H: 16, O: 6, S: 1 }],
  ['C12H22O11', { C: 12, H: 22, O: 11 }],
  ['UO2(NO3)2·6H2O', { U: 1, O: 14, N: 2, H: 12 }],
  ['Pb(OAc)2', { Pb: 1, C: 4, H: 6, O: 4 }],
];

describe('molar mass of compounds (reference: chemical-elements element masses)', () => {
  for (const [f, counts] of COMPOUNDS) {
    it(f, () => {
      const a = analyseFormula(f);
      expect(a.ok).toBe(true);
      expect(a.atoms).toEqual(counts);
      // The abridged weights differ from full-precision ones by at most the abridged uncertainties.
      const tol = Object.entries(counts).reduce((s, [el, n]) => s + n * ((ELEMENTS.find((e) => e.symbol === el)?.massUncertainty ?? 0) + 0.0006), 0);
      expect(Math.abs((a.molarMass?.value as number) - refMass(counts))).toBeLessThanOrEqual(tol);
    });
  }
});

// CRC Handbook of Chemistry and Physics, "Physical Constants of Inorganic Compounds" (from memory).
const HANDBOOK: Array<[string, number]> = [
  ['CuSO4·5H2O', 249.69],
  ['MgSO4·7H2O', 246.47],
  ['CaCl2·2H2O', 147.01],
  ['Na2CO3·10H2O', 286.14],
  ['Na2SO4·10H2O', 322.2],
  ['FeSO4·7H2O', 278.01],
  ['CaSO4·2H2O', 172.17],
  ['NiCl2·6H2O', 237.69],
  ['CoCl2·6H2O', 237.93],
  ['ZnSO4·7H2O', 287.56],
  ['BaCl2·2H2O', 244.26],
  ['Na2B4O7·10H2O', 381.37],
  ['KAl(SO4)2·12H2O', 474.39],
  ['K4[Fe(CN)6]·3H2O', 422.39],
  ['NaCl', 58.44],
  ['KCl', 74.55],
  ['CaCO3', 100.09],
];

describe('molar masses of hydrates and salts (CRC Handbook, from memory)', () => {
  for (const [f, mm] of HANDBOOK) {
    it(`${f} ≈ ${mm} g/mol`, () => {
      expect(analyseFormula(f).molarMass?.value).toBeCloseTo(mm, 1);
      expect(Math.abs((analyseFormula(f).molarMass?.value as number) - mm)).toBeLessThanOrEqual(0.05);
    });
  }
});

describe('molar-mass uncertainty', () => {
  it('is the counts times the CIAAW 2021 abridged uncertainties, combined in quadrature across elements', () => {
    // H2O: H 1.0080 ± 0.0002, O 15.999 ± 0.001 (CIAAW 2021 abridged).
    const u = analyseFormula('H2O').molarMass?.uncertainty as number;
    expect(u).toBeCloseTo(Math.sqrt((2 * 0.0002) ** 2 + 0.001 ** 2), 9);
  });
  it('is null where an element has no standard atomic weight, with an information diagnostic', () => {
    const a = analyseFormula('TcO2');
    expect(a.molarMass?.uncertainty).toBeNull();
    expect(a.diagnostics.map((d) => d.code)).toContain('no-standard-weight');
  });
});
