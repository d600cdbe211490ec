/**
 * Bonding: Pauling electronegativities checked against the npm package `periodic-table` (0.0.8), and the
 * bond type and ionic character against rules of thumb of the trade (common practice).
 */
import { describe, expect, it } from 'vitest';
import { symbols } from 'periodic-table';
import { analyseFormula } from '../../server/src/chem/analyse';
import { ELEMENTS } from '../../server/src/chem/data/elements';
import { bondType, percentIonic } from '../../server/src/chem/bond';
import { DEFAULT_CHEM_SETTINGS } from '../../server/src/chem/settings';

describe('Pauling electronegativities', () => {
  it('agree with the npm package periodic-table, apart from the documented differences', () => {
    const differences: string[] = [];
    for (const e of ELEMENTS) {
      const p = symbols[e.symbol];
      const theirs = p && p.electronegativity !== '' && p.electronegativity !== null ? Number(p.electronegativity) : null;
      const same = e.en === theirs || (e.en !== null && theirs !== null && Math.abs(e.en - theirs) <= 0.01);
      if (!same) differences.push(e.symbol);
    }
    // Known: periodic-table gives no value for Kr, Xe, Rn (our data, from pymatgen, has 3.0, 2.6, 2.2);
    // Tb 1.1 vs 1.2 and Tl 1.62 vs 2.04 are the oxidation-state-dependent spreads noted in data/reference/README.md.
    expect(differences).toEqual(['Kr', 'Xe', 'Tb', 'Tl', 'Rn']);
  });
});

const bond = (f: string) => analyseFormula(f).bond!;

describe('bond type (common practice: < 0.4 nonpolar covalent, 0.4–1.8 polar covalent, > 1.8 ionic)', () => {
  it('NaCl is ionic, ΔEN about 2.1 (rounded values 3.0 and 0.9; 3.16 − 0.93 = 2.23 with Pauling values)', () => {
    const b = bond('NaCl');
    expect(b.type).toBe('ionic');
    expect(b.pair).toEqual(['Na', 'Cl']);
    expect(b.deltaEN).toBeGreaterThan(1.9);
    expect(b.deltaEN).toBeLessThan(2.4);
  });
  it('HCl and HF are polar covalent; H2 and Cl2 are nonpolar', () => {
    expect(bond('HCl').type).toBe('polar covalent');
    expect(bond('HF').type).toBe('polar covalent');
    expect(bond('H2').type).toBe('nonpolar covalent');
    expect(bond('Cl2').deltaEN).toBe(0);
  });
  it('C–H bonds count as nonpolar (CH4), O–H as polar (H2O), and a salt of an oxoanion is read cation–oxygen', () => {
    expect(bond('CH4').type).toBe('nonpolar covalent');
    expect(bond('H2O').type).toBe('polar covalent');
    expect(bond('Na2SO4').pair).toEqual(['Na', 'O']);
    expect(bond('Na2SO4').type).toBe('ionic');
    expect(bond('CH3Cl').pair).toEqual(['C', 'Cl']);
  });
  it('metals and alloys get no bond type; elements are nonpolar', () => {
    expect(analyseFormula('Fe').bond).toBeNull();
    expect(analyseFormula('Ni3Al').bond).toBeNull();
    expect(bond('S8').type).toBe('nonpolar covalent');
  });
  it("uses Pauling's relation for percent ionic character: 1 − exp(−ΔEN²/4)", () => {
    // Pauling, The Nature of the Chemical Bond (3rd ed., 1960): ΔEN 1.7 ≈ 51 % ionic, ΔEN 1 ≈ 22 %.
    expect(percentIonic(1.7)).toBeCloseTo(51.4, 0);
    expect(percentIonic(1)).toBeCloseTo(22.1, 0);
    expect(bond('NaCl').percentIonic).toBeCloseTo(100 * (1 - Math.exp(-(2.23 ** 2) / 4)), 1);
  });
  it('takes its thresholds from settings, since texts differ', () => {
    expect(bondType(1.78, DEFAULT_CHEM_SETTINGS)).toBe('polar covalent');
    expect(bondType(1.78, { ...DEFAULT_CHEM_SETTINGS, ionicAbove: 1.7 })).toBe('ionic');
    expect(bondType(0.35, { ...DEFAULT_CHEM_SETTINGS, nonpolarBelow: 0.3 })).toBe('polar covalent');
  });
});
