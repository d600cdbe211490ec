/**
 * The equation parser: `2 H2 + O2 -> 2 H2O` → sides, species, coefficients and diagnostics, every piece
 * with its offsets in the equation text (UTF-16 code units, end exclusive). It never throws; bad input
 * gives diagnostics.
 *
 * Notation:
 * - one arrow joins the sides (the first one found; see arrows.ts for the list); a second arrow is an error,
 *   and only the text between the first and the second arrow is read as products;
 * - species are separated by `+` (see "Where `+` is a separator" below);
 * - a species is an optional coefficient (`2`, `0.5`, `1/2`, `½`, `1½`), optional space, then a formula
 *   read by `readSpecies` (charges, hydrates and state symbols included), or the electron written
 *   `e-`, `e^-`, `e^{-}`, `e⁻` or `e−`.
 *
 * Where `+` is a separator (and where it is a charge sign):
 * 1. A `+` with whitespace (or the start of the side, or another separator) right before it is a separator:
 *    `H2 + O2`, `H2 +O2`, and the second `+` in `Na+ + Cl-`.
 * 2. A `+` right after an open caret charge is a charge: `Fe^3+`, `Fe^+3`, `Fe^{3+}`, `Ca^+`.
 * 3. Any other `+` is attached to the species before it, and it is a charge sign when what follows says
 *    the species ends there: the end of the side, another `+` (`Ca++`, or `Na+ + …` after spaces), or a
 *    state symbol (`Na+(aq)`); the same holds after digits written straight after it (`Ca+2`, `Ca+2 + …`).
 *    When a species starts after it instead (a letter, a bracket, a fraction, a coefficient), directly or
 *    after spaces, it is a separator: `H2+O2`, `H2+ O2`, `H2+2O2`. After anything else (`Na+-`) it stays
 *    part of the species, and the formula parser reports what follows the charge.
 * So `Na+ + Cl-`, `2H+ + CO3^2-`, `Fe^3+ + e^-` read as ions, and `H2+O2` as two species. A charged species
 * followed directly by another species (`H+Cl-`) reads as `H + Cl-`: write spaces around separators.
 */
import { readSpecies as readSpeciesFormula } from '../analyse';
import { shiftDiagnostic, type ChemDiagnostic, type DiagnosticCode } from '../diagnostic';
import type { Formula } from '../formula/ast';
import type { AtomCounts } from '../formula/compute';
import { findArrow, type ArrowMatch } from './arrows';
import { add, rational, parseRational, toNumber, type Rational } from './rational';

export interface Species {
  /** The species as written: coefficient and formula (surrounding spaces excluded). */
  text: string;
  start: number;
  end: number;
  side: 'reactant' | 'product';
  /** The written coefficient; null when none is written (it then counts as 1). */
  coefficient: number | null;
  /** The written coefficient, exactly; null when none is written or it could not be read. */
  coefficientExact: Rational | null;
  /** The coefficient as written ('' when none). */
  coefficientText: string;
  coefficientStart?: number;
  coefficientEnd?: number;
  formulaText: string;
  formulaStart: number;
  formulaEnd: number;
  /** The formula read (the reading `readSpecies` chose); null for the electron and unreadable formulas. */
  formula: Formula | null;
  /** Atom counts of one formula unit (shared with the formula cache: read-only). Empty for the electron. */
  atoms: Readonly<AtomCounts>;
  /** Net charge of one formula unit (−1 for the electron). */
  charge: number;
  isElectron: boolean;
  /** False when the coefficient or the formula could not be read. */
  ok: boolean;
}

export interface ParsedEquation {
  text: string;
  arrow: ArrowMatch | null;
  reactants: Species[];
  products: Species[];
  /** Offsets relative to `text`. */
  diagnostics: ChemDiagnostic[];
  /** True when there is no error-severity diagnostic. */
  ok: boolean;
}

const FRACTIONS: Record<string, [number, number]> = { '½': [1, 2], '⅓': [1, 3], '⅔': [2, 3], '¼': [1, 4], '¾': [3, 4] };
const ELECTRON = /^e(?:[-−⁻]|\^[-−]|\^\{[-−]\})$/;
const STATE_AT = /^\((?:s|l|g|aq|cr)\)/;
const MAX_ARROW_FINDINGS = 10;
/** Coefficients beyond this many characters are not read (they are far beyond any safe integer). */
const MAX_COEFFICIENT_LENGTH = 24;

const isWs = (c: string | undefined) => c !== undefined && /\s/.test(c);
const isDigit = (c: string | undefined) => c !== undefined && c >= '0' && c <= '9';
const isLetter = (c: string | undefined) => c !== undefined && ((c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z'));
const isSignChar = (c: string | undefined) => c === '+' || c === '-' || c === '−';
/** Can a species start with this character? */
const startsSpecies = (c: string | undefined) => isLetter(c) || isDigit(c) || (c !== undefined && c in FRACTIONS) || c === '(' || c === '[' || c === '{';

/** Parse an equation. Offsets in the result are relative to `text`. */
export function parseEquation(text: string): ParsedEquation {
  const diagnostics: ChemDiagnostic[] = [];
  const error = (code: DiagnosticCode, start: number, end: number, message: string) => diagnostics.push({ code, severity: 'error', message, start, end });

  const first = findArrow(text);
  if (!first) {
    if (text.trim() === '') error('missing-arrow', 0, text.length, 'Empty equation: write reactants -> products.');
    else error('missing-arrow', 0, text.length, 'No arrow: write the reaction as reactants -> products (or with =, →, ⇌).');
    // Still read the species, so that bad formulas are reported.
    const reactants = text.trim() === '' ? [] : readSide(text, 0, text.length, 'reactant', diagnostics);
    return { text, arrow: null, reactants, products: [], diagnostics, ok: false };
  }
  const extra: ArrowMatch[] = [];
  for (let a = findArrow(text, first.end); a; a = findArrow(text, a.end)) extra.push(a);
  // One finding per extra arrow, up to a few (a line of arrows need not give thousands).
  for (const a of extra.slice(0, MAX_ARROW_FINDINGS)) {
    error('multiple-arrows', a.start, a.end, `Only one arrow may join the sides; this equation has ${extra.length + 1}.`);
  }
  const productsEnd = extra.length ? extra[0].start : text.length;

  const sideOf = (from: number, to: number, side: Species['side']) => {
    if (text.slice(from, to).trim() === '') {
      error(
        'empty-side',
        first.start,
        first.end,
        side === 'reactant' ? 'Nothing before the arrow: the equation has no reactants.' : 'Nothing after the arrow: the equation has no products.',
      );
      return [];
    }
    return readSide(text, from, to, side, diagnostics);
  };
  const reactants = sideOf(0, first.start, 'reactant');
  const products = sideOf(first.end, productsEnd, 'product');
  const ok = !diagnostics.some((d) => d.severity === 'error');
  return { text, arrow: { ...first }, reactants, products, diagnostics, ok };
}

/** All species of an equation in order: reactants, then products. */
export function allSpecies(eq: ParsedEquation): Species[] {
  return [...eq.reactants, ...eq.products];
}

/** Is the `+` at `i` a separator? (the rule in the header comment) */
function isSeparator(text: string, segStart: number, i: number, to: number, hasContent: boolean): boolean {
  // Rule 1: nothing attached before it.
  if (!hasContent || isWs(text[i - 1])) return true;
  // Rule 2: an open caret charge (`^`, `^3`, `^{3`, `^{3+` …) before it.
  let j = i - 1;
  let steps = 0;
  while (j >= segStart && steps < 12 && (isDigit(text[j]) || text[j] === '{' || isSignChar(text[j]))) {
    j--;
    steps++;
  }
  if (j >= segStart && text[j] === '^') {
    const inner = text.slice(j + 1, i);
    if (inner.startsWith('{') || !/[+\-−]/.test(inner)) return false;
  }
  // Rule 3: attached; decided by what follows.
  let k = i + 1;
  if (k >= to) return false;
  if (text[k] === '+') return false;
  if (text[k] === '(') return !STATE_AT.test(text.slice(k, k + 5));
  if (isDigit(text[k])) {
    while (k < to && isDigit(text[k])) k++;
    if (k >= to || text[k] === '+') return false;
    if (text[k] === '(') return !STATE_AT.test(text.slice(k, k + 5));
    if (!isWs(text[k])) return true;
  }
  if (isWs(text[k])) {
    while (k < to && isWs(text[k])) k++;
    return !(k >= to || text[k] === '+');
  }
  return startsSpecies(text[k]);
}

/** Split one side into species and read each. */
function readSide(text: string, from: number, to: number, side: Species['side'], diagnostics: ChemDiagnostic[]): Species[] {
  const segments: Array<{ start: number; end: number; sepBefore?: number; sepAfter?: number }> = [];
  let segStart = from;
  let sepBefore: number | undefined;
  let hasContent = false;
  for (let i = from; i < to; i++) {
    const c = text[i];
    if (c !== '+') {
      if (!isWs(c)) hasContent = true;
      continue;
    }
    if (isSeparator(text, segStart, i, to, hasContent)) {
      segments.push({ start: segStart, end: i, sepBefore, sepAfter: i });
      segStart = i + 1;
      sepBefore = i;
      hasContent = false;
    } else {
      hasContent = true;
    }
  }
  segments.push({ start: segStart, end: to, sepBefore });

  const out: Species[] = [];
  // A run of empty species (`A + + + B`) gives one finding.
  let emptyRun: ChemDiagnostic | undefined;
  for (const seg of segments) {
    let a = seg.start;
    let b = seg.end;
    while (a < b && isWs(text[a])) a++;
    while (b > a && isWs(text[b - 1])) b--;
    if (a === b) {
      const s = seg.sepBefore ?? (seg.sepAfter as number);
      const e = (seg.sepAfter ?? (seg.sepBefore as number)) + 1;
      if (emptyRun && seg.sepBefore !== undefined && seg.sepBefore === emptyRun.end - 1) {
        emptyRun.end = e;
        emptyRun.message = `There is no species between these '+' signs.`;
        continue;
      }
      const where = seg.sepBefore === undefined ? `before '+'` : seg.sepAfter === undefined ? `after '+'` : `between these '+' signs`;
      emptyRun = { code: 'empty-species', severity: 'error', start: s, end: e, message: `There is no species ${where}.` };
      diagnostics.push(emptyRun);
      continue;
    }
    emptyRun = undefined;
    out.push(readSpecies(text, a, b, side, diagnostics));
  }
  return out;
}

function readSpecies(text: string, a: number, b: number, side: Species['side'], diagnostics: ChemDiagnostic[]): Species {
  const error = (code: DiagnosticCode, start: number, end: number, message: string) => diagnostics.push({ code, severity: 'error', message, start, end });
  let ok = true;

  // Coefficient.
  let i = a;
  if (text[i] in FRACTIONS) {
    i++;
  } else if (isDigit(text[i])) {
    while (i < b && isDigit(text[i])) i++;
    if ((text[i] === '.' || text[i] === '/') && isDigit(text[i + 1]) && i + 1 < b) {
      i++;
      while (i < b && isDigit(text[i])) i++;
    } else if (i < b && text[i] in FRACTIONS) {
      i++;
    }
  }
  const coefficientText = text.slice(a, i);
  let coefficient: number | null = null;
  let coefficientExact: Rational | null = null;
  if (coefficientText !== '') {
    const r = readCoefficient(coefficientText);
    if (typeof r === 'string') {
      error('bad-coefficient', a, i, r);
      ok = false;
    } else {
      coefficientExact = r;
      coefficient = toNumber(r);
    }
  }
  let f = i;
  while (f < b && isWs(text[f])) f++;
  const formulaText = text.slice(f, b);
  const species: Species = {
    text: text.slice(a, b),
    start: a,
    end: b,
    side,
    coefficient,
    coefficientExact,
    coefficientText,
    ...(coefficientText !== '' ? { coefficientStart: a, coefficientEnd: i } : {}),
    formulaText,
    formulaStart: f,
    formulaEnd: b,
    formula: null,
    atoms: {},
    charge: 0,
    isElectron: false,
    ok,
  };

  if (formulaText === '') {
    error('missing-formula', a, i, `The coefficient '${coefficientText}' has no formula after it.`);
    species.ok = false;
    return species;
  }
  if (coefficientText !== '' && (isDigit(formulaText[0]) || formulaText[0] in FRACTIONS)) {
    let e = f;
    while (e < b && (isDigit(text[e]) || text[e] === '.' || text[e] === '/' || text[e] in FRACTIONS)) e++;
    error('malformed-formula', f, e, `A second number '${text.slice(f, e)}' follows the coefficient '${coefficientText}'; write one coefficient.`);
    species.ok = false;
    return species;
  }
  if (ELECTRON.test(formulaText)) {
    species.isElectron = true;
    species.charge = -1;
    return species;
  }
  const fa = readSpeciesFormula(formulaText);
  if (!fa.ok || !fa.formula) {
    let passed = 0;
    for (const d of fa.diagnostics) {
      if (d.severity !== 'error') continue;
      diagnostics.push(shiftDiagnostic(d, f));
      passed++;
    }
    if (passed === 0) error('malformed-formula', f, b, `'${formulaText}' is not a readable formula.`);
    species.ok = false;
    return species;
  }
  species.formula = fa.formula;
  species.atoms = fa.atoms;
  species.charge = fa.charge;
  return species;
}

/** The value of a coefficient as written, or the reason it cannot be used. */
function readCoefficient(t: string): Rational | string {
  if (t.length > MAX_COEFFICIENT_LENGTH) return `The coefficient '${t.slice(0, 12)}…' is too large.`;
  let value: Rational | null;
  const last = t[t.length - 1];
  if (last in FRACTIONS) {
    const [p, q] = FRACTIONS[last];
    const whole = t.length > 1 ? parseRational(t.slice(0, -1)) : rational(0n);
    value = whole ? add(whole, rational(BigInt(p), BigInt(q))) : null;
  } else {
    value = parseRational(t);
  }
  if (!value) return t.includes('/') ? `The coefficient '${t}' divides by zero.` : `The coefficient '${t}' is not a number.`;
  if (value.n === 0n) return `A coefficient of zero ('${t}') leaves the species out; remove it.`;
  const SAFE = BigInt(Number.MAX_SAFE_INTEGER);
  if (value.n > SAFE || value.d > SAFE) return `The coefficient '${t}' is too large.`;
  return value;
}
