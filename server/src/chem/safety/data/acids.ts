/**
 * Acid–base systems for the safety reading's own estimate of a batch's pH (used where the solution
 * chemistry gives none) and for the heat of neutralisation: each system's successive pKa values at 25 °C
 * and zero ionic strength, the enthalpy of each ionisation step (kJ/mol, HA → H⁺ + A⁻), and the charge of
 * its most protonated form.
 *
 * Sources (all FROM MEMORY, none of the books at hand):
 * - pKa: CRC Handbook of Chemistry and Physics, "Dissociation constants of inorganic acids and bases" and
 *   "Dissociation constants of organic acids and bases".
 * - ΔionH of the buffers (phosphate, carbonate, acetate, citrate, borate, ammonium, Tris, the
 *   ethanolamines, glycine, HEPES, MES): R. N. Goldberg, N. Kishore, R. M. Lennen, "Thermodynamic
 *   quantities for the ionization reactions of buffers", J. Phys. Chem. Ref. Data 31 (2002) 231.
 * - ΔionH of the others: differences of ΔfH° in the NBS tables (Wagman et al. 1982), e.g. HCN(aq) →
 *   CN⁻(aq): 150.6 − 107.1 = 43.5 kJ/mol. `null` where no value is known: the step is then counted as
 *   zero and the heat says so.
 * - Water: pKw 14.00 and ΔH = +55.84 kJ/mol (NBS: ΔfH°(H2O, l) − ΔfH°(OH⁻, aq) = −285.83 + 229.99).
 */

export interface AcidSystem {
  id: string;
  /** The acid in plain words (its most protonated form). */
  name: string;
  /** Charge of the most protonated form (HSO₄⁻ −1, NH₄⁺ +1, H₃PO₄ 0). */
  z0: number;
  pKa: readonly number[];
  /** ΔionH of each step, kJ/mol; null where not known. */
  dH: ReadonlyArray<number | null>;
}

export const PKW = 14.0;
export const WATER_IONISATION_KJ = 55.84;

const s = (id: string, name: string, z0: number, pKa: number[], dH: Array<number | null>): AcidSystem => ({ id, name, z0, pKa, dH });

export const ACID_SYSTEMS: Readonly<Record<string, AcidSystem>> = Object.freeze({
  hso4: s('hso4', 'hydrogen sulfate', -1, [1.99], [-21.9]),
  phosphate: s('phosphate', 'phosphoric acid', 0, [2.15, 7.2, 12.35], [-8.0, 3.6, 16.0]),
  diphosphate: s('diphosphate', 'diphosphoric acid', 0, [0.91, 2.1, 6.7, 9.32], [null, null, null, null]),
  carbonate: s('carbonate', 'carbonic acid (CO₂ aq)', 0, [6.35, 10.33], [9.15, 14.7]),
  sulfite: s('sulfite', 'sulfurous acid (SO₂ aq)', 0, [1.86, 7.17], [-17.4, -9.3]),
  acetate: s('acetate', 'acetic acid', 0, [4.76], [-0.41]),
  formate: s('formate', 'formic acid', 0, [3.75], [-0.2]),
  propionate: s('propionate', 'propionic acid', 0, [4.87], [-0.7]),
  lactate: s('lactate', 'lactic acid', 0, [3.86], [-0.3]),
  glycolate: s('glycolate', 'glycolic acid', 0, [3.83], [null]),
  gluconate: s('gluconate', 'gluconic acid', 0, [3.86], [null]),
  benzoate: s('benzoate', 'benzoic acid', 0, [4.2], [null]),
  citrate: s('citrate', 'citric acid', 0, [3.13, 4.76, 6.4], [4.07, 2.23, -3.38]),
  tartrate: s('tartrate', 'tartaric acid', 0, [3.04, 4.37], [null, null]),
  oxalate: s('oxalate', 'oxalic acid', 0, [1.25, 4.27], [null, 7.0]),
  succinate: s('succinate', 'succinic acid', 0, [4.21, 5.64], [null, null]),
  ascorbate: s('ascorbate', 'ascorbic acid', 0, [4.1, 11.6], [null, null]),
  edta: s('edta', 'edetic acid (EDTA)', 0, [2.0, 2.69, 6.13, 10.37], [null, null, null, null]),
  borate: s('borate', 'boric acid', 0, [9.24], [13.8]),
  silicate: s('silicate', 'silicic acid', 0, [9.84, 13.2], [null, null]),
  ammonium: s('ammonium', 'ammonium', 1, [9.25], [52.2]),
  tris: s('tris', 'Tris (protonated)', 1, [8.07], [47.45]),
  mea: s('mea', 'ethanolammonium', 1, [9.5], [50.5]),
  dea: s('dea', 'diethanolammonium', 1, [8.88], [42.1]),
  tea: s('tea', 'triethanolammonium', 1, [7.76], [33.6]),
  en: s('en', 'ethylenediammonium', 2, [6.85, 9.93], [45.3, 49.0]),
  glycine: s('glycine', 'glycine (cation)', 1, [2.35, 9.78], [4.0, 44.2]),
  hepes: s('hepes', 'HEPES', 0, [7.56], [20.4]),
  mes: s('mes', 'MES', 0, [6.27], [14.8]),
  hcn: s('hcn', 'hydrogen cyanide', 0, [9.21], [43.5]),
  h2s: s('h2s', 'hydrogen sulfide', 0, [7.0, 13.9], [22.1, null]),
  hocl: s('hocl', 'hypochlorous acid', 0, [7.53], [13.8]),
  hclo2: s('hclo2', 'chlorous acid', 0, [1.96], [-14.6]),
  hno2: s('hno2', 'nitrous acid', 0, [3.25], [14.6]),
  hn3: s('hn3', 'hydrazoic acid', 0, [4.72], [15.1]),
  hf: s('hf', 'hydrofluoric acid', 0, [3.17], [-12.6]),
  chromate: s('chromate', 'hydrogen chromate', -1, [6.51], [-3.0]),
  fe3: s('fe3', 'iron(III) (aqua ion)', 3, [2.19], [null]),
  al3: s('al3', 'aluminium (aqua ion)', 3, [4.97], [null]),
});

/** Systems by the name of their ions in chem/data/ions.ts: [system, units per ion]. */
export const ANION_SYSTEMS: Readonly<Record<string, readonly [string, number]>> = Object.freeze({
  sulfate: ['hso4', 1],
  'hydrogen sulfate': ['hso4', 1],
  phosphate: ['phosphate', 1],
  'hydrogen phosphate': ['phosphate', 1],
  'dihydrogen phosphate': ['phosphate', 1],
  diphosphate: ['diphosphate', 1],
  carbonate: ['carbonate', 1],
  'hydrogen carbonate': ['carbonate', 1],
  sulfite: ['sulfite', 1],
  'hydrogen sulfite': ['sulfite', 1],
  disulfite: ['sulfite', 2],
  acetate: ['acetate', 1],
  formate: ['formate', 1],
  lactate: ['lactate', 1],
  glycolate: ['glycolate', 1],
  gluconate: ['gluconate', 1],
  benzoate: ['benzoate', 1],
  citrate: ['citrate', 1],
  'hydrogen citrate': ['citrate', 1],
  'dihydrogen citrate': ['citrate', 1],
  tartrate: ['tartrate', 1],
  'hydrogen tartrate': ['tartrate', 1],
  oxalate: ['oxalate', 1],
  'hydrogen oxalate': ['oxalate', 1],
  edetate: ['edta', 1],
  'hydrogen edetate': ['edta', 1],
  'dihydrogen edetate': ['edta', 1],
  'trihydrogen edetate': ['edta', 1],
  borate: ['borate', 1],
  metaborate: ['borate', 1],
  tetraborate: ['borate', 4],
  metasilicate: ['silicate', 1],
  silicate: ['silicate', 1],
  cyanide: ['hcn', 1],
  'hydrogen sulfide': ['h2s', 1],
  hypochlorite: ['hocl', 1],
  chlorite: ['hclo2', 1],
  nitrite: ['hno2', 1],
  azide: ['hn3', 1],
  chromate: ['chromate', 1],
  dichromate: ['chromate', 2],
  'hydrogen difluoride': ['hf', 2],
});

/**
 * Molecular acids and bases by Hill formula (the main part, without water of crystallisation): the
 * system, units per molecule, and the fixed charge the molecule leaves in water (a strong acid's anion).
 * Where one Hill formula has isomers, the row is for the usual reagent (C2H4O2 acetic acid, C3H6O3 lactic
 * acid, C2H7NO ethanolamine).
 */
export interface MolecularAcidBase {
  name: string;
  system?: string;
  units?: number;
  /**
   * Charge per molecule left as an ion outside any system (the anion of a strong acid: HCl → −1); a base
   * such as NH3 leaves none: its charge is its system's (NH₄⁺ or NH₃ by pH).
   */
  fixed?: number;
  /** A strong acid, fully dissociated (its first proton, for H2SO4). */
  strong?: boolean;
}

export const MOLECULAR_ACID_BASE: Readonly<Record<string, MolecularAcidBase>> = Object.freeze({
  ClH: { name: 'hydrochloric acid', fixed: -1, strong: true },
  BrH: { name: 'hydrobromic acid', fixed: -1, strong: true },
  HI: { name: 'hydriodic acid', fixed: -1, strong: true },
  HNO3: { name: 'nitric acid', fixed: -1, strong: true },
  ClHO4: { name: 'perchloric acid', fixed: -1, strong: true },
  ClHO3: { name: 'chloric acid', fixed: -1, strong: true },
  H2O4S: { name: 'sulfuric acid', system: 'hso4', units: 1, strong: true },
  O3S: { name: 'sulfur trioxide (as sulfuric acid)', system: 'hso4', units: 1, strong: true },
  CH4O3S: { name: 'methanesulfonic acid', fixed: -1, strong: true },
  ClHO3S: { name: 'chlorosulfonic acid', system: 'hso4', units: 1, fixed: -1, strong: true },
  H3NO3S: { name: 'sulfamic acid', fixed: -1 },
  CrO3: { name: 'chromium trioxide (chromic acid)', system: 'chromate', units: 1, strong: true },
  H3O4P: { name: 'phosphoric acid', system: 'phosphate', units: 1 },
  O10P4: { name: 'phosphorus pentoxide (as phosphoric acid)', system: 'phosphate', units: 4 },
  O5P2: { name: 'phosphorus pentoxide (as phosphoric acid)', system: 'phosphate', units: 2 },
  H4O7P2: { name: 'diphosphoric acid', system: 'diphosphate', units: 1 },
  O2S: { name: 'sulfur dioxide', system: 'sulfite', units: 1 },
  CO2: { name: 'carbon dioxide', system: 'carbonate', units: 1 },
  C2H4O2: { name: 'acetic acid', system: 'acetate', units: 1 },
  CH2O2: { name: 'formic acid', system: 'formate', units: 1 },
  C3H6O2: { name: 'propionic acid', system: 'propionate', units: 1 },
  C3H6O3: { name: 'lactic acid', system: 'lactate', units: 1 },
  C2H4O3: { name: 'glycolic acid', system: 'glycolate', units: 1 },
  C6H12O7: { name: 'gluconic acid', system: 'gluconate', units: 1 },
  C7H6O2: { name: 'benzoic acid', system: 'benzoate', units: 1 },
  C6H8O7: { name: 'citric acid', system: 'citrate', units: 1 },
  C4H6O6: { name: 'tartaric acid', system: 'tartrate', units: 1 },
  C2H2O4: { name: 'oxalic acid', system: 'oxalate', units: 1 },
  C4H6O4: { name: 'succinic acid', system: 'succinate', units: 1 },
  C6H8O6: { name: 'ascorbic acid', system: 'ascorbate', units: 1 },
  C10H16N2O8: { name: 'edetic acid (EDTA)', system: 'edta', units: 1 },
  BH3O3: { name: 'boric acid', system: 'borate', units: 1 },
  CHN: { name: 'hydrogen cyanide', system: 'hcn', units: 1 },
  H2S: { name: 'hydrogen sulfide', system: 'h2s', units: 1 },
  ClHO: { name: 'hypochlorous acid', system: 'hocl', units: 1 },
  HNO2: { name: 'nitrous acid', system: 'hno2', units: 1 },
  HN3: { name: 'hydrazoic acid', system: 'hn3', units: 1 },
  FH: { name: 'hydrofluoric acid', system: 'hf', units: 1 },
  Cl2: { name: 'chlorine (as HOCl + HCl)', system: 'hocl', units: 1, fixed: -1 },
  H3N: { name: 'ammonia', system: 'ammonium', units: 1 },
  C4H11NO3: { name: 'Tris', system: 'tris', units: 1 },
  C2H7NO: { name: 'ethanolamine', system: 'mea', units: 1 },
  C4H11NO2: { name: 'diethanolamine', system: 'dea', units: 1 },
  C6H15NO3: { name: 'triethanolamine', system: 'tea', units: 1 },
  C2H8N2: { name: 'ethylenediamine', system: 'en', units: 1 },
  C2H5NO2: { name: 'glycine', system: 'glycine', units: 1 },
  C8H18N2O4S: { name: 'HEPES', system: 'hepes', units: 1 },
  C6H13NO4S: { name: 'MES', system: 'mes', units: 1 },
});
