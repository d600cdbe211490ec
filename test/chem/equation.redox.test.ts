/**
 * Redox equations as titrations write them. Where atoms and charge alone leave more than one independent
 * solution, the balancer uses half-reactions (chem/equation/redox.ts) and says so; where they leave one, the
 * answer is unchanged.
 *
 * Expected coefficients: the standard stoichiometry of these titrations (Vogel's Textbook of Quantitative
 * Chemical Analysis, the chapters on permanganate, dichromate and iodine titrations) — FROM MEMORY; each
 * is re-checked here by counting atoms and charge (`countsBalance`).
 */
import { describe, expect, it } from 'vitest';
import { analyseReaction, balanceEquation, parseEquation } from '../../server/src/chem/equation';
import { reactionMarkdown } from '../../server/src/service/hover';
import { countsBalance } from '../fixtures/equation';

function expectTitration(text: string, coefficients: number[], method: 'unique' | 'half-reactions') {
  const parsed = parseEquation(text);
  expect(parsed.ok, text).toBe(true);
  expect(countsBalance(parsed, coefficients), `the expected coefficients of ${text} balance`).toBe(true);
  const r = balanceEquation(parsed);
  expect(r.status, `${text}: ${r.message}`).toBe('balanced');
  expect(r.coefficients, text).toEqual(coefficients);
  expect(r.method, text).toBe(method);
  if (method === 'half-reactions') {
    expect(r.nullity, text).toBeGreaterThanOrEqual(2);
    expect(r.note, text).toMatch(/Other combinations of these species also conserve atoms and charge/);
  } else expect(r.nullity, text).toBe(1);
  // Written back, it reads as balanced.
  expect(balanceEquation(parseEquation(r.balancedText!)).status).toBe('already-balanced');
  return r;
}

describe('titrations whose species allow more than one balance: half-reactions decide', () => {
  it('permanganate and hydrogen peroxide in acid: 2, 5, 6 → 2, 5, 8 (Vogel, from memory)', () => {
    const r = expectTitration('MnO4^- + H2O2 + H^+ -> Mn^2+ + O2 + H2O', [2, 5, 6, 2, 5, 8], 'half-reactions');
    expect(r.balancedText).toBe('2 MnO4^- + 5 H2O2 + 6 H^+ -> 2 Mn^2+ + 5 O2 + 8 H2O');
    // The oxygen of O2 comes from the peroxide (O −1 → 0); permanganate's and water's oxygen keep −2.
    expect(r.note).toContain('Mn +7 → +2, O −1 → 0');
  });
  it('the same in molecular form with sulfuric acid: 2 KMnO4 + 5 H2O2 + 3 H2SO4 → K2SO4 + 2 MnSO4 + 5 O2 + 8 H2O (Vogel, from memory)', () => {
    expectTitration('KMnO4 + H2O2 + H2SO4 -> K2SO4 + MnSO4 + O2 + H2O', [2, 5, 3, 1, 2, 5, 8], 'half-reactions');
  });
  it('dichromate and hydrogen peroxide in acid: Cr2O7^2- + 3 H2O2 + 8 H+ → 2 Cr3+ + 3 O2 + 7 H2O (common textbook example, from memory)', () => {
    expectTitration('Cr2O7^2- + H2O2 + H^+ -> Cr^3+ + O2 + H2O', [1, 3, 8, 2, 3, 7], 'half-reactions');
  });
});

describe('titrations the algebra already decides keep their answer', () => {
  it('permanganate and oxalate: 2 MnO4- + 5 C2O4^2- + 16 H+ → 2 Mn2+ + 10 CO2 + 8 H2O (Vogel, from memory)', () => {
    expectTitration('MnO4^- + C2O4^2- + H^+ -> Mn^2+ + CO2 + H2O', [2, 5, 16, 2, 10, 8], 'unique');
    expectTitration('KMnO4 + H2C2O4 + H2SO4 -> K2SO4 + MnSO4 + CO2 + H2O', [2, 5, 3, 1, 2, 10, 8], 'unique');
  });
  it('permanganate and iron(II): MnO4- + 5 Fe2+ + 8 H+ → Mn2+ + 5 Fe3+ + 4 H2O (Vogel, from memory)', () => {
    expectTitration('MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O', [1, 5, 8, 1, 5, 4], 'unique');
  });
  it('dichromate and iron(II): Cr2O7^2- + 6 Fe2+ + 14 H+ → 2 Cr3+ + 6 Fe3+ + 7 H2O (Vogel, from memory)', () => {
    expectTitration('Cr2O7^2- + Fe^2+ + H^+ -> Cr^3+ + Fe^3+ + H2O', [1, 6, 14, 2, 6, 7], 'unique');
    expectTitration('K2Cr2O7 + FeSO4 + H2SO4 -> K2SO4 + Cr2(SO4)3 + Fe2(SO4)3 + H2O', [1, 6, 7, 1, 1, 3, 7], 'unique');
  });
  it('dichromate and iodide: Cr2O7^2- + 6 I- + 14 H+ → 2 Cr3+ + 3 I2 + 7 H2O (Vogel, from memory)', () => {
    expectTitration('Cr2O7^2- + I^- + H^+ -> Cr^3+ + I2 + H2O', [1, 6, 14, 2, 3, 7], 'unique');
  });
  it('thiosulfate and iodine: 2 S2O3^2- + I2 → S4O6^2- + 2 I- (Vogel, from memory)', () => {
    expectTitration('S2O3^2- + I2 -> S4O6^2- + I^-', [2, 1, 1, 2], 'unique');
  });
  it('iodate and iodide: IO3- + 5 I- + 6 H+ → 3 I2 + 3 H2O; peroxide and iodide: H2O2 + 2 I- + 2 H+ → I2 + 2 H2O (Vogel, from memory)', () => {
    expectTitration('IO3^- + I^- + H^+ -> I2 + H2O', [1, 5, 6, 3, 3], 'unique');
    expectTitration('H2O2 + I^- + H^+ -> I2 + H2O', [1, 2, 2, 1, 2], 'unique');
  });
});

describe('what the half-reactions cannot decide stays ambiguous', () => {
  it('two oxidation products of one element (H2O and H2O2 from O2)', () => {
    const r = balanceEquation(parseEquation('H2 + O2 -> H2O + H2O2'));
    expect(r.status).toBe('ambiguous');
    expect(r.coefficients).toBeNull();
  });
  it('two fuels burning at once (common practice: two independent reactions)', () => {
    expect(balanceEquation(parseEquation('CH4 + C3H8 + O2 -> CO2 + H2O')).status).toBe('ambiguous');
  });
  it('a non-redox mixture (no element changes state)', () => {
    // NaOH + HCl and Na2CO3 + HCl at once: acid–base only, nothing for half-reactions to decide.
    expect(balanceEquation(parseEquation('NaOH + Na2CO3 + HCl -> NaCl + H2O + CO2')).status).toBe('ambiguous');
  });
});

describe('what the editor shows', () => {
  it('the warning carries the balanced form and says it is by half-reactions; no ambiguity finding', () => {
    const a = analyseReaction('MnO4^- + H2O2 + H^+ -> Mn^2+ + O2 + H2O');
    expect(a.diagnostics.map((d) => d.code)).toEqual(['unbalanced-equation']);
    expect(a.diagnostics[0].data).toMatchObject({ status: 'balanced', coefficients: [2, 5, 6, 2, 5, 8] });
    expect(a.diagnostics[0].message).toContain(
      'Balanced: 2 MnO₄⁻ + 5 H₂O₂ + 6 H⁺ → 2 Mn²⁺ + 5 O₂ + 8 H₂O (by half-reactions; other combinations also conserve atoms and charge)',
    );
    const md = reactionMarkdown(a);
    expect(md).toContain('2 MnO4^- + 5 H2O2 + 6 H^+ -> 2 Mn^2+ + 5 O2 + 8 H2O');
    expect(md).toContain('Balanced by half-reactions');
  });
});
