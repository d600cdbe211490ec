/**
 * Charge balance and oxidation states, measured on a set of real compounds (none may be flagged: a false
 * warning on a real compound is the worse error) and of mis-written formulas (all should be flagged).
 * The rates are printed so that the issue note can report them.
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { MISWRITTEN, REAL } from '../fixtures/charge-sets';

const flagged = (f: string) => {
  const a = analyseFormula(f);
  expect(a.ok, `${f} should parse: ${a.diagnostics.map((d) => d.message).join('; ')}`).toBe(true);
  return !a.charges!.balanced || a.diagnostics.some((d) => d.code === 'charge-imbalance');
};

describe('charge balance on the test set', () => {
  const real = Object.values(REAL).flat();
  it(`has at least 150 real compounds (${real.length}) and 40 mis-written formulas (${MISWRITTEN.length})`, () => {
    expect(real.length).toBeGreaterThanOrEqual(150);
    expect(MISWRITTEN.length).toBeGreaterThanOrEqual(40);
  });

  it('flags no real compound (false-warning rate) and misses no mis-written one (miss rate)', () => {
    const falseWarnings = real.filter(flagged);
    const misses = MISWRITTEN.filter((f) => !flagged(f));
    console.log(
      `charge balance: false warnings ${falseWarnings.length}/${real.length} (${((100 * falseWarnings.length) / real.length).toFixed(1)} %), misses ${misses.length}/${MISWRITTEN.length} (${((100 * misses.length) / MISWRITTEN.length).toFixed(1)} %)`,
    );
    expect(falseWarnings).toEqual([]);
    expect(misses).toEqual([]);
  });

  for (const [group, list] of Object.entries(REAL)) {
    it(`assigns oxidation states that sum to the charge: ${group}`, () => {
      for (const f of list) {
        const a = analyseFormula(f);
        const ox = a.charges!.oxidationStates;
        if (!ox) continue;
        // An element the formula cannot determine ((NH4)2Sx, C2H5NO2) is absent, and the card says why.
        if (a.charges!.undetermined.length) {
          for (const u of a.charges!.undetermined) expect(ox[u.element], `${f} ${u.element}`).toBeUndefined();
          continue;
        }
        const sum = Object.entries(a.atoms).reduce((s, [el, n]) => s + n * (ox[el] ?? NaN), 0);
        expect(sum, f).toBeCloseTo(a.charge, 2);
        // The per-site states sum to the charge too.
        const bySite = a.charges!.sites!.reduce((s, x) => s + x.count * x.state, 0);
        expect(bySite, f).toBeCloseTo(a.charge, 2);
      }
    });
  }
});

describe('oxidation states (common textbook values)', () => {
  it.each([
    ['KMnO4', { K: 1, Mn: 7, O: -2 }],
    ['K2Cr2O7', { K: 1, Cr: 6, O: -2 }],
    ['H2O2', { H: 1, O: -1 }],
    ['Na2O2', { Na: 1, O: -1 }],
    ['KO2', { K: 1, O: -0.5 }],
    ['NaH', { Na: 1, H: -1 }],
    ['Mg3N2', { Mg: 2, N: -3 }],
    ['CaC2', { Ca: 2, C: -1 }],
    ['FeS2', { Fe: 2, S: -1 }],
    ['Na2S2O3', { Na: 1, S: 2, O: -2 }],
    ['NH4NO3', { N: 1, H: 1, O: -2 }],
    ['C6H12O6', { C: 0, H: 1, O: -2 }],
    ['CH4', { C: -4, H: 1 }],
    ['OF2', { O: 2, F: -1 }],
    ['SF6', { S: 6, F: -1 }],
    ['K4[Fe(CN)6]', { K: 1, Fe: 2, C: 2, N: -3 }],
    ['[Co(NH3)6]Cl3', { Co: 3, N: -3, H: 1, Cl: -1 }],
    ['Fe(III)', { Fe: 0 }],
  ])('%s', (f, expected) => {
    const ox = analyseFormula(f).charges!.oxidationStates!;
    for (const [el, q] of Object.entries(expected)) expect(ox[el], `${f} ${el}`).toBeCloseTo(q, 3);
  });

  it('gives mixed-valence oxides an average (contract: Fe in Fe3O4 ≈ 2.667) and says which ions', () => {
    const a = analyseFormula('Fe3O4');
    expect(a.charges!.oxidationStates!.Fe).toBeCloseTo(8 / 3, 3);
    expect(a.charges!.message).toContain('Fe²⁺ + 2 Fe³⁺');
    expect(analyseFormula('Pb3O4').charges!.message).toContain('2 Pb²⁺ + Pb⁴⁺');
  });

  it('gives a non-stoichiometric oxide the fractional average that balances', () => {
    expect(analyseFormula('Fe0.95O').charges!.oxidationStates!.Fe).toBeCloseTo(2 / 0.95, 3);
    expect(analyseFormula('La0.8Sr0.2MnO3').charges!.oxidationStates!.Mn).toBeCloseTo(3.2, 3);
  });
});

describe('imbalance messages and suggestions', () => {
  it.each([
    ['CaNO3', 'Ca²⁺ with one NO₃⁻ leaves +1', 'Ca(NO3)2'],
    ['Al(OH)2', 'Al³⁺ with two OH⁻ leaves +1', 'Al(OH)3'],
    ['NH4SO4', 'NH₄⁺ with one SO₄²⁻ leaves −1', '(NH4)2SO4'],
    ['AlO', 'Al³⁺ with one O²⁻ leaves +1', 'Al2O3'],
    ['Ca3(PO4)3', 'Three Ca²⁺ with three PO₄³⁻ leave −3', 'Ca3(PO4)2'],
    ['CaNO3·4H2O', 'Ca²⁺ with one NO₃⁻ leaves +1', 'Ca(NO3)2·4H2O'],
    ['SO4^3-', 'charge written is 3−', 'SO4^2-'],
    ['SO₄³⁻', 'charge written is 3−', 'SO₄²⁻'],
  ])('%s', (f, words, best) => {
    const a = analyseFormula(f);
    expect(a.charges!.balanced).toBe(false);
    expect(a.charges!.message).toContain(words);
    expect(a.charges!.suggestions[0]).toBe(best);
    // The suggestion itself is balanced.
    expect(analyseFormula(best).charges!.balanced).toBe(true);
  });

  it('puts the warning on the part that is wrong, not on the water of a hydrate', () => {
    const d = analyseFormula('CaNO3·4H2O').diagnostics.find((x) => x.code === 'charge-imbalance')!;
    expect([d.start, d.end]).toEqual([0, 5]);
    expect(d.severity).toBe('warning');
  });

  it('lists the usual states of a metal as alternatives, most common first', () => {
    expect(analyseFormula('FeCl').charges!.suggestions.slice(0, 2)).toEqual(['FeCl2', 'FeCl3']);
  });
});
