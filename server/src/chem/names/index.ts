/**
 * Names of substances (formula → name), following the IUPAC 2005 recommendations for inorganic
 * compounds (Nomenclature of Inorganic Chemistry, the "Red Book": stoichiometric names with the Stock
 * number, IR-5; hydrates IR-5.5). Only what the reading makes plain is named; anything else has no name
 * rather than a guessed one.
 */
import type { FormulaAnalysis } from '../analyse';
import { element } from '../data/elements';

const HYDRATE = [
  '',
  'monohydrate',
  'dihydrate',
  'trihydrate',
  'tetrahydrate',
  'pentahydrate',
  'hexahydrate',
  'heptahydrate',
  'octahydrate',
  'nonahydrate',
  'decahydrate',
  'undecahydrate',
  'dodecahydrate',
];
const MONATOMIC: Record<string, string> = {
  F: 'fluoride',
  Cl: 'chloride',
  Br: 'bromide',
  I: 'iodide',
  O: 'oxide',
  S: 'sulfide',
  Se: 'selenide',
  Te: 'telluride',
  N: 'nitride',
  P: 'phosphide',
  H: 'hydride',
};
/** Metals named without an oxidation number: they have one state in their salts (IUPAC 2005, IR-5.4.2.2). */
const ONE_STATE = new Set(['Li', 'Na', 'K', 'Rb', 'Cs', 'Be', 'Mg', 'Ca', 'Sr', 'Ba', 'Al', 'Zn', 'Cd', 'Ag', 'Ga', 'Sc', 'Y', 'La']);
const ROMAN = ['', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII'];

/**
 * The name of the substance where the reading makes it plain: an element, a single named ion, or a salt of
 * one cation and one anion (with its water of crystallisation): `nickel(II) sulfate hexahydrate`. Names
 * follow the IUPAC 2005 recommendations (stoichiometric names with the Stock number); undefined otherwise.
 */
export function nameOf(a: FormulaAnalysis): string | undefined {
  const c = a.charges;
  if (!a.ok || !a.formula || !c) return undefined;
  if (c.basis === 'element' && a.formula.parts.length === 1) {
    const el = Object.keys(a.atoms)[0];
    return el ? element(el)?.name : undefined;
  }
  const ions = c.ions;
  if (!ions || c.basis !== 'ionic' || !c.balanced) return undefined;
  if (ions.length === 1 && a.charge !== 0) return ions[0].ionName;
  // Water only in the other parts: a hydrate.
  let water = 0;
  for (const p of a.formula.parts.slice(1)) {
    const t = p.items.map((it) => (it.kind === 'element' ? it.symbol + (it.count === 1 ? '' : it.count) : '?')).join('');
    if (t !== 'H2O' || !Number.isInteger(p.multiplier)) return undefined;
    water += p.multiplier;
  }
  if (a.charge !== 0 || ions.length !== 2 || water >= HYDRATE.length) return undefined;
  const [cat, an] = ions;
  if (cat.role !== 'cation' || an.role !== 'anion' || !Number.isInteger(cat.charge) || new Set(cat.states).size > 1) return undefined;
  let cation: string | undefined;
  if (cat.kind === 'metal' && cat.element) {
    const name = element(cat.element)?.name;
    cation = name && (ONE_STATE.has(cat.element) ? name : `${name}(${ROMAN[cat.charge] ?? cat.charge})`);
  } else if (cat.kind === 'polyatomic') cation = cat.ionName;
  const anion = an.kind === 'monatomic-anion' && an.element ? MONATOMIC[an.element] : an.kind === 'polyatomic' ? an.ionName : undefined;
  if (!cation || !anion) return undefined;
  return `${cation} ${anion}${water ? ` ${HYDRATE[water]}` : ''}`;
}
