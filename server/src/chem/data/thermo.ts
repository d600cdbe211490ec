/**
 * Thermochemical data for Born–Haber cycles, melting points of common salts, and the table of molecular
 * substances, read from the generated tables (data/reference/*.csv; data/reference/README.md gives each
 * source). Where a value was recalled rather than read from a stored copy, the CSV says so and so do the
 * labels below, which cards show.
 *
 * - Ionisation energies and electron affinities: pymatgen's periodic table (NIST Atomic Spectra Database
 *   values, in eV), converted with 1 eV = 96.485 332 12 kJ/mol (CODATA 2018: e·N_A, both exact in the SI).
 * - Enthalpies of atomisation (ΔfH° of the gaseous atom, 298.15 K): CODATA Key Values for Thermodynamics
 *   (Cox, Wagman & Medvedev 1989) where CODATA gives one, else the NBS tables (Wagman et al. 1982). Br and I
 *   are from Br2(l) and I2(s). Recalled from memory.
 * - Standard enthalpies of formation of the crystalline salts, 298.15 K: NBS 1982 tables as reprinted in
 *   the CRC Handbook, Section 5. Recalled from memory.
 * - Melting points, and melting and boiling points of molecular substances: CRC Handbook, "Physical
 *   Constants of Inorganic Compounds". Recalled from memory.
 */
import { AFFINITY_ROWS, ATOMISATION_ROWS, FORMATION_ROWS, IONISATION_ROWS, MELTING_ROWS, MOLECULAR_ROWS } from './generated';

/** kJ/mol per eV (CODATA 2018: e · N_A / 1000, exact). */
export const KJ_PER_EV = 96.48533212;

export const SOURCES = {
  ionisation: 'NIST Atomic Spectra Database via pymatgen (eV, converted)',
  affinity: 'electron affinities from pymatgen (eV, converted)',
  atomisationCodata: 'CODATA Key Values for Thermodynamics (Cox, Wagman & Medvedev 1989), recalled',
  atomisationNbs: 'NBS tables (Wagman et al. 1982), recalled',
  formation: 'NBS/CRC enthalpies of formation (Wagman et al. 1982), recalled',
  meltingPoint: 'CRC Handbook (value recalled, not checked against the book)',
  molecular: 'CRC Handbook, Physical Constants of Inorganic Compounds (values recalled, not checked against the book)',
} as const;

/** ΔfH° of the gaseous atom (enthalpy of atomisation from the standard state), kJ/mol. */
export const ATOMISATION: Record<string, number> = Object.fromEntries(ATOMISATION_ROWS.map(([el, h]) => [el, h]));
/** Which compilation each atomisation enthalpy is from, and its uncertainty where CODATA gives one. */
export const ATOMISATION_SOURCE: Record<string, { source: 'CODATA' | 'NBS'; uncertainty: number | null }> = Object.fromEntries(
  ATOMISATION_ROWS.map(([el, , u, source]) => [el, { source, uncertainty: u }]),
);

/** Successive ionisation energies, eV (as tabulated). */
export const IONISATION_EV: Record<string, number[]> = Object.fromEntries(IONISATION_ROWS.map(([el, ies]) => [el, ies]));
/** Successive ionisation energies, kJ/mol. */
export const IONISATION: Record<string, number[]> = Object.fromEntries(IONISATION_ROWS.map(([el, ies]) => [el, ies.map((e) => e * KJ_PER_EV)]));

/** First electron affinity, kJ/mol released (X(g) + e⁻ → X⁻(g)). */
export const ELECTRON_AFFINITY: Record<string, number> = Object.fromEntries(AFFINITY_ROWS.map(([el, ea]) => [el, ea * KJ_PER_EV]));

/** ΔfH° of the crystalline salt, kJ/mol. */
export const FORMATION_SOLID: Record<string, number> = Object.fromEntries(FORMATION_ROWS);

/** Melting points of common salts, °C. */
export const MELTING_POINT_C: Record<string, number> = Object.fromEntries(MELTING_ROWS);

export interface MolecularSubstance {
  formula: string;
  /** `molecular`: discrete molecules; `polymeric`: covalent chains or layers that are molecular in the vapour. */
  kind: 'molecular' | 'polymeric';
  meltingPointC: number | null;
  boilingPointC: number | null;
  boilingKind: 'boils' | 'sublimes' | 'decomposes';
  note: string;
}

/** Binary substances of metals (and a few non-metals) that are molecular, not ionic lattices, with their melting and boiling points. */
export const MOLECULAR_SUBSTANCES: ReadonlyMap<string, MolecularSubstance> = new Map(
  MOLECULAR_ROWS.map(([formula, kind, mp, bp, boilingKind, note]) => [formula, { formula, kind, meltingPointC: mp, boilingPointC: bp, boilingKind, note }]),
);
