/**
 * Standard molar enthalpies of hydration of single ions, 25 °C, kJ/mol (gaseous ion → ion at infinite
 * dilution in water; negative). With a salt's lattice energy U (the energy to separate the crystal into
 * gaseous ions, positive) they give the Born–Haber estimate of its enthalpy of solution:
 *
 *   ΔsolH ≈ U + Σ ν ΔhydH(ion)
 *
 * which shows why a salt cools or warms the water: it cools when breaking up the crystal costs more than
 * the ions' hydration returns. It is the small difference of two large numbers, so it is an estimate
 * (the heat module measures its error on the salts of the solution table and prints it).
 *
 * Source: Y. Marcus, "Thermodynamics of solvation of ions. Part 5", J. Chem. Soc. Faraday Trans. 87
 * (1991) 2995, Table 1 (absolute values on the scale ΔhydH(H⁺) = −1103 kJ/mol), and Y. Marcus, "Ion
 * Properties" (Dekker, 1997). Only the sum over a neutral salt is independent of the scale, so every value
 * here must come from the one scale. EVERY VALUE IS FROM MEMORY of those tables (none was at hand).
 */

/** Cations by element symbol and charge (`Na+`, `Ca2+`), polyatomic ions by their name in chem/data/ions.ts. */
export const HYDRATION_KJ: Readonly<Record<string, number>> = Object.freeze({
  // Cations
  'Li+': -531,
  'Na+': -416,
  'K+': -334,
  'Rb+': -308,
  'Cs+': -283,
  'Ag+': -475,
  'Tl+': -337,
  'Cu+': -594,
  ammonium: -329,
  'Be2+': -2487,
  'Mg2+': -1949,
  'Ca2+': -1602,
  'Sr2+': -1470,
  'Ba2+': -1332,
  'Mn2+': -1868,
  'Fe2+': -1970,
  'Co2+': -2036,
  'Ni2+': -2119,
  'Cu2+': -2123,
  'Zn2+': -2070,
  'Cd2+': -1833,
  'Hg2+': -1853,
  'Sn2+': -1577,
  'Pb2+': -1509,
  'Al3+': -4715,
  'Cr3+': -4584,
  'Fe3+': -4462,
  'La3+': -3312,
  // Anions
  'F-': -510,
  'Cl-': -367,
  'Br-': -336,
  'I-': -291,
  hydroxide: -520,
  cyanide: -341,
  thiocyanate: -311,
  nitrate: -312,
  perchlorate: -246,
  'hydrogen carbonate': -384,
  'dihydrogen phosphate': -522,
  acetate: -425,
  formate: -403,
  carbonate: -1397,
  sulfate: -1035,
  phosphate: -2879,
});

export const HYDRATION_SOURCE = 'Marcus, J. Chem. Soc. Faraday Trans. 87 (1991) 2995 (ΔhydH(H⁺) = −1103 kJ/mol scale), from memory';
