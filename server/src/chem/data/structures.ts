/**
 * Structure types of common binary salts, for Born–Landé and Born–Mayer: which Madelung constant applies
 * and the coordination numbers of cation and anion (used to pick Shannon radii).
 * Assignments: data/reference/structure-types.csv, the standard ones of inorganic chemistry texts
 * (A. F. Wells, Structural Inorganic Chemistry, 5th ed.; N. N. Greenwood & A. Earnshaw, Chemistry of the
 * Elements) — recalled from memory. Madelung constants: CRC Handbook Section 12
 * (data/reference/madelung-constants.csv).
 */
import { MADELUNG_ROWS, STRUCTURE_ROWS } from './generated';

export interface StructureType {
  /** The structure type's name as cards show it. */
  structure: string;
  madelung: number;
  cationCN: number;
  anionCN: number;
  note?: string;
}

const M = new Map(MADELUNG_ROWS.map(([structure, , , m, note]) => [structure, { m, note }]));

const TABLE = new Map<string, StructureType>();
for (const [formula, row, label, cationCN, anionCN, note] of STRUCTURE_ROWS) {
  const m = M.get(row);
  if (!m) throw new Error(`no Madelung constant for ${row}`);
  const n = note || m.note;
  TABLE.set(formula, { structure: label, madelung: m.m, cationCN, anionCN, ...(n ? { note: n } : {}) });
}

/** The structure type of a salt by its formula written as cation then anion, e.g. `NaCl`, `CaF2`. */
export function structureOf(formula: string): StructureType | undefined {
  return TABLE.get(formula);
}

/** Every salt with a structure type, in table order. */
export function structureTable(): ReadonlyMap<string, StructureType> {
  return TABLE;
}
