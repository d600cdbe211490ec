/**
 * The sources of the solution tables. Every row of acids.ts, complexes.ts and solids.ts names one of
 * these beside its value, and says `fromMemory` where the value was recalled without the book at hand
 * (all of them, in this version: no stored copy of these tables was available when they were typed).
 */
export const SOURCES = {
  CRC: 'CRC Handbook of Chemistry and Physics, "Dissociation constants of inorganic acids and bases" and "… of organic acids and bases" (thermodynamic values, 25 °C)',
  'CRC-Ksp': 'CRC Handbook of Chemistry and Physics, "Solubility product constants" (25 °C)',
  'CRC-H': 'CRC Handbook of Chemistry and Physics, "Thermodynamic quantities for the ionization reactions of buffers" (ΔH°, 25 °C)',
  NIST46: 'NIST Critical Stability Constants (NIST SRD 46; Martell & Smith), 25 °C, at the ionic strength given',
  BM: 'Baes & Mesmer, The Hydrolysis of Cations (1976), I = 0, 25 °C',
  PB: 'Plummer & Busenberg, Geochim. Cosmochim. Acta 46 (1982) 1011: the CaCO3–CO2–H2O system, I = 0',
  NORD: 'Nordstrom et al., ACS Symposium Series 416 (1990): a consistent set of ion-pair and solubility constants, I = 0, 25 °C',
  BATES: 'Bates & Hetzer, J. Phys. Chem. 65 (1961) 667 (TRIS); Bates & Acree, J. Res. NBS 34 (1945) 373 (phosphate)',
  LANGE: 'Lange\'s Handbook of Chemistry, Section 8, "Cumulative formation constants" (25 °C)',
  HARNED: 'Harned & Owen, The Physical Chemistry of Electrolytic Solutions (3rd ed.); pKw and its enthalpy as in the CRC Handbook "Ion product of water"',
} as const;

export type SourceId = keyof typeof SOURCES;

/** Where a value comes from: the source, and whether it was recalled rather than read from a copy. */
export interface Sourced {
  source: SourceId;
  /** Recalled without the source at hand. */
  fromMemory: boolean;
}

/** The short citation of a row (`CRC Handbook …, from memory`). */
export function citation(s: Sourced): string {
  return `${SOURCES[s.source]}${s.fromMemory ? ' — from memory' : ''}`;
}
