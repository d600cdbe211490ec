/**
 * Oxidation states by the usual rules, for formulas that are not read as ions (molecules, organic
 * compounds, minerals written as oxide sums, non-stoichiometric phases), and for the atoms inside ions.
 *
 * Rules, in the order chemistry texts give them (IUPAC Red Book 2005, IR-4.6.1; common practice):
 * an element on its own is 0; F is −1; O is −2 (unless bonded to F only); H is +1, or −1 when it is the
 * most electronegative element present (hydrides); alkali metals +1, alkaline-earth metals +2, Al +3;
 * Cl, Br, I, S, Se, Te take their negative state when they are the most electronegative element present.
 * The remaining elements take states from their known ones (common first) so that the sum equals the
 * charge; when no whole-number set exists, the element with the widest range takes the average that
 * balances (Fe in Fe0.95O, C in organic compounds), which is the honest answer.
 */
import { element, isMetal } from '../data/elements';
import { cleanCount, type AtomCounts } from '../formula/compute';

export interface StateAssignment {
  states: Record<string, number>;
  /** Elements whose value is an average over several sites or states. */
  averaged: string[];
  /** Elements given a state outside their common and ICSD-observed ones. */
  unusual: string[];
}

const ALKALI = new Set(['Li', 'Na', 'K', 'Rb', 'Cs', 'Fr']);
const ALKALINE_EARTH = new Set(['Be', 'Mg', 'Ca', 'Sr', 'Ba', 'Ra']);
const NEGATIVE_WHEN_MOST_EN: Record<string, number> = { Cl: -1, Br: -1, I: -1, S: -2, Se: -2, Te: -2, N: -3 };

const en = (el: string) => element(el)?.en ?? 0;

interface Choice {
  state: number;
  cost: number;
}

function knownStates(el: string): Choice[] {
  const e = element(el);
  if (!e) return [];
  const out: Choice[] = [];
  const seen = new Set<number>();
  const add = (q: number, c: number) => {
    if (!seen.has(q)) {
      seen.add(q);
      out.push({ state: q, cost: c });
    }
  };
  e.commonStates.forEach((q) => add(q, 0));
  e.icsdStates.forEach((q) => add(q, 1));
  e.otherStates.forEach((q) => add(q, 3));
  return out;
}

function range(el: string): [number, number] {
  const s = knownStates(el).map((c) => c.state);
  if (s.length === 0) return [-8, 8];
  return [Math.min(0, ...s), Math.max(0, ...s)];
}

/** Assign oxidation states to `atoms` so that they sum to `charge`; null when no assignment is found. */
export function assignStates(atoms: AtomCounts, charge: number): StateAssignment | null {
  const els = Object.keys(atoms).filter((el) => atoms[el] > 0);
  if (els.length === 0) return null;
  if (els.length === 1) {
    const el = els[0];
    const v = cleanCount(charge / atoms[el]);
    const [lo, hi] = range(el);
    if (v < lo - 1e-9 || v > hi + 1e-9) return null;
    return { states: { [el]: v }, averaged: Number.isInteger(v) ? [] : [el], unusual: [] };
  }
  if (charge === 0 && els.every((el) => isMetal(el))) {
    return { states: Object.fromEntries(els.map((el) => [el, 0])), averaged: [], unusual: [] };
  }
  const fixed: Record<string, number> = {};
  const maxEN = Math.max(...els.map(en));
  const mostEN = els.find((el) => en(el) === maxEN);
  const hasF = els.includes('F');
  for (const el of els) {
    if (el === 'F') fixed[el] = -1;
    else if (el === 'O' && !hasF) fixed[el] = -2;
    else if (el === 'H') fixed[el] = el === mostEN ? -1 : 1;
    else if (ALKALI.has(el)) fixed[el] = 1;
    else if (ALKALINE_EARTH.has(el)) fixed[el] = 2;
    else if (el === 'Al') fixed[el] = 3;
    else if (el === mostEN && el in NEGATIVE_WHEN_MOST_EN) fixed[el] = NEGATIVE_WHEN_MOST_EN[el];
  }
  let rest = charge;
  for (const [el, q] of Object.entries(fixed)) rest -= q * atoms[el];
  const free = els.filter((el) => !(el in fixed));
  if (free.length === 0) {
    return Math.abs(rest) < 1e-6 ? { states: { ...fixed }, averaged: [], unusual: [] } : null;
  }
  // Whole-number states for the free elements (each with one state), cheapest first.
  const best = searchWhole(free, atoms, rest);
  if (best) {
    const unusual = free.filter((el) => (knownStates(el).find((c) => c.state === best[el])?.cost ?? 3) >= 3);
    return { states: { ...fixed, ...best }, averaged: [], unusual };
  }
  // One element absorbs the difference as an average; the others take their most common state.
  const byRange = [...free].sort((a, b) => {
    const [la, ha] = range(a);
    const [lb, hb] = range(b);
    return hb - lb - (ha - la) || (a === 'C' ? -1 : b === 'C' ? 1 : 0);
  });
  for (const absorber of byRange) {
    let r = rest;
    const states: Record<string, number> = { ...fixed };
    for (const el of free) {
      if (el === absorber) continue;
      const q = knownStates(el)[0]?.state ?? 0;
      states[el] = q;
      r -= q * atoms[el];
    }
    const v = cleanCount(r / atoms[absorber]);
    const [lo, hi] = range(absorber);
    if (v >= lo - 1e-9 && v <= hi + 1e-9) {
      states[absorber] = v;
      return { states, averaged: Number.isInteger(v) ? [] : [absorber], unusual: [] };
    }
  }
  return null;
}

/**
 * Weight of the electronegativity tie-break: among assignments of equal cost, the one that gives the
 * negative states to the more electronegative elements (the definition of oxidation states: bonding
 * electrons go to the more electronegative partner; IUPAC, Pure Appl. Chem. 88 (2016) 831, "Toward a
 * comprehensive definition of oxidation state"). SiC is Si +4, C −4; SO2Cl2 is S +6, Cl −1.
 */
const EN_TIE = 1e-3;

function searchWhole(free: string[], atoms: AtomCounts, target: number): Record<string, number> | null {
  // Dynamic programming over elements: sum → cheapest choice. Counts may be fractional.
  let layer = new Map<number, { cost: number; pick: Record<string, number> }>([[0, { cost: 0, pick: {} }]]);
  for (const el of free) {
    const next = new Map<number, { cost: number; pick: Record<string, number> }>();
    for (const [sum, v] of layer) {
      for (const c of knownStates(el)) {
        const s = Math.round((sum + c.state * atoms[el]) * 1e6) / 1e6;
        const cost = v.cost + c.cost + EN_TIE * c.state * atoms[el] * en(el);
        const at = next.get(s);
        if (!at || cost < at.cost) next.set(s, { cost, pick: { ...v.pick, [el]: c.state } });
      }
    }
    layer = next;
    if (layer.size > 20000) return null;
  }
  return layer.get(Math.round(target * 1e6) / 1e6)?.pick ?? null;
}
