/**
 * Acid–base systems: thermodynamic acid dissociation constants (pKa at I = 0, 25 °C unless a row says
 * another ionic strength) for the systems formulation chemists use, with the enthalpy of each step where
 * it is tabulated (for the van 't Hoff correction; a step without one is used at its 25 °C value).
 *
 * Each system has a basis form (the most deprotonated one, or the free base of an amine): the solver's
 * component. Every other form is the basis plus h protons, formed with log β = the sum of the pKa of the
 * steps between them. `formula` is the composition a salt's formula is matched against (reading.ts):
 * `KHC8H4O4` is K⁺ and C8H5O4 = hydrogen phthalate, whatever order it is written in. `readings` are
 * forms met only in what is weighed (borax's B4O7²⁻, metasilicate's SiO3²⁻, H2SO4): what they give in
 * water, as basis units and protons.
 *
 * Sources (tables/sources.ts): CRC Handbook dissociation constants unless a row says otherwise; EDTA at
 * I = 0.1 M from NIST SRD 46 (extrapolated to I = 0 by the model's own Davies equation, so that the
 * model gives back the measured constants at 0.1 M). Every value here was recalled (fromMemory).
 */
import type { Sourced } from './sources';

export interface AcidForm {
  /** Species label: ASCII, caret charge (`H2PO4^-`); the solver's id. */
  label: string;
  /** Composition matched against a salt's formula (no charge), where a salt can be written with it. */
  formula?: string;
  /** Protons relative to the basis form. */
  h: number;
  /** Common name of the form. */
  name: string;
}

/** A form met in what is weighed: what one unit of it gives in water, as basis units and protons. */
export interface Reading {
  formula: string;
  charge: number;
  name: string;
  /** Basis units per formula unit. */
  basis: number;
  /** Protons per formula unit relative to `basis` basis units (negative: hydroxide released). */
  h: number;
}

export interface AcidSystem extends Sourced {
  id: string;
  /** The acid's name (`phosphoric acid`), and the system's (`phosphate`). */
  acid: string;
  system: string;
  /** Charge of the basis form. */
  charge: number;
  /** Forms from the most protonated to the basis (the last). */
  forms: AcidForm[];
  /** Stepwise pKa, most protonated step first (forms.length − 1 values). */
  pKa: number[];
  /** Ionic strength (M) at which the pKa were measured (0: thermodynamic). */
  ionicStrength?: number;
  /** ΔH° of each dissociation step, kJ/mol (null: not tabulated), with its source. */
  dH?: Array<number | null>;
  dHSource?: Sourced;
  /** Forms only met in what is weighed. */
  readings?: Reading[];
  /** A short note the hover can show (borax, polyborates, CO2). */
  note?: string;
}

const crc = { source: 'CRC', fromMemory: true } as const;
const crcH = { source: 'CRC-H', fromMemory: true } as const;

/** A diprotic or larger system's forms from labels and compositions, most protonated first. */
const forms = (...list: Array<[label: string, formula: string | undefined, name: string]>): AcidForm[] =>
  list.map(([label, formula, name], k) => ({ label, ...(formula ? { formula } : {}), name, h: list.length - 1 - k }));

export const WATER = {
  pKw: 13.995,
  /** ΔH° of H2O → H⁺ + OH⁻, kJ/mol. */
  dH: 55.84,
  source: 'HARNED',
  fromMemory: true,
} as const;

export const ACID_SYSTEMS: AcidSystem[] = [
  {
    id: 'phosphate',
    acid: 'phosphoric acid',
    system: 'phosphate',
    charge: -3,
    forms: forms(
      ['H3PO4', 'H3PO4', 'phosphoric acid'],
      ['H2PO4^-', 'H2PO4', 'dihydrogen phosphate'],
      ['HPO4^2-', 'HPO4', 'hydrogen phosphate'],
      ['PO4^3-', 'PO4', 'phosphate'],
    ),
    // pKa2 7.198: Bates & Acree, the value behind the IUPAC phosphate standards.
    pKa: [2.148, 7.198, 12.35],
    dH: [-8.0, 3.6, 16.0],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'citrate',
    acid: 'citric acid',
    system: 'citrate',
    charge: -3,
    forms: forms(
      ['H3Cit', 'C6H8O7', 'citric acid'],
      ['H2Cit^-', 'C6H7O7', 'dihydrogen citrate'],
      ['HCit^2-', 'C6H6O7', 'hydrogen citrate'],
      ['Cit^3-', 'C6H5O7', 'citrate'],
    ),
    pKa: [3.128, 4.761, 6.396],
    dH: [4.1, 2.2, -3.4],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'acetate',
    acid: 'acetic acid',
    system: 'acetate',
    charge: -1,
    forms: forms(['CH3COOH', 'C2H4O2', 'acetic acid'], ['CH3COO^-', 'C2H3O2', 'acetate']),
    pKa: [4.756],
    dH: [-0.4],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'formate',
    acid: 'formic acid',
    system: 'formate',
    charge: -1,
    forms: forms(['HCOOH', 'CH2O2', 'formic acid'], ['HCOO^-', 'CHO2', 'formate']),
    pKa: [3.745],
    dH: [-0.2],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'lactate',
    acid: 'lactic acid',
    system: 'lactate',
    charge: -1,
    forms: forms(['HLac', 'C3H6O3', 'lactic acid'], ['Lac^-', 'C3H5O3', 'lactate']),
    pKa: [3.86],
    ...crc,
  },
  {
    id: 'carbonate',
    acid: 'carbonic acid',
    system: 'carbonate',
    charge: -2,
    forms: forms(['H2CO3', 'CH2O3', 'carbonic acid (CO₂(aq))'], ['HCO3^-', 'CHO3', 'hydrogen carbonate'], ['CO3^2-', 'CO3', 'carbonate']),
    // pKa1 counts dissolved CO2 and H2CO3 together, as tables do.
    pKa: [6.352, 10.329],
    dH: [9.15, 14.85],
    dHSource: crcH,
    readings: [{ formula: 'CO2', charge: 0, name: 'carbon dioxide', basis: 1, h: 2 }],
    note: 'Closed to air: no CO₂ is taken up or lost.',
    ...crc,
  },
  {
    id: 'borate',
    acid: 'boric acid',
    system: 'borate',
    charge: -1,
    forms: forms(['B(OH)3', 'BH3O3', 'boric acid'], ['B(OH)4^-', 'BH4O4', 'tetrahydroxyborate']),
    pKa: [9.237],
    dH: [13.8],
    dHSource: crcH,
    readings: [
      // Borax: B4O7²⁻ + 7 H2O → 2 B(OH)3 + 2 B(OH)4⁻.
      { formula: 'B4O7', charge: -2, name: 'tetraborate (borax)', basis: 4, h: 2 },
      { formula: 'BO2', charge: -1, name: 'metaborate', basis: 1, h: 0 },
      { formula: 'BO3', charge: -3, name: 'orthoborate', basis: 1, h: -2 },
    ],
    note: 'Polyborates (above about 0.025 M boron) are not modelled.',
    ...crc,
  },
  {
    id: 'phthalate',
    acid: 'phthalic acid',
    system: 'phthalate',
    charge: -2,
    forms: forms(['H2Phth', 'C8H6O4', 'phthalic acid'], ['HPhth^-', 'C8H5O4', 'hydrogen phthalate'], ['Phth^2-', 'C8H4O4', 'phthalate']),
    pKa: [2.943, 5.432],
    ...crc,
  },
  {
    id: 'oxalate',
    acid: 'oxalic acid',
    system: 'oxalate',
    charge: -2,
    forms: forms(['H2C2O4', 'C2H2O4', 'oxalic acid'], ['HC2O4^-', 'C2HO4', 'hydrogen oxalate'], ['C2O4^2-', 'C2O4', 'oxalate']),
    pKa: [1.25, 4.266],
    ...crc,
  },
  {
    id: 'tartrate',
    acid: 'tartaric acid',
    system: 'tartrate',
    charge: -2,
    forms: forms(['H2Tart', 'C4H6O6', 'tartaric acid'], ['HTart^-', 'C4H5O6', 'hydrogen tartrate'], ['Tart^2-', 'C4H4O6', 'tartrate']),
    pKa: [3.036, 4.366],
    ...crc,
  },
  {
    id: 'sulfate',
    acid: 'sulfuric acid',
    system: 'sulfate',
    charge: -2,
    forms: forms(['HSO4^-', 'HSO4', 'hydrogen sulfate'], ['SO4^2-', 'SO4', 'sulfate']),
    // The first proton is fully dissociated (pKa1 about −3).
    pKa: [1.99],
    dH: [-22.4],
    dHSource: crcH,
    readings: [{ formula: 'H2SO4', charge: 0, name: 'sulfuric acid', basis: 1, h: 2 }],
    ...crc,
  },
  {
    id: 'sulfite',
    acid: 'sulfurous acid',
    system: 'sulfite',
    charge: -2,
    // pKa1 counts dissolved SO2 and H2SO3 together.
    forms: forms(['H2SO3', 'H2SO3', 'sulfurous acid (SO₂(aq))'], ['HSO3^-', 'HSO3', 'hydrogen sulfite'], ['SO3^2-', 'SO3', 'sulfite']),
    pKa: [1.86, 7.17],
    readings: [
      // Metabisulfite: S2O5²⁻ + H2O → 2 HSO3⁻.
      { formula: 'S2O5', charge: -2, name: 'disulfite (metabisulfite)', basis: 2, h: 2 },
      { formula: 'SO2', charge: 0, name: 'sulfur dioxide', basis: 1, h: 2 },
    ],
    ...crc,
  },
  {
    id: 'sulfamate',
    acid: 'sulfamic acid',
    system: 'sulfamate',
    charge: -1,
    forms: forms(['H3NSO3', 'H3NO3S', 'sulfamic acid'], ['NH2SO3^-', 'H2NO3S', 'sulfamate']),
    pKa: [0.99],
    ...crc,
  },
  {
    id: 'hypophosphite',
    acid: 'hypophosphorous acid',
    system: 'hypophosphite',
    charge: -1,
    forms: forms(['H3PO2', 'H3PO2', 'hypophosphorous acid'], ['H2PO2^-', 'H2PO2', 'hypophosphite']),
    pKa: [1.2],
    ...crc,
  },
  {
    id: 'phosphite',
    acid: 'phosphorous acid',
    system: 'phosphite',
    charge: -2,
    forms: forms(['H3PO3', 'H3PO3', 'phosphorous acid'], ['H2PO3^-', 'H2PO3', 'dihydrogen phosphite'], ['HPO3^2-', 'HPO3', 'phosphite']),
    pKa: [1.3, 6.7],
    ...crc,
  },
  {
    id: 'fluoride',
    acid: 'hydrofluoric acid',
    system: 'fluoride',
    charge: -1,
    forms: forms(['HF', 'HF', 'hydrogen fluoride'], ['F^-', 'F', 'fluoride']),
    pKa: [3.17],
    dH: [-13.3],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'sulfide',
    acid: 'hydrogen sulfide',
    system: 'sulfide',
    charge: -1,
    // Basis HS⁻: S²⁻ is formed with pKa2 ≈ 19 (older tables give 12.9–17; it matters only above pH 14).
    forms: forms(['H2S', 'H2S', 'hydrogen sulfide'], ['HS^-', 'HS', 'hydrogen sulfide ion']),
    pKa: [7.02],
    dH: [22.2],
    dHSource: crcH,
    readings: [{ formula: 'S', charge: -2, name: 'sulfide', basis: 1, h: -1 }],
    ...crc,
  },
  {
    id: 'silicate',
    acid: 'silicic acid',
    system: 'silicate',
    charge: -2,
    forms: forms(['H4SiO4', 'H4SiO4', 'silicic acid'], ['H3SiO4^-', 'H3SiO4', 'trihydrogen silicate'], ['H2SiO4^2-', 'H2SiO4', 'dihydrogen silicate']),
    pKa: [9.84, 13.2],
    readings: [
      { formula: 'SiO3', charge: -2, name: 'metasilicate', basis: 1, h: 0 },
      { formula: 'SiO4', charge: -4, name: 'orthosilicate', basis: 1, h: -2 },
    ],
    ...crc,
  },
  {
    id: 'cyanide',
    acid: 'hydrogen cyanide',
    system: 'cyanide',
    charge: -1,
    forms: forms(['HCN', 'CHN', 'hydrogen cyanide'], ['CN^-', 'CN', 'cyanide']),
    pKa: [9.21],
    dH: [43.6],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'ammonia',
    acid: 'ammonium',
    system: 'ammonia',
    charge: 0,
    forms: forms(['NH4^+', 'NH4', 'ammonium'], ['NH3', 'NH3', 'ammonia']),
    pKa: [9.245],
    dH: [52.2],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'mea',
    acid: 'ethanolammonium',
    system: 'ethanolamine (MEA)',
    charge: 0,
    forms: forms(['MEAH^+', 'C2H8NO', 'ethanolammonium'], ['MEA', 'C2H7NO', 'ethanolamine']),
    pKa: [9.5],
    dH: [50.5],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'dea',
    acid: 'diethanolammonium',
    system: 'diethanolamine (DEA)',
    charge: 0,
    forms: forms(['DEAH^+', 'C4H12NO2', 'diethanolammonium'], ['DEA', 'C4H11NO2', 'diethanolamine']),
    pKa: [8.88],
    dH: [42.1],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'tea',
    acid: 'triethanolammonium',
    system: 'triethanolamine (TEA)',
    charge: 0,
    forms: forms(['TEAH^+', 'C6H16NO3', 'triethanolammonium'], ['TEA', 'C6H15NO3', 'triethanolamine']),
    pKa: [7.76],
    dH: [33.6],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'tris',
    acid: 'TRIS-H⁺',
    system: 'TRIS',
    charge: 0,
    forms: forms(['TRISH^+', 'C4H12NO3', 'TRIS-H⁺'], ['TRIS', 'C4H11NO3', 'TRIS (tris(hydroxymethyl)aminomethane)']),
    pKa: [8.072],
    dH: [47.45],
    dHSource: { source: 'BATES', fromMemory: true },
    source: 'BATES',
    fromMemory: true,
  },
  {
    id: 'glycine',
    acid: 'glycine',
    system: 'glycine',
    charge: -1,
    forms: forms(['H2Gly^+', 'C2H6NO2', 'glycinium'], ['HGly', 'C2H5NO2', 'glycine (zwitterion)'], ['Gly^-', 'C2H4NO2', 'glycinate']),
    pKa: [2.35, 9.778],
    dH: [4.0, 44.2],
    dHSource: crcH,
    ...crc,
  },
  {
    id: 'edta',
    acid: 'EDTA',
    system: 'EDTA',
    charge: -4,
    forms: forms(
      ['H6EDTA^2+', 'C10H18N2O8', 'H₆EDTA²⁺'],
      ['H5EDTA^+', 'C10H17N2O8', 'H₅EDTA⁺'],
      ['H4EDTA', 'C10H16N2O8', 'EDTA (acid)'],
      ['H3EDTA^-', 'C10H15N2O8', 'H₃EDTA⁻'],
      ['H2EDTA^2-', 'C10H14N2O8', 'H₂EDTA²⁻'],
      ['HEDTA^3-', 'C10H13N2O8', 'HEDTA³⁻'],
      ['EDTA^4-', 'C10H12N2O8', 'EDTA⁴⁻'],
    ),
    pKa: [0.0, 1.5, 2.0, 2.69, 6.13, 10.37],
    ionicStrength: 0.1,
    source: 'NIST46',
    fromMemory: true,
  },
];
