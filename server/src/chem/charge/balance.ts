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
import type { ChemDiagnostic } from '../diagnostic';
import { element, isMetal } from '../data/elements';
import type { Formula, FormulaItem, FormulaPart } from '../formula/ast';
import { cleanCount, formatCharge, formatCount, formulaAtoms, partAtoms, subscriptDigits, type AtomCounts } from '../formula/compute';
import { parseFormula } from '../formula/parse';
import { assignStates } from './oxidation';
import { solve, type IonicSolution } from './ionic';
import { hasRealCation, interstitialOnly, plausible, segmentations, type Segment } from './segments';

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
/** A signed number for people: +1, −2 (true minus sign). */
const signed = (q: number) => {
  const r = formatCount(Math.abs(cleanCount(q)));
  return q > 0 ? `+${r}` : q < 0 ? `−${r}` : '0';
};
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
  const anion = segs.some((s) => s.role === 'anion');
  if (hasRealCation(segs) && anion) return true;
  if (target !== 0 && segs.length === 1) {
    const s = segs[0];
    return (s.kind === 'polyatomic' && !!s.ion) || s.kind === 'complex' || s.kind === 'metal' || ((s.kind === 'monatomic-anion' || s.kind === 'proton') && s.multiplicity === 1);
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
}

function ionsOf(sol: IonicSolution): IonInReading[] {
  return sol.segments.map(({ segment: s, unitCharges, total }) => {
    const unit = s.kind === 'metal' ? total / s.multiplicity : unitCharges[0];
    return {
      label: label(s, Number.isInteger(unit) ? unit : Math.round(unit)),
      text: s.ionText,
      count: s.multiplicity,
      charge: cleanCount(unit),
      role: s.role,
      kind: s.kind,
      states: unitCharges,
      ...(s.element ? { element: s.element } : {}),
      ...(s.ion ? { ionName: s.ion.charges.length > 1 && s.ion.namesByCharge?.[unitCharges[0]] ? s.ion.namesByCharge[unitCharges[0]] : s.ion.name, radius: s.ion.radius, radiusFromMemory: s.ion.radiusFromMemory } : {}),
    };
  });
}

/** Oxidation states implied by a solved ionic reading. */
function statesOf(sol: IonicSolution): { states: Record<string, number> } | null {
  const sum: Record<string, number> = {};
  const weights: AtomCounts = {};
  const add = (el: string, q: number, n: number) => {
    sum[el] = (sum[el] ?? 0) + q * n;
    weights[el] = (weights[el] ?? 0) + n;
  };
  for (const { segment: s, unitCharges, total } of sol.segments) {
    const m = s.multiplicity;
    if (s.kind === 'metal' || s.kind === 'monatomic-anion' || s.kind === 'proton') {
      add(s.element as string, total / m, m);
      continue;
    }
    const unit = unitCharges[0];
    const atoms = segmentAtoms(s);
    if (!atoms) return null;
    let inner: Record<string, number> | null = null;
    if (s.ion?.states) inner = s.ion.states;
    else if (s.kind === 'complex' && s.complex) {
      const metalState = unit - s.complex.ligandCharge;
      const rest = { ...atoms };
      rest[s.complex.metal] -= 1;
      if (rest[s.complex.metal] <= 0) delete rest[s.complex.metal];
      const lig: { states: Record<string, number> } | null = Object.keys(rest).length ? assignStates(rest, unit - metalState) : { states: {} };
      if (!lig) return null;
      for (const [el, n] of Object.entries(rest)) add(el, lig.states[el], n * m);
      add(s.complex.metal, metalState, m);
      continue;
    } else inner = assignStates(atoms, unit)?.states ?? null;
    if (!inner) return null;
    for (const [el, n] of Object.entries(atoms)) add(el, inner[el] ?? 0, n * m);
  }
  const states: Record<string, number> = {};
  for (const el of Object.keys(sum)) states[el] = cleanCount(sum[el] / weights[el]);
  return { states };
}

/** Atoms of one unit of a segment, from the ion as written. */
function segmentAtoms(s: Segment): AtomCounts | null {
  const hit = ATOMS_CACHE.get(s.ionText);
  if (hit) return hit;
  const r = parseFormula(s.ionText);
  if (!r.ok || !r.formula) return null;
  const atoms = formulaAtoms(r.formula);
  if (ATOMS_CACHE.size > 5000) ATOMS_CACHE.clear();
  ATOMS_CACHE.set(s.ionText, atoms);
  return atoms;
}
const ATOMS_CACHE = new Map<string, AtomCounts>();

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
      const counts = new Map<Segment, number>([[c, qa / g], [a, qc / g]]);
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

function assessPart(formula: Formula, part: FormulaPart, target: number): PartResult {
  const text = formula.text;
  const atoms = partAtoms(part);
  const els = Object.keys(atoms);
  const span = { start: part.start + part.multiplierText.length, end: part.end };
  // One object shape for every result (object spreads here were the hot spot of cold analyses).
  const mk = (r: Pick<PartResult, 'balanced' | 'states' | 'basis' | 'message'> & Partial<PartResult>): PartResult => ({
    balanced: r.balanced, states: r.states, weights: atoms, basis: r.basis, message: r.message, suggestions: r.suggestions ?? [],
    ions: r.ions ?? null, mixed: r.mixed ?? [], unusual: r.unusual ?? [], span: r.span, wholeSuggestions: r.wholeSuggestions ?? false,
  });
  if (els.length === 0) return mk({ balanced: true, states: null, basis: 'none', message: '' });
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
  for (const fallback of [false, true]) {
    let best: { sol: IonicSolution; segs: Segment[]; decisive: boolean } | undefined;
    for (const segs of segmentations(text, part.items, fallback)) {
      if (!plausible(segs)) continue;
      if (fallback && !interstitialOnly(segs)) continue;
      const isDecisive = !organic && decisive(segs, target);
      if (isDecisive && !decisiveSegs) decisiveSegs = segs;
      const sol = solve(segs, target, continuous);
      if (!sol) continue;
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
      return mk({ balanced: true, states: st?.states ?? null, basis: 'ionic', message, ions, mixed, unusual });
    }
    if (!decisiveSegs) break;
  }
  if (decisiveSegs) {
    const ion = target !== 0 && decisiveSegs.length === 1;
    const suggestions = ion ? ionChargeSuggestions(formula, decisiveSegs[0]) : partSuggestions(decisiveSegs, target);
    return mk({ balanced: false, states: null, basis: 'ionic', wholeSuggestions: ion, message: imbalanceWords(decisiveSegs, target), suggestions,
      span: target !== 0 && formula.chargeSpan ? { start: Math.min(span.start, formula.chargeSpan.start), end: formula.chargeSpan.end } : span,
    });
  }
  if (anySolution) {
    const st = statesOf(anySolution.sol);
    if (st) return mk({ balanced: true, states: st.states, basis: metals.length ? 'states' : 'molecular', message: metals.length ? 'Balanced by oxidation states.' : 'Molecular substance: oxidation states by the usual rules.' });
  }
  const assigned = assignStates(atoms, target);
  if (assigned) {
    const avg = assigned.averaged.length ? ` (${assigned.averaged.join(', ')} as an average)` : '';
    if (metals.length === 0) return mk({ balanced: true, states: assigned.states, basis: 'molecular', message: `Molecular substance: oxidation states by the usual rules${avg}.` });
    return mk({ balanced: true, states: assigned.states, basis: 'states', message: `Balanced by oxidation states${avg}.`, unusual: assigned.unusual });
  }
  if (metals.length === 0 || organic) {
    return mk({ balanced: true, states: null, basis: 'molecular', message: 'Molecular substance: no oxidation states assigned; charge balance does not apply.' });
  }
  return mk({ balanced: false, states: null, basis: 'states', span,
    message: `No usual oxidation states of ${els.join(', ')} sum to ${signed(target)}.`,
  });
}

/** Charge balance, oxidation states and the ionic reading of a parsed formula. */
export function assessCharge(formula: Formula): ChargeAssessment {
  const results = formula.parts.map((p, k) => (p.items.length ? assessPart(formula, p, k === 0 ? formula.charge : 0) : null)).filter((r): r is PartResult => r !== null);
  const diagnostics: ChemDiagnostic[] = [];
  const suggestions: string[] = [];
  const bad = results.filter((r) => !r.balanced);
  formula.parts.forEach((p, k) => {
    const r = results[k];
    if (!r || r.balanced) return;
    const from = p.start + p.multiplierText.length;
    const partSugs = r.suggestions.filter((s) => s !== formula.text.slice(from, p.end));
    const whole = r.wholeSuggestions ? r.suggestions : partSugs.map((s) => formula.text.slice(0, from) + s + formula.text.slice(p.end));
    suggestions.push(...whole);
    const span = r.span ?? { start: from, end: p.end };
    diagnostics.push({
      code: 'charge-imbalance', severity: 'warning', start: span.start, end: span.end, message: r.message,
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
  if (oxidationStates) for (const el of Object.keys(tot)) oxidationStates[el] = w[el] ? cleanCount(Number((tot[el] / w[el]).toFixed(4))) : 0;
  const main = results[0];
  const message = bad.length ? bad.map((r) => r.message).join(' ') : main?.message ?? '';
  return {
    balanced: bad.length === 0,
    message,
    suggestions: [...new Set(suggestions)].slice(0, 4),
    oxidationStates,
    ions: main?.ions ?? null,
    basis: main?.basis ?? 'none',
    mixedValence: results.flatMap((r) => r.mixed),
    unusual: results.flatMap((r) => r.unusual),
    diagnostics,
  };
}
