/**
 * No lattice energy where there is no ionic lattice: molecular oxides and halides.
 *
 * Sources: melting and boiling points, CRC Handbook of Chemistry and Physics, "Physical Constants of
 * Inorganic Compounds" — FROM MEMORY (data/reference/molecular-substances.csv); the rule, Fajans' rules as
 * commonly applied to the oxides and halides of the metals (common practice; see lattice/molecular.ts).
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { MOLECULAR_SUBSTANCES } from '../../server/src/chem/data/thermo';
import { covalentByCharge, MOLECULAR_FROM_CHARGE, stateAt } from '../../server/src/chem/lattice/molecular';
import { cardJson, cardText } from '../../server/src/service/card';
import { formulaCardMarkdown } from '../../server/src/service/hover';
import { DEFAULT_SETTINGS } from '../../server/src/service/settings';

describe('molecular oxides and halides get no lattice energy, and the card says why', () => {
  // State at 25 °C from CRC melting and boiling points (from memory): OsO4 mp 41 °C; Mn2O7 mp 6 °C;
  // WF6 bp 17 °C; TiCl4, SnCl4, CrO2Cl2, VOCl3, SiCl4 liquids; PCl5 sublimes at 160 °C.
  const cases: Array<[string, 'solid' | 'liquid' | 'gas']> = [
    ['OsO4', 'solid'],
    ['Mn2O7', 'liquid'],
    ['WF6', 'gas'],
    ['TiCl4', 'liquid'],
    ['SnCl4', 'liquid'],
    ['CrO2Cl2', 'liquid'],
    ['VOCl3', 'liquid'],
    ['SiCl4', 'liquid'],
    ['PCl5', 'solid'],
    ['UF6', 'solid'],
    ['MoF6', 'liquid'],
  ];
  for (const [f, state] of cases) {
    it(`${f}: no lattice energy; a molecular substance, ${state} at 25 °C`, () => {
      const a = analyseFormula(f);
      expect(a.lattice, f).toBeNull();
      expect(a.latticeWithheld?.reason).toBe('molecular');
      expect(a.latticeWithheld?.stateAt25C).toBe(state);
      expect(a.latticeWithheld?.text).toMatch(new RegExp(`^No lattice energy: ${f} is a molecular substance, not an ionic solid \\(a ${state} at 25 °C`));
      const j = cardJson(a);
      expect(j.latticeEnergy).toBeNull();
      expect(j.latticeEnergyNote).toMatchObject({ reason: 'molecular', stateAt25C: state });
      expect(cardText(a)).toMatch(new RegExp(`lattice energy  none — ${f} is a molecular substance`));
      expect(formulaCardMarkdown(a, DEFAULT_SETTINGS)).toContain(`is a molecular substance, not an ionic solid (a ${state} at 25 °C`);
    });
  }

  it('the rule alone, for substances not in the table (Fajans: high formal charge with oxide or halide)', () => {
    for (const [f, charge] of [
      ['Re2O7', 7],
      ['UF5', 5],
      ['VBr4', 4],
      ['CrF6', 6],
    ] as const) {
      expect(MOLECULAR_SUBSTANCES.has(f)).toBe(false);
      const a = analyseFormula(f);
      expect(a.lattice, f).toBeNull();
      expect(a.latticeWithheld?.reason, f).toBe('covalent');
      expect(a.latticeWithheld?.text, f).toContain(`at +${charge}`);
      expect(a.latticeWithheld?.text, f).toContain("Fajans' rules");
    }
  });

  it('the table and the rule agree: every tabulated metal compound at or above the threshold is molecular or polymeric', () => {
    let checked = 0;
    for (const [f, m] of MOLECULAR_SUBSTANCES) {
      const a = analyseFormula(f);
      const rule = covalentByCharge(a.charges);
      if (rule) {
        checked++;
        expect(['molecular', 'polymeric']).toContain(m.kind);
        expect(rule.charge).toBeGreaterThanOrEqual(MOLECULAR_FROM_CHARGE[rule.anion]);
      }
      // Every row gives a state at 25 °C.
      expect(stateAt(m), f).toBeDefined();
    }
    expect(checked).toBeGreaterThan(20);
  });

  it('covalent polymeric solids are named so (ZrCl4, chains; sublimes 331 °C per the CRC, from memory)', () => {
    const a = analyseFormula('ZrCl4');
    expect(a.lattice).toBeNull();
    expect(a.latticeWithheld?.reason).toBe('polymeric');
    expect(a.latticeWithheld?.text).toContain('sublimes at 331 °C');
  });

  it('a hydrate of a molecular substance: the note says it is for the substance without its adducts', () => {
    const a = analyseFormula('SnCl4·5H2O');
    expect(a.lattice).toBeNull();
    expect(a.latticeWithheld?.text).toMatch(/^No lattice energy \(for the substance without its adducts\): SnCl4 is a molecular substance/);
  });
});

describe('ionic solids keep their lattice energy', () => {
  // Ionic (or extended ionic-covalent) solids with high melting points, CRC (from memory): TiO2 1843 °C,
  // ZrO2 2710 °C, UF4 1036 °C, ThCl4 770 °C, ZrF4 932 °C (sublimes), MoO3 795 °C, AlF3,
  // MgCl2 714 °C, FeCl3 (layer lattice) 307 °C, AlCl3 (layer lattice); the large Th⁴⁺ and U⁴⁺ keep ionic
  // tetrachlorides (UCl4 590 °C).
  for (const f of ['NaCl', 'MgCl2', 'TiO2', 'ZrO2', 'UF4', 'ThCl4', 'UCl4', 'ZrF4', 'MoO3', 'AlF3', 'FeCl3', 'AlCl3', 'Fe2O3', 'CuCl', 'KNO3']) {
    it(f, () => {
      const a = analyseFormula(f);
      expect(a.lattice, f).not.toBeNull();
      expect(a.latticeWithheld, f).toBeNull();
      expect(cardJson(a).latticeEnergyNote).toBeNull();
    });
  }
});
