/**
 * What a parsed formula is: atom counts, molar mass with its uncertainty, mass composition, Hill order
 * and the normalised display forms.
 */
import { element } from '../data/elements';
import type { Formula, FormulaItem, FormulaPart } from './ast';
import { startsWithAdductMolecule, SUBSCRIPT_DIGITS, SUPERSCRIPT_DIGITS } from './parse';

export type AtomCounts = Record<string, number>;

/** Round away binary noise from fractional counts (0.1 + 0.2) without hiding real decimals. */
export function cleanCount(x: number): number {
  if (Number.isNaN(x)) return x;
  const r = Math.round(x * 1e9) / 1e9;
  return Object.is(r, -0) ? 0 : r;
}

/** Atom counts of a list of items (brackets multiplied out). */
export function itemAtoms(items: readonly FormulaItem[], factor = 1, into: AtomCounts = {}): AtomCounts {
  const stack: Array<{ items: readonly FormulaItem[]; factor: number }> = [{ items, factor }];
  while (stack.length) {
    const { items: list, factor: f } = stack.pop() as { items: readonly FormulaItem[]; factor: number };
    for (const it of list) {
      if (it.kind === 'element') into[it.symbol] = (into[it.symbol] ?? 0) + it.count * f;
      else if (it.kind === 'abbrev') for (const [el, n] of Object.entries(it.atoms)) into[el] = (into[el] ?? 0) + n * it.count * f;
      else stack.push({ items: it.items, factor: f * it.count });
    }
  }
  return into;
}

export function partAtoms(part: FormulaPart, into: AtomCounts = {}): AtomCounts {
  return itemAtoms(part.items, part.multiplier, into);
}

/** Atom counts of the whole formula, adduct and hydrate parts included, in Hill order. */
export function formulaAtoms(f: Formula): AtomCounts {
  const raw: AtomCounts = {};
  for (const p of f.parts) partAtoms(p, raw);
  const out: AtomCounts = {};
  for (const el of hillOrder(Object.keys(raw))) out[el] = cleanCount(raw[el]);
  return out;
}

/** Hill order: C first, then H, then the rest alphabetically; without carbon, all alphabetically. */
export function hillOrder(symbols: string[]): string[] {
  const hasC = symbols.includes('C');
  return [...symbols].sort((a, b) => {
    if (hasC) {
      const rank = (s: string) => (s === 'C' ? 0 : s === 'H' ? 1 : 2);
      const d = rank(a) - rank(b);
      if (d !== 0) return d;
    }
    return a < b ? -1 : a > b ? 1 : 0;
  });
}

export function formatCount(n: number): string {
  if (Number.isNaN(n)) return 'x';
  if (Number.isInteger(n)) return String(n);
  return String(Number(n.toFixed(4)));
}

export function hillFormula(atoms: AtomCounts): string {
  return hillOrder(Object.keys(atoms))
    .map((el) => (atoms[el] === 1 ? el : el + formatCount(atoms[el])))
    .join('');
}

export interface MolarMass {
  /** g/mol from IUPAC/CIAAW 2021 abridged standard atomic weights. */
  value: number;
  /**
   * Standard uncertainty, g/mol: the abridged uncertainties of different elements combined in quadrature,
   * each multiplied by its count (atoms of one element share one weight, so their errors add linearly).
   * Null when an element has no standard atomic weight.
   */
  uncertainty: number | null;
  /** Elements with no standard atomic weight, for which a mass number was used. */
  nominal: string[];
}

export function molarMass(atoms: AtomCounts): MolarMass {
  let value = 0;
  let u2 = 0;
  const nominal: string[] = [];
  for (const [el, n] of Object.entries(atoms)) {
    const e = element(el);
    if (!e) continue;
    value += n * e.mass;
    if (e.massUncertainty === null) nominal.push(el);
    else u2 += (n * e.massUncertainty) ** 2;
  }
  return { value, uncertainty: nominal.length ? null : Math.sqrt(u2), nominal };
}

export interface CompositionRow {
  element: string;
  count: number;
  massFraction: number;
}

export function composition(atoms: AtomCounts, mass = molarMass(atoms).value): CompositionRow[] {
  return Object.entries(atoms).map(([el, count]) => ({
    element: el,
    count,
    massFraction: mass > 0 ? (count * (element(el)?.mass ?? 0)) / mass : 0,
  }));
}

const toSub = (digits: string) => digits.replace(/[0-9]/g, (d) => SUBSCRIPT_DIGITS[Number(d)]);
const toSup = (digits: string) => digits.replace(/[0-9]/g, (d) => SUPERSCRIPT_DIGITS[Number(d)]);
const CLOSE: Record<string, string> = { '(': ')', '[': ']', '{': '}' };
const ROMAN = ['0', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII'];

function renderItems(items: readonly FormulaItem[], unicode: boolean): string {
  let out = '';
  for (const it of items) {
    const body =
      it.kind === 'element'
        ? it.symbol + (it.stock === undefined ? '' : `(${ROMAN[it.stock]})`)
        : it.kind === 'abbrev'
          ? it.name
          : it.open + renderItems(it.items, unicode) + CLOSE[it.open];
    const count = it.count === 1 ? '' : formatCount(it.count);
    out += body + (unicode ? toSub(count) : count);
  }
  return out;
}

/** Charge as a superscript (`²⁻`) or in caret form (`^2-`). */
export function formatCharge(charge: number, unicode: boolean): string {
  if (charge === 0) return '';
  const mag = Math.abs(charge) === 1 ? '' : String(Math.abs(charge));
  const sign = charge > 0 ? '+' : '-';
  return unicode ? toSup(mag) + (charge > 0 ? '⁺' : '⁻') : `^${mag}${sign}`;
}

/**
 * The normalised form of a formula: parts joined by `·`, counts as subscripts, charge as superscript
 * (unicode), or the ASCII form used in edits (`CuSO4*5H2O` is written back with the user's own separator
 * by the caller; here `·` in Unicode and `.` in ASCII).
 */
export function displayFormula(f: Formula, unicode = true, includeState = true): string {
  let out = '';
  f.parts.forEach((p, k) => {
    const mult = p.multiplier === 1 ? '' : p.multiplierText || formatCount(p.multiplier);
    const body = renderItems(p.items, unicode);
    if (k > 0) {
      // In ASCII a '.' between digits would read as a decimal point unless an adduct molecule follows.
      const ambiguous = /[0-9]$/.test(out) && /^[0-9]/.test(mult) && !startsWithAdductMolecule(body);
      out += unicode ? '·' : ambiguous ? '*' : '.';
    }
    out += mult + body;
  });
  const state = includeState && f.state ? `(${f.state})` : '';
  return out + formatCharge(f.charge, unicode) + state;
}

/** Unicode subscripts for an ASCII formula string (digits after a letter or a closing bracket). */
export function subscriptDigits(formula: string): string {
  return formula.replace(/(?<=[A-Za-z)\]}])[0-9]+(\.[0-9]+)?/g, (m) => toSub(m));
}

/** The minus sign of every written-out number and charge: U+2212, never the hyphen. */
export const MINUS = '\u2212';

/** A signed number for people: +1, −2, +2.667, 0 (true minus sign; at most three decimals). */
export function signed(x: number): string {
  const a = Math.abs(cleanCount(x));
  const r = Number.isInteger(a) ? String(a) : String(Number(a.toFixed(3)));
  return x > 0 && r !== '0' ? `+${r}` : x < 0 && r !== '0' ? `${MINUS}${r}` : '0';
}

/** Whether a formula as written uses Unicode notation (subscript or superscript digits, ⁺ ⁻, the middle dot). */
export const writtenInUnicode = (text: string) => /[₀-₉⁰-⁹⁺⁻·]/.test(text);

/**
 * A formula text (a suggestion, a corrected part) in the notation of what the user wrote: Unicode
 * subscripts where they wrote Unicode, plain digits where they wrote ASCII. Charges and hydrate dots are
 * left as they come (suggestions carry the user's own).
 */
export function inNotationOf(written: string, text: string): string {
  const ascii = text.replace(/[₀-₉]/g, (d) => String(SUBSCRIPT_DIGITS.indexOf(d)));
  return /[₀-₉⁰-⁹⁺⁻]/.test(written) ? subscriptDigits(ascii) : ascii;
}
