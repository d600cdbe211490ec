/**
 * Element data, in one place.
 *
 * Sources (numbers come from data/reference/, generated into ./generated.ts):
 * - Standard atomic weights and their uncertainties: IUPAC/CIAAW 2021 abridged values,
 *   T. Prohaska et al., Pure Appl. Chem. 94 (2022) 573-600.
 *   Elements with no standard atomic weight (Tc, Pm, Po-Ac, Np and above) carry the mass number of a
 *   long-lived isotope instead; cards say so.
 * - Pauling electronegativities and oxidation states (common, other known, ICSD-observed):
 *   materialsproject/pymatgen periodic_table.json (see data/reference/README.md).
 * - Element names: IUPAC Nomenclature of Inorganic Chemistry (2005), Table I (IUPAC spellings:
 *   aluminium, caesium, sulfur).
 */
import { ELEMENT_ROWS } from './generated';

export interface Element {
  z: number;
  symbol: string;
  name: string;
  /** CIAAW 2021 abridged standard atomic weight, or the nominal mass number where there is none. */
  mass: number;
  /** Uncertainty of the abridged weight; null where the element has no standard atomic weight. */
  massUncertainty: number | null;
  hasStandardWeight: boolean;
  /** Pauling electronegativity, or null (He, Ne, Ar, Z >= 104). */
  en: number | null;
  commonStates: number[];
  otherStates: number[];
  icsdStates: number[];
}

const NAMES = (
  'hydrogen helium lithium beryllium boron carbon nitrogen oxygen fluorine neon sodium magnesium aluminium ' +
  'silicon phosphorus sulfur chlorine argon potassium calcium scandium titanium vanadium chromium manganese iron ' +
  'cobalt nickel copper zinc gallium germanium arsenic selenium bromine krypton rubidium strontium yttrium ' +
  'zirconium niobium molybdenum technetium ruthenium rhodium palladium silver cadmium indium tin antimony ' +
  'tellurium iodine xenon caesium barium lanthanum cerium praseodymium neodymium promethium samarium europium ' +
  'gadolinium terbium dysprosium holmium erbium thulium ytterbium lutetium hafnium tantalum tungsten rhenium ' +
  'osmium iridium platinum gold mercury thallium lead bismuth polonium astatine radon francium radium actinium ' +
  'thorium protactinium uranium neptunium plutonium americium curium berkelium californium einsteinium fermium ' +
  'mendelevium nobelium lawrencium rutherfordium dubnium seaborgium bohrium hassium meitnerium darmstadtium ' +
  'roentgenium copernicium nihonium flerovium moscovium livermorium tennessine oganesson'
).split(' ');

export const ELEMENTS: readonly Element[] = ELEMENT_ROWS.map(([z, symbol, w, u, nominal, en, common, other, icsd]) => ({
  z,
  symbol,
  name: NAMES[z - 1],
  mass: w ?? (nominal as number),
  massUncertainty: w === null ? null : u,
  hasStandardWeight: w !== null,
  en,
  commonStates: common,
  otherStates: other,
  icsdStates: icsd,
}));

const BY_SYMBOL = new Map(ELEMENTS.map((e) => [e.symbol, e]));

export function element(symbol: string): Element | undefined {
  return BY_SYMBOL.get(symbol);
}

export function isElementSymbol(symbol: string): boolean {
  return BY_SYMBOL.has(symbol);
}

/** Metals for the purpose of reading a formula as a salt (everything left of the B–Si–As–Te–At staircase, less H). */
const NONMETALS = new Set(['H', 'He', 'B', 'C', 'N', 'O', 'F', 'Ne', 'Si', 'P', 'S', 'Cl', 'Ar', 'As', 'Se', 'Br', 'Kr', 'Te', 'I', 'Xe', 'At', 'Rn', 'Ts', 'Og']);
export function isMetal(symbol: string): boolean {
  return BY_SYMBOL.has(symbol) && !NONMETALS.has(symbol);
}
