/**
 * Sparingly soluble solids: solubility products at 25 °C (I = 0), each written as the dissolution into
 * species of the model with log Ksp, the formula of what comes out (for its mass) and the source.
 * Hydroxides are written with OH⁻, as the CRC Handbook tabulates them; the model turns OH⁻ into
 * H2O − H⁺ with the ion product of water at the batch's temperature. Sulfides are written with HS⁻
 * (MS + H⁺ ⇌ M²⁺ + HS⁻), which avoids the poorly known second dissociation constant of H2S.
 *
 * Sources: CRC Handbook "Solubility product constants" unless a row says otherwise (calcite: Plummer &
 * Busenberg 1982; gypsum, brushite, sulfides, amorphous silica: Nordstrom et al. 1990). ΔH° of dissolution where
 * tabulated. Every value was recalled (fromMemory).
 */
import type { SourceId, Sourced } from './sources';

export interface SolidRow extends Sourced {
  /** The solid as a formula (its molar mass is the mass that comes out). */
  formula: string;
  /** Mineral or common name. */
  name: string;
  /** Dissolution: species of the model → coefficients. */
  into: Readonly<Record<string, number>>;
  logKsp: number;
  /** ΔH° of dissolution, kJ/mol. */
  dH?: number;
  /** Why the solid may not form in practice (kinetics), for the hover. */
  note?: string;
}

const rows: SolidRow[] = [];
function add(source: SourceId, list: Array<[string, string, Record<string, number>, number, number?]>, note?: string) {
  for (const [formula, name, into, logKsp, dH] of list)
    rows.push({ formula, name, into, logKsp, source, fromMemory: true, ...(dH !== undefined ? { dH } : {}), ...(note ? { note } : {}) });
}

const OH = 'OH^-';

add('NORD', [
  ['CaSO4·2H2O', 'gypsum', { 'Ca^2+': 1, 'SO4^2-': 1 }, -4.58, -0.46],
  ['FeS', 'mackinawite', { 'Fe^2+': 1, 'HS^-': 1, 'H^+': -1 }, -3.6],
  ['ZnS', 'sphalerite', { 'Zn^2+': 1, 'HS^-': 1, 'H^+': -1 }, -11.62],
  ['CuS', 'covellite', { 'Cu^2+': 1, 'HS^-': 1, 'H^+': -1 }, -23.04],
  ['NiS', 'nickel sulfide', { 'Ni^2+': 1, 'HS^-': 1, 'H^+': -1 }, -9.23],
  ['PbS', 'galena', { 'Pb^2+': 1, 'HS^-': 1, 'H^+': -1 }, -13.97],
  ['CdS', 'greenockite', { 'Cd^2+': 1, 'HS^-': 1, 'H^+': -1 }, -15.93],
  ['Ag2S', 'acanthite', { 'Ag^+': 2, 'HS^-': 1, 'H^+': -1 }, -36.05],
  ['SiO2', 'amorphous silica', { H4SiO4: 1 }, -2.71],
]);
add('PB', [['CaCO3', 'calcite', { 'Ca^2+': 1, 'CO3^2-': 1 }, -8.48, -10.8]]);
add('CRC-Ksp', [
  // sulfates
  ['BaSO4', 'barite', { 'Ba^2+': 1, 'SO4^2-': 1 }, -9.97, 26.3],
  ['SrSO4', 'celestine', { 'Sr^2+': 1, 'SO4^2-': 1 }, -6.46],
  ['PbSO4', 'anglesite', { 'Pb^2+': 1, 'SO4^2-': 1 }, -7.6],
  ['Ag2SO4', 'silver sulfate', { 'Ag^+': 2, 'SO4^2-': 1 }, -4.92],
  // carbonates
  ['BaCO3', 'witherite', { 'Ba^2+': 1, 'CO3^2-': 1 }, -8.59],
  ['SrCO3', 'strontianite', { 'Sr^2+': 1, 'CO3^2-': 1 }, -9.25],
  ['ZnCO3', 'smithsonite', { 'Zn^2+': 1, 'CO3^2-': 1 }, -9.84],
  ['NiCO3', 'nickel carbonate', { 'Ni^2+': 1, 'CO3^2-': 1 }, -6.85],
  ['CuCO3', 'copper(II) carbonate', { 'Cu^2+': 1, 'CO3^2-': 1 }, -9.86],
  ['FeCO3', 'siderite', { 'Fe^2+': 1, 'CO3^2-': 1 }, -10.5],
  ['MnCO3', 'rhodochrosite', { 'Mn^2+': 1, 'CO3^2-': 1 }, -10.65],
  ['PbCO3', 'cerussite', { 'Pb^2+': 1, 'CO3^2-': 1 }, -13.13],
  ['CdCO3', 'otavite', { 'Cd^2+': 1, 'CO3^2-': 1 }, -12.0],
  ['Ag2CO3', 'silver carbonate', { 'Ag^+': 2, 'CO3^2-': 1 }, -11.07],
  // hydroxides
  ['Mg(OH)2', 'brucite', { 'Mg^2+': 1, [OH]: 2 }, -11.25],
  ['Ca(OH)2', 'portlandite', { 'Ca^2+': 1, [OH]: 2 }, -5.3, -17.9],
  ['Mn(OH)2', 'manganese(II) hydroxide', { 'Mn^2+': 1, [OH]: 2 }, -12.72],
  ['Fe(OH)2', 'iron(II) hydroxide', { 'Fe^2+': 1, [OH]: 2 }, -16.31],
  ['Fe(OH)3', 'iron(III) hydroxide', { 'Fe^3+': 1, [OH]: 3 }, -38.55],
  ['Al(OH)3', 'aluminium hydroxide', { 'Al^3+': 1, [OH]: 3 }, -32.89],
  ['Cr(OH)3', 'chromium(III) hydroxide', { 'Cr^3+': 1, [OH]: 3 }, -30.2],
  ['Co(OH)2', 'cobalt(II) hydroxide', { 'Co^2+': 1, [OH]: 2 }, -14.23],
  ['Ni(OH)2', 'nickel hydroxide', { 'Ni^2+': 1, [OH]: 2 }, -15.26],
  ['Cu(OH)2', 'copper(II) hydroxide', { 'Cu^2+': 1, [OH]: 2 }, -19.66],
  ['Zn(OH)2', 'zinc hydroxide', { 'Zn^2+': 1, [OH]: 2 }, -16.52],
  ['Cd(OH)2', 'cadmium hydroxide', { 'Cd^2+': 1, [OH]: 2 }, -14.14],
  ['Pb(OH)2', 'lead(II) hydroxide', { 'Pb^2+': 1, [OH]: 2 }, -19.84],
  // phosphates
  ['Ca3(PO4)2', 'tricalcium phosphate', { 'Ca^2+': 3, 'PO4^3-': 2 }, -32.68],
  ['Mg3(PO4)2', 'magnesium phosphate', { 'Mg^2+': 3, 'PO4^3-': 2 }, -23.98],
  ['Zn3(PO4)2', 'zinc phosphate', { 'Zn^2+': 3, 'PO4^3-': 2 }, -32.05],
  ['Ni3(PO4)2', 'nickel phosphate', { 'Ni^2+': 3, 'PO4^3-': 2 }, -31.32],
  ['Cu3(PO4)2', 'copper(II) phosphate', { 'Cu^2+': 3, 'PO4^3-': 2 }, -36.85],
  ['FePO4·2H2O', 'strengite', { 'Fe^3+': 1, 'PO4^3-': 1 }, -15.0],
  ['AlPO4', 'aluminium phosphate', { 'Al^3+': 1, 'PO4^3-': 1 }, -20.01],
  ['Ag3PO4', 'silver phosphate', { 'Ag^+': 3, 'PO4^3-': 1 }, -16.05],
  // halides
  ['AgCl', 'silver chloride', { 'Ag^+': 1, 'Cl^-': 1 }, -9.75, 65.5],
  ['AgBr', 'silver bromide', { 'Ag^+': 1, 'Br^-': 1 }, -12.27, 84.4],
  ['AgI', 'silver iodide', { 'Ag^+': 1, 'I^-': 1 }, -16.07, 112.3],
  ['PbCl2', 'lead(II) chloride', { 'Pb^2+': 1, 'Cl^-': 2 }, -4.77],
  ['PbBr2', 'lead(II) bromide', { 'Pb^2+': 1, 'Br^-': 2 }, -5.18],
  ['PbI2', 'lead(II) iodide', { 'Pb^2+': 1, 'I^-': 2 }, -8.01],
  ['CuCl', 'copper(I) chloride', { 'Cu^+': 1, 'Cl^-': 1 }, -6.76],
  ['CuBr', 'copper(I) bromide', { 'Cu^+': 1, 'Br^-': 1 }, -8.2],
  ['CuI', 'copper(I) iodide', { 'Cu^+': 1, 'I^-': 1 }, -11.9],
  ['CaF2', 'fluorite', { 'Ca^2+': 1, 'F^-': 2 }, -10.46, 11.7],
  ['MgF2', 'sellaite', { 'Mg^2+': 1, 'F^-': 2 }, -10.29],
  ['SrF2', 'strontium fluoride', { 'Sr^2+': 1, 'F^-': 2 }, -8.36],
  ['BaF2', 'barium fluoride', { 'Ba^2+': 1, 'F^-': 2 }, -6.74],
  ['PbF2', 'lead(II) fluoride', { 'Pb^2+': 1, 'F^-': 2 }, -7.48],
  // oxalate
  ['CaC2O4·H2O', 'whewellite', { 'Ca^2+': 1, 'C2O4^2-': 1 }, -8.63],
]);
add('CRC-Ksp', [['MgCO3·3H2O', 'nesquehonite', { 'Mg^2+': 1, 'CO3^2-': 1 }, -5.62]], 'magnesite (MgCO₃) is less soluble but does not form at room temperature');
add('NORD', [['CaHPO4·2H2O', 'brushite', { 'Ca^2+': 1, 'HPO4^2-': 1 }, -6.6]], 'hydroxyapatite, less soluble still, forms slowly and is not in the table');

export const SOLIDS: readonly SolidRow[] = rows;
