/** Species labels (ASCII, caret charge: `HPO4^2-`, `Cu(NH3)4^2+`, `CaSO4(aq)`) written for people. */
import { displayFormula, formatCharge, subscriptDigits } from '../formula/compute';
import { parseFormula } from '../formula/parse';

/** The label in Unicode: `HPO₄²⁻`, `Cu(NH₃)₄²⁺`, `CaSO₄(aq)`. */
export function labelDisplay(label: string): string {
  const m = /^(.*)\^(\d*)([+-])$/.exec(label);
  if (!m) return subscriptDigits(label);
  const q = (m[2] ? Number(m[2]) : 1) * (m[3] === '+' ? 1 : -1);
  return subscriptDigits(m[1]) + formatCharge(q, true);
}

/** A formula (a solid's) in Unicode: `CaSO₄·2H₂O`. */
export function formulaDisplay(f: string): string {
  const p = parseFormula(f);
  return p.ok && p.formula ? displayFormula(p.formula, true) : subscriptDigits(f);
}
