/**
 * Balancing: the equation as a matrix (rows = elements and charge, columns = species, reactants positive,
 * products negative), its null space by Gauss–Jordan elimination over exact rationals, and what the null
 * space says: one solution (balanced), none (impossible), several independent ones. In the last case a redox
 * equation is balanced by half-reactions where they decide one solution (./redox.ts: balanced, with a note
 * that other combinations also conserve atoms and charge); otherwise it is ambiguous.
 */
import type { ChemDiagnostic } from '../diagnostic';
import { displayFormula, formatCount, signed } from '../formula/compute';
import { isReversible } from './arrows';
import { allSpecies, parseEquation, type ParsedEquation, type Species } from './parse';
import { BoundedCache, detach } from '../cache';
import { balanceByHalfReactions } from './redox';
import { add, fromNumber, gcd, isZero, lcm, mul, neg, ONE, rational, sub, toNumber, ZERO, type Rational } from './rational';

export const MAX_SPECIES = 40;
export const MAX_ELEMENTS = 40;

export type BalanceStatus = 'balanced' | 'already-balanced' | 'impossible' | 'ambiguous' | 'too-large' | 'invalid';

export interface BalanceResult {
  status: BalanceStatus;
  /**
   * Smallest whole-number coefficients, in order of appearance (reactants, then products): the solution for
   * `balanced`, the written coefficients in whole numbers for `already-balanced`; null otherwise.
   */
  coefficients: number[] | null;
  /** The equation written with `coefficients` (1 omitted, the user's formulas and arrow); null when there are none. */
  balancedText: string | null;
  /** The same in Unicode notation (`2 H₂ + O₂ → 2 H₂O`), for messages and titles; null when there are none. */
  balancedDisplay: string | null;
  message: string;
  /** Elements whose totals differ between the sides AS WRITTEN (written coefficients, unwritten = 1). */
  differences: Array<{ element: string; left: number; right: number }>;
  /** Total charge of each side AS WRITTEN. */
  charge: { left: number; right: number };
  /** Dimension of the solution space (number of independent balanced forms); null when not computed. */
  nullity: number | null;
  /** For `already-balanced`: the written coefficients share a factor or are fractional, so a smaller whole-number form exists. */
  reducible: boolean;
  /** How a `balanced` answer was found: the unique solution of the atoms and charge, or the half-reactions (nullity > 1). */
  method?: 'unique' | 'half-reactions';
  /** For `half-reactions`: the redox couples used and that other combinations also conserve atoms and charge. */
  note?: string;
}

export interface BalanceCheck {
  /** Every element, in order of first appearance, with its total on each side. */
  elements: Array<{ element: string; left: number; right: number }>;
  charge: { left: number; right: number };
  /** True when every element and the charge agree. */
  balanced: boolean;
}

// ---------------------------------------------------------------------------------------------------------
// Totals

interface ExactTotals {
  elements: string[];
  left: Map<string, Rational>;
  right: Map<string, Rational>;
  chargeLeft: Rational;
  chargeRight: Rational;
}

/** Elements in order of first appearance (reactants then products; within a species, in Hill order). */
function elementOrder(species: readonly Species[]): string[] {
  const seen = new Set<string>();
  for (const s of species) for (const el of Object.keys(s.atoms)) seen.add(el);
  return [...seen];
}

function exactCount(n: number): Rational {
  return fromNumber(n) ?? ZERO;
}

function totals(eq: ParsedEquation, coefficients: readonly Rational[]): ExactTotals {
  const species = allSpecies(eq);
  const elements = elementOrder(species);
  const left = new Map<string, Rational>();
  const right = new Map<string, Rational>();
  for (const el of elements) {
    left.set(el, ZERO);
    right.set(el, ZERO);
  }
  let chargeLeft = ZERO;
  let chargeRight = ZERO;
  species.forEach((s, k) => {
    const c = coefficients[k] ?? ONE;
    const into = s.side === 'reactant' ? left : right;
    for (const [el, n] of Object.entries(s.atoms)) into.set(el, add(into.get(el) as Rational, mul(c, exactCount(n))));
    const q = mul(c, rational(BigInt(Math.trunc(s.charge))));
    if (s.side === 'reactant') chargeLeft = add(chargeLeft, q);
    else chargeRight = add(chargeRight, q);
  });
  return { elements, left, right, chargeLeft, chargeRight };
}

function writtenCoefficients(eq: ParsedEquation): Rational[] {
  return allSpecies(eq).map((s) => s.coefficientExact ?? ONE);
}

function coefficientsToRational(coefficients: readonly (number | Rational)[]): Rational[] {
  return coefficients.map((c) => (typeof c === 'number' ? (fromNumber(c) ?? ZERO) : c));
}

/**
 * Per-element and charge totals of each side with the given coefficients (one per species, reactants then
 * products; a missing one counts as 1, a non-finite number as 0).
 */
export function balanceCheck(parsed: ParsedEquation, coefficients: readonly (number | Rational)[]): BalanceCheck {
  const t = totals(parsed, coefficientsToRational(coefficients));
  const elements = t.elements.map((el) => ({ element: el, left: toNumber(t.left.get(el) as Rational), right: toNumber(t.right.get(el) as Rational) }));
  const balanced = t.elements.every((el) => isZero(sub(t.left.get(el) as Rational, t.right.get(el) as Rational))) && isZero(sub(t.chargeLeft, t.chargeRight));
  return { elements, charge: { left: toNumber(t.chargeLeft), right: toNumber(t.chargeRight) }, balanced };
}

// ---------------------------------------------------------------------------------------------------------
// Null space

/**
 * A basis of the null space of `m` (rows × cols), by Gauss–Jordan elimination to reduced row echelon
 * form over the rationals. One basis vector per free column: that column 1, the other free columns 0.
 *
 * The elimination is done fraction-free, which is the same computation with the numbers kept small:
 * each row is first scaled to integers (scaling a row leaves the null space unchanged), and after the
 * k-th pivot the working matrix is exactly d·R, where R is the rational matrix Gauss–Jordan elimination
 * has at that step and d is the k-th pivot minor. The update
 *   a[i][j] ← (a[r][c]·a[i][j] − a[i][c]·a[r][j]) / d_previous
 * then divides exactly (its result is d·R again, and d·R is a ratio of minors times d, so integral), and
 * no gcd is needed inside the loop: entries stay bounded by the minors of the input (Hadamard's bound),
 * so 40 × 40 systems with six-digit counts take milliseconds.
 */
export function nullSpace(m: readonly (readonly Rational[])[], cols: number): Rational[][] {
  const a: bigint[][] = m.map((row) => {
    let den = 1n;
    for (let j = 0; j < cols; j++) if (row[j].n !== 0n) den = lcm(den, row[j].d);
    return Array.from({ length: cols }, (_, j) => (row[j].n * den) / row[j].d);
  });
  const rows = a.length;
  const pivotOfRow: number[] = [];
  let prev = 1n;
  let r = 0;
  for (let c = 0; c < cols && r < rows; c++) {
    // Pivot: the non-zero entry of smallest magnitude, to keep the numbers small.
    let p = -1;
    let best = 0n;
    for (let i = r; i < rows; i++) {
      const x = a[i][c];
      if (x === 0n) continue;
      const size = x < 0n ? -x : x;
      if (p < 0 || size < best) {
        p = i;
        best = size;
      }
    }
    if (p < 0) continue;
    [a[r], a[p]] = [a[p], a[r]];
    const piv = a[r][c];
    const pr = a[r];
    for (let i = 0; i < rows; i++) {
      if (i === r) continue;
      const row = a[i];
      const f = row[c];
      for (let j = 0; j < cols; j++) row[j] = (piv * row[j] - f * pr[j]) / prev;
    }
    prev = piv;
    pivotOfRow.push(c);
    r++;
  }
  // Now every pivot entry equals `prev` and a = prev · RREF.
  const isPivot = new Set(pivotOfRow);
  const basis: Rational[][] = [];
  for (let free = 0; free < cols; free++) {
    if (isPivot.has(free)) continue;
    const v: Rational[] = new Array(cols).fill(ZERO);
    v[free] = ONE;
    pivotOfRow.forEach((pc, row) => {
      v[pc] = rational(-a[row][free], prev);
    });
    basis.push(v);
  }
  return basis;
}

/** The smallest whole-number multiple of `v` (first non-zero entry positive): integers with no common factor. */
export function smallestIntegers(v: readonly Rational[]): bigint[] {
  let den = 1n;
  for (const x of v) if (x.n !== 0n) den = lcm(den, x.d);
  const ints = v.map((x) => (x.n * den) / x.d);
  let g = 0n;
  for (const x of ints) g = gcd(g, x);
  if (g === 0n) return ints;
  const firstSign = ints.find((x) => x !== 0n) ?? 1n;
  const s = firstSign < 0n ? -g : g;
  return ints.map((x) => x / s);
}

// ---------------------------------------------------------------------------------------------------------
// Text

/** The equation written with the given coefficients (1 omitted), the user's formulas and arrow. */
export function writeEquation(
  eq: ParsedEquation,
  coefficients: readonly (bigint | number)[],
  order: { reactants: Species[]; products: Species[] } = eq,
): string {
  const index = new Map(allSpecies(eq).map((s, k) => [s, k] as const));
  const term = (s: Species) => {
    const c = coefficients[index.get(s) ?? -1];
    const text = c === undefined || c === 1 || c === 1n ? '' : `${c} `;
    return text + s.formulaText;
  };
  return `${order.reactants.map(term).join(' + ')} ${eq.arrow?.arrow ?? '->'} ${order.products.map(term).join(' + ')}`;
}

/** +2, 0, −1 (true minus sign). */
export const formatSignedCharge = (q: number): string => signed(q);

/**
 * The equation in Unicode and IUPAC notation, for people: formulas in their display form (`SO₄²⁻`,
 * `CuSO₄·5H₂O`), `e⁻` for the electron, `→` or `⇌` for the arrow, coefficients as given (1 omitted).
 */
export function displayEquation(
  eq: ParsedEquation,
  coefficients?: readonly (bigint | number)[] | null,
  order: { reactants: Species[]; products: Species[] } = eq,
): string {
  const index = new Map(allSpecies(eq).map((s, k) => [s, k] as const));
  const term = (s: Species) => {
    const c = coefficients ? coefficients[index.get(s) ?? -1] : s.coefficientText || undefined;
    const text = c === undefined || c === 1 || c === 1n || c === '' ? '' : `${c} `;
    return text + (s.isElectron ? 'e⁻' : s.formula ? displayFormula(s.formula) : s.formulaText);
  };
  const arrow = eq.arrow && isReversible(eq.arrow.arrow) ? '⇌' : '→';
  return `${order.reactants.map(term).join(' + ')} ${arrow} ${order.products.map(term).join(' + ')}`;
}

function listNames(names: string[]): string {
  const MAX = 6;
  if (names.length > MAX) return `${names.slice(0, MAX - 1).join(', ')} and ${names.length - MAX + 1} more`;
  if (names.length <= 1) return names.join('');
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** The name of a species in messages: its formula as written ("the electron" for e⁻). */
const nameOf = (s: Species) => (s.isElectron ? 'e⁻' : s.formula ? displayFormula(s.formula) : s.formulaText);

// ---------------------------------------------------------------------------------------------------------
// Balancing

const SAFE = BigInt(Number.MAX_SAFE_INTEGER);

function result(status: BalanceStatus, message: string, rest: Partial<BalanceResult> = {}): BalanceResult {
  return {
    status,
    message,
    coefficients: null,
    balancedText: null,
    balancedDisplay: null,
    differences: [],
    charge: { left: 0, right: 0 },
    nullity: null,
    reducible: false,
    ...rest,
  };
}

/** Balance a parsed equation. Never throws; always returns quickly (at most 40 species and 40 elements). */
export function balanceEquation(parsed: ParsedEquation): BalanceResult {
  if (!parsed.ok || parsed.reactants.length === 0 || parsed.products.length === 0) {
    return result('invalid', 'The equation could not be read; see the other findings.');
  }
  const species = allSpecies(parsed);

  // As written.
  const written = writtenCoefficients(parsed);
  const t = totals(parsed, written);
  const differences = t.elements
    .filter((el) => !isZero(sub(t.left.get(el) as Rational, t.right.get(el) as Rational)))
    .map((el) => ({ element: el, left: toNumber(t.left.get(el) as Rational), right: toNumber(t.right.get(el) as Rational) }));
  const charge = { left: toNumber(t.chargeLeft), right: toNumber(t.chargeRight) };
  const chargeDiffers = !isZero(sub(t.chargeLeft, t.chargeRight));
  const asWritten = { differences, charge };

  if (differences.length === 0 && !chargeDiffers) {
    const ints = smallestIntegers(written);
    const fits = ints.every((x) => x <= SAFE);
    const reducible = written.some((w, k) => w.d !== 1n || w.n !== ints[k]);
    const coefficients = fits ? ints.map(Number) : null;
    const balancedText = coefficients ? writeEquation(parsed, coefficients) : null;
    const balancedDisplay = coefficients ? displayEquation(parsed, coefficients) : null;
    const message = reducible && balancedDisplay ? `Balanced as written; in smallest whole numbers: ${balancedDisplay}.` : 'Balanced as written.';
    return result('already-balanced', message, { ...asWritten, coefficients, balancedText, balancedDisplay, reducible });
  }

  if (species.length > MAX_SPECIES) {
    return result('too-large', `${species.length} species: balancing is limited to ${MAX_SPECIES}.`, asWritten);
  }
  if (t.elements.length > MAX_ELEMENTS) {
    return result('too-large', `${t.elements.length} elements: balancing is limited to ${MAX_ELEMENTS}.`, asWritten);
  }

  // The matrix: one row per element, plus a charge row when anything is charged.
  const sideSign = (s: Species) => (s.side === 'reactant' ? ONE : neg(ONE));
  const matrix: Rational[][] = t.elements.map((el) => species.map((s) => (s.atoms[el] ? mul(sideSign(s), exactCount(s.atoms[el])) : ZERO)));
  if (species.some((s) => s.charge !== 0)) {
    matrix.push(species.map((s) => mul(sideSign(s), rational(BigInt(Math.trunc(s.charge))))));
  }
  const basis = nullSpace(matrix, species.length);
  const nullity = basis.length;

  if (nullity === 0) {
    return result('impossible', impossibleReason(parsed, t), { ...asWritten, nullity });
  }
  if (nullity >= 2) {
    const hr = balanceByHalfReactions(species);
    if (hr && hr.coefficients.every((x) => x <= SAFE) && balanceCheck(parsed, hr.coefficients.map(Number)).balanced) {
      const coefficients = hr.coefficients.map(Number);
      const balancedText = writeEquation(parsed, coefficients);
      const balancedDisplay = displayEquation(parsed, coefficients);
      const couples = hr.couples.map((c) => `${c.element} ${formatSignedCharge(c.from)} → ${formatSignedCharge(c.to)}`).join(', ');
      const note = `Balanced by half-reactions (electrons lost = electrons gained; ${couples}; every other atom keeps its oxidation state). Other combinations of these species also conserve atoms and charge (${nullity} independent ones), such as a side reaction of one of them; these coefficients are the redox reaction as a titration writes it.`;
      return result('balanced', `Balanced: ${balancedDisplay}. ${note}`, {
        ...asWritten,
        coefficients,
        balancedText,
        balancedDisplay,
        nullity,
        method: 'half-reactions',
        note,
      });
    }
    return result(
      'ambiguous',
      `These species can be balanced in ${nullity} independent ways (the equation combines more than one reaction), so no single set of coefficients follows from them. Write the coefficients, or split it into separate reactions.`,
      { ...asWritten, nullity },
    );
  }

  const v = smallestIntegers(basis[0]);
  // Orient the solution so that most species keep their side.
  const positives = v.filter((x) => x > 0n).length;
  const negatives = v.filter((x) => x < 0n).length;
  const w = negatives > positives ? v.map((x) => -x) : v;
  const zero = species.filter((_, k) => w[k] === 0n);
  if (zero.length) {
    const names = listNames(zero.map(nameOf));
    return result(
      'impossible',
      `It balances only with ${names} left out (coefficient 0): ${zero.length === 1 ? 'it takes' : 'they take'} no part in the reaction as written.`,
      { ...asWritten, nullity },
    );
  }
  const moved = species.filter((_, k) => w[k] < 0n);
  if (moved.length) {
    const names = listNames(moved.map(nameOf));
    const abs = w.map((x) => (x < 0n ? -x : x));
    const fits = abs.every((x) => x <= SAFE);
    const order = {
      reactants: species.filter((s, k) => (s.side === 'reactant') === w[k] > 0n),
      products: species.filter((s, k) => (s.side === 'product') === w[k] > 0n),
    };
    const hint = fits ? `: ${displayEquation(parsed, abs.map(Number), order)}` : '';
    return result('impossible', `It cannot be balanced with the species on the sides given: ${names} would have to be on the other side${hint}.`, {
      ...asWritten,
      nullity,
    });
  }
  if (w.some((x) => x > SAFE)) {
    return result('too-large', `The balanced coefficients exceed ${Number.MAX_SAFE_INTEGER} and cannot be shown exactly.`, { ...asWritten, nullity });
  }
  const coefficients = w.map(Number);
  const balancedText = writeEquation(parsed, coefficients);
  const balancedDisplay = displayEquation(parsed, coefficients);
  return result('balanced', `Balanced: ${balancedDisplay}`, { ...asWritten, coefficients, balancedText, balancedDisplay, nullity, method: 'unique' });
}

/** Why no coefficients balance the equation: elements or charge on one side only, when that is the case. */
function impossibleReason(parsed: ParsedEquation, t: ExactTotals): string {
  const onlyLeft = t.elements.filter((el) => parsed.reactants.some((s) => s.atoms[el]) && !parsed.products.some((s) => s.atoms[el]));
  const onlyRight = t.elements.filter((el) => parsed.products.some((s) => s.atoms[el]) && !parsed.reactants.some((s) => s.atoms[el]));
  const parts: string[] = [];
  if (onlyLeft.length) parts.push(`${listNames(onlyLeft)} ${onlyLeft.length === 1 ? 'appears' : 'appear'} only on the left`);
  if (onlyRight.length) parts.push(`${listNames(onlyRight)} ${onlyRight.length === 1 ? 'appears' : 'appear'} only on the right`);
  const reason = parts.length ? `: ${parts.join(', and ')}` : ': no choice of coefficients makes every element and the charge agree';
  return `These species cannot be balanced${reason}.`;
}

/**
 * The text of the `unbalanced-equation` warning: what differs, in a chemist's words, then the balanced
 * form when there is one, in Unicode notation, e.g. "Not balanced — left: 2 O; right: 1 O. Balanced: 2 H₂ + O₂ → 2 H₂O".
 */
export function unbalancedMessage(r: BalanceResult): string {
  const parts: string[] = [];
  if (r.differences.length) {
    const side = (which: 'left' | 'right') => r.differences.map((d) => `${formatCount(d[which])} ${d.element}`).join(', ');
    parts.push(`left: ${side('left')}; right: ${side('right')}`);
  }
  if (r.charge.left !== r.charge.right) parts.push(`charge ${formatSignedCharge(r.charge.left)} vs ${formatSignedCharge(r.charge.right)}`);
  let text = parts.length ? `Not balanced — ${parts.join('; ')}.` : 'Balanced as written.';
  if (r.status === 'balanced' && r.balancedDisplay)
    text += ` Balanced: ${r.balancedDisplay}${r.method === 'half-reactions' ? ' (by half-reactions; other combinations also conserve atoms and charge)' : ''}`;
  else if (r.status === 'impossible') text += ' No coefficients balance these species as placed.';
  else if (r.status === 'ambiguous') text += ' These species have more than one independent balanced form; write the coefficients.';
  else if (r.status === 'too-large') text += ` ${r.message}`;
  return text;
}

// ---------------------------------------------------------------------------------------------------------
// Analysis

export interface ReactionAnalysis {
  text: string;
  parsed: ParsedEquation;
  balance: BalanceResult;
  /** Parse diagnostics plus the balance findings; offsets relative to `text`. */
  diagnostics: ChemDiagnostic[];
  ok: boolean;
}

/** Analyses by equation text (flat copies of the texts: see ../cache.ts). */
const cache = new BoundedCache<ReactionAnalysis>(5000, 32 * 1024 * 1024);

/**
 * Parse and balance an equation, with its diagnostics: `unbalanced-equation` (warning) when atoms or charge
 * differ as written, and an information finding when it is ambiguous, impossible or too large to balance.
 * Memoised by text; results are shared, so treat them as read-only.
 */
export function analyseReaction(text: string): ReactionAnalysis {
  const hit = cache.get(text);
  if (hit) return hit;
  text = detach(text);
  const parsed = parseEquation(text);
  const balance = balanceEquation(parsed);
  const diagnostics = [...parsed.diagnostics];
  // For a readable equation the balance as written is checked first, so any other status means it is unbalanced.
  if (parsed.ok && balance.status !== 'already-balanced' && balance.status !== 'invalid') {
    diagnostics.push({
      code: 'unbalanced-equation',
      severity: 'warning',
      start: 0,
      end: text.length,
      message: unbalancedMessage(balance),
      data: { balanced: balance.balancedText, display: balance.balancedDisplay, coefficients: balance.coefficients, status: balance.status },
    });
  }
  if (balance.status === 'ambiguous' || balance.status === 'impossible' || balance.status === 'too-large') {
    const code = balance.status === 'ambiguous' ? 'ambiguous-equation' : balance.status === 'impossible' ? 'impossible-equation' : 'equation-too-large';
    diagnostics.push({ code, severity: 'information', start: 0, end: text.length, message: balance.message, data: { status: balance.status } });
  }
  const analysis: ReactionAnalysis = { text, parsed, balance, diagnostics, ok: parsed.ok };
  cache.set(text, analysis, 4096 + 64 * text.length);
  return analysis;
}

export function clearReactionCache(): void {
  cache.clear();
}
