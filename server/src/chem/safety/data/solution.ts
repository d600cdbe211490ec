/**
 * Standard enthalpies of solution at infinite dilution, 25 °C, kJ per mole of the substance as weighed
 * (ΔsolH°: positive = the solution cools, negative = it warms). A hydrate has a row of its own where its
 * value is known; its water of crystallisation becomes solvent.
 *
 * Sources, per row (`source`):
 * - CRC: CRC Handbook of Chemistry and Physics, section 5, "Enthalpy of solution of electrolytes"
 *   (infinite dilution, 25 °C; the table rests on the NBS compilations, V. B. Parker, NSRDS-NBS 2, 1965).
 * - NBS: computed here as Σ ν ΔfH°(ion, aq, ∞) − ΔfH°(solid) (+ n ΔfH°(H2O, l) for n waters of a
 *   hydrate) from the NBS tables of chemical thermodynamic properties (D. D. Wagman et al., J. Phys. Chem.
 *   Ref. Data 11, Suppl. 2, 1982), where the CRC table has no row.
 * - ORG: the molecular substances (sugars, urea, alcohols, glycols, peroxide, ammonia), the usual handbook
 *   value to the undissociated solute at infinite dilution (NBS tables; CRC).
 *
 * EVERY ROW IS FROM MEMORY: no copy of the Handbook or of the NBS tables was at hand when the table was
 * typed, so every source says so. The test suite cross-checks the CRC rows against the NBS formation
 * enthalpies of the solids and ions (also recalled, a separate memory), which agree within about 1 kJ/mol.
 * Values at infinite dilution differ from those at working concentrations by a few kJ/mol for 1:1 salts
 * and up to about 10 kJ/mol for 2:2 salts (the heat of dilution); the temperature estimate says so.
 */

export interface SolutionEnthalpyRow {
  /** The substance as chemists write it (read with the formula parser; matched by Hill formula and water count). */
  formula: string;
  /** ΔsolH° at infinite dilution, 25 °C, kJ/mol. */
  kJPerMol: number;
  source: string;
}

export const SOURCE_CRC = 'CRC Handbook, "Enthalpy of solution of electrolytes" (infinite dilution, 25 °C), from memory';
export const SOURCE_NBS = 'from the NBS tables (Wagman et al. 1982): ΔfH° of the ions at infinite dilution less that of the solid, from memory';
export const SOURCE_ORG = 'NBS tables / CRC Handbook, the usual value to the undissociated solute at infinite dilution, from memory';

const rows = (source: string, list: Array<[string, number]>): SolutionEnthalpyRow[] => list.map(([formula, kJPerMol]) => ({ formula, kJPerMol, source }));

export const SOLUTION_ENTHALPIES: readonly SolutionEnthalpyRow[] = Object.freeze([
  ...rows(SOURCE_CRC, [
    ['LiF', 4.73],
    ['LiCl', -37.03],
    ['LiBr', -48.83],
    ['LiI', -63.3],
    ['LiOH', -23.56],
    ['LiNO3', -2.51],
    ['Li2SO4', -29.8],
    ['Li2CO3', -18.2],
    ['NaF', 0.91],
    ['NaCl', 3.88],
    ['NaBr', -0.6],
    ['NaI', -7.53],
    ['NaOH', -44.51],
    ['NaNO3', 20.5],
    ['NaNO2', 13.89],
    ['NaClO3', 21.72],
    ['NaClO4', 13.88],
    ['NaCN', 1.21],
    ['Na2SO4', -2.43],
    ['Na2CO3', -26.7],
    ['CH3COONa', -17.32],
    ['KF', -17.73],
    ['KCl', 17.22],
    ['KBr', 19.87],
    ['KI', 20.33],
    ['KOH', -57.61],
    ['KNO3', 34.89],
    ['KClO3', 41.38],
    ['KClO4', 51.04],
    ['KMnO4', 43.56],
    ['KSCN', 24.23],
    ['KCN', 11.72],
    ['K2SO4', 23.8],
    ['KH2PO4', 19.6],
    ['RbCl', 17.28],
    ['CsCl', 17.78],
    ['CsI', 33.35],
    ['NH4Cl', 14.78],
    ['NH4Br', 16.78],
    ['NH4I', 13.72],
    ['NH4NO3', 25.69],
    ['(NH4)2SO4', 6.61],
    ['AgNO3', 22.59],
    ['MgCl2', -160.0],
    ['MgSO4', -91.2],
    ['Mg(NO3)2', -90.88],
    ['CaCl2', -81.33],
    ['Ca(NO3)2', -19.16],
    ['BaCl2', -13.22],
    ['Ba(NO3)2', 40.38],
    ['CuSO4', -73.26],
    ['ZnCl2', -73.1],
    ['AlCl3', -329.0],
  ]),
  ...rows(SOURCE_NBS, [
    ['NaHCO3', 18.7],
    ['Na2SO3', -14.9],
    ['Na2HPO4', -24.3],
    ['NaH2PO4', 0.4],
    ['K2CO3', -30.9],
    ['KHCO3', 18.8],
    ['K2CrO4', 17.8],
    ['K2Cr2O7', 66.4],
    ['NH4H2PO4', 16.3],
    ['SrCl2', -51.2],
    ['Ca(OH)2', -16.7],
    ['CaO', -81.9],
    ['ZnSO4', -80.4],
    ['NiSO4', -90.4],
    ['NiCl2', -83.0],
    ['CoCl2', -80.0],
    ['FeSO4', -70.0],
    ['MnSO4', -64.8],
    ['CuCl2', -49.5],
    ['FeCl3', -150.5],
    ['Al2(SO4)3', -349.0],
    ['H3BO3', 22.0],
    // Hydrates: their water of crystallisation already holds part of the hydration energy.
    ['CuSO4·5H2O', 6.0],
    ['CaCl2·2H2O', -45.8],
    ['CaCl2·6H2O', 15.8],
    ['MgCl2·6H2O', -17.1],
    ['MgSO4·7H2O', 11.8],
    ['Na2CO3·H2O', -12.0],
    ['Na2CO3·10H2O', 65.6],
    ['Na2SO4·10H2O', 79.5],
    ['Na2S2O3·5H2O', 50.0],
    ['Na2HPO4·12H2O', 95.5],
    ['CH3COONa·3H2O', 19.7],
    ['NiSO4·6H2O', 4.6],
    ['NiCl2·6H2O', -0.1],
    ['CoCl2·6H2O', 7.9],
    ['ZnSO4·7H2O', 13.8],
    ['FeSO4·7H2O', 15.4],
    ['AlCl3·6H2O', -55.9],
    ['Al2(SO4)3·18H2O', -55.9],
    ['BaCl2·2H2O', 16.5],
    ['Ca(NO3)2·4H2O', 31.5],
  ]),
  ...rows(SOURCE_ORG, [
    ['C12H22O11', 5.8], // sucrose
    ['C6H12O6', 11.0], // glucose (anhydrous α-D-glucose)
    ['CH4N2O', 15.4], // urea
    ['C3H8O3', -5.8], // glycerol (liquid)
    ['C2H6O2', -6.2], // ethylene glycol (liquid)
    ['CH4O', -7.3], // methanol (liquid)
    ['C2H6O', -10.2], // ethanol (liquid)
    ['C3H8O', -13.0], // propan-2-ol (liquid)
    ['C3H6O', -10.0], // acetone (liquid)
    ['C2H4O2', -1.3], // acetic acid (liquid), to the undissociated acid
    ['H2O2', -3.4], // hydrogen peroxide (liquid)
    ['NH3', -34.2], // ammonia gas, to aqueous NH3
  ]),
]);
