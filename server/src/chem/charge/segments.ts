/**
 * Reading one part of a formula as ions: every way of cutting its items into cations and anions that the
 * ion table, the metals' usual charges and the monatomic anions allow.
 */
import { element, isMetal } from '../data/elements';
import type { IonDef } from '../data/ions';
import { SALT_STATES, USUAL_EXTRA } from '../data/states';
import type { FormulaItem, GroupNode } from '../formula/ast';
import { itemsKey, ligandCharge, matchIon, matchKey, MAX_ION_ITEMS } from '../ions/match';

export type SegmentKind = 'metal' | 'proton' | 'monatomic-anion' | 'polyatomic' | 'complex' | 'neutral-ligand';

/** One way a segment may be charged: `total` over all its units, the states behind it, and how unusual it is. */
export interface ChargeOption {
  total: number;
  /** Per-atom states for a metal segment (a multiset for mixed valence), else the per-unit charge. */
  states: number[];
  /** 0 usual, 1 observed but less common, 4 known but unusual (fallback). */
  cost: number;
}

export interface Segment {
  kind: SegmentKind;
  role: 'cation' | 'anion' | 'neutral';
  /** The ion as written, without the count that multiplies it (`NO3`, `Fe`, `[Fe(CN)6]`). */
  ionText: string;
  /** Bracket used in the text when it is a group ('' for runs and single items). */
  bracket: '' | '(' | '[' | '{';
  multiplicity: number;
  /** Offsets of the segment in the formula text, count included. */
  start: number;
  end: number;
  element?: string;
  ion?: IonDef;
  /** For complexes: the central metal and the sum of the ligands' charges. */
  complex?: { metal: string; ligandCharge: number; carbonyl?: boolean };
  /** A carbonyl or phosphine ligand written as a group (`(CO)4`). */
  carbonyl?: boolean;
  /** Per-unit charge options (for metals: per atom), usual first. */
  unitOptions: Array<{ charge: number; cost: number }>;
  /** An oxidation state written in Stock notation (`Fe(III)`): kept whatever the reading. */
  stock?: number;
  /** For a metal read in a salt with its salt states only: the options it had before. */
  unrestricted?: Array<{ charge: number; cost: number }>;
}

/**
 * Extra cost of a catenated anion (peroxide, superoxide, ozonide, disulfide, polysulfide): more than a
 * metal state observed in solids (cost ≤ 1), less than an unusual one (cost ≥ 2). So MnO2 reads as
 * Mn⁴⁺ + 2 O²⁻, not Mn²⁺ + O₂²⁻, while BaO2, Na2O2, KO2 and FeS2 (no oxide or sulfide reading with a
 * usual state) stay peroxide, superoxide and disulfide.
 */
export const CATENATED_COST = 1.5;

/** Charge options of a table ion: the usual charge first, a catenated anion at its extra cost. */
export function ionOptions(ion: IonDef): Array<{ charge: number; cost: number }> {
  const extra = ion.catenated ? CATENATED_COST : 0;
  return ion.charges.map((charge, k) => ({ charge, cost: (k === 0 ? 0 : 1) + extra }));
}

const HALOGENS = new Set(['F', 'Cl', 'Br', 'I', 'At']);
const CHALCOGENS = new Set(['O', 'S', 'Se', 'Te']);
/** Monatomic anions of the less electronegative non-metals: only where no oxide, halide or chalcogenide is present. */
const PNICTOGEN_LIKE: Record<string, number[]> = { N: [-3], P: [-3], As: [-3], Sb: [-3], C: [-4], Si: [-4], Ge: [-4], B: [-3] };
/** Zintl-type anions (CaSi2, NaSi): other negative states of Si, Ge, P, As, Sb, at a cost. */
const ZINTL_EXTRA: Record<string, number[]> = { Si: [-1, -2, -3], Ge: [-1, -2, -3], P: [-1, -2], As: [-1, -2], Sb: [-1, -2] };
const D_OR_F_BLOCK = (z: number) => (z >= 21 && z <= 29) || (z >= 39 && z <= 47) || (z >= 57 && z <= 79) || (z >= 89 && z <= 111) || z === 80;

/**
 * States well established in salts and oxides that the data set lists only among "other known" states
 * (or not at all), added to the usual ones. Source: N. N. Greenwood & A. Earnshaw, Chemistry of the
 * Elements, 2nd ed. (1997), the chapters on these elements (from memory): gold(I) (AuCl, [Au(CN)2]⁻),
 * osmium(II, III, VI, VIII) and ruthenium(VIII) (OsO4, RuO4), iron(IV) (SrFeO3).
 */
const EXTRA_USUAL: Record<string, number[]> = { Os: [2, 3, 6], Fe: [4], Pt: [6] };

/**
 * Usual positive charges of a metal as an ion: the common states and the usual ones of data/states.ts
 * first (cost 0), then those seen in the ICSD (1), then the few above (2), then, as a fallback, any known.
 */
export function metalCharges(symbol: string, fallback: boolean): Array<{ charge: number; cost: number }> {
  const e = element(symbol);
  if (!e) return [];
  const out: Array<{ charge: number; cost: number }> = [];
  const seen = new Set<number>();
  const add = (q: number, cost: number) => {
    if (q > 0 && !seen.has(q)) {
      seen.add(q);
      out.push({ charge: q, cost });
    }
  };
  e.commonStates.forEach((q) => add(q, 0));
  (USUAL_EXTRA[symbol] ?? []).forEach((q) => add(q, 0));
  e.icsdStates.forEach((q) => add(q, 1));
  (EXTRA_USUAL[symbol] ?? []).forEach((q) => add(q, 2));
  if (fallback && D_OR_F_BLOCK(e.z)) e.otherStates.forEach((q) => add(q, 4));
  if (out.length === 0 && fallback) e.otherStates.forEach((q) => add(q, 4));
  return out;
}

function anionCharges(symbol: string): Array<{ charge: number; cost: number }> {
  if (HALOGENS.has(symbol)) return [{ charge: -1, cost: 0 }];
  if (CHALCOGENS.has(symbol)) return [{ charge: -2, cost: 0 }];
  if (symbol === 'H') return [{ charge: -1, cost: 0 }];
  const base = PNICTOGEN_LIKE[symbol];
  if (!base) return [];
  return [...base.map((charge) => ({ charge, cost: 0 })), ...(ZINTL_EXTRA[symbol] ?? []).map((charge) => ({ charge, cost: 3 }))];
}

const textOf = (formula: string, it: { start: number; end: number }) => formula.slice(it.start, it.end);

/** The ion text of a group without its count: `(NO3)2` → `NO3`, keeping the user's characters. */
function groupInner(formula: string, g: GroupNode): string {
  const first = g.items[0];
  const last = g.items[g.items.length - 1];
  return first && last ? formula.slice(first.start, last.end) : '';
}

/** Read a bracket as a complex: a metal first, then ligands whose charges are known. */
function readComplex(g: GroupNode): { metal: string; ligandCharge: number; carbonyl: boolean } | undefined {
  const [first, ...rest] = g.items;
  if (!first || first.kind !== 'element' || first.count !== 1 || !isMetal(first.symbol) || rest.length === 0) return undefined;
  let sum = 0;
  const carbonyl = rest.every((it) => it.kind === 'group' && isCarbonylLigand(it.items));
  for (const it of rest) {
    let q: number | undefined;
    if (it.kind === 'element') {
      q = HALOGENS.has(it.symbol) ? -1 : it.symbol === 'O' ? -2 : it.symbol === 'H' ? -1 : undefined;
      if (q === undefined) return undefined;
      sum += q * it.count;
    } else if (it.kind === 'abbrev') {
      sum += it.charge * it.count;
    } else {
      q = ligandCharge(it.items);
      if (q === undefined) return undefined;
      sum += q * it.count;
    }
  }
  return { metal: first.symbol, ligandCharge: sum, carbonyl };
}

/**
 * Carbonyl and phosphine ligands (CO, PPh3): a metal that has only these is in oxidation state 0
 * (Ni(CO)4, Fe(CO)5, Cr(CO)6; IUPAC Red Book 2005, IR-10; Greenwood & Earnshaw, ch. 8).
 */
export function isCarbonylLigand(items: readonly FormulaItem[]): boolean {
  const k = itemsKey(items);
  return k === 'C1O1' || k === 'P1Ph3';
}

/**
 * A metal with neutral carbonyl ligands only (`Ni(CO)4`, `Fe2(CO)9`): the metals' options become 0; null
 * where the segments are anything else.
 */
export function carbonylReading(segs: Segment[]): Segment[] | null {
  if (!segs.some((s) => s.kind === 'metal')) return null;
  if (!segs.some((s) => s.kind === 'neutral-ligand' && s.carbonyl)) return null;
  if (!segs.every((s) => s.kind === 'metal' || (s.kind === 'neutral-ligand' && s.carbonyl))) return null;
  return segs.map((s) => (s.kind === 'metal' ? { ...s, unitOptions: [{ charge: 0, cost: 0 }] } : s));
}

function groupSegments(formula: string, g: GroupNode, fallback: boolean): Segment[] {
  const out: Segment[] = [];
  const inner = groupInner(formula, g);
  const base = { ionText: inner, bracket: g.open, multiplicity: g.count, start: g.start, end: g.end } as const;
  for (const m of matchIon(g.items)) {
    out.push({ ...base, kind: 'polyatomic', role: m.role, ion: m.ion, unitOptions: ionOptions(m.ion) });
  }
  const cx = readComplex(g);
  if (cx) {
    const opts = metalCharges(cx.metal, fallback).map((o) => ({ charge: o.charge + cx.ligandCharge, cost: o.cost }));
    if (cx.carbonyl) opts.unshift({ charge: 0, cost: 0 });
    const role = opts.every((o) => o.charge < 0) ? 'anion' : opts.every((o) => o.charge > 0) ? 'cation' : 'neutral';
    out.push({ ...base, kind: 'complex', role, complex: cx, unitOptions: opts });
  }
  const lig = ligandCharge(g.items);
  if (lig === 0)
    out.push({
      ...base,
      kind: 'neutral-ligand',
      role: 'neutral',
      unitOptions: [{ charge: 0, cost: 0 }],
      ...(isCarbonylLigand(g.items) ? { carbonyl: true } : {}),
    });
  else if (lig !== undefined && out.length === 0)
    out.push({ ...base, kind: 'polyatomic', role: lig < 0 ? 'anion' : 'cation', unitOptions: [{ charge: lig, cost: 0 }] });
  // A single element in brackets: (Cl)2 reads as Cl2.
  if (out.length === 0 && g.items.length === 1 && g.items[0].kind === 'element' && g.items[0].count === 1) {
    const el = g.items[0].symbol;
    for (const s of singleElement(el, fallback)) out.push({ ...base, ...s, element: el });
  }
  return out;
}

const SINGLE = new Map<string, Array<Pick<Segment, 'kind' | 'role' | 'unitOptions'>>>();
/** The ways one element can stand as an ion (memoised; treat the result as read-only). */
function singleElement(el: string, fallback: boolean): Array<Pick<Segment, 'kind' | 'role' | 'unitOptions'>> {
  const k = fallback ? el + '*' : el;
  let hit = SINGLE.get(k);
  if (!hit) SINGLE.set(k, (hit = singleElementUncached(el, fallback)));
  return hit;
}

function singleElementUncached(el: string, fallback: boolean): Array<Pick<Segment, 'kind' | 'role' | 'unitOptions'>> {
  const out: Array<Pick<Segment, 'kind' | 'role' | 'unitOptions'>> = [];
  if (isMetal(el)) out.push({ kind: 'metal', role: 'cation', unitOptions: metalCharges(el, fallback) });
  if (el === 'H') out.push({ kind: 'proton', role: 'cation', unitOptions: [{ charge: 1, cost: 0 }] });
  const an = anionCharges(el);
  if (an.length) out.push({ kind: 'monatomic-anion', role: 'anion', unitOptions: an });
  return out.filter((s) => s.unitOptions.length > 0);
}

export const MAX_SEGMENTATIONS = 64;
const MAX_STEPS = 4000;

/** Every reading of `items` as a sequence of segments (bounded). */
export function segmentations(formula: string, items: readonly FormulaItem[], fallback: boolean): Segment[][] {
  const results: Segment[][] = [];
  const acc: Segment[] = [];
  const n = items.length;
  // Per-item keys for run matching (undefined for brackets, which end a run).
  const itemKeys = items.map((it) => (it.kind === 'group' ? undefined : itemsKey([it])));
  const memo: Array<Array<{ seg: Segment; next: number }> | undefined> = new Array(n);
  const choicesAt = (i: number) => (memo[i] ??= choicesFrom(i));
  const choicesFrom = (i: number): Array<{ seg: Segment; next: number }> => {
    const it = items[i];
    const out: Array<{ seg: Segment; next: number }> = [];
    if (it.kind === 'group') {
      for (const seg of groupSegments(formula, it, fallback)) out.push({ seg, next: i + 1 });
      return out;
    }
    if (it.kind === 'abbrev') {
      if (it.charge !== 0)
        out.push({
          seg: {
            kind: 'polyatomic',
            role: 'anion',
            ionText: textOf(formula, { start: it.start, end: it.end - (it.count === 1 ? 0 : String(it.count).length) }),
            bracket: '',
            multiplicity: it.count,
            start: it.start,
            end: it.end,
            unitOptions: [{ charge: it.charge, cost: 0 }],
          },
          next: i + 1,
        });
      else {
        const m = matchIon([it]);
        for (const x of m)
          out.push({
            seg: {
              kind: 'polyatomic',
              role: x.role,
              ion: x.ion,
              ionText: textOf(formula, it),
              bracket: '',
              multiplicity: 1,
              start: it.start,
              end: it.end,
              unitOptions: ionOptions(x.ion),
            },
            next: i + 1,
          });
      }
      return out;
    }
    // Runs of items that spell a polyatomic ion (longest first), then the single element. The run's key
    // is built item by item, and only runs of elements and shorthand are looked up.
    const runs: Array<{ len: number; key: string }> = [];
    let key = '';
    for (let len = 1; len <= Math.min(MAX_ION_ITEMS, n - i); len++) {
      const k = itemKeys[i + len - 1];
      if (k === undefined) break;
      key += k;
      runs.push({ len, key });
    }
    for (let r = runs.length - 1; r >= 0; r--) {
      const { len, key: runKey } = runs[r];
      const first = items[i];
      const last = items[i + len - 1];
      for (const m of matchKey(runKey)) {
        out.push({
          seg: {
            kind: 'polyatomic',
            role: m.role,
            ion: m.ion,
            ionText: formula.slice(first.start, last.end),
            bracket: '',
            multiplicity: 1,
            start: first.start,
            end: last.end,
            unitOptions: ionOptions(m.ion),
          },
          next: i + len,
        });
      }
    }
    const symEnd = it.symbolEnd;
    for (const s of singleElement(it.symbol, fallback)) {
      const opts =
        it.stock !== undefined
          ? s.unitOptions
              .filter((o) => o.charge === it.stock)
              .concat(s.unitOptions.some((o) => o.charge === it.stock) || s.kind !== 'metal' ? [] : [{ charge: it.stock, cost: 0 }])
          : s.unitOptions;
      if (opts.length === 0) continue;
      out.push({
        seg: {
          kind: s.kind,
          role: s.role,
          unitOptions: opts,
          element: it.symbol,
          ionText: formula.slice(it.start, symEnd),
          bracket: '',
          multiplicity: it.count,
          start: it.start,
          end: it.end,
          ...(it.stock !== undefined ? { stock: it.stock } : {}),
        },
        next: i + 1,
      });
    }
    return out;
  };
  if (n === 0) return results;
  // Depth-first over positions with an explicit stack; `acc` holds the choices of the frames below the top.
  const stack: Array<{ choices: Array<{ seg: Segment; next: number }>; k: number }> = [{ choices: choicesAt(0), k: 0 }];
  let steps = 0;
  while (stack.length && results.length < MAX_SEGMENTATIONS && steps++ < MAX_STEPS) {
    const top = stack[stack.length - 1];
    if (top.k >= top.choices.length) {
      stack.pop();
      acc.pop();
      continue;
    }
    const c = top.choices[top.k++];
    if (c.next === n) {
      results.push([...acc, c.seg]);
      continue;
    }
    acc.push(c.seg);
    stack.push({ choices: choicesAt(c.next), k: 0 });
  }
  return results;
}

/**
 * Metal-rich interstitial phases (Fe3C, Mn4N, TiH2, Ni2B) do not follow valence rules: only for them are a
 * metal's unusual states tried.
 */
export function interstitialOnly(segs: Segment[]): boolean {
  const anions = segs.filter((s) => s.role === 'anion');
  return anions.length > 0 && anions.every((s) => s.kind === 'monatomic-anion' && ['C', 'N', 'B', 'Si', 'H', 'P', 'Ge'].includes(s.element as string));
}

/** Whether a segmentation is chemically sensible as a salt or ion (rules on monatomic anions and protons). */
export function plausible(segs: Segment[]): boolean {
  const monoAnions = segs.filter((s) => s.kind === 'monatomic-anion').map((s) => s.element as string);
  const hasStrongAnion = segs.some(
    (s) => (s.kind === 'monatomic-anion' && (HALOGENS.has(s.element!) || CHALCOGENS.has(s.element!))) || (s.role === 'anion' && s.kind !== 'monatomic-anion'),
  );
  for (const el of monoAnions) {
    if (el in PNICTOGEN_LIKE && hasStrongAnion) return false;
    if (el === 'H' && monoAnions.some((x) => x !== 'H')) return false;
    if (el === 'H' && segs.some((s) => s.role === 'anion' && s.kind !== 'monatomic-anion')) return false;
  }
  if (segs.length > 1 && segs.some((s) => s.kind === 'proton') && !segs.some((s) => s.role === 'anion' && !(s.kind === 'monatomic-anion' && s.element === 'H')))
    return false;
  if (segs.some((s) => s.kind === 'proton') && monoAnions.includes('H')) return false;
  return true;
}

/** A real cation: a metal, a polyatomic cation or a complex cation (protons alone make an acid, a molecule). */
export function hasRealCation(segs: Segment[]): boolean {
  return segs.some((s) => s.role === 'cation' && s.kind !== 'proton');
}

/** A complex whose charge may take either sign (`[Au(CN)2]`: +1 or −1 by the metal's state) can be either ion. */
const eitherSign = (s: Segment) => s.kind === 'complex' && s.role === 'neutral';

/** A real cation and an anion, two different segments (a complex of either sign counts as either). */
export function cationWithAnion(segs: Segment[]): boolean {
  const cat = segs.filter((s) => (s.role === 'cation' && s.kind !== 'proton') || eitherSign(s));
  const an = segs.filter((s) => s.role === 'anion' || eitherSign(s));
  return cat.some((c) => an.some((a) => a !== c));
}

const SALT_HALIDES = new Set(['Cl', 'Br', 'I']);
const OXIDE_LIKE = new Set(['O', 'S', 'Se', 'Te', 'N', 'P', 'As', 'Sb', 'C', 'Si', 'Ge', 'B', 'H']);

/**
 * A salt of polyatomic anions or of chloride, bromide, iodide read with each metal's salt states only
 * (data/states.ts): the same segments with the metals' options replaced, or null where the reading is
 * not such a salt (oxides, chalcogenides, fluorides, hydrides, intermetallic phases keep the usual set).
 */
export function saltReading(segs: Segment[]): Segment[] | null {
  const anions = segs.filter((s) => s.role === 'anion' || (s.kind === 'complex' && s.role === 'neutral'));
  if (anions.length === 0) return null;
  for (const a of anions) {
    if (a.kind === 'monatomic-anion') {
      if (a.element === 'F' || OXIDE_LIKE.has(a.element as string) || !SALT_HALIDES.has(a.element as string)) return null;
    } else if (a.ion?.catenated) return null;
  }
  let changed = false;
  const out = segs.map((s) => {
    if (s.kind !== 'metal' || s.stock !== undefined) return s;
    const states = SALT_STATES[s.element as string];
    if (!states) return s;
    changed = true;
    return { ...s, unitOptions: states.map((charge, k) => ({ charge, cost: k === 0 ? 0 : 0.25 })), unrestricted: s.unitOptions };
  });
  return changed ? out : null;
}
