/**
 * The formula reader on notations chemists write: decimal adduct counts, spaced hydrates, true minus
 * signs, counts written x, and alloy designations (which are not formulas). Atom counts are arithmetic on
 * the notation; the alloy rule is the EN/ISO designation scheme (EN 573-2, EN 1412; common practice).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { analyseBatch } from '../../server/src/chem/batch';
import { formulaAtoms } from '../../server/src/chem/formula/compute';
import { parseFormula } from '../../server/src/chem/formula/parse';
import { joinSpacedAdduct } from '../../server/src/chem/formula/spaced';
import { cardJson } from '../../server/src/service/card';
import { formulaCardMarkdown } from '../../server/src/service/hover';
import { DEFAULT_SETTINGS } from '../../server/src/service/settings';

const atoms = (t: string) => {
  const r = parseFormula(t);
  expect(r.diagnostics, t).toEqual([]);
  return formulaAtoms(r.formula!);
};

describe('adduct counts and spaces', () => {
  it.each([
    ['CaCl2·1.5H2O', { Ca: 1, Cl: 2, H: 3, O: 1.5 }],
    ['Na2CO3·1.5H2O2', { C: 1, H: 3, Na: 2, O: 6 }], // sodium percarbonate, 2Na2CO3·3H2O2 per formula unit halved
    ['2Na2CO3·3H2O2', { C: 2, H: 6, Na: 4, O: 12 }],
    ['CaSO4·0.5H2O', { Ca: 1, H: 1, O: 4.5, S: 1 }],
    ['CaSO4.0.5H2O', { Ca: 1, H: 1, O: 4.5, S: 1 }],
    ['CuSO4.1.5H2O', { Cu: 1, H: 3, O: 5.5, S: 1 }],
    ['CuSO4 · 5H2O', { Cu: 1, H: 10, O: 9, S: 1 }],
    ['CuSO4 · 5 H2O', { Cu: 1, H: 10, O: 9, S: 1 }],
    ['CuSO4· 5H2O', { Cu: 1, H: 10, O: 9, S: 1 }],
    ['CuSO4 •5H2O', { Cu: 1, H: 10, O: 9, S: 1 }],
  ])('%s', (t, expected) => {
    expect(atoms(t)).toEqual(expected);
  });

  it('reads a spaced hydrate exactly like the unspaced one (molar mass, ions, display)', () => {
    const a = analyseFormula('CuSO4 · 5H2O');
    const b = analyseFormula('CuSO4·5H2O');
    expect(a.molarMass!.value).toBe(b.molarMass!.value);
    expect(a.display).toBe(b.display);
    expect(a.charges!.message).toBe(b.charges!.message);
  });

  it('still says where a stray space is (`Na Cl`), and that nothing follows a final dot', () => {
    expect(parseFormula('Na Cl').diagnostics[0]).toMatchObject({ code: 'malformed-formula', start: 2, end: 3 });
    expect(parseFormula('CuSO4 ·').ok).toBe(false);
  });

  it('reads O^−− (U+2212 minus signs) like O^--', () => {
    expect(analyseFormula('O^−−').charge).toBe(-2);
    expect(analyseFormula('O^--').charge).toBe(-2);
    expect(analyseFormula('SO4^2−').charge).toBe(-2);
  });

  it('property: spaces around a middle dot never change the atoms (fast-check)', () => {
    const salts = ['CuSO4', 'NiCl2', 'MgSO4', 'Na2CO3', 'CaCl2', 'FeSO4', 'K4[Fe(CN)6]'];
    const adducts = ['H2O', 'NH3', 'H2O2'];
    const ws = fc.constantFrom('', ' ', '  ', '\t');
    fc.assert(
      fc.property(fc.constantFrom(...salts), fc.constantFrom(...adducts), fc.integer({ min: 1, max: 12 }), ws, ws, (salt, add, n, before, after) => {
        const plain = `${salt}·${n === 1 ? '' : n}${add}`;
        const spaced = `${salt}${before}·${after}${n === 1 ? '' : n}${add}`;
        const p = parseFormula(spaced);
        expect(p.diagnostics).toEqual([]);
        expect(formulaAtoms(p.formula!)).toEqual(formulaAtoms(parseFormula(plain).formula!));
      }),
      { numRuns: 500 },
    );
  });
});

describe('spaced hydrates on a batch line', () => {
  const lines = (block: string) => {
    let at = 0;
    return block.split('\n').map((text) => {
      const l = { text, start: at };
      at += text.length + 1;
      return l;
    });
  };
  it.each(['CuSO4 · 5H2O 25 g', 'CuSO4 · 5 H2O 25 g', 'CuSO4· 5H2O 25 g', 'CuSO4 ·5H2O 25 g'])('%s weighs 25 g of the pentahydrate', (line) => {
    const b = analyseBatch(lines(`volume: 1 L\n${line}`));
    expect(b.diagnostics).toEqual([]);
    expect(b.ingredients[0].analysis.hill).toBe('CuH10O9S');
    // 25 g / 249.68 g/mol (CIAAW 2021 weights) = 0.1001 mol
    expect(b.ingredients[0].moles).toBeCloseTo(25 / analyseFormula('CuSO4·5H2O').molarMass!.value, 12);
  });
  it('joins only the formula: the amount and unit stay tokens', () => {
    const line = 'CuSO4 · 5 H2O 25 g';
    const tokens = [...line.matchAll(/\S+/g)].map((m) => ({ text: m[0], start: 10 + m.index!, end: 10 + m.index! + m[0].length }));
    expect(joinSpacedAdduct(tokens, line, 10).map((t) => t.text)).toEqual(['CuSO4 · 5 H2O', '25', 'g']);
    expect(joinSpacedAdduct(tokens.slice(0, 1), line, 10).map((t) => t.text)).toEqual(['CuSO4']);
  });
});

describe('alloy designations are not formulas', () => {
  it.each([
    [
      'AlSi10Mg',
      'Al',
      90,
      [
        ['Si', 10],
        ['Mg', null],
      ],
    ],
    ['CuZn37', 'Cu', 63, [['Zn', 37]]],
    ['AlMg3', 'Al', 97, [['Mg', 3]]],
    ['CuSn8', 'Cu', 92, [['Sn', 8]]],
    [
      'CuNi10Fe1Mn',
      'Cu',
      89,
      [
        ['Ni', 10],
        ['Fe', 1],
        ['Mn', null],
      ],
    ],
    [
      'TiAl6V4',
      'Ti',
      90,
      [
        ['Al', 6],
        ['V', 4],
      ],
    ],
    [
      'AlSi7Mg0.3',
      'Al',
      92.7,
      [
        ['Si', 7],
        ['Mg', 0.3],
      ],
    ],
  ] as const)('%s: %s balance ≈ %d %, no charge warning', (t, base, pct, parts) => {
    const a = analyseFormula(t);
    expect(a.diagnostics.filter((d) => d.code === 'charge-imbalance')).toEqual([]);
    const d = cardJson(a).alloyDesignation!;
    expect(d.base).toBe(base);
    expect(d.baseMassPercent).toBeCloseTo(pct, 6);
    expect(d.components.map((c) => [c.element, c.massPercent])).toEqual(parts);
    expect(a.bond).toBeNull();
    expect(formulaCardMarkdown(a, DEFAULT_SETTINGS)).toContain('alloy designation');
  });
  it.each(['NaCl2', 'CuCl2', 'CuSO4', 'MgB2', 'CuAl2', 'Ni3Al', 'Cu5Zn8', 'FeNi', 'CuZn', 'AlCl3', 'Ag2O', 'CuZn60', 'CuZn10Sn20'])(
    '%s is no designation',
    (t) => {
      expect(cardJson(analyseFormula(t)).alloyDesignation).toBeNull();
    },
  );
  it('flags NaCl2 as before (a formula with a wrong count)', () => {
    expect(analyseFormula('NaCl2').charges!.balanced).toBe(false);
  });
});
