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
  /** A chain of like atoms (peroxide, superoxide, ozonide, disulfide, polysulfide): read only where no oxide or sulfide reading with usual states exists. */
  catenated?: boolean;
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
  { name: 'peroxide', forms: ['O2'], charges: [-2, -1], namesByCharge: { [-1]: 'superoxide' }, catenated: true, ...mem(1.73) },
  { name: 'disulfide', forms: ['S2'], charges: [-2], catenated: true },
  { name: 'acetylide', forms: ['C2'], charges: [-2] },
  { name: 'triiodide', forms: ['I3'], charges: [-1] },
  { name: 'amide', forms: ['NH2'], charges: [-1] },
  { name: 'hydrogen sulfide', forms: ['HS'], charges: [-1], ...mem(2.07) },
  // Sulfur oxoanions and chains (Greenwood & Earnshaw, ch. 15; IUPAC Red Book 2005, Table IX).
  { name: 'dithionate', forms: ['S2O6'], charges: [-2] },
  { name: 'trithionate', forms: ['S3O6'], charges: [-2] },
  { name: 'tetrathionate', forms: ['S4O6'], charges: [-2] },
  { name: 'pentathionate', forms: ['S5O6'], charges: [-2] },
  { name: 'trisulfide', forms: ['S3'], charges: [-2], catenated: true },
  { name: 'tetrasulfide', forms: ['S4'], charges: [-2], catenated: true },
  { name: 'pentasulfide', forms: ['S5'], charges: [-2], catenated: true },
  { name: 'hexasulfide', forms: ['S6'], charges: [-2], catenated: true },
  { name: 'polysulfide', forms: ['Sx'], charges: [-2], catenated: true },
  { name: 'ozonide', forms: ['O3'], charges: [-1], catenated: true },
  { name: 'sulfamate', forms: ['SO3NH2', 'NH2SO3', 'H2NSO3', 'OSO2NH2'], charges: [-1], states: { N: -3 } },
  // Sulfonates: with Pauling's values (C 2.55 < S 2.58) the C–S bond's electrons go to S, so S is +4.
  { name: 'methanesulfonate', forms: ['CH3SO3', 'SO3CH3'], charges: [-1], states: { S: 4, C: -2 } },
  // Phosphates (Greenwood & Earnshaw, ch. 12): triphosphate (tripolyphosphate), cyclic trimetaphosphate,
  // metaphosphate as in (NaPO3)n.
  { name: 'triphosphate', forms: ['P3O10'], charges: [-5] },
  { name: 'trimetaphosphate', forms: ['P3O9'], charges: [-3] },
  { name: 'metaphosphate', forms: ['PO3'], charges: [-1] },
  { name: 'hexametaphosphate', forms: ['P6O18'], charges: [-6] },
  // Perborate: the peroxoborate of the trade formula NaBO3·4H2O (really Na2[B2(O2)2(OH)4]·6H2O;
  // Greenwood & Earnshaw, ch. 6): B +3, O −4/3 on average.
  { name: 'perborate', forms: ['BO3'], charges: [-1], states: { B: 3, O: -4 / 3 }, catenated: true },
  { name: 'zincate', forms: ['ZnO2'], charges: [-2] },
  { name: 'stannate', forms: ['SnO3'], charges: [-2] },
  // Alkoxides (IUPAC Red Book 2005, Table IX: methanolate, ethanolate…; common practice for the forms).
  { name: 'methoxide', forms: ['OCH3', 'CH3O', 'OMe', 'MeO'], charges: [-1] },
  { name: 'ethoxide', forms: ['OC2H5', 'C2H5O', 'OEt', 'EtO'], charges: [-1] },
  { name: 'propoxide', forms: ['OC3H7', 'C3H7O', 'OCH(CH3)2'], charges: [-1] },
  { name: 'butoxide', forms: ['OC4H9', 'C4H9O', 'OBu', 'OC(CH3)3'], charges: [-1] },
  // Organic anions of formulation work: charges of the fully or partly deprotonated acids (CRC Handbook,
  // "Dissociation constants of organic acids and bases"; common practice for the formulas).
  { name: 'hydrogen citrate', forms: ['C6H6O7', 'HC6H5O7'], charges: [-2], weak: true },
  { name: 'dihydrogen citrate', forms: ['C6H7O7', 'H2C6H5O7'], charges: [-1], weak: true },
  { name: 'gluconate', forms: ['C6H11O7', 'HOCH2(CHOH)4COO'], charges: [-1] },
  { name: 'glycolate', forms: ['C2H3O3', 'HOCH2COO'], charges: [-1] },
  { name: 'hydrogen oxalate', forms: ['HC2O4', 'C2HO4'], charges: [-1], weak: true },
  { name: 'hydrogen tartrate', forms: ['C4H5O6', 'HC4H4O6'], charges: [-1], weak: true },
  { name: 'stearate', forms: ['C17H35COO', 'C18H35O2', 'C17H35CO2'], charges: [-1] },
  { name: 'edetate', forms: ['C10H12N2O8'], charges: [-4], states: { N: -3 } },
  { name: 'hydrogen edetate', forms: ['C10H13N2O8'], charges: [-3], states: { N: -3 }, weak: true },
  { name: 'dihydrogen edetate', forms: ['C10H14N2O8'], charges: [-2], states: { N: -3 }, weak: true },
  { name: 'trihydrogen edetate', forms: ['C10H15N2O8'], charges: [-1], states: { N: -3 }, weak: true },
  { name: 'nitrilotriacetate', forms: ['C6H6NO6', 'N(CH2COO)3'], charges: [-3], states: { N: -3 } },
  { name: 'dodecyl sulfate', forms: ['C12H25SO4', 'C12H25OSO3', 'CH3(CH2)11OSO3'], charges: [-1] },
  { name: 'dodecylbenzenesulfonate', forms: ['C18H29SO3', 'C12H25C6H4SO3'], charges: [-1], states: { S: 4 } },
  { name: 'saccharinate', forms: ['C7H4NO3S'], charges: [-1], states: { N: -3 } },
  // Dichloroisocyanurate: the chlorine counted +1 as the trade does (it is released as HOCl).
  { name: 'dichloroisocyanurate', forms: ['C3Cl2N3O3', 'Cl2C3N3O3'], charges: [-1], states: { C: 4, N: -3, Cl: 1 } },
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
