/**
 * Equations: parsing (species, coefficients, the `+`/charge ambiguity, exact offsets), balancing and the
 * reaction analysis.
 *
 * The balanced equations checked here are worked examples found in general chemistry textbooks; since the
 * books were not at hand, each is marked "common textbook example". Every expected result is also
 * re-checked by counting atoms and charges in the test itself (`countsBalance`), so the expectations do not
 * rest on memory alone.
 */
import { describe, expect, it } from 'vitest';
import { analyseReaction, balanceCheck, balanceEquation, clearReactionCache, parseEquation, unbalancedMessage } from '../../server/src/chem/equation';
import { countsBalance } from '../fixtures/equation';

const balance = (text: string) => balanceEquation(parseEquation(text));

function expectBalanced(text: string, coefficients: number[], balancedText?: string) {
  const parsed = parseEquation(text);
  expect(parsed.diagnostics, text).toEqual([]);
  const r = balanceEquation(parsed);
  expect(r.status, `${text}: ${r.message}`).toBe('balanced');
  expect(r.coefficients).toEqual(coefficients);
  expect(countsBalance(parsed, coefficients)).toBe(true);
  if (balancedText) expect(r.balancedText).toBe(balancedText);
  // The balanced text reads back as balanced, with the same coefficients.
  const again = balance(r.balancedText as string);
  expect(again.status).toBe('already-balanced');
  expect(again.coefficients).toEqual(coefficients);
  expect(again.reducible).toBe(false);
}

describe('textbook equations', () => {
  it('combustion of propane', () => {
    // common textbook example: C3H8 + 5 O2 -> 3 CO2 + 4 H2O
    expectBalanced('C3H8 + O2 -> CO2 + H2O', [1, 5, 3, 4], 'C3H8 + 5 O2 -> 3 CO2 + 4 H2O');
  });

  it('combustion of octane', () => {
    // common textbook example: 2 C8H18 + 25 O2 -> 16 CO2 + 18 H2O
    expectBalanced('C8H18 + O2 -> CO2 + H2O', [2, 25, 16, 18], '2 C8H18 + 25 O2 -> 16 CO2 + 18 H2O');
  });

  it('rusting of iron', () => {
    // common textbook example: 4 Fe + 3 O2 -> 2 Fe2O3
    expectBalanced('Fe + O2 -> Fe2O3', [4, 3, 2], '4 Fe + 3 O2 -> 2 Fe2O3');
  });

  it('permanganate and hydrochloric acid', () => {
    // common textbook example: 2 KMnO4 + 16 HCl -> 2 KCl + 2 MnCl2 + 5 Cl2 + 8 H2O
    expectBalanced('KMnO4 + HCl -> KCl + MnCl2 + Cl2 + H2O', [2, 16, 2, 2, 5, 8]);
  });

  it('copper and dilute nitric acid', () => {
    // common textbook example: 3 Cu + 8 HNO3 -> 3 Cu(NO3)2 + 2 NO + 4 H2O
    expectBalanced('Cu + HNO3 -> Cu(NO3)2 + NO + H2O', [3, 8, 3, 2, 4], '3 Cu + 8 HNO3 -> 3 Cu(NO3)2 + 2 NO + 4 H2O');
  });

  it('permanganate oxidises iron(II) in acid (ionic form)', () => {
    // common textbook example: MnO4- + 5 Fe2+ + 8 H+ -> Mn2+ + 5 Fe3+ + 4 H2O
    expectBalanced('MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O', [1, 5, 8, 1, 5, 4], 'MnO4^- + 5 Fe^2+ + 8 H^+ -> Mn^2+ + 5 Fe^3+ + 4 H2O');
  });

  it('dichromate oxidises iodide in acid (ionic form)', () => {
    // common textbook example: Cr2O7^2- + 6 I- + 14 H+ -> 2 Cr3+ + 3 I2 + 7 H2O
    expectBalanced('Cr2O7^2- + I^- + H^+ -> Cr^3+ + I2 + H2O', [1, 6, 14, 2, 3, 7]);
  });

  it('half-reactions with electrons', () => {
    // common textbook example: MnO4- + 8 H+ + 5 e- -> Mn2+ + 4 H2O
    expectBalanced('MnO4^- + H^+ + e^- -> Mn^2+ + H2O', [1, 8, 5, 1, 4], 'MnO4^- + 8 H^+ + 5 e^- -> Mn^2+ + 4 H2O');
    // common textbook example: Cr2O7^2- + 14 H+ + 6 e- -> 2 Cr3+ + 7 H2O
    expectBalanced('Cr2O7^2- + H+ + e- -> Cr3+ + H2O', [1, 14, 6, 2, 7]);
    // common textbook example: Fe3+ + e- -> Fe2+, written with superscripts
    expect(balance('Fe³⁺ + e⁻ → Fe²⁺').status).toBe('already-balanced');
  });

  it('dehydration of a hydrate', () => {
    // common textbook example: CuSO4·5H2O -> CuSO4 + 5 H2O (blue vitriol heated)
    expectBalanced('CuSO4·5H2O -> CuSO4 + H2O', [1, 1, 5], 'CuSO4·5H2O -> CuSO4 + 5 H2O');
    expectBalanced('CuSO4.5H2O -> CuSO4 + H2O', [1, 1, 5]);
    // common textbook example: gypsum to plaster of Paris, CaSO4·2H2O -> CaSO4·½H2O + 1½ H2O
    expectBalanced('CaSO4·2H2O -> CaSO4·½H2O + H2O', [2, 2, 3]);
    expect(balance('CaSO4·2H2O -> CaSO4·½H2O + 1½ H2O').status).toBe('already-balanced');
  });

  it('neutralisation and precipitation in ionic form are balanced as written', () => {
    // common textbook example: H+ + OH- -> H2O; Ag+ + Cl- -> AgCl; Ba2+ + SO4^2- -> BaSO4
    for (const t of ['H+ + OH- -> H2O', 'Ag^+ + Cl^- -> AgCl(s)', 'Ba²⁺ + SO₄²⁻ → BaSO₄', 'Na+(aq) + Cl-(aq) -> NaCl(s)']) {
      const r = balance(t);
      expect(r.status, t).toBe('already-balanced');
      expect(r.differences).toEqual([]);
    }
  });
});

describe('statuses', () => {
  it('already balanced as written', () => {
    // common textbook example: 2 H2 + O2 -> 2 H2O
    const r = balance('2 H2 + O2 -> 2 H2O');
    expect(r.status).toBe('already-balanced');
    expect(r.coefficients).toEqual([2, 1, 2]);
    expect(r.reducible).toBe(false);
    expect(r.differences).toEqual([]);
    expect(r.charge).toEqual({ left: 0, right: 0 });
  });

  it('balanced with a common factor is already balanced, and says it reduces', () => {
    const r = balance('4 H2 + 2 O2 -> 4 H2O');
    expect(r.status).toBe('already-balanced');
    expect(r.reducible).toBe(true);
    expect(r.coefficients).toEqual([2, 1, 2]);
    expect(r.message).toContain('2 H₂ + O₂ → 2 H₂O');
    expect(r.balancedText).toBe('2 H2 + O2 -> 2 H2O');
  });

  it('fractional coefficients as written', () => {
    // common textbook example (formation reaction of water): H2 + 1/2 O2 -> H2O
    for (const t of ['H2 + 1/2 O2 -> H2O', 'H2 + ½O2 -> H2O', 'H2 + 0.5 O2 -> H2O', 'H2 + 1/2O2 → H2O']) {
      const r = balance(t);
      expect(r.status, t).toBe('already-balanced');
      expect(r.coefficients).toEqual([2, 1, 2]);
      expect(r.reducible).toBe(true);
    }
    const p = parseEquation('H2 + 1/2 O2 -> H2O');
    expect(p.reactants[1].coefficient).toBe(0.5);
    expect(p.reactants[1].coefficientText).toBe('1/2');
    expect(p.reactants[0].coefficient).toBeNull();
    expect(parseEquation('1½ O2 -> O3').reactants[0].coefficient).toBe(1.5);
  });

  it('wrong written coefficients are rebalanced', () => {
    const r = balance('2 H2 + 2 O2 -> 2 H2O');
    expect(r.status).toBe('balanced');
    expect(r.coefficients).toEqual([2, 1, 2]);
    expect(r.differences).toEqual([{ element: 'O', left: 4, right: 2 }]);
  });

  it('ambiguous: two independent reactions in one', () => {
    const r = balance('H2 + O2 -> H2O + H2O2');
    expect(r.status).toBe('ambiguous');
    expect(r.nullity).toBe(2);
    expect(r.coefficients).toBeNull();
    expect(r.balancedText).toBeNull();
    expect(r.message).toMatch(/2 independent ways/);
    // Balanced as written wins: 3 H2 + 2 O2 -> 2 H2O + H2O2 counts 6 H and 4 O on each side.
    expect(balance('3 H2 + 2 O2 -> 2 H2O + H2O2').status).toBe('already-balanced');
  });

  it('impossible: no common elements', () => {
    const r = balance('NaCl -> KBr');
    expect(r.status).toBe('impossible');
    expect(r.message).toMatch(/Cl and Na appear only on the left/);
    expect(r.message).toMatch(/Br and K appear only on the right/);
  });

  it('impossible: a species on the wrong side, named', () => {
    // Zn + Cu2+ -> Zn2+ + Cu (common textbook example) with Zn2+ written among the reactants.
    const r = balance('Zn + Zn^2+ + Cu^2+ -> Cu');
    expect(r.status).toBe('impossible');
    // Messages write formulas in Unicode notation (Zn²⁺), whatever notation the equation was typed in.
    expect(r.message).toContain('Zn²⁺ would have to be on the other side');
    expect(r.message).toContain('Zn + Cu²⁺ → Zn²⁺ + Cu');
    // Water electrolysis with oxygen on the wrong side.
    expect(balance('H2O + O2 -> H2').message).toContain('O₂ would have to be on the other side: 2 H₂O → O₂ + 2 H₂');
  });

  it('impossible: a species that takes no part', () => {
    const r = balance('H2 + O2 + N2 -> H2O');
    expect(r.status).toBe('impossible');
    expect(r.message).toContain('N₂ left out');
  });

  it('impossible: charge cannot balance', () => {
    const r = balance('H^+ -> H2');
    expect(r.status).toBe('impossible');
    expect(unbalancedMessage(r)).toBe('Not balanced — left: 1 H; right: 2 H; charge +1 vs 0. No coefficients balance these species as placed.');
  });

  it('too large: coefficients beyond the safe integers', () => {
    // H_p + O_q + N_r -> HON needs lcm(p, q, r) of the product: 999983·999979·999961 ≈ 1e18.
    const t0 = performance.now();
    const r = balance('H999983 + O999979 + N999961 -> HON');
    expect(r.status).toBe('too-large');
    expect(r.coefficients).toBeNull();
    expect(r.message).toMatch(/exceed/);
    expect(performance.now() - t0).toBeLessThan(1000);
  });

  it('too large: more than 40 species', () => {
    const species = Array.from({ length: 40 }, (_, k) => `H${k + 2}`);
    const r = balance(`${species.join(' + ')} -> H2O`);
    expect(r.status).toBe('too-large');
    expect(r.message).toMatch(/41 species/);
  });

  it('invalid when the equation does not parse', () => {
    for (const t of ['H2 + O2', 'H2 + Xx -> H2O', '-> H2O', '2 H2 + + O2 -> H2O']) {
      const r = balance(t);
      expect(r.status, t).toBe('invalid');
      expect(r.coefficients).toBeNull();
    }
  });
});

describe('the + sign: separator or charge', () => {
  const read = (t: string) => {
    const p = parseEquation(t);
    return {
      ok: p.ok,
      reactants: p.reactants.map((s) => [s.text, s.charge] as const),
      products: p.products.map((s) => [s.text, s.charge] as const),
    };
  };

  it('Na+ + Cl- -> NaCl', () => {
    expect(read('Na+ + Cl- -> NaCl')).toEqual({
      ok: true,
      reactants: [
        ['Na+', 1],
        ['Cl-', -1],
      ],
      products: [['NaCl', 0]],
    });
    expect(balance('Na+ + Cl- -> NaCl').status).toBe('already-balanced');
  });

  it('2H+ + CO3^2- -> H2O + CO2', () => {
    // common textbook example: acid on a carbonate, 2 H+ + CO3^2- -> H2O + CO2
    const p = parseEquation('2H+ + CO3^2- -> H2O + CO2');
    expect(p.reactants.map((s) => [s.coefficient, s.formulaText, s.charge])).toEqual([
      [2, 'H+', 1],
      [null, 'CO3^2-', -2],
    ]);
    expect(balance('2H+ + CO3^2- -> H2O + CO2').status).toBe('already-balanced');
    expect(balance('H+ + CO3^2- -> H2O + CO2').coefficients).toEqual([2, 1, 1, 1]);
  });

  it('every charge notation next to separators', () => {
    expect(read('Fe^3+ + e^- -> Fe^2+').reactants).toEqual([
      ['Fe^3+', 3],
      ['e^-', -1],
    ]);
    expect(read('Fe3+ + e- -> Fe2+').reactants).toEqual([
      ['Fe3+', 3],
      ['e-', -1],
    ]);
    expect(read('Fe^{3+} + e⁻ -> Fe²⁺').reactants).toEqual([
      ['Fe^{3+}', 3],
      ['e⁻', -1],
    ]);
    expect(read('Fe^+3 + e- -> Fe^2+').reactants).toEqual([
      ['Fe^+3', 3],
      ['e-', -1],
    ]);
    expect(read('Ca++ + 2 Cl- -> CaCl2').reactants).toEqual([
      ['Ca++', 2],
      ['2 Cl-', -1],
    ]);
    expect(read('Ca+2 + 2 Cl- -> CaCl2').reactants).toEqual([
      ['Ca+2', 2],
      ['2 Cl-', -1],
    ]);
    expect(read('Na+(aq) + Cl-(aq) -> NaCl(s)').reactants).toEqual([
      ['Na+(aq)', 1],
      ['Cl-(aq)', -1],
    ]);
    expect(read('NH4^+ + OH^- -> NH3 + H2O').reactants).toEqual([
      ['NH4^+', 1],
      ['OH^-', -1],
    ]);
  });

  it('no spaces: a + followed by a species is a separator', () => {
    expect(read('H2+O2->H2O').reactants).toEqual([
      ['H2', 0],
      ['O2', 0],
    ]);
    expect(read('2H2+O2->2H2O').reactants).toEqual([
      ['2H2', 0],
      ['O2', 0],
    ]);
    expect(read('H2+2O2->H2O').reactants).toEqual([
      ['H2', 0],
      ['2O2', 0],
    ]);
    expect(read('Fe^3++e^-->Fe^2+').reactants).toEqual([
      ['Fe^3+', 3],
      ['e^-', -1],
    ]);
    expect(read('Na++Cl-->NaCl').reactants).toEqual([
      ['Na+', 1],
      ['Cl-', -1],
    ]);
    // A + with a species after a space is a separator, even when attached on the left.
    expect(read('H2+ O2 -> H2O').reactants).toEqual([
      ['H2', 0],
      ['O2', 0],
    ]);
  });

  it('a + with spaces on both sides is always a separator', () => {
    expect(read('H2 + O2 -> H2O').reactants).toEqual([
      ['H2', 0],
      ['O2', 0],
    ]);
    expect(read('H2 +O2 -> H2O').reactants).toEqual([
      ['H2', 0],
      ['O2', 0],
    ]);
  });
});

describe('offsets', () => {
  it('species, coefficients and formulas', () => {
    const t = '2H2 + O2 -> 2 H2O(l)';
    const p = parseEquation(t);
    expect(p.arrow).toEqual({ arrow: '->', start: 9, end: 11 });
    const [a, b] = p.reactants;
    const [c] = p.products;
    expect([a.start, a.end, a.coefficientStart, a.coefficientEnd, a.formulaStart, a.formulaEnd]).toEqual([0, 3, 0, 1, 1, 3]);
    expect([b.start, b.end, b.coefficientStart, b.formulaStart, b.formulaEnd]).toEqual([6, 8, undefined, 6, 8]);
    expect([c.start, c.end, c.coefficientStart, c.coefficientEnd, c.formulaStart, c.formulaEnd]).toEqual([12, 20, 12, 13, 14, 20]);
    for (const s of [a, b, c]) {
      expect(t.slice(s.start, s.end)).toBe(s.text);
      expect(t.slice(s.formulaStart, s.formulaEnd)).toBe(s.formulaText);
    }
    expect(c.formulaText).toBe('H2O(l)');
  });

  it('UTF-16 offsets with Unicode arrows and superscripts', () => {
    const t = 'SO₄²⁻ + Ba²⁺ ⟶ BaSO₄';
    const p = parseEquation(t);
    expect(p.arrow).toEqual({ arrow: '⟶', start: 13, end: 14 });
    expect(p.reactants.map((s) => [s.start, s.end])).toEqual([
      [0, 5],
      [8, 12],
    ]);
    expect(p.products.map((s) => [s.start, s.end])).toEqual([[15, 20]]);
  });

  it('formula diagnostics are shifted to the equation', () => {
    const t = 'H2 + 2 Xx2 -> H2O';
    const p = parseEquation(t);
    expect(p.ok).toBe(false);
    const d = p.diagnostics.find((x) => x.code === 'unknown-element');
    expect(d).toMatchObject({ severity: 'error', start: 7, end: 9 });
    expect(t.slice(d!.start, d!.end)).toBe('Xx');
    const m = parseEquation('NaCl + Ca(OH -> X').diagnostics.find((x) => x.code === 'malformed-formula');
    expect(m).toMatchObject({ severity: 'error', start: 9, end: 10 });
    expect(parseEquation('nacl -> NaCl').diagnostics[0]).toMatchObject({ code: 'unknown-element', start: 0, end: 4 });
  });

  it('empty species, empty sides and arrows', () => {
    expect(parseEquation('H2 + + O2 -> H2O').diagnostics).toEqual([expect.objectContaining({ code: 'empty-species', start: 3, end: 6 })]);
    expect(parseEquation('H2 + + + O2 -> H2O').diagnostics).toEqual([expect.objectContaining({ code: 'empty-species', start: 3, end: 8 })]);
    expect(parseEquation('+ H2 -> H2').diagnostics).toEqual([expect.objectContaining({ code: 'empty-species', start: 0, end: 1 })]);
    expect(parseEquation('H2 + -> H2').diagnostics).toEqual([expect.objectContaining({ code: 'empty-species', start: 3, end: 4 })]);
    expect(parseEquation(' -> H2O').diagnostics).toEqual([expect.objectContaining({ code: 'empty-side', start: 1, end: 3 })]);
    expect(parseEquation('H2 -> H2 -> H2').diagnostics).toEqual([expect.objectContaining({ code: 'multiple-arrows', start: 9, end: 11 })]);
    expect(parseEquation('H2 + O2').diagnostics).toEqual([expect.objectContaining({ code: 'missing-arrow', start: 0, end: 7 })]);
    expect(parseEquation('2 -> H2').diagnostics).toEqual([expect.objectContaining({ code: 'missing-formula', start: 0, end: 1 })]);
    expect(parseEquation('0 H2 -> H2').diagnostics).toEqual([expect.objectContaining({ code: 'bad-coefficient', start: 0, end: 1 })]);
    expect(parseEquation('1/0 H2 -> H2').diagnostics).toEqual([expect.objectContaining({ code: 'bad-coefficient', start: 0, end: 3 })]);
    expect(parseEquation('2 3H2 -> H2').diagnostics).toEqual([expect.objectContaining({ code: 'malformed-formula', start: 2, end: 3 })]);
  });
});

describe('garbage never throws', () => {
  it.each(
    [
      '',
      ' ',
      '->',
      '-> ->',
      '=>=>',
      '<=>',
      '+',
      '+ -> +',
      '2 -> 3',
      'H2 + O2',
      '^^^ -> ^',
      'e -> e',
      '½ -> ½',
      '((((((((((((((((((((((((((((((((((((((((H -> H',
      `${'('.repeat(5000)} -> H2`,
      `${'+'.repeat(20000)} -> H`,
      `${'-> '.repeat(5000)}`,
      'H2 + O2 -> H2O \u0000',
      '\ud83d -> \udc00',
      '99999999999999999999999999 H2 -> H2',
      'H1000001 -> H',
      `${'H2 + '.repeat(5000)}H2 -> H2O`,
    ].map((t) => [JSON.stringify(t.length > 40 ? `${t.slice(0, 40)}…` : t), t]),
  )('%s', (_, t) => {
    const a = analyseReaction(t);
    expect(a.balance.status).toBeTypeOf('string');
    for (const d of a.diagnostics) {
      expect(d.start).toBeGreaterThanOrEqual(0);
      expect(d.end).toBeLessThanOrEqual(t.length);
      expect(d.start).toBeLessThanOrEqual(d.end);
    }
  });

  it('clear messages for no arrow, two arrows and empty sides', () => {
    expect(analyseReaction('H2 + O2').diagnostics.map((d) => d.code)).toEqual(['missing-arrow']);
    expect(
      analyseReaction('-> ->')
        .diagnostics.map((d) => d.code)
        .sort(),
    ).toEqual(['empty-side', 'empty-side', 'multiple-arrows']);
    expect(analyseReaction('H2 ->').diagnostics.map((d) => [d.code, d.message])).toEqual([
      ['empty-side', 'Nothing after the arrow: the equation has no products.'],
    ]);
  });
});

describe('balanceCheck and messages', () => {
  it('per-element totals', () => {
    const p = parseEquation('C3H8 + O2 -> CO2 + H2O');
    expect(balanceCheck(p, [1, 5, 3, 4])).toEqual({
      elements: [
        { element: 'C', left: 3, right: 3 },
        { element: 'H', left: 8, right: 8 },
        { element: 'O', left: 10, right: 10 },
      ],
      charge: { left: 0, right: 0 },
      balanced: true,
    });
    expect(balanceCheck(p, [1, 1, 1, 1]).balanced).toBe(false);
    const q = parseEquation('MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O');
    expect(balanceCheck(q, [1, 5, 8, 1, 5, 4]).charge).toEqual({ left: 17, right: 17 });
  });

  it('the unbalanced message names what differs and gives the balanced form', () => {
    expect(unbalancedMessage(balance('H2 + O2 -> H2O'))).toBe('Not balanced — left: 2 O; right: 1 O. Balanced: 2 H₂ + O₂ → 2 H₂O');
    expect(unbalancedMessage(balance('Fe^3+ + Cu -> Fe^2+ + Cu^2+'))).toBe('Not balanced — charge +3 vs +4. Balanced: 2 Fe³⁺ + Cu → 2 Fe²⁺ + Cu²⁺');
  });
});

describe('analyseReaction', () => {
  it('warns about an unbalanced equation, over the whole text, with the balanced form', () => {
    clearReactionCache();
    const t = 'Fe + O2 -> Fe2O3';
    const a = analyseReaction(t);
    expect(a.ok).toBe(true);
    expect(a.diagnostics).toEqual([
      {
        code: 'unbalanced-equation',
        severity: 'warning',
        start: 0,
        end: t.length,
        // The message in Unicode notation; the fix (data.balanced) in the notation typed, for the edit.
        message: 'Not balanced — left: 1 Fe, 2 O; right: 2 Fe, 3 O. Balanced: 4 Fe + 3 O₂ → 2 Fe₂O₃',
        data: { balanced: '4 Fe + 3 O2 -> 2 Fe2O3', display: '4 Fe + 3 O₂ → 2 Fe₂O₃', coefficients: [4, 3, 2], status: 'balanced' },
      },
    ]);
    expect(analyseReaction(t)).toBe(a);
  });

  it('no findings for a balanced equation', () => {
    expect(analyseReaction('2 H2 + O2 -> 2 H2O').diagnostics).toEqual([]);
  });

  it('explains ambiguous and impossible equations', () => {
    const amb = analyseReaction('H2 + O2 -> H2O + H2O2');
    expect(amb.diagnostics.map((d) => [d.code, d.severity])).toEqual([
      ['unbalanced-equation', 'warning'],
      ['ambiguous-equation', 'information'],
    ]);
    expect(amb.diagnostics[0].data).toEqual({ balanced: null, display: null, coefficients: null, status: 'ambiguous' });
    const imp = analyseReaction('NaCl -> KBr');
    expect(imp.diagnostics.map((d) => [d.code, d.severity])).toEqual([
      ['unbalanced-equation', 'warning'],
      ['impossible-equation', 'information'],
    ]);
    expect(imp.diagnostics[1].message).toMatch(/only on the left/);
  });

  it('parse errors: no balance findings', () => {
    const a = analyseReaction('H2 + Qq -> H2O');
    expect(a.ok).toBe(false);
    expect(a.balance.status).toBe('invalid');
    expect(a.diagnostics.map((d) => d.code)).toEqual(['unknown-element']);
  });
});
