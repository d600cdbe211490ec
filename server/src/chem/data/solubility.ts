/**
 * Solubility in water of the salts, acids and bases common in plating, cleaning, buffers and water
 * treatment: grams of the ANHYDROUS substance that dissolve in 100 g of water at 20 or 25 °C (the
 * temperature is given per row). A hydrate's water counts as solvent, so a hydrate is compared through
 * its anhydrous salt.
 *
 * Basis: the CRC Handbook of Chemistry and Physics, "Aqueous solubility of inorganic compounds at various
 * temperatures" (which gives mass percent of the anhydrous solute in the saturated solution; converted
 * here as 100·w / (100 − w)), and for the organic salts, acids and buffer substances the usual handbook
 * values at 20 or 25 °C.
 *
 * EVERY ROW IS FROM MEMORY: no copy of the Handbook was at hand when the table was typed, so each row
 * says so in `source`. When a row is checked against the book, put the edition and page in its `source`.
 * Figures recalled this way are typically good to a few percent for the very soluble salts and to a
 * factor of about two for the practically insoluble ones (whose solubility also depends on pH and
 * dissolved CO2). They are used for a warning that is labelled an estimate, never for a computed amount.
 */

export interface SolubilityRow {
  /** The anhydrous substance as chemists write it (read with the formula parser; matched by Hill formula). */
  formula: string;
  /** Grams of anhydrous substance per 100 g water at `temperatureC`. */
  gPer100gWater: number;
  temperatureC: 20 | 25;
  source: string;
}

const MEM = 'from memory of the CRC Handbook aqueous solubility table, not checked against the book';
const MEM_ORG = 'from memory of the usual handbook value, not checked against a book';

const rows = (source: string, list: Array<[string, number, 20 | 25]>): SolubilityRow[] =>
  list.map(([formula, gPer100gWater, temperatureC]) => ({ formula, gPer100gWater, temperatureC, source }));

export const SOLUBILITY: readonly SolubilityRow[] = Object.freeze([
  // Chlorides, fluorides, bromides, iodides.
  ...rows(MEM, [
    ['NaCl', 36.0, 25], ['KCl', 35.5, 25], ['NH4Cl', 39.5, 25], ['LiCl', 84.5, 25], ['CaCl2', 81.3, 25],
    ['MgCl2', 56.0, 25], ['BaCl2', 37.0, 25], ['NiCl2', 67.5, 25], ['CuCl2', 75.7, 25], ['ZnCl2', 408, 25],
    ['FeCl2', 68.5, 20], ['FeCl3', 91.2, 20], ['CoCl2', 56.2, 25], ['MnCl2', 73.9, 20], ['AlCl3', 45.8, 20],
    ['PbCl2', 0.99, 20], ['AgCl', 0.00019, 25],
    ['NaF', 4.15, 25], ['KF', 102, 25], ['NH4F', 83.5, 25], ['NH4HF2', 63, 20], ['CaF2', 0.0016, 20],
    ['NaBr', 94.6, 25], ['KBr', 67.8, 25], ['NaI', 184, 25], ['KI', 148, 25],
  ]),
  // Sulfates.
  ...rows(MEM, [
    ['Na2SO4', 28.1, 25], ['K2SO4', 12.0, 25], ['(NH4)2SO4', 76.4, 25], ['MgSO4', 35.7, 25], ['CaSO4', 0.205, 25],
    ['BaSO4', 0.00025, 25], ['SrSO4', 0.0135, 25], ['PbSO4', 0.0044, 20], ['Ag2SO4', 0.83, 25],
    ['NiSO4', 40.4, 25], ['CuSO4', 22.0, 25], ['ZnSO4', 57.7, 25], ['FeSO4', 29.5, 25], ['CoSO4', 38.3, 25],
    ['MnSO4', 63.7, 25], ['Al2(SO4)3', 38.5, 25], ['NaHSO4', 28.5, 25], ['SnSO4', 33, 25],
  ]),
  // Nitrates and nitrite.
  ...rows(MEM, [
    ['NaNO3', 91.2, 25], ['KNO3', 38.3, 25], ['NH4NO3', 213, 25], ['Ca(NO3)2', 144, 25], ['Mg(NO3)2', 71.2, 25],
    ['Ni(NO3)2', 99.2, 25], ['Cu(NO3)2', 145, 25], ['Zn(NO3)2', 120, 25], ['Co(NO3)2', 103, 25], ['Al(NO3)3', 73.9, 20],
    ['AgNO3', 234, 25], ['Pb(NO3)2', 59.7, 25], ['Ba(NO3)2', 10.2, 25], ['NaNO2', 84.8, 25],
  ]),
  // Carbonates and hydrogencarbonates.
  ...rows(MEM, [
    ['Na2CO3', 30.7, 25], ['K2CO3', 112, 25], ['NaHCO3', 10.3, 25], ['KHCO3', 36.2, 25], ['NH4HCO3', 24.8, 25],
    ['Li2CO3', 1.29, 25], ['CaCO3', 0.0013, 25], ['MgCO3', 0.0139, 25], ['BaCO3', 0.0024, 20], ['NiCO3', 0.0093, 25],
    ['ZnCO3', 0.00009, 20], ['Ag2CO3', 0.0032, 20], ['PbCO3', 0.00011, 20],
  ]),
  // Phosphates and condensed phosphates.
  ...rows(MEM, [
    ['Na3PO4', 14.4, 25], ['Na2HPO4', 11.8, 25], ['NaH2PO4', 94.2, 25], ['K3PO4', 90, 20], ['K2HPO4', 168, 25],
    ['KH2PO4', 25.0, 25], ['NH4H2PO4', 40.4, 25], ['(NH4)2HPO4', 69.0, 25], ['Ca3(PO4)2', 0.00012, 25], ['CaHPO4', 0.02, 25],
    ['Na4P2O7', 6.7, 25], ['Na5P3O10', 14.5, 25], ['K4P2O7', 187, 25],
  ]),
  // Hydroxides, boron compounds, silicate, sulfur oxyanions, oxidisers, cyanides.
  ...rows(MEM, [
    ['NaOH', 111, 20], ['KOH', 121, 25], ['LiOH', 12.8, 20], ['Ca(OH)2', 0.173, 20], ['Mg(OH)2', 0.00064, 25], ['Ba(OH)2', 3.89, 20],
    ['H3BO3', 5.7, 25], ['Na2B4O7', 3.1, 25], ['Na2SiO3', 22.2, 25],
    ['Na2S2O3', 70.1, 20], ['Na2SO3', 27, 20], ['Na2S2O5', 54, 20], ['Na2S', 18.6, 20], ['H3NSO3', 21.3, 20],
    ['KMnO4', 6.38, 20], ['K2Cr2O7', 13, 20], ['K2CrO4', 62.9, 20], ['Na2Cr2O7', 187, 25], ['CrO3', 169, 25],
    ['(NH4)2S2O8', 80, 25], ['Na2S2O8', 55.6, 20], ['K2S2O8', 5.29, 20],
    ['NaCN', 63.7, 25], ['KCN', 71.6, 25],
  ]),
  // Acetates, citrates, oxalates, gluconate, chelating agents, buffer substances.
  ...rows(MEM_ORG, [
    ['CH3COONa', 50.4, 25], ['CH3COOK', 268, 25], ['Ca(CH3COO)2', 34.7, 20], ['Mg(CH3COO)2', 53.4, 20],
    ['Cu(CH3COO)2', 7.2, 20], ['Pb(CH3COO)2', 44.3, 20],
    ['Na3C6H5O7', 42.5, 25], ['C6H8O7', 145, 20], ['Ca3(C6H5O7)2', 0.095, 25],
    ['H2C2O4', 14.3, 25], ['Na2C2O4', 3.7, 20], ['CaC2O4', 0.00067, 20], ['NaC6H11O7', 59, 25],
    ['C10H16N2O8', 0.05, 25], ['Na2C10H14N2O8', 10, 20], ['Na4C10H12N2O8', 103, 20],
    ['KHC8H4O4', 8.0, 20], ['C4H11NO3', 50, 25], ['C2H5NO2', 25, 25],
  ]),
]);

/**
 * Below this (g per 100 g water) a substance is called practically insoluble: less than 1 part in
 * 10 000 parts of solvent (the pharmacopoeias' descriptive term; common practice).
 */
export const PRACTICALLY_INSOLUBLE_BELOW = 0.01;
