/**
 * The free ions the solution model knows besides the acid–base systems: metal ions (each charge state
 * its own component: Fe²⁺ and Fe³⁺, Cu⁺ and Cu²⁺) and the anions of strong acids. Charges are standard
 * chemistry (IUPAC Red Book 2005); no constant is needed here.
 *
 * `salt` lists the charges a metal takes in the salts a batch is made of, the usual one first (FeCl3 is
 * Fe³⁺, FeSO4 Fe²⁺: the reading picks the charge that balances).
 */
export interface FreeIon {
  label: string;
  /** Composition (an element symbol or a polyatomic anion's formula). */
  formula: string;
  charge: number;
  name: string;
}

export const METAL_CHARGES: Readonly<Record<string, readonly number[]>> = {
  Li: [1],
  Na: [1],
  K: [1],
  Rb: [1],
  Cs: [1],
  Ag: [1],
  Mg: [2],
  Ca: [2],
  Sr: [2],
  Ba: [2],
  Mn: [2],
  Fe: [2, 3],
  Co: [2],
  Ni: [2],
  Cu: [2, 1],
  Zn: [2],
  Cd: [2],
  Pb: [2],
  Al: [3],
  Cr: [3],
};

const METAL_NAMES: Record<string, string> = {
  Li: 'lithium',
  Na: 'sodium',
  K: 'potassium',
  Rb: 'rubidium',
  Cs: 'caesium',
  Ag: 'silver',
  Mg: 'magnesium',
  Ca: 'calcium',
  Sr: 'strontium',
  Ba: 'barium',
  Mn: 'manganese(II)',
  Fe: 'iron',
  Co: 'cobalt(II)',
  Ni: 'nickel',
  Cu: 'copper',
  Zn: 'zinc',
  Cd: 'cadmium',
  Pb: 'lead',
  Al: 'aluminium',
  Cr: 'chromium(III)',
};

const caret = (q: number) => (q === 0 ? '' : `^${Math.abs(q) === 1 ? '' : Math.abs(q)}${q > 0 ? '+' : '-'}`);

/** The label of a metal ion: `Fe^3+`, `Na^+`. */
export const metalLabel = (el: string, charge: number) => `${el}${caret(charge)}`;

const roman = ['', 'I', 'II', 'III', 'IV'];

export const METAL_IONS: FreeIon[] = Object.entries(METAL_CHARGES).flatMap(([el, charges]) =>
  charges.map((q) => ({
    label: metalLabel(el, q),
    formula: el,
    charge: q,
    name: charges.length > 1 ? `${METAL_NAMES[el]}(${roman[q]})` : METAL_NAMES[el],
  })),
);

/** Anions of strong acids: components with no acid–base chemistry of their own. */
export const STRONG_ANIONS: FreeIon[] = [
  { label: 'Cl^-', formula: 'Cl', charge: -1, name: 'chloride' },
  { label: 'Br^-', formula: 'Br', charge: -1, name: 'bromide' },
  { label: 'I^-', formula: 'I', charge: -1, name: 'iodide' },
  { label: 'NO3^-', formula: 'NO3', charge: -1, name: 'nitrate' },
  { label: 'ClO4^-', formula: 'ClO4', charge: -1, name: 'perchlorate' },
];

/** The proton: component 0 of every system. */
export const PROTON: FreeIon = { label: 'H^+', formula: 'H', charge: 1, name: 'hydrogen ion' };
