/**
 * Balancing by half-reactions, for redox equations whose atoms and charge alone leave more than one
 * independent solution (`MnO4^- + H2O2 + H^+ -> Mn^2+ + O2 + H2O` also balances as any mixture with the
 * peroxide's own decomposition 2 H2O2 -> 2 H2O + O2).
 *
 * The method as a titration is written (the usual ion–electron method of analytical chemistry texts such as
 * Vogel's Textbook of Quantitative Chemical Analysis; common practice): each element's atoms are tracked
 * by oxidation state, as pools. An atom keeps its state unless its element changes state in the reaction,
 * and then it moves only along a redox couple, from a state found among the reactants only to one found
 * among the products only: Mn +7 → +2, and for oxygen −1 (peroxide) → 0 (O2). So the O2 is drawn from the
 * peroxide, not from permanganate or water, and the water's oxygen keeps its −2. Conserving every pool,
 * with the couples' flows free, and the charge (electrons lost = electrons gained) leaves, for a titration,
 * one solution: 2 MnO4⁻ + 5 H2O2 + 6 H⁺ → 2 Mn²⁺ + 5 O2 + 8 H2O.
 *
 * Couples of one element (D = states among the reactants only, A = among the products only):
 * one D and one A → D → A; several D and one A → each to A (comproportionation, IO3⁻ + I⁻ → I2); one D and
 * several A → D to each (disproportionation); D without A → each to the nearest product state (H2O2 → H2O);
 * A without D → each from the nearest reactant state. Anything else (several of both, or a tie for the
 * nearest) is left undecided, as is a system that still has more than one solution: the equation is then
 * reported ambiguous. Oxidation states are the analysis's per-element values (averages for mixed valence).
 */
import { analyseFormula } from '../analyse';
import { nullSpace, smallestIntegers } from './balance';
import type { Species } from './parse';
import { fromNumber, mul, neg, ONE, rational, ZERO, type Rational } from './rational';

export interface HalfReactionResult {
  /** Smallest whole-number coefficients, in order of the species, every one positive. */
  coefficients: bigint[];
  /** The couples used: element, from state, to state (e.g. Mn 7 → 2). */
  couples: Array<{ element: string; from: number; to: number }>;
}

/** A number as an exact fraction with a small denominator (oxidation-state averages such as 8/3, 2.5). */
function exact(x: number): Rational | null {
  for (let d = 1; d <= 1000; d++) {
    const n = Math.round(x * d);
    if (Math.abs(x * d - n) < 1e-6) return rational(BigInt(n), BigInt(d));
  }
  return null;
}

const keyOf = (x: number) => (Math.round(x * 1e6) / 1e6).toString();

/** Oxidation states of each element of a species, or null when they cannot be assigned. */
function statesOf(s: Species): Record<string, number> | null {
  if (s.isElectron) return {};
  const a = analyseFormula(s.formulaText);
  const ox = a.charges?.oxidationStates;
  if (!ox) return null;
  for (const el of Object.keys(s.atoms)) if (ox[el] === undefined || !Number.isFinite(ox[el])) return null;
  return ox;
}

/** The couples of one element from its reactant and product states, or null when they are not decided. */
function couplesOf(reactant: number[], product: number[]): Array<[number, number]> | null {
  const r = new Set(reactant.map(keyOf));
  const p = new Set(product.map(keyOf));
  const uniq = (xs: number[]) => [...new Map(xs.map((x) => [keyOf(x), x])).values()];
  const D = uniq(reactant.filter((x) => !p.has(keyOf(x))));
  const A = uniq(product.filter((x) => !r.has(keyOf(x))));
  const nearest = (x: number, pool: number[]): number | null => {
    const ds = pool.map((y) => Math.abs(y - x));
    const best = Math.min(...ds);
    const at = pool.filter((_, k) => Math.abs(ds[k] - best) < 1e-9);
    return uniq(at).length === 1 ? at[0] : null;
  };
  if (D.length === 0 && A.length === 0) return [];
  if (D.length >= 1 && A.length === 1) return D.map((d) => [d, A[0]]);
  if (D.length === 1 && A.length > 1) return A.map((a) => [D[0], a]);
  if (A.length === 0) {
    const out: Array<[number, number]> = [];
    for (const d of D) {
      const to = nearest(d, uniq(product));
      if (to === null) return null;
      out.push([d, to]);
    }
    return out;
  }
  if (D.length === 0) {
    const out: Array<[number, number]> = [];
    for (const a of A) {
      const from = nearest(a, uniq(reactant));
      if (from === null) return null;
      out.push([from, a]);
    }
    return out;
  }
  return null;
}

/** Rank of a set of rational vectors of length n. */
function rank(vectors: Rational[][], n: number): number {
  if (vectors.length === 0) return 0;
  return n - nullSpace(vectors, n).length;
}

/**
 * Balance by half-reactions (see the header), or null when they do not decide a single positive solution.
 * `species` in order, reactants first; only called for equations the algebra leaves ambiguous.
 */
export function balanceByHalfReactions(species: readonly Species[]): HalfReactionResult | null {
  const states = species.map(statesOf);
  if (states.some((s) => s === null)) return null;
  const elements = [...new Set(species.flatMap((s) => Object.keys(s.atoms)))];
  // Pools: (element, state) → row; couples: columns after the species.
  const couples: Array<{ element: string; from: number; to: number }> = [];
  for (const el of elements) {
    const r: number[] = [];
    const p: number[] = [];
    species.forEach((s, k) => {
      if (!s.atoms[el]) return;
      (s.side === 'reactant' ? r : p).push((states[k] as Record<string, number>)[el]);
    });
    const c = couplesOf(r, p);
    if (c === null) return null;
    for (const [from, to] of c) couples.push({ element: el, from, to });
  }
  if (couples.length === 0) return null;
  const n = species.length;
  const cols = n + couples.length;
  const pools = new Map<string, Rational[]>();
  const row = (el: string, state: number) => {
    const k = `${el} ${keyOf(state)}`;
    let r = pools.get(k);
    if (!r) pools.set(k, (r = new Array(cols).fill(ZERO)));
    return r;
  };
  for (let k = 0; k < n; k++) {
    const s = species[k];
    const sign = s.side === 'reactant' ? ONE : neg(ONE);
    for (const [el, count] of Object.entries(s.atoms)) {
      const c = fromNumber(count) ?? exact(count);
      if (!c) return null;
      const r = row(el, (states[k] as Record<string, number>)[el]);
      r[k] = mul(sign, c);
    }
  }
  couples.forEach((c, j) => {
    row(c.element, c.from)[n + j] = neg(ONE);
    row(c.element, c.to)[n + j] = ONE;
  });
  const matrix = [...pools.values()];
  const charge: Rational[] = new Array(cols).fill(ZERO);
  species.forEach((s, k) => {
    charge[k] = mul(s.side === 'reactant' ? ONE : neg(ONE), rational(BigInt(Math.trunc(s.charge))));
  });
  matrix.push(charge);
  const basis = nullSpace(matrix, cols);
  const projected = basis.map((v) => v.slice(0, n)).filter((v) => v.some((x) => x.n !== 0n));
  if (rank(projected, n) !== 1) return null;
  const v = smallestIntegers(projected[0]);
  const w = v.some((x) => x < 0n) && v.every((x) => x <= 0n) ? v.map((x) => -x) : v;
  // With every coefficient positive the couples run forwards: a reactant-only state can only drain.
  if (!w.every((x) => x > 0n)) return null;
  return { coefficients: w, couples };
}
