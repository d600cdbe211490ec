/**
 * Polyatomic ions, ligands and polyatomic cations, with their charges.
 *
 * Sources:
 * - Names and charges: IUPAC, Nomenclature of Inorganic Chemistry (Red Book, 2005), Table IX (names of
 *   ions and ligands); charges are those of the named ions and are standard chemistry.
 * - Internal oxidation states (`states`, where the usual rule — O −2, H +1, the central atom balancing —
 *   would give a wrong answer, e.g. peroxo ions): IUPAC Red Book 2005, IR-4.6 and the ions' structures.
 * - Thermochemical radii (`radius`, Å): H. D. B. Jenkins & H. K. Roobottom, CRC Handbook of Chemistry and
 *   Physics, Section 12, "Lattice energies", Table 2. Only NH4+ (1.36) and HF2- (1.72) were confirmed from a
 *   stored copy (data/reference/thermochemical-radii.csv); every other radius here is FROM MEMORY of that
 *   table and is marked `radiusFromMemory`. Cards say so beside a Kapustinskii estimate that uses one.
 */
export interface IonDef {
  /** Usual name. */
  name: string;
  /** Ways of writing it (ASCII, as a chemist types it); the first is the canonical form. */
  forms: string[];
  /** Possible charges, the usual one first (MnO4: permanganate −1, manganate −2). */
  charges: number[];
  /** Names per charge where they differ. */
  namesByCharge?: Record<number, string>;
  /** Oxidation states of its atoms where the simple rule does not give them. */
  states?: Record<string, number>;
  /** Thermochemical radius in Å (see the header for sources). */
  radius?: number;
  radiusFromMemory?: boolean;
  /** Weak acid/base or amphiprotic: treated as undissociated beyond the first step in batches. */
  weak?: boolean;
}

const mem = (r: number) => ({ radius: r, radiusFromMemory: true });

export const ANIONS: IonDef[] = [
  { name: 'hydroxide', forms: ['OH'], charges: [-1], ...mem(1.33) },
  { name: 'nitrate', forms: ['NO3'], charges: [-1], ...mem(2.0) },
  { name: 'nitrite', forms: ['NO2'], charges: [-1], ...mem(1.92) },
  { name: 'sulfate', forms: ['SO4'], charges: [-2], ...mem(2.18) },
  { name: 'sulfite', forms: ['SO3'], charges: [-2], ...mem(2.04) },
  { name: 'hydrogen sulfate', forms: ['HSO4'], charges: [-1], ...mem(2.21) },
  { name: 'hydrogen sulfite', forms: ['HSO3'], charges: [-1] },
  { name: 'thiosulfate', forms: ['S2O3'], charges: [-2], states: { S: 2, O: -2 }, ...mem(2.51) },
  { name: 'peroxodisulfate', forms: ['S2O8'], charges: [-2], states: { S: 6, O: -1.75 } },
  { name: 'disulfite', forms: ['S2O5'], charges: [-2], states: { S: 4, O: -2 } },
  { name: 'dithionite', forms: ['S2O4'], charges: [-2], states: { S: 3, O: -2 } },
  { name: 'phosphate', forms: ['PO4'], charges: [-3], ...mem(2.38) },
  { name: 'hydrogen phosphate', forms: ['HPO4'], charges: [-2], weak: true },
  { name: 'dihydrogen phosphate', forms: ['H2PO4'], charges: [-1], weak: true },
  { name: 'diphosphate', forms: ['P2O7'], charges: [-4] },
  { name: 'hypophosphite', forms: ['H2PO2'], charges: [-1] },
  { name: 'carbonate', forms: ['CO3'], charges: [-2], ...mem(1.78) },
  { name: 'hydrogen carbonate', forms: ['HCO3'], charges: [-1], weak: true, ...mem(1.56) },
  { name: 'oxalate', forms: ['C2O4'], charges: [-2], ...mem(2.09) },
  { name: 'acetate', forms: ['CH3COO', 'CH3CO2', 'C2H3O2', 'OOCCH3', 'O2CCH3'], charges: [-1], ...mem(1.62) },
  { name: 'formate', forms: ['HCOO', 'HCO2', 'CHO2'], charges: [-1], ...mem(2.0) },
  { name: 'citrate', forms: ['C6H5O7'], charges: [-3] },
  { name: 'tartrate', forms: ['C4H4O6'], charges: [-2] },
  { name: 'lactate', forms: ['C3H5O3'], charges: [-1] },
  { name: 'benzoate', forms: ['C6H5COO', 'C7H5O2'], charges: [-1] },
  { name: 'cyanide', forms: ['CN'], charges: [-1], states: { C: 2, N: -3 }, ...mem(1.91) },
  { name: 'cyanate', forms: ['OCN', 'NCO'], charges: [-1], states: { O: -2, C: 4, N: -3 } },
  { name: 'thiocyanate', forms: ['SCN', 'NCS'], charges: [-1], states: { S: -2, C: 4, N: -3 }, ...mem(2.2) },
  { name: 'permanganate', forms: ['MnO4'], charges: [-1, -2], namesByCharge: { [-2]: 'manganate' }, ...mem(2.4) },
  { name: 'chromate', forms: ['CrO4'], charges: [-2], ...mem(2.29) },
  { name: 'dichromate', forms: ['Cr2O7'], charges: [-2] },
  { name: 'ferrate', forms: ['FeO4'], charges: [-2] },
  { name: 'molybdate', forms: ['MoO4'], charges: [-2], ...mem(2.31) },
  { name: 'tungstate', forms: ['WO4'], charges: [-2] },
  { name: 'vanadate', forms: ['VO4'], charges: [-3] },
  { name: 'metavanadate', forms: ['VO3'], charges: [-1] },
  { name: 'perchlorate', forms: ['ClO4'], charges: [-1], ...mem(2.4) },
  { name: 'chlorate', forms: ['ClO3'], charges: [-1], ...mem(1.71) },
  { name: 'chlorite', forms: ['ClO2'], charges: [-1] },
  { name: 'hypochlorite', forms: ['ClO', 'OCl'], charges: [-1] },
  { name: 'bromate', forms: ['BrO3'], charges: [-1], ...mem(1.54) },
  { name: 'hypobromite', forms: ['BrO', 'OBr'], charges: [-1] },
  { name: 'iodate', forms: ['IO3'], charges: [-1], ...mem(1.81) },
  { name: 'periodate', forms: ['IO4'], charges: [-1], ...mem(2.49) },
  { name: 'silicate', forms: ['SiO4'], charges: [-4] },
  { name: 'metasilicate', forms: ['SiO3'], charges: [-2] },
  { name: 'borate', forms: ['BO3'], charges: [-3] },
  { name: 'metaborate', forms: ['BO2'], charges: [-1] },
  { name: 'tetraborate', forms: ['B4O7'], charges: [-2] },
  { name: 'tetrafluoroborate', forms: ['BF4'], charges: [-1], ...mem(2.32) },
  { name: 'hexafluorophosphate', forms: ['PF6'], charges: [-1], ...mem(2.42) },
  { name: 'hexafluorosilicate', forms: ['SiF6'], charges: [-2], ...mem(2.48) },
  { name: 'tetrahydroborate', forms: ['BH4'], charges: [-1], states: { B: 3, H: -1 }, ...mem(2.05) },
  { name: 'tetrahydroaluminate', forms: ['AlH4'], charges: [-1], states: { Al: 3, H: -1 } },
  { name: 'tetrachloroaluminate', forms: ['AlCl4'], charges: [-1], ...mem(2.95) },
  { name: 'aluminate', forms: ['AlO2'], charges: [-1] },
  { name: 'arsenate', forms: ['AsO4'], charges: [-3], ...mem(2.48) },
  { name: 'arsenite', forms: ['AsO3'], charges: [-3] },
  { name: 'selenate', forms: ['SeO4'], charges: [-2], ...mem(2.43) },
  { name: 'selenite', forms: ['SeO3'], charges: [-2], ...mem(2.39) },
  { name: 'azide', forms: ['N3'], charges: [-1], ...mem(1.95) },
  { name: 'hydrogen difluoride', forms: ['HF2'], charges: [-1], states: { H: 1, F: -1 }, radius: 1.72 },
  { name: 'peroxide', forms: ['O2'], charges: [-2, -1], namesByCharge: { [-1]: 'superoxide' }, ...mem(1.73) },
  { name: 'disulfide', forms: ['S2'], charges: [-2] },
  { name: 'acetylide', forms: ['C2'], charges: [-2] },
  { name: 'triiodide', forms: ['I3'], charges: [-1] },
  { name: 'amide', forms: ['NH2'], charges: [-1] },
  { name: 'hydrogen sulfide', forms: ['HS'], charges: [-1], ...mem(2.07) },
];

export const CATIONS: IonDef[] = [
  { name: 'ammonium', forms: ['NH4'], charges: [1], states: { N: -3, H: 1 }, radius: 1.36 },
  { name: 'hydronium', forms: ['H3O'], charges: [1] },
  { name: 'mercury(I)', forms: ['Hg2'], charges: [2], states: { Hg: 1 } },
  { name: 'uranyl', forms: ['UO2'], charges: [2] },
  { name: 'vanadyl', forms: ['VO'], charges: [2] },
  { name: 'hydrazinium', forms: ['N2H5'], charges: [1] },
  { name: 'tetramethylammonium', forms: ['NMe4', 'Me4N'], charges: [1], states: { N: -3, C: -2, H: 1 } },
];

/** Ligands as they appear inside a complex (charge as a ligand). Source: IUPAC Red Book 2005, Table VII. */
export const LIGAND_CHARGES: Record<string, number> = {
  NH3: 0, H2O: 0, OH2: 0, CO: 0, NO: 0, PPh3: 0, py: 0, en: 0, bpy: 0, phen: 0,
  CN: -1, NC: -1, Cl: -1, F: -1, Br: -1, I: -1, OH: -1, NO2: -1, ONO: -1, SCN: -1, NCS: -1, N3: -1, H: -1,
  acac: -1, C2O4: -2, ox: -2, CO3: -2, SO4: -2, S2O3: -2, O: -2, edta: -4,
};
