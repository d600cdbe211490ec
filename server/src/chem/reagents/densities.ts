/**
 * Densities of the liquids a formulation pours: the commercial aqueous reagents as functions of their
 * mass fraction, and the pure liquids, all at 20 °C.
 *
 * Sources (the `src` of each table; every row is from its table's source unless the row names its own):
 * - CRC-CPAS: CRC Handbook of Chemistry and Physics, Section 5, "Concentrative Properties of Aqueous
 *   Solutions: Density, Refractive Index, Freezing Point Depression, and Viscosity" (density at 20 °C
 *   against mass percent of solute). The values here were RECALLED FROM MEMORY of that table, not read
 *   from a copy at hand; they agree with the handbook's usual molarities of the concentrated reagents
 *   (96 % sulfuric acid ≈ 18.0 M, 37 % hydrochloric ≈ 12.0 M, 70 % nitric ≈ 15.7 M, 28 % ammonia ≈ 14.8 M,
 *   50 % sodium hydroxide ≈ 19.1 M), which the tests check.
 * - PERRY: Perry's Chemical Engineers' Handbook, Section 2, density tables of aqueous acids (hydrofluoric
 *   acid, formic acid), from memory.
 * - SOLVAY-H2O2: the hydrogen peroxide producers' technical data (density of aqueous H2O2 at 20 °C), from
 *   memory.
 * - CRC-ORG: CRC Handbook, Section 3, "Physical Constants of Organic Compounds" (density at 20 °C), from
 *   memory; water: CRC Handbook, Section 6, "Properties of Water in the Range 0–100 °C" (0.99821 g/mL at
 *   20 °C).
 *
 * These are densities of the reagent grade at 20 °C: the label's or the certificate's value wins, and a
 * shelf entry may give it.
 */

/** Density of water at 20 °C, g/mL (CRC Handbook, Section 6). */
export const WATER_20C = 0.99821;

export interface DensityTable {
  /** Identifier (stable, for messages and tests). */
  id: string;
  /** The reagent as the trade names it. */
  name: string;
  /** The solute's formula (ASCII): the assay is the mass fraction of this. */
  formula: string;
  /** Other written forms that mean this solute (`CH3CO2H` for acetic acid). */
  forms: string[];
  /**
   * `[mass percent, density g/mL at 20 °C, source]`, ascending in mass percent; a row without its own
   * source is from the table's `src`. The 0 % row is water (CRC Handbook, Section 6).
   */
  rows: ReadonlyArray<readonly [number, number, string?]>;
  src: string;
  /** The usual commercial strengths (% by mass), for messages. */
  commercial: string;
  /** The pure substance is a liquid one pours (an assay may be left out: 100 % is taken). */
  pureLiquid: boolean;
}

const w = WATER_20C;
const WATER_SRC = 'CRC Handbook, Section 6 (water at 20 °C)';

export const AQUEOUS: DensityTable[] = [
  {
    id: 'sulfuric',
    name: 'sulfuric acid',
    formula: 'H2SO4',
    forms: ['H2SO4'],
    rows: [
      [0, w, WATER_SRC],
      [1, 1.0051],
      [2, 1.0118],
      [5, 1.0317],
      [10, 1.0661],
      [15, 1.102],
      [20, 1.1394],
      [25, 1.1783],
      [30, 1.2185],
      [35, 1.2599],
      [40, 1.3028],
      [45, 1.3476],
      [50, 1.3951],
      [55, 1.4453],
      [60, 1.4983],
      [65, 1.5533],
      [70, 1.6105],
      [75, 1.6692],
      [80, 1.7272],
      [85, 1.7786],
      [90, 1.8144],
      [92, 1.824],
      [94, 1.8312],
      [96, 1.8355],
      [98, 1.8361],
      [100, 1.8305],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: '93–98 %',
    pureLiquid: true,
  },
  {
    id: 'hydrochloric',
    name: 'hydrochloric acid',
    formula: 'HCl',
    forms: ['HCl'],
    rows: [
      [0, w, WATER_SRC],
      [1, 1.0032],
      [2, 1.0082],
      [4, 1.0181],
      [6, 1.0279],
      [8, 1.0376],
      [10, 1.0474],
      [12, 1.0574],
      [14, 1.0675],
      [16, 1.0776],
      [18, 1.0878],
      [20, 1.098],
      [22, 1.1083],
      [24, 1.1187],
      [26, 1.129],
      [28, 1.1392],
      [30, 1.1493],
      [32, 1.1593],
      [34, 1.1691],
      [36, 1.1789],
      [38, 1.1885],
      [40, 1.198],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: '32–37 %',
    pureLiquid: false,
  },
  {
    id: 'nitric',
    name: 'nitric acid',
    formula: 'HNO3',
    forms: ['HNO3'],
    rows: [
      [0, w, WATER_SRC],
      [1, 1.0036],
      [2, 1.0091],
      [5, 1.0256],
      [10, 1.0543],
      [15, 1.0842],
      [20, 1.115],
      [25, 1.1469],
      [30, 1.18],
      [35, 1.214],
      [40, 1.2463],
      [45, 1.2783],
      [50, 1.31],
      [55, 1.3393],
      [60, 1.3667],
      [65, 1.3913],
      [70, 1.4134],
      [75, 1.4337],
      [80, 1.4521],
      [85, 1.4686],
      [90, 1.4826],
      [95, 1.4932],
      [100, 1.5129],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: '65–70 %; fuming 90–100 %',
    pureLiquid: true,
  },
  {
    id: 'phosphoric',
    name: 'phosphoric acid',
    formula: 'H3PO4',
    forms: ['H3PO4'],
    rows: [
      [0, w, WATER_SRC],
      [1, 1.0038],
      [2, 1.0092],
      [5, 1.0254],
      [10, 1.0523],
      [15, 1.0814],
      [20, 1.1134],
      [25, 1.146],
      [30, 1.1805],
      [35, 1.216],
      [40, 1.254],
      [45, 1.293],
      [50, 1.335],
      [55, 1.379],
      [60, 1.426],
      [65, 1.474],
      [70, 1.526],
      [75, 1.579],
      [80, 1.633],
      [85, 1.689],
      [90, 1.746],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: '75–85 %',
    pureLiquid: false,
  },
  {
    id: 'acetic',
    name: 'acetic acid',
    formula: 'CH3COOH',
    forms: ['CH3COOH', 'CH3CO2H', 'HC2H3O2', 'C2H4O2', 'AcOH', 'HOAc'],
    // Not monotonic: the density passes a maximum near 78 % (the hydrate CH3COOH·H2O region).
    rows: [
      [0, w, WATER_SRC],
      [1, 0.9996],
      [2, 1.0012],
      [5, 1.0055],
      [10, 1.0125],
      [15, 1.0195],
      [20, 1.0263],
      [25, 1.0326],
      [30, 1.0384],
      [35, 1.0438],
      [40, 1.0488],
      [45, 1.0534],
      [50, 1.0575],
      [55, 1.0611],
      [60, 1.0642],
      [65, 1.0666],
      [70, 1.0685],
      [75, 1.0696],
      [80, 1.07],
      [85, 1.0689],
      [90, 1.0661],
      [95, 1.0605],
      [100, 1.0498],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: 'glacial 99–100 %; 80 %',
    pureLiquid: true,
  },
  {
    id: 'formic',
    name: 'formic acid',
    formula: 'HCOOH',
    forms: ['HCOOH', 'HCO2H', 'CH2O2'],
    rows: [
      [0, w, WATER_SRC],
      [10, 1.0246],
      [20, 1.0488],
      [30, 1.0729],
      [40, 1.0963],
      [50, 1.1207],
      [60, 1.1424],
      [70, 1.1655],
      [80, 1.186],
      [90, 1.2044],
      [100, 1.2212],
    ],
    src: 'PERRY (from memory)',
    commercial: '85–98 %',
    pureLiquid: true,
  },
  {
    id: 'hydrofluoric',
    name: 'hydrofluoric acid',
    formula: 'HF',
    forms: ['HF'],
    rows: [
      [0, w, WATER_SRC],
      [10, 1.036],
      [20, 1.073],
      [30, 1.101],
      [40, 1.129],
      [48, 1.15],
      [50, 1.155],
    ],
    src: 'PERRY (from memory)',
    commercial: '40–50 %',
    pureLiquid: false,
  },
  {
    id: 'ammonia',
    name: 'ammonia solution',
    formula: 'NH3',
    forms: ['NH3', 'NH4OH'],
    rows: [
      [0, w, WATER_SRC],
      [1, 0.9939],
      [2, 0.9895],
      [4, 0.9811],
      [6, 0.973],
      [8, 0.9651],
      [10, 0.9575],
      [12, 0.9501],
      [14, 0.943],
      [16, 0.9362],
      [18, 0.9295],
      [20, 0.9229],
      [22, 0.9164],
      [24, 0.9101],
      [26, 0.904],
      [28, 0.898],
      [30, 0.892],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: '25–30 % (as NH3)',
    pureLiquid: false,
  },
  {
    id: 'sodium-hydroxide',
    name: 'sodium hydroxide solution',
    formula: 'NaOH',
    forms: ['NaOH'],
    rows: [
      [0, w, WATER_SRC],
      [1, 1.0095],
      [2, 1.0207],
      [4, 1.0428],
      [6, 1.0648],
      [8, 1.0869],
      [10, 1.1089],
      [12, 1.1309],
      [14, 1.153],
      [16, 1.1751],
      [18, 1.1972],
      [20, 1.2191],
      [24, 1.2629],
      [28, 1.3064],
      [32, 1.349],
      [36, 1.39],
      [40, 1.43],
      [44, 1.4685],
      [48, 1.5065],
      [50, 1.5253],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: '25 %, 32 %, 50 %',
    pureLiquid: false,
  },
  {
    id: 'potassium-hydroxide',
    name: 'potassium hydroxide solution',
    formula: 'KOH',
    forms: ['KOH'],
    rows: [
      [0, w, WATER_SRC],
      [1, 1.0083],
      [2, 1.0175],
      [4, 1.0359],
      [6, 1.0544],
      [8, 1.073],
      [10, 1.0918],
      [12, 1.1108],
      [14, 1.1299],
      [16, 1.1493],
      [18, 1.1688],
      [20, 1.1884],
      [24, 1.2286],
      [28, 1.27],
      [32, 1.3124],
      [36, 1.3561],
      [40, 1.3991],
      [45, 1.45],
      [50, 1.51],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: '45–50 %',
    pureLiquid: false,
  },
  {
    id: 'hydrogen-peroxide',
    name: 'hydrogen peroxide solution',
    formula: 'H2O2',
    forms: ['H2O2'],
    rows: [
      [0, w, WATER_SRC],
      [3, 1.0095],
      [6, 1.0205],
      [10, 1.035],
      [20, 1.073],
      [30, 1.1122],
      [35, 1.131],
      [40, 1.15],
      [50, 1.196],
      [60, 1.241],
      [70, 1.288],
      [80, 1.338],
      [90, 1.392],
      [100, 1.45],
    ],
    src: 'SOLVAY-H2O2 (from memory)',
    commercial: '3 %, 30–35 %, 50 %',
    pureLiquid: false,
  },
];

/**
 * Mixtures with water of the solvents a formulation dilutes (CRC-CPAS, from memory): ethanol (the
 * alcoholometric table) and glycerol. A solvent without an assay is the pure liquid.
 */
export const AQUEOUS_SOLVENTS: DensityTable[] = [
  {
    id: 'ethanol',
    name: 'ethanol',
    formula: 'C2H5OH',
    forms: ['C2H5OH', 'CH3CH2OH', 'EtOH', 'C2H6O'],
    rows: [
      [0, w, WATER_SRC],
      [10, 0.98187],
      [20, 0.96864],
      [30, 0.95382],
      [40, 0.93518],
      [50, 0.91384],
      [60, 0.89113],
      [70, 0.86766],
      [80, 0.84344],
      [90, 0.81797],
      [95, 0.80424],
      [100, 0.78934],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: '96 % and absolute (99.5 % and more), by mass or by volume: check which the label means',
    pureLiquid: true,
  },
  {
    id: 'glycerol',
    name: 'glycerol',
    formula: 'C3H5(OH)3',
    forms: ['C3H5(OH)3', 'HOCH2CH(OH)CH2OH', 'C3H8O3'],
    rows: [
      [0, w, WATER_SRC],
      [10, 1.0221],
      [20, 1.047],
      [30, 1.0727],
      [40, 1.0995],
      [50, 1.1263],
      [60, 1.1533],
      [70, 1.18],
      [80, 1.2085],
      [90, 1.2347],
      [100, 1.2613],
    ],
    src: 'CRC-CPAS (from memory)',
    commercial: '99.5 %, 86–88 %',
    pureLiquid: true,
  },
];

export interface PureLiquid {
  id: string;
  name: string;
  /** Written forms (ASCII) that mean this liquid. */
  forms: string[];
  /** g/mL at 20 °C. */
  density: number;
  src: string;
}

/** Pure liquids with no water table here (ethanol and glycerol are in AQUEOUS_SOLVENTS). */
export const PURE_LIQUIDS: PureLiquid[] = [
  { id: 'water', name: 'water', forms: ['H2O'], density: WATER_20C, src: 'CRC Handbook, Section 6' },
  { id: 'methanol', name: 'methanol', forms: ['CH3OH', 'MeOH', 'CH4O'], density: 0.7914, src: 'CRC-ORG (from memory)' },
  {
    id: 'isopropanol',
    name: 'isopropanol (propan-2-ol)',
    forms: ['(CH3)2CHOH', 'CH3CH(OH)CH3', 'C3H7OH', 'C3H8O'],
    density: 0.7855,
    src: 'CRC-ORG (from memory)',
  },
  { id: 'ethylene-glycol', name: 'ethylene glycol', forms: ['HOCH2CH2OH', 'C2H4(OH)2', '(CH2OH)2', 'C2H6O2'], density: 1.1135, src: 'CRC-ORG (from memory)' },
  { id: 'propylene-glycol', name: 'propylene glycol', forms: ['CH3CH(OH)CH2OH', 'C3H6(OH)2', 'C3H8O2'], density: 1.0361, src: 'CRC-ORG (from memory)' },
  { id: 'acetone', name: 'acetone', forms: ['(CH3)2CO', 'CH3COCH3', 'C3H6O'], density: 0.7905, src: 'CRC-ORG (from memory)' },
];
