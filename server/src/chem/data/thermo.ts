/**
 * Thermochemical data for Born–Haber cycles and melting points of common salts.
 *
 * ALL VALUES IN THIS FILE ARE FROM MEMORY of standard compilations (no stored copy was at hand); each group
 * names the compilation it was recalled from. They are used for the Born–Haber lattice enthalpy and the
 * melting point shown on cards, both labelled with their source; the tests compare the Born–Haber results
 * with the CRC Handbook's lattice energy table and the first ionisation energies with the npm package
 * `periodic-table`.
 *
 * - Standard enthalpies of formation of solids and of gaseous atoms, 298.15 K, kJ/mol: NBS Tables of
 *   Chemical Thermodynamic Properties (J. Phys. Chem. Ref. Data 11, Suppl. 2, 1982), as reprinted in the
 *   CRC Handbook of Chemistry and Physics, Section 5. Gaseous atoms of Br and I from Br2(l) and I2(s).
 * - Ionisation energies, kJ/mol: CRC Handbook, "Ionization energies of atoms and atomic ions" (NIST ASD).
 * - Electron affinities, kJ/mol (energy released): CRC Handbook, "Electron affinities".
 * - Melting points, °C: CRC Handbook, "Physical constants of inorganic compounds".
 */

/** ΔfH° of the gaseous atom (enthalpy of atomisation from the standard state), kJ/mol. */
export const ATOMISATION: Record<string, number> = {
  Li: 159.3, Na: 107.5, K: 89.0, Rb: 80.9, Cs: 76.5,
  Be: 324.0, Mg: 147.1, Ca: 177.8, Sr: 164.4, Ba: 180.0,
  Ag: 284.9, Cu: 337.4, Zn: 130.4, Al: 330.0,
  F: 79.4, Cl: 121.3, Br: 111.9, I: 106.8, H: 218.0,
};

/** Successive ionisation energies, kJ/mol. */
export const IONISATION: Record<string, number[]> = {
  Li: [520.2, 7298.1], Na: [495.8, 4562.4], K: [418.8, 3052.1], Rb: [403.0, 2633.0], Cs: [375.7, 2234.3],
  Be: [899.5, 1757.1], Mg: [737.7, 1450.7], Ca: [589.8, 1145.4], Sr: [549.5, 1064.2], Ba: [502.9, 965.2],
  Ag: [731.0, 2070.0], Cu: [745.5, 1957.9], Zn: [906.4, 1733.3], Al: [577.5, 1816.7, 2744.8],
};

/** First electron affinity, kJ/mol released (X(g) + e⁻ → X⁻(g)). */
export const ELECTRON_AFFINITY: Record<string, number> = { F: 328.2, Cl: 348.6, Br: 324.5, I: 295.2, H: 72.8 };

/** ΔfH° of the crystalline salt, kJ/mol. */
export const FORMATION_SOLID: Record<string, number> = {
  LiF: -616.0, LiCl: -408.6, LiBr: -351.2, LiI: -270.4,
  NaF: -576.6, NaCl: -411.2, NaBr: -361.1, NaI: -287.8,
  KF: -567.3, KCl: -436.5, KBr: -393.8, KI: -327.9,
  RbF: -557.7, RbCl: -435.4, RbBr: -394.6, RbI: -333.8,
  CsF: -553.5, CsCl: -443.0, CsBr: -405.8, CsI: -346.6,
  AgF: -204.6, AgCl: -127.0, AgBr: -100.4, AgI: -61.8,
  CuCl: -137.2, CuBr: -104.6, CuI: -67.8,
  MgF2: -1124.2, CaF2: -1228.0, SrF2: -1216.3, BaF2: -1207.1,
  MgCl2: -641.3, CaCl2: -795.4, SrCl2: -828.9, BaCl2: -855.0,
  MgBr2: -524.3, CaBr2: -682.8,
  ZnCl2: -415.1, AlF3: -1510.4, AlCl3: -704.2,
  LiH: -90.5, NaH: -56.3, KH: -57.7,
};

/** Melting points of common salts, °C. */
export const MELTING_POINT_C: Record<string, number> = {
  LiF: 848, LiCl: 610, LiBr: 550, LiI: 469,
  NaF: 996, NaCl: 801, NaBr: 747, NaI: 661,
  KF: 858, KCl: 771, KBr: 734, KI: 681,
  RbF: 795, RbCl: 718, RbBr: 692, RbI: 656,
  CsF: 703, CsCl: 646, CsBr: 636, CsI: 621,
  AgF: 435, AgCl: 455, AgBr: 432, AgI: 558,
  MgO: 2825, CaO: 2613, SrO: 2531, BaO: 1973,
  MgF2: 1263, CaF2: 1418, SrF2: 1477, BaF2: 1368,
  MgCl2: 714, CaCl2: 772, SrCl2: 874, BaCl2: 962,
  Al2O3: 2054, ZnO: 1974, TiO2: 1843, CuCl: 423, NaNO3: 307, KNO3: 334,
};
