/**
 * Charge balance and oxidation states of a formula.
 *
 * First the formula is read as cations and anions (ion table, metals' usual charges, monatomic anions).
 * Where that reading is decisive — a real cation (metal, polyatomic or complex cation) with anions, or an
 * ion written with its charge that the table names — it decides: `CaNO3`, `NH4SO4` and `Al(OH)2` are
 * imbalanced even though some exotic set of oxidation states would sum to zero. Otherwise oxidation
 * states are assigned by the usual rules (charge/oxidation.ts). Molecular and organic substances, elements
 * and alloys are never flagged.
 */
import { BoundedCache, detach } from '../cache';
import type { ChemDiagnostic } from '../diagnostic';
import { element, isMetal } from '../data/elements';
import type { Formula, FormulaItem, FormulaPart } from '../formula/ast';
import {
  cleanCount,
  formatCharge,
  formatCount,
  formulaAtoms,
  inNotationOf,
  itemAtoms,
  partAtoms,
  signed,
  subscriptDigits,
  type AtomCounts,
} from '../formula/compute';
import { parseFormula } from '../formula/parse';
import { readAlloyDesignation, type AlloyDesignation } from '../formula/alloy';
import { assignStates } from './oxidation';
import { organicNitrogen } from './structure';
import { solve, type IonicSolution } from './ionic';
import { SALT_STATES } from '../data/states';
import { compositionReadings } from '../ions/composition';
import { carbonylReading, cationWithAnion, interstitialOnly, plausible, saltReading, segmentations, type Segment } from './segments';

export interface IonInReading {
  /** Display label with charge, e.g. `NO₃⁻`. */
  label: string;
  /** The ion as written, e.g. `NO3`. */
  text: string;
  count: number;
  charge: number;
  role: 'cation' | 'anion' | 'neutral';
  kind: Segment['kind'];
  /** Per-atom states for metals (mixed valence), else one value. */
  states: number[];
  element?: string;
  ionName?: string;
  radius?: number;
  radiusFromMemory?: boolean;
}

export interface ChargeAssessment {
  balanced: boolean;
  message: string;
  suggestions: string[];
  oxidationStates: Record<string, number> | null;
  /**
   * States per site where the formula shows the sites (each ion; each group of an organic N; the molecule
   * or hydrate part as written otherwise); counts over the whole formula. Null where no states are.
   */
  sites: SiteState[] | null;
  /** Elements whose state the formula cannot determine (absent from both), with the reason. */
  undetermined: Array<{ element: string; reason: string }>;
  /** Where the text is an alloy designation (`AlSi10Mg`), its nominal composition. */
  designation?: AlloyDesignation;
  /** The ionic reading of the main part, when the formula reads as ions. */
  ions: IonInReading[] | null;
  /** `ionic` (read as ions), `states` (oxidation-state rules), `molecular`, `element`, `alloy`, `none`. */
  basis: 'ionic' | 'states' | 'molecular' | 'element' | 'alloy' | 'none';
  mixedValence: string[];
  unusual: string[];
  diagnostics: ChemDiagnostic[];
}

const WORDS = ['zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten', 'eleven', 'twelve'];
const countWord = (n: number) => (Number.isInteger(n) && n < WORDS.length ? WORDS[n] : formatCount(n));
const chargeWord = (q: number) => (q === 0 ? '0' : `${Math.abs(q)}${q > 0 ? '+' : '−'}`);
const capital = (t: string) => t.charAt(0).toUpperCase() + t.slice(1);

function label(seg: Segment, unitCharge: number): string {
  const q = Number.isInteger(unitCharge) ? unitCharge : 0;
  const body = seg.bracket === '[' || seg.bracket === '{' ? `${seg.bracket}${seg.ionText}${seg.bracket === '[' ? ']' : '}'}` : seg.ionText;
  return subscriptDigits(body) + formatCharge(q, true);
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

const hasFraction = (items: readonly FormulaItem[]): boolean =>
  items.some((it) => !Number.isInteger(it.count) || (it.kind === 'group' && hasFraction(it.items)));

/** Decisive readings: a real cation with anions; or, for an ion written with a charge, an ion the table names. */
function decisive(segs: Segment[], target: number): boolean {
  if (cationWithAnion(segs)) return true;
  if (target !== 0 && segs.length === 1) {
    const s = segs[0];
    return (
      (s.kind === 'polyatomic' && !!s.ion) ||
      s.kind === 'complex' ||
      s.kind === 'metal' ||
      ((s.kind === 'monatomic-anion' || s.kind === 'proton') && s.multiplicity === 1)
    );
  }
  return false;
}

interface PartResult {
  balanced: boolean;
  states: Record<string, number> | null;
  weights: AtomCounts;
  basis: ChargeAssessment['basis'];
  message: string;
  suggestions: string[];
  ions: IonInReading[] | null;
  mixed: string[];
  unusual: string[];
  /** Offsets (in the formula text) of what the warning should cover. */
  span?: { start: number; end: number };
  /** Suggestions are whole formulas (an ion's charge corrected), not texts for the part. */
  wholeSuggestions?: boolean;
  /** States per site, counts per one unit of the part (before its multiplier). */
  sites?: SiteState[];
  /** Elements whose state the formula does not determine, and why. */
  undetermined?: Array<{ element: string; reason: string }>;
}

function ionsOf(sol: IonicSolution): IonInReading[] {
  return sol.segments.map(({ segment: s, unitCharges, total }) => {
    const unit = s.kind === 'metal' ? total / s.multiplicity : unitCharges[0];
    return {
      label: label(s, Number.isInteger(unit) ? unit : Math.round(unit)),
      text: s.ionText,
      count: s.multiplicity,
      charge: cleanCount(unit),
      role: s.kind === 'complex' ? (unit > 0 ? 'cation' : unit < 0 ? 'anion' : 'neutral') : s.role,
      kind: s.kind,
      states: unitCharges,
      ...(s.element ? { element: s.element } : {}),
      ...(s.ion
        ? {
            ionName: s.ion.charges.length > 1 && s.ion.namesByCharge?.[unitCharges[0]] ? s.ion.namesByCharge[unitCharges[0]] : s.ion.name,
            radius: s.ion.radius,
            radiusFromMemory: s.ion.radiusFromMemory,
          }
        : {}),
    };
  });
}

/** Oxidation states implied by a solved ionic reading, per element (averages) and per site (each ion). */
function statesOf(sol: IonicSolution): { states: Record<string, number>; sites: SiteState[] } | null {
  const sum: Record<string, number> = {};
  const weights: AtomCounts = {};
  const sites: SiteState[] = [];
  const add = (el: string, q: number, n: number, site: string) => {
    sum[el] = (sum[el] ?? 0) + q * n;
    weights[el] = (weights[el] ?? 0) + n;
    const at = sites.find((x) => x.element === el && x.site === site && Math.abs(x.state - q) < 1e-9);
    if (at) at.count = cleanCount(at.count + n);
    else sites.push({ element: el, state: cleanCount(q), count: cleanCount(n), site });
  };
  for (const { segment: s, unitCharges, total } of sol.segments) {
    const m = s.multiplicity;
    if (s.kind === 'metal' && unitCharges.length === m && new Set(unitCharges).size > 1) {
      // Mixed valence: one site per state (Fe3O4: Fe²⁺ and 2 Fe³⁺).
      for (const q of new Set(unitCharges)) add(s.element as string, q, unitCharges.filter((x) => x === q).length, label(s, q));
      continue;
    }
    if (s.kind === 'metal' || s.kind === 'monatomic-anion' || s.kind === 'proton') {
      const q = total / m;
      add(s.element as string, q, m, Number.isInteger(cleanCount(q)) ? label(s, q) : `${s.ionText} (average)`);
      continue;
    }
    const unit = unitCharges[0];
    const site = label(s, unit);
    const atoms = segmentAtoms(s);
    if (!atoms) return null;
    if (Object.values(atoms).some(Number.isNaN)) continue; // `Sx`: its state depends on x (see variablePart)
    let inner: Record<string, number> | null;
    if (s.ion?.states) {
      // Internal states given for some atoms (peroxo O, thio S, amine N); the others by the usual rules.
      const fixed = s.ion.states;
      const rest: AtomCounts = {};
      let left = unit;
      for (const [el, n] of Object.entries(atoms)) {
        if (el in fixed) left -= fixed[el] * n;
        else rest[el] = n;
      }
      const others = Object.keys(rest).length ? (assignStates(rest, left)?.states ?? null) : {};
      inner = others ? { ...others, ...fixed } : null;
    } else if (s.kind === 'complex' && s.complex) {
      const metalState = unit - s.complex.ligandCharge;
      const rest = { ...atoms };
      rest[s.complex.metal] -= 1;
      if (rest[s.complex.metal] <= 0) delete rest[s.complex.metal];
      const lig: { states: Record<string, number> } | null = Object.keys(rest).length ? assignStates(rest, unit - metalState) : { states: {} };
      if (!lig) return null;
      add(s.complex.metal, metalState, m, site);
      for (const [el, n] of Object.entries(rest)) add(el, lig.states[el], n * m, site);
      continue;
    } else inner = assignStates(atoms, unit)?.states ?? null;
    if (!inner) return null;
    for (const [el, n] of Object.entries(atoms)) add(el, inner[el] ?? 0, n * m, site);
  }
  const states: Record<string, number> = {};
  for (const el of Object.keys(sum)) states[el] = cleanCount(sum[el] / weights[el]);
  return { states, sites };
}

/** One site of a formula: the element's state there (e.g. N −3 in NH₄⁺, N +5 in NO₃⁻). */
export interface SiteState {
  element: string;
  state: number;
  count: number;
  /** Where it sits: the ion (`NH₄⁺`), the group (`NO₂ (nitro)`), or the molecule as written. */
  site: string;
}

/** Sites of states assigned to a part as a whole: one site, the part as written. */
function wholeSites(states: Record<string, number>, atoms: AtomCounts, site: string): SiteState[] {
  return Object.keys(atoms)
    .filter((el) => el in states)
    .map((el) => ({ element: el, state: states[el], count: atoms[el], site }));
}

/** Atoms of one unit of a segment, from the ion as written. */
function segmentAtoms(s: Segment): AtomCounts | null {
  const hit = ATOMS_CACHE.get(s.ionText);
  if (hit) return hit;
  const r = parseFormula(s.ionText);
  if (!r.ok || !r.formula) return null;
  const atoms = formulaAtoms(r.formula);
  // The ion's text is a slice of the formula's: the key is a flat copy (see ../cache.ts).
  ATOMS_CACHE.set(detach(s.ionText), atoms, 64 + 48 * Object.keys(atoms).length);
  return atoms;
}
const ATOMS_CACHE = new BoundedCache<AtomCounts>(5000, 2 * 1024 * 1024);

function renderSegment(s: Segment, count: number): string {
  const c = count === 1 ? '' : formatCount(count);
  if (s.kind === 'metal' || s.kind === 'monatomic-anion' || s.kind === 'proton') return s.ionText + c;
  if (s.bracket === '[' || s.bracket === '{') return `${s.bracket}${s.ionText}${s.bracket === '[' ? ']' : '}'}${c}`;
  const multiAtom = /[A-Z].*[A-Z]|[0-9]/.test(s.ionText) || s.ionText.length > 2;
  return count === 1 || !multiAtom ? s.ionText + c : `(${s.ionText})${c}`;
}

/** Corrected texts for a part: criss-cross for one cation with one anion, else one count adjusted. */
function partSuggestions(segs: Segment[], target: number): string[] {
  const out: string[] = [];
  const charged = segs.filter((s) => s.role !== 'neutral');
  const cations = charged.filter((s) => s.role === 'cation');
  const anions = charged.filter((s) => s.role === 'anion');
  const usual = (s: Segment) => s.unitOptions.filter((o) => o.cost <= 1).map((o) => o.charge);
  if (cations.length === 1 && anions.length === 1 && target === 0) {
    const [c] = cations;
    const [a] = anions;
    const qa = Math.abs(usual(a)[0] ?? 0);
    for (const qc of usual(c)) {
      if (qa === 0) break;
      const g = gcd(qc, qa);
      const counts = new Map<Segment, number>([
        [c, qa / g],
        [a, qc / g],
      ]);
      out.push(segs.map((s) => renderSegment(s, counts.get(s) ?? s.multiplicity)).join(''));
    }
    return out;
  }
  const order = [...anions].reverse().concat(cations);
  for (const s of order) {
    for (const q of usual(s)) {
      if (q === 0) continue;
      let others = 0;
      for (const t of charged) if (t !== s) others += (usual(t)[0] ?? 0) * t.multiplicity;
      const need = (target - others) / q;
      if (Number.isInteger(need) && need > 0 && need <= 12 && need !== s.multiplicity) {
        out.push(segs.map((t) => renderSegment(t, t === s ? need : t.multiplicity)).join(''));
      }
    }
  }
  return out;
}

/** An ion written with the wrong charge: the same ion with each of its usual charges, in the user's notation. */
function ionChargeSuggestions(formula: Formula, seg: Segment): string[] {
  const span = formula.chargeSpan;
  if (!span) return [];
  const written = formula.text.slice(span.start, span.end);
  const superscript = /[⁺⁻]/.test(written);
  const before = formula.chargeNotation === 'bare-digit' ? formula.text.slice(0, span.start) : formula.text.slice(0, span.start);
  const after = formula.text.slice(span.end);
  const usual = seg.unitOptions.filter((o) => o.cost <= 1 && o.charge !== 0 && o.charge * seg.multiplicity !== formula.charge);
  return usual.map((o) => before + formatCharge(o.charge * seg.multiplicity, superscript) + after);
}

/** Words for what is off: "Ca²⁺ with one NO₃⁻ leaves +1". */
function imbalanceWords(segs: Segment[], target: number): string {
  // The usual charges (cost ≤ 1) closest to balance.
  let best: { sum: number; picks: number[] } | null = null;
  const opts = segs.map((s) => s.unitOptions.filter((o) => o.cost <= 1).map((o) => o.charge));
  const walk = (k: number, sum: number, picks: number[]) => {
    if (k === segs.length) {
      if (!best || Math.abs(sum - target) < Math.abs(best.sum - target)) best = { sum, picks: [...picks] };
      return;
    }
    for (const q of (opts[k].length ? opts[k] : [0]).slice(0, 4)) {
      picks.push(q);
      walk(k + 1, sum + q * segs[k].multiplicity, picks);
      picks.pop();
    }
  };
  walk(0, 0, []);
  const b = best as unknown as { sum: number; picks: number[] };
  const phrase = (s: Segment, q: number, always: boolean) => (s.multiplicity === 1 && !always ? label(s, q) : `${countWord(s.multiplicity)} ${label(s, q)}`);
  const cat = segs.map((s, k) => [s, b.picks[k]] as const).filter(([s]) => s.role === 'cation');
  const an = segs.map((s, k) => [s, b.picks[k]] as const).filter(([s]) => s.role !== 'cation');
  const diff = cleanCount(b.sum - target);
  if (target !== 0) {
    const all = segs.map((s, k) => phrase(s, b.picks[k], false)).join(' + ');
    return capital(`${all} carries ${signed(b.sum)}, but the charge written is ${chargeWord(target)}.`);
  }
  const left = cat.map(([s, q]) => phrase(s, q, false)).join(' and ');
  const right = an.map(([s, q]) => phrase(s, q, true)).join(' and ');
  return capital(`${left} with ${right} ${cat.length === 1 && cat[0][0].multiplicity === 1 ? 'leaves' : 'leave'} ${signed(diff)}.`);
}

function describeIons(ions: IonInReading[]): string {
  const out: string[] = [];
  for (const i of ions) {
    const distinct = [...new Set(i.states)];
    if (i.kind === 'metal' && distinct.length > 1 && i.element) {
      // Mixed valence: Fe²⁺ + 2 Fe³⁺.
      for (const q of distinct) {
        const n = i.states.filter((x) => x === q).length;
        out.push(`${n === 1 ? '' : `${n} `}${i.text}${formatCharge(q, true)}`);
      }
    } else out.push(i.count === 1 ? i.label : `${formatCount(i.count)} ${i.label}`);
  }
  return out.join(' + ');
}

const ELEMENT_NAME = (el: string) => element(el)?.name ?? el;

/** "It balances only with Ni⁴⁺, a state nickel does not show in salts (nickel: +2)." */
function outsideSaltWords(sol: IonicSolution): string {
  const bits: string[] = [];
  for (const { segment: s, unitCharges } of sol.segments) {
    if (s.kind !== 'metal' || !s.element) continue;
    const states = SALT_STATES[s.element];
    if (!states) continue;
    const off = [...new Set(unitCharges)].filter((q) => !states.includes(q));
    if (off.length === 0) continue;
    const usual = [...states]
      .sort((a, b) => a - b)
      .map(signed)
      .join(', ');
    bits.push(
      `${off.map((q) => s.element + formatCharge(q, true)).join(', ')}, a state ${ELEMENT_NAME(s.element)} does not show in salts of this kind (${ELEMENT_NAME(s.element)} in salts: ${usual})`,
    );
  }
  return bits.length ? `It balances only with ${bits.join('; ')}.` : '';
}

function assessPart(formula: Formula, part: FormulaPart, target: number): PartResult {
  const text = formula.text;
  const atoms = partAtoms(part);
  const els = Object.keys(atoms);
  const span = { start: part.start + part.multiplierText.length, end: part.end };
  const unitAtoms = itemAtoms(part.items);
  const partLabel = subscriptDigits(text.slice(span.start, span.end).replace(/\s+/g, ''));
  // One object shape for every result (object spreads here were the hot spot of cold analyses).
  const mk = (r: Pick<PartResult, 'balanced' | 'states' | 'basis' | 'message'> & Partial<PartResult>): PartResult => ({
    balanced: r.balanced,
    states: r.states,
    weights: atoms,
    basis: r.basis,
    message: r.message,
    suggestions: r.suggestions ?? [],
    ions: r.ions ?? null,
    mixed: r.mixed ?? [],
    unusual: r.unusual ?? [],
    span: r.span,
    wholeSuggestions: r.wholeSuggestions ?? false,
    sites: r.sites ?? (r.states ? wholeSites(r.states, unitAtoms, partLabel) : undefined),
    undetermined: r.undetermined,
  });
  if (els.length === 0) return mk({ balanced: true, states: null, basis: 'none', message: '' });
  const varEls = els.filter((el) => Number.isNaN(atoms[el]));
  if (varEls.length) return variablePart(formula, part, target, mk, unitAtoms, partLabel);
  if (els.length === 1 && target === 0) {
    return mk({ balanced: true, states: { [els[0]]: 0 }, basis: 'element', message: `${element(els[0])?.name ?? els[0]} as the element: oxidation state 0.` });
  }
  const metals = els.filter(isMetal);
  if (target === 0 && metals.length === els.length) {
    return mk({ balanced: true, states: Object.fromEntries(els.map((e) => [e, 0])), basis: 'alloy', message: 'Intermetallic or alloy: oxidation states 0.' });
  }
  const organic = atoms.C !== undefined && atoms.H !== undefined && metals.length === 0;
  const continuous = hasFraction(part.items) || !Number.isInteger(part.multiplier);
  let decisiveSegs: Segment[] | undefined;
  let anySolution: { sol: IonicSolution; segs: Segment[] } | undefined;
  /** A salt that balances only with a state its metal does not show in salts (Ni(SO4)2 with Ni⁴⁺). */
  let outsideSalt: IonicSolution | undefined;
  /** Whether some decisive reading names a polyatomic anion or complex as written. */
  let namesAnion = false;
  let carbonyl = false;
  for (const fallback of [false, true]) {
    let best: { sol: IonicSolution; segs: Segment[]; decisive: boolean } | undefined;
    for (const written of segmentations(text, part.items, fallback)) {
      if (!plausible(written)) continue;
      if (fallback && !interstitialOnly(written)) continue;
      const metalCarbonyl = target === 0 ? carbonylReading(written) : null;
      const salt = saltReading(written);
      const segs = metalCarbonyl ?? salt ?? written;
      const isDecisive = !organic && decisive(segs, target);
      if (isDecisive && !decisiveSegs) decisiveSegs = segs;
      if (isDecisive && segs.some((s) => (s.role === 'anion' && s.kind === 'polyatomic') || s.kind === 'complex')) namesAnion = true;
      const sol = solve(segs, target, continuous);
      if (!sol) {
        if (salt && isDecisive && !outsideSalt) outsideSalt = solve(written, target, continuous) ?? undefined;
        continue;
      }
      if (metalCarbonyl) carbonyl = true;
      const cost = sol.cost + 0.1 * segs.length;
      const bestCost = best ? best.sol.cost + 0.1 * best.segs.length : Infinity;
      if (!best || (isDecisive && !best.decisive) || (isDecisive === best.decisive && cost < bestCost)) best = { sol, segs, decisive: isDecisive };
    }
    if (best && !anySolution) anySolution = best;
    if (best?.decisive) {
      const ions = ionsOf(best.sol);
      const st = statesOf(best.sol);
      const mixed = ions.filter((i) => i.kind === 'metal' && (new Set(i.states).size > 1 || !Number.isInteger(i.charge))).map((i) => i.element as string);
      const unusual = fallback ? ions.filter((i, k) => best!.sol.segments[k].cost >= 4).map((i) => `${i.element ?? i.text} ${signed(i.charge)}`) : [];
      let message = `Balanced: ${describeIons(ions)}`;
      if (mixed.length) message += continuous ? ' (non-stoichiometric: an average oxidation state)' : ' (mixed valence)';
      message += '.';
      if (unusual.length) message += ` Only with ${unusual.join(', ')}, an unusual oxidation state.`;
      return mk({ balanced: true, states: st?.states ?? null, basis: 'ionic', message, ions, mixed, unusual, sites: st?.sites });
    }
    if (!decisiveSegs) break;
  }
  // A salt written in another order (`C6H5Na3O7`, `C12H25NaO4S`, a Hill formula): by composition, where
  // the formula as written names no polyatomic anion.
  if (target === 0 && !namesAnion && !continuous) {
    let firstReading: Segment[] | undefined;
    let best: { sol: IonicSolution; segs: Segment[] } | undefined;
    for (const segs of compositionReadings(atoms, part.items, span)) {
      firstReading ??= segs;
      const sol = solve(segs, 0, false);
      if (sol && (!best || sol.cost < best.sol.cost)) best = { sol, segs };
    }
    if (best) {
      const ions = ionsOf(best.sol);
      const st = statesOf(best.sol);
      return mk({
        balanced: true,
        states: st?.states ?? null,
        basis: 'ionic',
        message: `Balanced: ${describeIons(ions)} (read by composition).`,
        ions,
        sites: st?.sites,
      });
    }
    if (firstReading && !decisiveSegs) decisiveSegs = firstReading;
  }
  if (decisiveSegs) {
    const ion = target !== 0 && decisiveSegs.length === 1;
    const suggestions = ion ? ionChargeSuggestions(formula, decisiveSegs[0]) : partSuggestions(decisiveSegs, target);
    let message = imbalanceWords(decisiveSegs, target);
    if (outsideSalt) message += ` ${outsideSaltWords(outsideSalt)}`;
    return mk({
      balanced: false,
      states: null,
      basis: 'ionic',
      wholeSuggestions: ion,
      message,
      suggestions,
      span: target !== 0 && formula.chargeSpan ? { start: Math.min(span.start, formula.chargeSpan.start), end: formula.chargeSpan.end } : span,
    });
  }
  if (organic && atoms.N) {
    // Nitrogen by the groups the formula shows (charge/structure.ts); carbon takes the average that balances.
    const nr = organicNitrogen(part.items, unitAtoms, partLabel);
    if (nr?.kind === 'sites') {
      const rest: AtomCounts = { ...unitAtoms };
      delete rest.N;
      const nSum = nr.sites.reduce((a, x) => a + x.state * x.count, 0);
      const asg = assignStates(rest, target / part.multiplier - nSum);
      if (asg) {
        const nAvg = cleanCount(nSum / unitAtoms.N);
        const sites: SiteState[] = [
          ...nr.sites.map((x) => ({ element: 'N', state: x.state, count: x.count, site: x.site })),
          ...wholeSites(asg.states, rest, partLabel),
        ];
        const words = nr.sites.map((x) => `N ${signed(x.state)} in ${x.site}`).join(', ');
        return mk({
          balanced: true,
          states: { ...asg.states, N: nAvg },
          basis: 'molecular',
          sites,
          message: `Molecular substance: ${words}; the other atoms by the usual rules${asg.averaged.length ? ` (${asg.averaged.join(', ')} as an average)` : ''}.`,
        });
      }
    } else if (nr?.kind === 'undetermined') {
      const all = assignStates(atoms, target);
      const states: Record<string, number> = {};
      const undetermined = [{ element: 'N', reason: `N: no firm state — ${nr.reason}` }];
      if (all) for (const [el, q] of Object.entries(all.states)) if (el !== 'N' && el !== 'C') states[el] = q;
      undetermined.push({ element: 'C', reason: 'C: its average depends on the state of N, which the formula does not fix.' });
      return mk({
        balanced: true,
        states,
        basis: 'molecular',
        undetermined,
        message: `Molecular substance: no firm oxidation state for N (and so for C): ${nr.reason}`,
      });
    }
  }
  if (anySolution) {
    const st = statesOf(anySolution.sol);
    if (st && carbonyl) {
      const m = anySolution.sol.segments.filter((x) => x.segment.kind === 'metal').map((x) => x.segment.element as string);
      return mk({
        balanced: true,
        states: st.states,
        basis: 'states',
        message: `Metal carbonyl: ${[...new Set(m)].join(', ')} in oxidation state 0 with neutral ligands.`,
        sites: st.sites,
      });
    }
    if (st)
      return mk({
        balanced: true,
        states: st.states,
        basis: metals.length ? 'states' : 'molecular',
        message: metals.length ? 'Balanced by oxidation states.' : 'Molecular substance: oxidation states by the usual rules.',
      });
  }
  const assigned = assignStates(atoms, target);
  if (assigned) {
    const avg = assigned.averaged.length ? ` (${assigned.averaged.join(', ')} as an average)` : '';
    if (metals.length === 0)
      return mk({ balanced: true, states: assigned.states, basis: 'molecular', message: `Molecular substance: oxidation states by the usual rules${avg}.` });
    return mk({ balanced: true, states: assigned.states, basis: 'states', message: `Balanced by oxidation states${avg}.`, unusual: assigned.unusual });
  }
  if (metals.length === 0 || organic) {
    return mk({
      balanced: true,
      states: null,
      basis: 'molecular',
      message: 'Molecular substance: no oxidation states assigned; charge balance does not apply.',
    });
  }
  return mk({ balanced: false, states: null, basis: 'states', span, message: `No usual oxidation states of ${els.join(', ')} sum to ${signed(target)}.` });
}

const RULE_STATES: Record<string, number> = { O: -2, H: 1, F: -1, Li: 1, Na: 1, K: 1, Rb: 1, Cs: 1, Be: 2, Mg: 2, Ca: 2, Sr: 2, Ba: 2 };

/**
 * A part with a count written `x` (`(NH4)2Sx`, `NOx`): read as ions where a table ion has that form
 * (polysulfide Sx²⁻), and never flagged; the state of an element that depends on x is not given.
 */
function variablePart(
  formula: Formula,
  part: FormulaPart,
  target: number,
  mk: (r: Pick<PartResult, 'balanced' | 'states' | 'basis' | 'message'> & Partial<PartResult>) => PartResult,
  unitAtoms: AtomCounts,
  partLabel: string,
): PartResult {
  const why = (el: string) => ({ element: el, reason: `${el}: its state depends on the count x, which the formula leaves open.` });
  for (const segs of segmentations(formula.text, part.items, false)) {
    if (
      !plausible(segs) ||
      !decisive(segs, target) ||
      !segs.some((x) => x.ion && Number.isNaN(itemAtoms(parseFormula(x.ionText).formula?.parts[0].items ?? []).S))
    )
      continue;
    const sol = solve(
      segs.filter((x) => Number.isFinite(x.multiplicity)),
      target,
      false,
    );
    if (!sol) continue;
    const ions = ionsOf(sol);
    const st = statesOf(sol);
    const known = st ? st.states : {};
    const undetermined = Object.keys(unitAtoms)
      .filter((el) => !(el in known))
      .map(why);
    return mk({ balanced: true, states: known, basis: 'ionic', message: `Balanced: ${describeIons(ions)}.`, ions, sites: st?.sites ?? [], undetermined });
  }
  const states: Record<string, number> = {};
  const undetermined: Array<{ element: string; reason: string }> = [];
  for (const el of Object.keys(unitAtoms)) {
    if (el in RULE_STATES) states[el] = RULE_STATES[el];
    else undetermined.push(why(el));
  }
  const counted = Object.fromEntries(Object.entries(unitAtoms).filter(([, n]) => Number.isFinite(n)));
  return mk({
    balanced: true,
    states,
    basis: 'molecular',
    message: 'A count is written x: no charge balance is checked, and states that depend on x are not given.',
    sites: wholeSites(states, counted, partLabel),
    undetermined,
  });
}

const pctText = (x: number) => `${formatCount(x)} %`;

/** An alloy designation is no formula: its nominal composition, and no charge to balance. */
function designationAssessment(formula: Formula, alloy: AlloyDesignation): ChargeAssessment {
  const parts = alloy.components.map((c) => `${c.element} ${c.massPercent === null ? 'minor (under 1 %)' : pctText(c.massPercent)}`);
  const minor = alloy.components.some((c) => c.massPercent === null);
  const message = `Alloy designation, not a formula: nominal mass percent ${parts.join(', ')}, ${alloy.base} the balance (${minor ? 'about ' : ''}${pctText(alloy.baseMassPercent)}${minor ? ' less the minor additions' : ''}).`;
  const atoms = formulaAtoms(formula);
  const states = Object.fromEntries(Object.keys(atoms).map((el) => [el, 0]));
  return {
    balanced: true,
    message,
    suggestions: [],
    oxidationStates: states,
    sites: Object.keys(atoms).map((el) => ({ element: el, state: 0, count: atoms[el], site: 'alloy' })),
    undetermined: [],
    ions: null,
    basis: 'alloy',
    mixedValence: [],
    unusual: [],
    diagnostics: [],
    designation: alloy,
  };
}

/** Charge balance, oxidation states and the ionic reading of a parsed formula. */
export function assessCharge(formula: Formula): ChargeAssessment {
  const alloy = readAlloyDesignation(formula);
  if (alloy) return designationAssessment(formula, alloy);
  const results = formula.parts
    .map((p, k) => (p.items.length ? assessPart(formula, p, k === 0 ? formula.charge : 0) : null))
    .filter((r): r is PartResult => r !== null);
  const diagnostics: ChemDiagnostic[] = [];
  const suggestions: string[] = [];
  const bad = results.filter((r) => !r.balanced);
  formula.parts.forEach((p, k) => {
    const r = results[k];
    if (!r || r.balanced) return;
    const from = p.start + p.multiplierText.length;
    const partSugs = r.suggestions.filter((s) => s !== formula.text.slice(from, p.end));
    // Written back in the user's notation: ASCII digits for `CaNO3`, subscripts for `CaNO₃`.
    const whole = (r.wholeSuggestions ? r.suggestions : partSugs.map((s) => formula.text.slice(0, from) + s + formula.text.slice(p.end)))
      .map((s) => inNotationOf(formula.text, s))
      .filter((s) => s !== formula.text);
    suggestions.push(...whole);
    const span = r.span ?? { start: from, end: p.end };
    diagnostics.push({
      code: 'charge-imbalance',
      severity: 'warning',
      start: span.start,
      end: span.end,
      message: r.message,
      data: { suggestions: whole },
    });
  });
  // Element-wise oxidation states, weighted by atoms over all parts.
  let oxidationStates: Record<string, number> | null = {};
  const tot: Record<string, number> = {};
  const w: Record<string, number> = {};
  for (const r of results) {
    if (!r.states) {
      oxidationStates = null;
      break;
    }
    for (const [el, q] of Object.entries(r.states)) {
      const n = r.weights[el] ?? 0;
      tot[el] = (tot[el] ?? 0) + q * n;
      w[el] = (w[el] ?? 0) + n;
    }
  }
  const undetermined = results.flatMap((r) => r.undetermined ?? []);
  const unknown = new Set(undetermined.map((u) => u.element));
  if (oxidationStates)
    for (const el of Object.keys(tot)) if (!unknown.has(el)) oxidationStates[el] = w[el] ? cleanCount(Number((tot[el] / w[el]).toFixed(4))) : 0;
  // Per-site states over all parts (a part's multiplier multiplies its counts), null where states are.
  let sites: SiteState[] | null = oxidationStates ? [] : null;
  if (sites) {
    const partsWithItems = formula.parts.filter((p) => p.items.length);
    results.forEach((r, k) => {
      const mult = partsWithItems[k]?.multiplier ?? 1;
      if (!r.sites) {
        sites = null;
        return;
      }
      for (const x of r.sites) if (!unknown.has(x.element) && sites) sites.push({ ...x, count: cleanCount(x.count * mult) });
    });
  }
  const main = results[0];
  const message = bad.length ? bad.map((r) => r.message).join(' ') : (main?.message ?? '');
  return {
    balanced: bad.length === 0,
    message,
    suggestions: [...new Set(suggestions)].slice(0, 4),
    oxidationStates,
    ions: main?.ions ?? null,
    basis: main?.basis ?? 'none',
    sites,
    undetermined,
    mixedValence: results.flatMap((r) => r.mixed),
    unusual: results.flatMap((r) => r.unusual),
    diagnostics,
  };
}
