/**
 * Structure types of common binary salts, for Born–Landé and Born–Mayer: which Madelung constant applies
 * and the coordination numbers of cation and anion (used to pick Shannon radii).
 * Assignments are the standard ones of inorganic chemistry texts (A. F. Wells, Structural Inorganic
 * Chemistry, 5th ed.; N. N. Greenwood & A. Earnshaw, Chemistry of the Elements) — FROM MEMORY.
 * Madelung constants: CRC Handbook Section 12 (data/reference/madelung-constants.csv).
 */
import { MADELUNG_ROWS } from './generated';

export interface StructureType {
  /** Row name in the Madelung table. */
  structure: string;
  madelung: number;
  cationCN: number;
  anionCN: number;
  note?: string;
}

const M = new Map(MADELUNG_ROWS.map(([structure, , , m, note]) => [structure, { m, note }]));
const S = (structure: string, cationCN: number, anionCN: number, label = structure): StructureType => {
  const row = M.get(structure);
  if (!row) throw new Error(`no Madelung constant for ${structure}`);
  return { structure: label, madelung: row.m, cationCN, anionCN, ...(row.note ? { note: row.note } : {}) };
};

const ROCK_SALT = ['LiF', 'LiCl', 'LiBr', 'LiI', 'NaF', 'NaCl', 'NaBr', 'NaI', 'KF', 'KCl', 'KBr', 'KI', 'RbF', 'RbCl', 'RbBr', 'RbI', 'CsF',
  'AgF', 'AgCl', 'AgBr', 'MgO', 'CaO', 'SrO', 'BaO', 'MnO', 'FeO', 'CoO', 'NiO', 'CdO', 'MgS', 'CaS', 'SrS', 'BaS', 'PbS', 'LiH', 'NaH', 'KH'];
const CSCL = ['CsCl', 'CsBr', 'CsI', 'TlCl', 'TlBr'];
const FLUORITE = ['CaF2', 'SrF2', 'BaF2', 'CdF2', 'PbF2', 'SrCl2', 'CeO2', 'ThO2', 'UO2', 'HgF2'];
const ANTIFLUORITE = ['Li2O', 'Na2O', 'K2O', 'Rb2O', 'Li2S', 'Na2S', 'K2S'];
const ZINC_BLENDE = ['ZnS', 'CuCl', 'CuBr', 'CuI', 'AgI', 'BeS', 'ZnSe', 'CdTe', 'HgS'];
const WURTZITE = ['BeO', 'CdS', 'CdSe', 'ZnTe'];
const RUTILE = ['TiO2', 'SnO2', 'PbO2', 'MnO2', 'FeF2', 'ZnF2', 'CoF2', 'NiF2', 'MnF2', 'RuO2', 'IrO2'];
const CORUNDUM = ['Al2O3', 'Cr2O3', 'Fe2O3', 'Ti2O3', 'V2O3', 'Ga2O3'];
const CDI2 = ['CdI2', 'PbI2', 'CaI2', 'MgI2', 'MgBr2', 'FeBr2'];
const CDCL2 = ['CdCl2', 'MgCl2', 'NiCl2', 'CoCl2', 'FeCl2', 'MnCl2'];

const TABLE = new Map<string, StructureType>();
const put = (list: string[], t: StructureType) => list.forEach((f) => TABLE.set(f, t));
put(ROCK_SALT, S('rock salt', 6, 6));
put(CSCL, S('caesium chloride', 8, 8));
put(FLUORITE, S('fluorite', 8, 4));
put(ANTIFLUORITE, S('fluorite', 4, 8, 'antifluorite'));
put(ZINC_BLENDE, S('zinc blende (sphalerite)', 4, 4, 'zinc blende'));
put(WURTZITE, S('wurtzite', 4, 4));
TABLE.set('ZnO', S('zinc oxide (wurtzite type)', 4, 4, 'wurtzite (ZnO)'));
put(RUTILE, S('rutile', 6, 3));
TABLE.set('MgF2', S('magnesium fluoride (rutile type)', 6, 3, 'rutile (MgF2)'));
put(CORUNDUM, S('corundum', 6, 4));
put(CDI2, S('cadmium iodide (alpha)', 6, 3, 'cadmium iodide'));
put(CDCL2, S('cadmium chloride', 6, 3));
TABLE.set('CaCl2', S('calcium chloride', 6, 3));
TABLE.set('Cu2O', { ...S('cuprite', 2, 4), note: 'sources disagree on the Madelung constant of cuprite (CRC 2.22124; another compilation implies 2.058)' });
TABLE.set('Ag2O', { ...S('cuprite', 2, 4), note: 'sources disagree on the Madelung constant of cuprite' });

/** The structure type of a salt by its formula written as cation then anion, e.g. `NaCl`, `CaF2`. */
export function structureOf(formula: string): StructureType | undefined {
  return TABLE.get(formula);
}
