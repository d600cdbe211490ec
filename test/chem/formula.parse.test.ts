/**
 * The formula parser: notations, positions, and one precise diagnostic per bad token.
 * Expected atom counts are read off the formulas by hand (arithmetic on the notation, not reference data).
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { parseFormula, MAX_DEPTH } from '../../server/src/chem/formula/parse';
import { displayFormula, formulaAtoms, hillFormula } from '../../server/src/chem/formula/compute';

const atoms = (t: string) => {
  const r = parseFormula(t);
  expect(r.diagnostics).toEqual([]);
  return formulaAtoms(r.formula!);
};

describe('notations', () => {
  it.each([
    ['NaCl', { Cl: 1, Na: 1 }],
    ['CH3COOH', { C: 2, H: 4, O: 2 }],
    ['Ca(OH)2', { Ca: 1, O: 2, H: 2 }],
    ['K3[Fe(CN)6]', { K: 3, Fe: 1, C: 6, N: 6 }],
    ['{[Co(NH3)5]Cl}Cl2', { Co: 1, N: 5, H: 15, Cl: 3 }],
    ['Fe0.95O', { Fe: 0.95, O: 1 }],
    ['Li0.5CoO2', { Li: 0.5, Co: 1, O: 2 }],
    ['CuSO4.5H2O', { Cu: 1, S: 1, O: 9, H: 10 }],
    ['Na2CO3.10H2O', { Na: 2, C: 1, O: 13, H: 20 }],
    ['CaSO4.0.5H2O', { Ca: 1, S: 1, O: 4.5, H: 1 }],
    ['CaSO4·½H2O', { Ca: 1, S: 1, O: 4.5, H: 1 }],
    ['CaSO4·1/2H2O', { Ca: 1, S: 1, O: 4.5, H: 1 }],
    ['CuSO4•5H2O', { Cu: 1, S: 1, O: 9, H: 10 }],
    ['CuSO4*5H2O', { Cu: 1, S: 1, O: 9, H: 10 }],
    ['CaCl2.2NH3', { Ca: 1, Cl: 2, N: 2, H: 6 }],
    ['[Cu(H2O)6]SO4·H2O', { Cu: 1, H: 14, O: 11, S: 1 }],
    ['K4[Fe(CN)6]·3H2O', { K: 4, Fe: 1, C: 6, N: 6, H: 6, O: 3 }],
    ['H₂SO₄', { H: 2, S: 1, O: 4 }],
    ['Fe₀.₉₅O', { Fe: 0.95, O: 1 }],
    ['(C2H5)2O', { C: 4, H: 10, O: 1 }],
    ['Et2O', { C: 4, H: 10, O: 1 }],
    ['PhCOOH', { C: 7, H: 6, O: 2 }],
    ['[Co(en)3]Cl3', { Co: 1, C: 6, H: 24, N: 6, Cl: 3 }],
    ['Fe(acac)3', { Fe: 1, C: 15, H: 21, O: 6 }],
    ['Uue'.slice(0, 0) + 'Og', { Og: 1 }],
  ])('%s', (text, expected) => {
    expect(atoms(text)).toEqual(expected);
  });

  it('reads charges in every notation', () => {
    for (const [t, q] of [
      ['SO4^2-', -2],
      ['SO4^-2', -2],
      ['SO4^{2-}', -2],
      ['SO₄²⁻', -2],
      ['NH4^+', 1],
      ['NH4+', 1],
      ['Cl-', -1],
      ['Ca++', 2],
      ['Ca+2', 2],
      ['Fe3+', 3],
      ['Fe^3+', 3],
      ['O2-', -2],
      ['[Fe(CN)6]^4-', -4],
      ['H3O⁺', 1],
      ['e-', 0],
    ] as const) {
      const r = parseFormula(t);
      if (t === 'e-') {
        expect(r.ok).toBe(false);
        continue;
      }
      expect(r.ok, t).toBe(true);
      expect(analyseFormula(t).charge, t).toBe(q);
    }
  });

  it('reads a bare trailing digit-and-sign on one element as the charge (Fe3+ is Fe³⁺), and offers both readings otherwise', () => {
    const fe = parseFormula('Fe3+').formula!;
    expect(fe.charge).toBe(3);
    expect(formulaAtoms(fe)).toEqual({ Fe: 1 });
    expect(fe.chargeSpan).toEqual({ start: 2, end: 4 });
    const so4 = parseFormula('SO42-').formula!;
    expect(so4.charge).toBe(-1);
    expect(so4.alternative?.charge).toBe(-2);
    expect(formulaAtoms(so4.alternative!)).toEqual({ O: 4, S: 1 });
  });

  it('reads state symbols at the end', () => {
    for (const [t, s] of [
      ['NaCl(aq)', 'aq'],
      ['H2O(l)', 'l'],
      ['CO2(g)', 'g'],
      ['Fe(s)', 's'],
      ['Na^+(aq)', 'aq'],
    ] as const) {
      const f = parseFormula(t).formula!;
      expect(f.state, t).toBe(s);
    }
    expect(atoms('Na^+(aq)')).toEqual({ Na: 1 });
  });

  it('reads Stock notation as an oxidation state, not as iodine', () => {
    const f = parseFormula('Fe(III)').formula!;
    expect(formulaAtoms(f)).toEqual({ Fe: 1 });
    expect(f.parts[0].items[0]).toMatchObject({ kind: 'element', symbol: 'Fe', stock: 3 });
  });

  it('writes the Hill formula with C and H first, otherwise alphabetically', () => {
    expect(hillFormula(atoms('CH3COOH'))).toBe('C2H4O2');
    expect(hillFormula(atoms('H2SO4'))).toBe('H2O4S');
    expect(hillFormula(atoms('CuSO4·5H2O'))).toBe('CuH10O9S');
    expect(hillFormula(atoms('NaHCO3'))).toBe('CHNaO3');
  });

  it('prints a normalised display form with subscripts and superscripts', () => {
    expect(displayFormula(parseFormula('CuSO4.5H2O').formula!)).toBe('CuSO₄·5H₂O');
    expect(displayFormula(parseFormula('SO4^2-').formula!)).toBe('SO₄²⁻');
    expect(displayFormula(parseFormula('[Fe(CN)6]^4-').formula!, false)).toBe('[Fe(CN)6]^4-');
  });
});

describe('diagnostics point at the exact characters', () => {
  const only = (t: string) => {
    const r = parseFormula(t);
    expect(r.diagnostics, t).toHaveLength(1);
    return r.diagnostics[0];
  };
  it.each([
    ['NaXx2Cl', 'unknown-element', 2, 4],
    ['Nacl', 'unknown-element', 0, 4],
    ['Ca(NO3', 'malformed-formula', 2, 3],
    ['NaCl)', 'malformed-formula', 4, 5],
    ['Ca(NO3]2', 'malformed-formula', 6, 7],
    ['Na$Cl', 'malformed-formula', 2, 3],
    ['H0O', 'malformed-formula', 1, 2],
    ['H99999999999999999999', 'malformed-formula', 1, 21],
    ['Na Cl', 'malformed-formula', 2, 3],
    ['NaCl^2', 'malformed-formula', 4, 6],
    ['CuSO4·', 'malformed-formula', 5, 6],
    ['()', 'malformed-formula', 0, 2],
    ['na', 'unknown-element', 0, 2],
    ['Ben', 'unknown-element', 0, 3],
    ['CL2', 'unknown-element', 0, 2],
    ['Co(en', 'malformed-formula', 2, 3],
    ['Coen', 'unknown-element', 0, 4],
    ['Na🧪Cl', 'malformed-formula', 2, 4],
  ] as const)('%s', (text, code, start, end) => {
    const d = only(text);
    expect(d.code).toBe(code);
    expect(d.severity).toBe('error');
    expect([d.start, d.end]).toEqual([start, end]);
  });

  it('suggests case fixes for unknown symbols', () => {
    expect(parseFormula('Nacl').diagnostics[0].data?.suggestions).toContain('NaCl');
    expect(parseFormula('CL2').diagnostics[0].data?.suggestions).toEqual(['Cl']);
    expect(parseFormula('CaCL2').diagnostics[0]).toMatchObject({ start: 2, end: 4, data: { suggestions: ['Cl'] } });
  });

  it('stops at a nesting limit with one diagnostic instead of overflowing', () => {
    const deep = '('.repeat(20000) + 'H' + ')'.repeat(20000);
    const r = parseFormula(deep.slice(0, 4000));
    expect(r.ok).toBe(false);
    expect(r.diagnostics[0].message).toContain(String(MAX_DEPTH));
    expect(parseFormula(deep).ok).toBe(false);
  });
});
