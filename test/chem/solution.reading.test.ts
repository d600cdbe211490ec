/**
 * Salts read into the solution model's components whatever way they are written (chem/solution/reading.ts),
 * and the tables behind them (chem/solution/tables/): each row's charge agrees with its reaction, every row
 * names a source, and a sample of values is checked against the named source.
 *
 * Readings are standard chemistry (what a salt gives in water); borax: B4O7²⁻ + 7 H2O → 2 B(OH)3 + 2 B(OH)4⁻
 * (Greenwood & Earnshaw, Chemistry of the Elements, boron chapter; from memory).
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { COMPONENTS, FORMED_SPECIES, labelCharge, MODEL_SOLIDS, SPECIES } from '../../server/src/chem/solution/model';
import { readIngredient } from '../../server/src/chem/solution/reading';
import { ACID_SYSTEMS, WATER } from '../../server/src/chem/solution/tables/acids';
import { COMPLEXES } from '../../server/src/chem/solution/tables/complexes';
import { SOLIDS } from '../../server/src/chem/solution/tables/solids';
import { SOURCES } from '../../server/src/chem/solution/tables/sources';

/** What a formula gives, as `count label` sorted. */
const gives = (f: string) =>
  readIngredient(analyseFormula(f))
    .shares.map((s) => `${s.count} ${s.label}`)
    .sort();

describe('a salt read into components, whatever way it is written', () => {
  it('sodium acetate as CH3COONa, NaCH3COO, NaC2H3O2 and C2H3NaO2 (Hill)', () => {
    const want = ['1 CH3COO^-', '1 Na^+'];
    for (const f of ['CH3COONa', 'NaCH3COO', 'NaC2H3O2', 'C2H3NaO2']) expect(gives(f), f).toEqual(want);
  });

  it('potassium hydrogen phthalate KHC8H4O4: K⁺, phthalate and one proton (hydrogen phthalate)', () => {
    expect(gives('KHC8H4O4')).toEqual(['1 H^+', '1 K^+', '1 Phth^2-']);
    expect(readIngredient(analyseFormula('KHC8H4O4')).as).toEqual(['K^+', 'HPhth^-']);
  });

  it('disodium EDTA dihydrate C10H14N2Na2O8·2H2O: 2 Na⁺ and H₂EDTA²⁻ (the hydrate water is solvent)', () => {
    expect(gives('C10H14N2Na2O8·2H2O')).toEqual(['1 EDTA^4-', '2 H^+', '2 Na^+']);
    expect(gives('Na2H2(edta)')).toEqual(gives('C10H14N2Na2O8'));
  });

  it('borax Na2B4O7·10H2O gives two boric acids and two borates: 4 B(OH)₄⁻ basis units and 2 protons', () => {
    expect(gives('Na2B4O7·10H2O')).toEqual(['2 H^+', '2 Na^+', '4 B(OH)4^-']);
  });

  it('amine salts and ammonium salts: TRIS·HCl, NH4Cl, (NH4)2SO4, NH4H2PO4, ammonium acetate', () => {
    expect(gives('C4H11NO3·HCl')).toEqual(['1 Cl^-', '1 H^+', '1 TRIS']);
    expect(gives('NH4Cl')).toEqual(['1 Cl^-', '1 H^+', '1 NH3']);
    expect(gives('(NH4)2SO4')).toEqual(['1 SO4^2-', '2 H^+', '2 NH3']);
    expect(gives('NH4H2PO4')).toEqual(['1 NH3', '1 PO4^3-', '3 H^+']);
    expect(gives('CH3COONH4')).toEqual(['1 CH3COO^-', '1 H^+', '1 NH3']);
    // "Ammonium hydroxide" is aqueous ammonia.
    expect(gives('NH4OH')).toEqual(['1 NH3']);
  });

  it('the charge of a metal is the one that balances: FeCl3 is Fe³⁺, FeSO4 Fe²⁺, Mohr salt Fe²⁺', () => {
    expect(gives('FeCl3')).toEqual(['1 Fe^3+', '3 Cl^-']);
    expect(gives('FeSO4·7H2O')).toEqual(['1 Fe^2+', '1 SO4^2-']);
    expect(gives('(NH4)2Fe(SO4)2·6H2O')).toEqual(['1 Fe^2+', '2 H^+', '2 NH3', '2 SO4^2-']);
  });

  it('acids, bases and oxides: HCl, H2SO4, NaOH, Ca(OH)2, CaO (O²⁻ + H2O → 2 OH⁻), CO2', () => {
    expect(gives('HCl')).toEqual(['1 Cl^-', '1 H^+']);
    expect(gives('H2SO4')).toEqual(['1 SO4^2-', '2 H^+']);
    expect(gives('NaOH')).toEqual(['-1 H^+', '1 Na^+']);
    expect(gives('Ca(OH)2')).toEqual(gives('CaO'));
    expect(gives('CO2')).toEqual(['1 CO3^2-', '2 H^+']);
  });

  it('what the tables do not know stays whole: MnO₄⁻ and [Fe(CN)₆]⁴⁻ are inert ions, [Co(NH3)6]³⁺ a whole complex', () => {
    expect(readIngredient(analyseFormula('KMnO4')).inert).toEqual(['MnO4^-']);
    expect(readIngredient(analyseFormula('K4[Fe(CN)6]·3H2O')).inert).toEqual(['[Fe(CN)6]^4-']);
    expect(readIngredient(analyseFormula('[Co(NH3)6]Cl3')).inert).toEqual(['[Co(NH3)6]^3+']);
  });

  it('a molecule the tables do not know is left out of the equilibrium, and says why; glucose is no pair of lactic acids', () => {
    for (const f of ['C2H6O', 'C6H12O6', 'H2O2', 'CH4N2O']) expect(readIngredient(analyseFormula(f)).leftOut, f).toBeTruthy();
    expect(readIngredient(analyseFormula('H2O')).leftOut).toBe('water: the solvent');
    expect(readIngredient(analyseFormula('Cu')).leftOut).toMatch(/metal: not dissolved/);
  });

  it('an ion listed on its own is read as itself', () => {
    expect(gives('SO4^2-')).toEqual(['1 SO4^2-']);
    expect(gives('Cu^2+')).toEqual(['1 Cu^2+']);
    expect(gives('NH4^+')).toEqual(['1 H^+', '1 NH3']);
  });

  it('every reading gives as much charge as the formula carries (neutral salts: none)', () => {
    for (const f of ['Na3C6H5O7·2H2O', 'KAl(SO4)2·12H2O', 'Ni(NH2SO3)2', 'NaH2PO2·H2O', 'Na2S2O5', 'Na2SiO3', 'KHF2', 'Cu(NH3)4SO4', 'KNaC4H4O6']) {
      const r = readIngredient(analyseFormula(f));
      expect(r.shares.length, f).toBeGreaterThan(0);
      const q = r.shares.reduce((s, x) => s + x.count * (COMPONENTS.get(x.label)?.charge ?? x.charge), 0);
      expect(q, f).toBe(0);
    }
  });
});

describe('the tables', () => {
  it('every species and solid names a source of the list, and the enthalpies theirs', () => {
    for (const s of ACID_SYSTEMS) {
      expect(SOURCES[s.source], s.id).toBeTruthy();
      if (s.dH) expect(SOURCES[s.dHSource!.source], s.id).toBeTruthy();
      expect(s.pKa.length, s.id).toBe(s.forms.length - 1);
    }
    for (const r of [...COMPLEXES, ...SOLIDS]) expect(SOURCES[r.source]).toBeTruthy();
  });

  it('each species label carries the charge of its reaction, and each solid dissolves to no net charge', () => {
    for (const s of FORMED_SPECIES) expect(s.charge, s.label).toBe(labelCharge(s.label));
    for (const s of SPECIES.values()) if (s.kind === 'component') expect(s.charge, s.label).toBe(labelCharge(s.label));
    for (const m of MODEL_SOLIDS) expect([...m.stoich.keys()].length, m.row.formula).toBeGreaterThan(0);
  });

  it('has the systems formulation chemists use, and the complexes and solids the task names', () => {
    const ids = ACID_SYSTEMS.map((s) => s.id);
    for (const id of [
      'phosphate',
      'citrate',
      'acetate',
      'formate',
      'lactate',
      'carbonate',
      'borate',
      'phthalate',
      'oxalate',
      'tartrate',
      'sulfate',
      'sulfamate',
      'hypophosphite',
      'phosphite',
      'fluoride',
      'sulfide',
      'silicate',
      'ammonia',
      'mea',
      'dea',
      'tea',
      'tris',
      'glycine',
      'edta',
    ])
      expect(ids).toContain(id);
    for (const label of [
      'Cu(NH3)4^2+',
      'Ni(NH3)6^2+',
      'Zn(NH3)4^2+',
      'Co(NH3)6^2+',
      'Ag(NH3)2^+',
      'CaEDTA^2-',
      'MgEDTA^2-',
      'FeEDTA^-',
      'CuEDTA^2-',
      'NiEDTA^2-',
      'ZnEDTA^2-',
      'CaCit^-',
      'FeOH^2+',
      'Al(OH)4^-',
      'Zn(OH)4^2-',
      'CuOH^+',
      'FeCl^2+',
      'CuCl^+',
      'ZnCl4^2-',
    ])
      expect(SPECIES.has(label), label).toBe(true);
    const solids = SOLIDS.map((s) => s.formula);
    for (const f of [
      'CaSO4·2H2O',
      'BaSO4',
      'SrSO4',
      'PbSO4',
      'CaCO3',
      'MgCO3·3H2O',
      'BaCO3',
      'ZnCO3',
      'NiCO3',
      'CuCO3',
      'Mg(OH)2',
      'Ca(OH)2',
      'Fe(OH)2',
      'Fe(OH)3',
      'Al(OH)3',
      'Zn(OH)2',
      'Ni(OH)2',
      'Cu(OH)2',
      'Co(OH)2',
      'Cr(OH)3',
      'Ca3(PO4)2',
      'Zn3(PO4)2',
      'FePO4·2H2O',
      'Ni3(PO4)2',
      'AgCl',
      'AgBr',
      'AgI',
      'PbCl2',
      'CuCl',
      'CaF2',
      'ZnS',
      'CuS',
    ])
      expect(solids).toContain(f);
  });

  it('a sample of values against their sources (from memory)', () => {
    // CRC Handbook, "Dissociation constants": acetic acid 4.756, phosphoric 2.148 / 7.198 / 12.35; pKw 13.995.
    expect(ACID_SYSTEMS.find((s) => s.id === 'acetate')!.pKa).toEqual([4.756]);
    expect(ACID_SYSTEMS.find((s) => s.id === 'phosphate')!.pKa).toEqual([2.148, 7.198, 12.35]);
    expect(WATER.pKw).toBe(13.995);
    // CRC Handbook, "Solubility product constants": AgCl 1.77×10⁻¹⁰ (log −9.75), BaSO4 1.08×10⁻¹⁰ (log −9.97).
    expect(SOLIDS.find((s) => s.formula === 'AgCl')!.logKsp).toBeCloseTo(Math.log10(1.77e-10), 2);
    expect(SOLIDS.find((s) => s.formula === 'BaSO4')!.logKsp).toBeCloseTo(Math.log10(1.08e-10), 2);
    // Baes & Mesmer: FeOH²⁺ log *β1 −2.19; NIST SRD 46: Cu(NH3)4²⁺ log β4 11.75.
    expect(COMPLEXES.find((r) => r.label === 'FeOH^2+')!.logK).toBe(-2.19);
    expect(COMPLEXES.find((r) => r.label === 'Cu(NH3)4^2+')!.logK).toBe(11.75);
  });

  it('a constant measured at I = 0.1 M is brought to I = 0 by Davies: CaEDTA²⁻ 10.65 → about 12.37 (NIST SRD 46 gives 12.4 at I = 0; from memory)', () => {
    const k = SPECIES.get('CaEDTA^2-')!.k;
    // The complex's own log K at I = 0 (less the components' nothing: Ca²⁺ and EDTA⁴⁻ are components).
    expect(k.fixed + k.withH).toBeGreaterThan(12.2);
    expect(k.fixed + k.withH).toBeLessThan(12.6);
  });
});
