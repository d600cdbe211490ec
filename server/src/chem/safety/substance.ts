/**
 * The substance behind a formula, as the safety tables look it up: the Hill formula of its main part
 * (without water of crystallisation), the waters of crystallisation per formula unit, and any other
 * adduct (the H2O2 of sodium percarbonate, Na2CO3·1.5H2O2).
 */
import type { FormulaAnalysis } from '../analyse';
import { hillFormula, partAtoms, type AtomCounts } from '../formula/compute';
import { parseFormula } from '../formula/parse';
import { chooseReading } from '../ions/reading';

export interface MainPart {
  /** Hill formula of the first part of the formula (the salt of a hydrate, the whole of anything else). */
  hill: string;
  atoms: AtomCounts;
  /** Waters of crystallisation per formula unit. */
  water: number;
  /** Hill formulas of the other parts that are not water, with their counts (`H2O2` × 1.5). */
  adducts: ReadonlyArray<readonly [string, number]>;
}

const memo = new WeakMap<FormulaAnalysis, MainPart | null>();

export function mainPart(a: FormulaAnalysis): MainPart | null {
  let hit = memo.get(a);
  if (hit === undefined) memo.set(a, (hit = compute(a)));
  return hit;
}

function compute(a: FormulaAnalysis): MainPart | null {
  if (!a.ok || !a.formula || a.formula.parts.length === 0) return null;
  const [first, ...rest] = a.formula.parts;
  const atoms = partAtoms(first);
  // A leading multiplier on the first part (`2NaCl`) is a count of formula units, not another substance.
  if (first.multiplier !== 1) for (const el of Object.keys(atoms)) atoms[el] /= first.multiplier;
  let water = 0;
  const adducts: Array<[string, number]> = [];
  for (const part of rest) {
    const at = partAtoms(part);
    const keys = Object.keys(at);
    if (keys.length === 2 && at.O > 0 && at.H === 2 * at.O) water += at.O;
    else {
      const unit: AtomCounts = {};
      for (const el of keys) unit[el] = at[el] / (part.multiplier || 1);
      adducts.push([hillFormula(unit), part.multiplier || 1]);
    }
  }
  return { hill: hillFormula(atoms), atoms, water, adducts };
}

/** The table key of a substance: Hill formula of the main part, and `·nH2O` where it is a hydrate. */
export function substanceKey(main: MainPart): string {
  return main.water ? `${main.hill}·${main.water}H2O` : main.hill;
}

/** The key of a formula written in a data table (parsed once when the table is indexed). */
export function keyOfFormula(text: string): string | null {
  const parsed = parseFormula(text);
  if (!parsed.ok || !parsed.formula) return null;
  const f = chooseReading(parsed.formula);
  const fake = { ok: true, formula: f } as FormulaAnalysis;
  const main = compute(fake);
  return main ? substanceKey(main) : null;
}
