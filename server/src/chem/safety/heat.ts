/**
 * The heat of making up a batch, and the temperature change it brings.
 *
 *   ΔH = Σ dissolution or dilution of each ingredient + the neutralisation between them
 *   ΔT = −ΔH / (m·cp)
 *
 * - Dissolution: the enthalpy of solution at infinite dilution (data/solution.ts); for a hydrate with no
 *   row of its own, the anhydrous salt's value plus the median step per water of crystallisation of the
 *   table's hydrate pairs (an estimate); for a salt with no row, the Born–Haber estimate U + Σ ΔhydH of its
 *   ions (the card's lattice energy, data/hydration.ts; an estimate, its error measured on the table per
 *   lattice method and printed). Above its solubility (chem/data/solubility.ts) only what dissolves counts;
 *   a sparingly soluble solid, nothing.
 * - The warning (`exceeds`): |ΔT| above the threshold by more than the typical error of the estimated
 *   steps, so that a rough estimate alone does not raise it.
 * - Dilution of the concentrated acids and bases (H2SO4, HCl, HNO3, NaOH): their integral enthalpy of
 *   solution from the water they bring (n₀ mol per mol) to the water of the batch (n₁): ΔH(n₁) − ΔH(n₀)
 *   (data/dilution.ts). Each is diluted as if alone in the batch's water.
 * - Neutralisation: the acid–base species of the mixed batch against those of each ingredient alone in
 *   the same water (ph.ts, ideal solution), each change of protonation times its ionisation enthalpy
 *   (data/acids.ts), and the water formed or ionised times 55.84 kJ/mol.
 * - m·cp: the batch's water at 4.184 J/(g·K) (CRC Handbook, "Properties of water", 25 °C) and its dissolved
 *   substances at 1.0 J/(g·K) for solids (common practice; salts 0.7–1.2) or their own heat capacity for
 *   liquids. No heat is lost to the vessel or the air, and the batch is stirred: a well-stirred batch
 *   made up quickly comes close to it; one made up slowly loses part of the heat as it goes.
 *
 * Tolerance (stated, checked in the test suite on NaOH, NH4NO3, CaCl2 and H2SO4 make-ups against hand
 * calculations from the handbook values): about ±10 % for batches up to about 2 M, from the
 * infinite-dilution enthalpies and the heat capacity model; more for concentrated ones.
 */
import { analysisDerivedCache } from '../cache';
import { mainPart, keyOfFormula, substanceKey } from './substance';
import { type BatchState, type IngredientState, WATER_MOLAR_MASS, estimateVolumeL } from './context';
import { DILUTION_CURVES, integralEnthalpy, type DilutionCurve } from './data/dilution';
import { HYDRATION_KJ, HYDRATION_SOURCE } from './data/hydration';
import { SOLUTION_ENTHALPIES, type SolutionEnthalpyRow } from './data/solution';
import { ACID_SYSTEMS, WATER_IONISATION_KJ, PKW, type AcidSystem } from './data/acids';
import { acidBaseShare, bandOne, solveOne, solveParts, type Part } from './ph';
import type { FormulaAnalysis } from '../analyse';
import { SOLUBILITY } from '../data/solubility';
import { analyseFormula } from '../analyse';
import type { HeatReading, HeatStep, SafetyOptions } from './types';

export const WATER_CP = 4.184;
export const SOLID_CP = 1.0;
export const DEFAULT_HEAT_THRESHOLD_K = 15;
const DEFAULT_START_C = 20;

// ── table indexes (fixed tables: built on first use, never evicted) ──

let solutionIndex: Map<string, SolutionEnthalpyRow> | null = null;
function solutionRow(key: string): SolutionEnthalpyRow | undefined {
  if (!solutionIndex) {
    solutionIndex = new Map();
    for (const row of SOLUTION_ENTHALPIES) {
      const k = keyOfFormula(row.formula);
      if (k && !solutionIndex.has(k)) solutionIndex.set(k, row);
    }
  }
  return solutionIndex.get(key);
}

let curveIndex: Map<string, DilutionCurve> | null = null;
function dilutionCurve(hill: string): DilutionCurve | undefined {
  if (!curveIndex) {
    curveIndex = new Map();
    for (const c of DILUTION_CURVES) {
      const k = keyOfFormula(c.formula);
      if (k) curveIndex.set(k, c);
    }
  }
  return curveIndex.get(hill);
}

const median = (xs: readonly number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length === 0 ? NaN : s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

/** The table's hydrate pairs: the median change of ΔsolH per water of crystallisation, its spread and range. */
export interface HydrateStep {
  kJPerWater: number;
  /** Median absolute deviation of the pairs from the median, per water: the typical error of using it. */
  madKJ: number;
  min: number;
  max: number;
  pairs: number;
}
let hydrateStepMemo: HydrateStep | null = null;
export function hydrateStep(): HydrateStep {
  if (hydrateStepMemo) return hydrateStepMemo;
  const steps: number[] = [];
  for (const row of SOLUTION_ENTHALPIES) {
    const a = analyseFormula(row.formula);
    const m = mainPart(a);
    if (!m || !m.water) continue;
    const anh = solutionRow(m.hill);
    if (anh) steps.push((row.kJPerMol - anh.kJPerMol) / m.water);
  }
  const mid = median(steps);
  hydrateStepMemo = {
    kJPerWater: mid,
    madKJ: median(steps.map((x) => Math.abs(x - mid))),
    min: Math.min(...steps),
    max: Math.max(...steps),
    pairs: steps.length,
  };
  return hydrateStepMemo;
}

// ── Born–Haber estimate: lattice energy + hydration of the ions ──

export interface LatticeHydration {
  latticeKJ: number;
  latticeMethod: string;
  hydrationKJ: number;
  /** U + Σ ΔhydH, kJ/mol of the anhydrous salt. */
  kJPerMol: number;
}

/** The key of an ion in the hydration table. */
function ionKey(ion: { kind: string; element?: string; ionName?: string; charge: number }): string | undefined {
  if ((ion.kind === 'metal' || ion.kind === 'monatomic-anion') && ion.element) {
    const z = Math.abs(ion.charge);
    return `${ion.element}${z > 1 ? z : ''}${ion.charge > 0 ? '+' : '-'}`;
  }
  return ion.ionName;
}

const latticeMemo = analysisDerivedCache<LatticeHydration | { none: true }>(20_000, 2 * 1024 * 1024);

/** U + Σ ΔhydH for an ionic salt whose ions are all in the hydration table and that has a lattice energy; null otherwise. */
export function latticeHydration(a: FormulaAnalysis): LatticeHydration | null {
  const hit = latticeMemo.get(a.input);
  if (hit) return 'none' in hit ? null : hit;
  const r = computeLatticeHydration(a);
  latticeMemo.set(a.input, r ?? { none: true }, 160);
  return r;
}

/** Cations whose salts the ionic lattice models describe poorly (covalent character: d¹⁰ and 6s² ions). */
const COVALENT_CATIONS = new Set(['Cu+', 'Ag+', 'Tl+', 'Hg2+', 'Sn2+', 'Pb2+']);

function computeLatticeHydration(a: FormulaAnalysis): LatticeHydration | null {
  const c = a.charges;
  if (!a.ok || !c || c.basis !== 'ionic' || !c.balanced || !c.ions || a.charge !== 0) return null;
  let hydration = 0;
  for (const ion of c.ions) {
    if (ion.role === 'neutral') continue;
    if (ion.role === 'cation' && COVALENT_CATIONS.has(ionKey(ion) ?? '')) return null;
    const k = ionKey(ion);
    const h = k ? HYDRATION_KJ[k] : undefined;
    if (h === undefined) return null;
    hydration += h * ion.count;
  }
  const lat = a.lattice;
  if (!lat || lat.covalency) return null;
  return { latticeKJ: lat.kJPerMol, latticeMethod: lat.method, hydrationKJ: hydration, kJPerMol: lat.kJPerMol + hydration };
}

/** How far the Born–Haber estimate runs from the table, over the table's anhydrous salts it can estimate. */
export interface EstimateAccuracy {
  n: number;
  medianAbsKJ: number;
  /** Share of those salts where the estimate gets the sign (warms or cools) right. */
  signRight: number;
  /** The same by the lattice-energy method the card used (Born–Haber cycle, Kapustinskii equation…). */
  byMethod: Readonly<Record<string, { n: number; medianAbsKJ: number }>>;
}
let accuracyMemo: EstimateAccuracy | null = null;
export function estimateAccuracy(): EstimateAccuracy {
  if (accuracyMemo) return accuracyMemo;
  const errs: number[] = [];
  const by = new Map<string, number[]>();
  let right = 0;
  for (const row of SOLUTION_ENTHALPIES) {
    const a = analyseFormula(row.formula);
    const m = mainPart(a);
    if (!m || m.water) continue;
    const est = latticeHydration(a);
    if (!est) continue;
    const err = Math.abs(est.kJPerMol - row.kJPerMol);
    errs.push(err);
    const list = by.get(est.latticeMethod) ?? [];
    list.push(err);
    by.set(est.latticeMethod, list);
    if (Math.sign(est.kJPerMol) === Math.sign(row.kJPerMol) || Math.abs(row.kJPerMol) < 5) right++;
  }
  const byMethod: Record<string, { n: number; medianAbsKJ: number }> = {};
  for (const [method, list] of by) byMethod[method] = { n: list.length, medianAbsKJ: median(list) };
  accuracyMemo = { n: errs.length, medianAbsKJ: median(errs), signRight: errs.length ? right / errs.length : NaN, byMethod };
  return accuracyMemo;
}

// ── per-mole enthalpy of solution of one substance (also for cards) ──

export interface SolutionEnthalpy {
  /** kJ per mole of the substance as written, at infinite dilution. */
  kJPerMol: number;
  /** `table` (a row of its own), `hydrate-estimate` (the anhydrous row and the hydrate step), `lattice-estimate` (U + Σ ΔhydH). */
  basis: 'table' | 'hydrate-estimate' | 'lattice-estimate';
  method: string;
  source: string;
  /** For an estimate: its typical error, kJ/mol (measured on the table). */
  typicalErrorKJ?: number;
  /** Why it warms or cools the water, where the lattice energy and the ions' hydration are known. */
  why?: string;
}

const fmt = (x: number, digits = 3) => {
  const r = Number(x.toPrecision(digits));
  const s = Math.abs(r) >= 1000 ? Math.round(r).toString() : r.toString();
  return s.replace('-', '−');
};
const signed = (x: number) => (x > 0 ? `+${fmt(x)}` : fmt(x));

const valueMemo = analysisDerivedCache<SolutionEnthalpy | { none: true }>(20_000, 8 * 1024 * 1024);
const cardMemo = analysisDerivedCache<SolutionEnthalpy | { none: true }>(5_000, 4 * 1024 * 1024);

/**
 * The enthalpy of solution of a substance at infinite dilution, from the table or an estimate, with why it
 * warms or cools the water (which needs the card's lattice energy); null where neither is possible.
 * Memoised; read-only.
 */
export function enthalpyOfSolution(a: FormulaAnalysis): SolutionEnthalpy | null {
  const hit = cardMemo.get(a.input);
  if (hit) return 'none' in hit ? null : hit;
  const v = solutionValue(a);
  let r: SolutionEnthalpy | null = v;
  if (v) {
    const main = mainPart(a);
    const ref =
      v.basis === 'lattice-estimate'
        ? v.kJPerMol - (main?.water ?? 0) * hydrateStep().kJPerWater
        : v.basis === 'hydrate-estimate'
          ? (solutionRow(main?.hill ?? '')?.kJPerMol ?? v.kJPerMol)
          : v.kJPerMol;
    const why = main?.water && v.basis === 'table' ? undefined : whyText(latticeHydration(a), ref);
    r = why ? { ...v, why } : v;
  }
  cardMemo.set(a.input, r ?? { none: true }, r ? 256 + 2 * (r.method.length + (r.why?.length ?? 0)) : 32);
  return r;
}

/** The value alone, for the batch (no lattice energy unless the estimate needs it). Memoised; read-only. */
export function solutionValue(a: FormulaAnalysis): SolutionEnthalpy | null {
  const hit = valueMemo.get(a.input);
  if (hit) return 'none' in hit ? null : hit;
  const r = computeValue(a);
  valueMemo.set(a.input, r ?? { none: true }, r ? 256 + 2 * r.method.length : 32);
  return r;
}

function computeValue(a: FormulaAnalysis): SolutionEnthalpy | null {
  const main = mainPart(a);
  if (!main || !a.ok) return null;
  const row = solutionRow(substanceKey(main));
  if (row)
    return { kJPerMol: row.kJPerMol, basis: 'table', method: `enthalpy of solution at infinite dilution ${signed(row.kJPerMol)} kJ/mol`, source: row.source };
  const step = hydrateStep();
  if (main.water) {
    const anh = solutionRow(main.hill);
    if (anh) {
      const v = anh.kJPerMol + main.water * step.kJPerWater;
      return {
        kJPerMol: v,
        basis: 'hydrate-estimate',
        typicalErrorKJ: main.water * step.madKJ,
        method: `estimate: the anhydrous salt's ${signed(anh.kJPerMol)} kJ/mol plus ${main.water} × ${fmt(step.kJPerWater)} kJ/mol per water of crystallisation (the median of the table's ${step.pairs} hydrate pairs, range ${fmt(step.min)}–${fmt(step.max)})`,
        source: anh.source,
      };
    }
  }
  const lh = latticeHydration(a);
  if (lh) {
    const acc = estimateAccuracy();
    const own = acc.byMethod[lh.latticeMethod] ?? { n: acc.n, medianAbsKJ: acc.medianAbsKJ };
    const v = lh.kJPerMol + main.water * step.kJPerWater;
    const hydrate = main.water ? ` plus ${main.water} × ${fmt(step.kJPerWater)} kJ/mol for the water of crystallisation` : '';
    const model = lh.latticeMethod.replace(/ (equation|cycle)$/, '');
    return {
      kJPerMol: v,
      basis: 'lattice-estimate',
      typicalErrorKJ: own.medianAbsKJ + main.water * step.madKJ,
      method: `estimate: lattice energy ${fmt(lh.latticeKJ)} kJ/mol (${lh.latticeMethod}) and hydration of the ions ${fmt(lh.hydrationKJ)} kJ/mol${hydrate}; with a ${model} lattice energy this estimate is off by a median ${fmt(own.medianAbsKJ, 2)} kJ/mol on the ${own.n} salts of the table that have one`,
      source: HYDRATION_SOURCE,
    };
  }
  return null;
}

/** Differences of the two large terms that explain a tabulated value: within this of it (kJ/mol). */
const WHY_WITHIN_KJ = 20;

function whyText(lh: LatticeHydration | null, value: number): string | undefined {
  if (!lh || Math.abs(lh.kJPerMol - value) > WHY_WITHIN_KJ) return undefined;
  const verdict =
    value > 2
      ? 'breaking up the crystal costs more than the hydration of its ions gives back, so it cools the water'
      : value < -2
        ? 'the hydration of its ions gives back more than breaking up the crystal costs, so it warms the water'
        : 'the two nearly balance, so it dissolves with little heat';
  return `Breaking up the crystal takes about ${fmt(lh.latticeKJ)} kJ/mol (lattice energy, ${lh.latticeMethod}); hydrating its ions gives back about ${fmt(-lh.hydrationKJ)} kJ/mol: ${verdict}.`;
}

// ── the batch ──

/** Below this solubility (g per 100 g water) a substance is taken as not dissolving (common practice: "sparingly soluble"). */
const SPARINGLY_SOLUBLE_BELOW = 1;
let solubilityIndex: Map<string, number> | null = null;
/** The solubility of a substance by the key of its anhydrous form (g/100 g water, chem/data/solubility.ts), where tabulated. */
function solubilityOf(hill: string): number | undefined {
  if (!solubilityIndex) {
    solubilityIndex = new Map();
    for (const row of SOLUBILITY) {
      const k = keyOfFormula(row.formula);
      if (k) solubilityIndex.set(k, row.gPer100gWater);
    }
  }
  return solubilityIndex.get(hill);
}

/** The heat of making up a batch; null where no ingredient's heat is known. */
/**
 * Whether the heat of making up cannot exceed the threshold, from a bound that needs no computation of the
 * steps: every ingredient at most |ΔsolH| (with its typical error) per mole, 100 kJ/mol more for an acid or
 * base diluted from its concentrated form (sulfuric acid, the largest, gives about 96 kJ/mol to infinite
 * dilution; CRC, from memory), and for neutralisation 60 kJ per mole of protons (55.84 kJ for water
 * with room for the ionisation enthalpies of the steps) for the lesser of what the acids can give and the
 * bases take (strong ions by their charge, each weak system up to four protons either way), against the heat capacity of the batch's water alone. A batch for which this
 * holds cannot raise the warning; its heat is then computed only when it is shown.
 */
export function heatBoundedBelow(state: BatchState, options: SafetyOptions = {}): boolean {
  const threshold = options.heatThresholdK ?? DEFAULT_HEAT_THRESHOLD_K;
  if (state.waterG === null || !(state.waterG > 0)) return false;
  let kJ = 0;
  // What the ingredients can give and take of protons, mol: strong ions by their charge (a cation's
  // counter-ion OH⁻ is base, an anion's H⁺ acid), each weak system up to four protons either way.
  let acidEq = 0;
  let baseEq = 0;
  for (const it of state.items) {
    if (it.isWater || !it.moles) continue;
    const a = it.ing.analysis;
    const moles = Math.abs(it.moles);
    const sol = solutionValue(a);
    let perMol = sol ? Math.abs(sol.kJPerMol) + (sol.typicalErrorKJ ?? 0) : 0;
    const main = it.main;
    if (main && !main.water && dilutionCurve(main.hill)) perMol += 100;
    kJ += moles * perMol;
    const share = acidBaseShare(a);
    if (!share.active) continue;
    let weak = 0;
    for (const [, count] of share.systems) weak += 4 * Math.abs(count);
    acidEq += moles * (Math.max(0, -share.fixed) + weak);
    baseEq += moles * (Math.max(0, share.fixed) + weak);
  }
  // Neutralisation: at most 60 kJ per mole of protons passed, the lesser of what is given and taken.
  kJ += 60 * Math.min(acidEq, baseEq);
  return (kJ * 1000) / (state.waterG * WATER_CP) <= threshold;
}

export function heatOfMakingUp(state: BatchState, options: SafetyOptions = {}, startC = DEFAULT_START_C): HeatReading | null {
  const threshold = options.heatThresholdK ?? DEFAULT_HEAT_THRESHOLD_K;
  const steps: HeatStep[] = [];
  for (const it of state.items) {
    if (it.isWater || it.moles === null || it.moles === 0) continue;
    steps.push(dissolution(it, state));
  }
  const neut = neutralisation(state);
  if (neut) steps.push(neut.step);
  let kJ = 0;
  let anyCounted = false;
  let anySolution = false;
  for (const st of steps) {
    if (st.kind === 'not-counted') continue;
    anyCounted = true;
    anySolution ||= st.kind === 'solution' || st.kind === 'estimate';
    kJ += st.kJ;
  }
  if (!anyCounted) return null;
  let heatCapacity: number | null = null;
  let solutionMassG: number | null = null;
  if (state.waterG !== null && state.waterG > 0) {
    heatCapacity = state.waterG * WATER_CP;
    solutionMassG = state.waterG;
    for (const it of state.items) {
      if (it.isWater || it.anhydrousG === null) continue;
      heatCapacity += it.anhydrousG * (it.liquid?.cp ?? SOLID_CP);
      solutionMassG += it.anhydrousG;
    }
  }
  const rise = heatCapacity ? (-kJ * 1000) / heatCapacity : null;
  const finalC = rise === null ? null : startC + rise;
  // A warning only where the rise passes the threshold even at the near end of its estimated steps' typical error.
  let uncertaintyKJ = 0;
  for (const st of steps) uncertaintyKJ += st.uncertaintyKJ ?? 0;
  const uncertaintyK = heatCapacity ? (uncertaintyKJ * 1000) / heatCapacity : 0;
  const exceeds = rise !== null && Math.abs(rise) - uncertaintyK > threshold;
  const cp = heatCapacity && solutionMassG ? heatCapacity / solutionMassG : null;
  // The texts are written when read (the check reads only `exceeds`, and the advice where it exceeds);
  // getters are enumerable, so JSON has them.
  let method: string | undefined;
  let notes: string[] | undefined;
  let adv: string[] | undefined;
  return {
    kJ,
    temperatureRiseK: rise,
    get method() {
      const parts = methodParts(steps);
      return (method ??=
        rise === null
          ? `ΔH of making up from ${parts}; no temperature change without the batch's water`
          : `ΔH of making up from ${parts}; ΔT = −ΔH/(m·cp) with m = ${fmt(solutionMassG ?? 0)} g, cp = ${fmt(cp ?? 0, 3)} J/(g·K) (water 4.184, dissolved solids 1.0), no heat lost — an estimate`);
    },
    steps,
    uncertaintyK,
    heatCapacityJPerK: heatCapacity,
    solutionMassG,
    startC,
    finalC,
    thresholdK: threshold,
    exceeds,
    get advice() {
      return (adv ??= exceeds && rise !== null ? advice(steps, rise, finalC ?? startC, state) : []);
    },
    get notes() {
      if (notes) return notes;
      notes = [...state.notes];
      if (neut?.note) notes.push(neut.note);
      for (const st of steps) if (st.kind === 'not-counted') notes.push(`${st.ingredient}: ${st.method}.`);
      if (heatCapacity === null)
        notes.push(
          state.aqueous
            ? 'The batch water is not known: no temperature change is estimated.'
            : 'No final volume or water is given: the heat is for dissolving into a large amount of water, and no temperature change is estimated.',
        );
      if (state.waterFrom === 'volume') notes.push('The batch water is estimated from the final volume less the volume the dissolved substances take up.');
      if (anySolution)
        notes.push('Enthalpies of solution are at infinite dilution; at working strength they differ by a few kJ/mol (up to about 10 for 2:2 salts).');
      if (uncertaintyK > 0)
        notes.push(
          `The estimated enthalpies of solution carry a typical error of about ${fmt(uncertaintyK, 2)} K on the temperature change; the warning allows for it.`,
        );
      notes.push('No heat is lost to the vessel or the air: a batch made up slowly warms less, over a longer time.');
      return notes;
    },
  };
}

const PART_TEXT: ReadonlyArray<readonly [HeatStep['kind'], string]> = [
  ['solution', 'enthalpies of solution (CRC/NBS tables)'],
  ['estimate', 'estimated enthalpies of solution'],
  ['dilution', 'integral heats of dilution (NBS)'],
  ['neutralisation', 'the heat of neutralisation (ideal pH model)'],
];
const partsMemo = new Map<number, string>();

/** The kinds of step counted, in words (one text per combination, kept). */
function methodParts(steps: HeatStep[]): string {
  let mask = 0;
  for (const st of steps) for (let k = 0; k < PART_TEXT.length; k++) if (PART_TEXT[k][0] === st.kind) mask |= 1 << k;
  let text = partsMemo.get(mask);
  if (text === undefined) {
    text = PART_TEXT.filter((_, k) => mask & (1 << k))
      .map(([, t]) => t)
      .join(', ');
    partsMemo.set(mask, text);
  }
  return text;
}

const CAUSTIC_HILLS = new Set(['HNaO', 'HKO', 'HLiO', 'CaO', 'Na2O', 'K2O']);

/** A step object of one shape (no spreads: this runs for every ingredient of every batch). */
function step(it: IngredientState, kind: HeatStep['kind'], kJ: number, method: string, kJPerMol?: number, source?: string): HeatStep {
  const s: HeatStep = { kind, ingredient: it.display, index: it.index, kJ, method };
  if (kJPerMol !== undefined) s.kJPerMol = kJPerMol;
  if (source !== undefined) s.source = source;
  return s;
}

const NOT_READ = 'not read as a formula: not counted';
const SUPPLIED_AS_SOLUTION =
  'supplied as a solution; its heat of dilution is not tabulated and is taken as zero (usually small, except for strong acids and bases)';
const NO_ENTHALPY = 'no enthalpy of solution known: not counted';

function dissolution(it: IngredientState, state: BatchState): HeatStep {
  const main = it.main;
  const moles = it.moles as number;
  if (!main) return step(it, 'not-counted', 0, NOT_READ);
  const totalWaterMol = state.waterG !== null ? state.waterG / WATER_MOLAR_MASS : Infinity;
  const curve = !main.water ? dilutionCurve(main.hill) : undefined;
  if (curve) {
    const n0 = it.waterG / WATER_MOLAR_MASS / moles;
    const n1 = totalWaterMol / moles;
    const h0 = integralEnthalpy(curve, n0);
    const h1 = integralEnthalpy(curve, n1);
    let method: string | undefined;
    const s: HeatStep = {
      kind: n0 > 0 ? 'dilution' : 'solution',
      ingredient: it.display,
      index: it.index,
      kJ: moles * (h1 - h0),
      get method() {
        const from = n0 > 0 ? `from ${fmt(n0)} (as supplied)` : `from the pure ${curve.pure}`;
        const to = Number.isFinite(n1) ? `to ${fmt(n1)} mol H₂O per mol` : 'to infinite dilution';
        return (method ??= `integral heat of solution ${from} ${to}: ΔH(n₁) − ΔH(n₀) = ${fmt(h1)} − (${fmt(h0)}) kJ/mol`);
      },
      kJPerMol: h1 - h0,
      source: curve.source,
    };
    return s;
  }
  if (it.aqueousReagent) return step(it, 'not-counted', 0, SUPPLIED_AS_SOLUTION);
  if (it.liquid && !it.liquid.aqueous && Number.isFinite(totalWaterMol)) {
    const x = moles / (moles + totalWaterMol);
    if (x > 0.1)
      return step(
        it,
        'not-counted',
        0,
        `a co-solvent (mole fraction ${fmt(x, 2)}): its heat of mixing with water is not modelled at this strength (small for these liquids, under about 1 kJ per mole of mixture)`,
      );
  }
  const sol = solutionValue(it.ing.analysis);
  if (!sol) return step(it, 'not-counted', 0, NO_ENTHALPY);
  const solubility = solubilityOf(main.hill);
  if (solubility !== undefined && solubility < SPARINGLY_SOLUBLE_BELOW)
    return step(
      it,
      'not-counted',
      0,
      `sparingly soluble (${fmt(solubility, 2)} g per 100 g water): it does not dissolve, and its heat of solution is not counted`,
    );
  const kind = sol.basis === 'table' ? 'solution' : 'estimate';
  if (solubility !== undefined && state.waterG !== null && it.anhydrousG) {
    // What is above its solubility does not dissolve: the grams of this substance on all lines against it.
    let total = 0;
    for (const x of state.items) if (x.main?.hill === main.hill) total += x.anhydrousG ?? 0;
    const share = Math.min(1, (solubility * state.waterG) / 100 / total);
    if (share < 1)
      return withError(
        step(
          it,
          kind,
          moles * share * sol.kJPerMol,
          `${sol.method}; above its solubility (${fmt(solubility)} g per 100 g water, CRC, from memory) only ${fmt(share * 100, 2)} % dissolves and is counted`,
          sol.kJPerMol,
          sol.source,
        ),
        moles * share,
        sol,
      );
  }
  return withError(step(it, kind, moles * sol.kJPerMol, sol.method, sol.kJPerMol, sol.source), moles, sol);
}

/** An estimate's step carries its typical error, kJ. */
function withError(s: HeatStep, molesCounted: number, sol: SolutionEnthalpy): HeatStep {
  if (sol.typicalErrorKJ) s.uncertaintyKJ = molesCounted * sol.typicalErrorKJ;
  return s;
}

/** The neutralisation between ingredients: the batch's acid–base species against each ingredient's alone, in the same volume. */
function neutralisation(state: BatchState): { step: HeatStep; note?: string } | null {
  const v = estimateVolumeL(state.volumeL, state.waterG);
  if (!v || !state.aqueous) return null;
  const candidates: Array<{ it: IngredientState; part: Part; band: -1 | 0 | 1 }> = [];
  let acid = false;
  let base = false;
  for (const it of state.items) {
    if (it.isWater || !it.moles) continue;
    const share = acidBaseShare(it.ing.analysis);
    if (!share.active) continue;
    const band = bandOne(share, it.moles, v, 6.5, 7.5);
    acid ||= band < 0;
    base ||= band > 0;
    candidates.push({ it, part: { share, moles: it.moles }, band });
  }
  // An acid meets a base only where one ingredient alone is acid and another alone is basic.
  if (!acid || !base) return null;
  const actives: Array<{ it: IngredientState; part: Part; pH: number }> = [];
  for (const c of candidates) {
    // A substance that alone stays within pH 6.5–7.5 is taken at pH 7 (its species barely differ there).
    const pH = c.band === 0 ? 7 : solveOne(c.part.share, c.part.moles, v);
    if (pH !== null) actives.push({ it: c.it, part: c.part, pH });
  }
  // The batch's own estimate is the same computation; the solution chemistry's pH is not (activities), so the
  // species before and after are both taken from the ideal model. Only an estimate already made is reused:
  // asking for the batch's pH here would solve an equilibrium whose pH is then not used.
  const est = state.pHIfUsed();
  const pHFinal =
    est?.from === 'estimate'
      ? est.value
      : solveParts(
          actives.map((x) => x.part),
          v,
        );
  if (pHFinal === null) return null;
  // Each system's enthalpy is linear in its amount at a given pH: the batch's is the sum of the parts' at its pH.
  let kJ = 0;
  let unknown: Set<string> | null = null;
  let ohBefore = 0;
  for (const x of actives) {
    ohBefore += Math.pow(10, x.pH - PKW) * v;
    for (const [id, units] of x.part.share.systems) {
      const sys = ACID_SYSTEMS[id];
      const mol = units * x.part.moles;
      let h = systemEnthalpy(sys, mol, pHFinal);
      let lost = lastLost;
      h -= systemEnthalpy(sys, mol, x.pH);
      lost -= lastLost;
      kJ += h;
      if (Math.abs(lost) > 1e-6 && UNKNOWN_STEPS.has(id)) (unknown ??= new Set()).add(sys.name);
    }
  }
  kJ += (Math.pow(10, pHFinal - PKW) * v - ohBefore) * WATER_IONISATION_KJ;
  if (Math.abs(kJ) < 0.05) return null;
  let method: string | undefined;
  const step: HeatStep = {
    kind: 'neutralisation',
    ingredient: null,
    index: null,
    kJ,
    get method() {
      const acids = actives.filter((x) => x.pH < 6.5).map((x) => x.it.display);
      const bases = actives.filter((x) => x.pH > 7.5).map((x) => x.it.display);
      return (method ??= `neutralisation of ${acids.join(', ')} by ${bases.join(', ')}: the species at the batch's estimated pH ${pHFinal.toFixed(1)} against each alone, with the ionisation enthalpies of each step and 55.84 kJ/mol for water (ideal solution)`);
    },
    source: 'Goldberg et al., J. Phys. Chem. Ref. Data 31 (2002) 231; NBS tables (Wagman et al. 1982); from memory',
  };
  return { step, note: unknown ? `Ionisation enthalpies not known (counted as zero): ${[...unknown].join(', ')}.` : undefined };
}

/** Systems with a step of unknown ionisation enthalpy. */
const UNKNOWN_STEPS = new Set(
  Object.values(ACID_SYSTEMS)
    .filter((sys) => sys.dH.some((d) => d === null))
    .map((sys) => sys.id),
);

/** Protons lost (mol) in the last `systemEnthalpy` call. */
let lastLost = 0;

/**
 * The ionisation enthalpy held by `mol` of a system at a pH, kJ, from its most protonated form:
 * mol × Σᵢ αᵢ × (ΔionH₁ + … + ΔionHᵢ), with the species weighted tᵢ = Π Kaⱼ/[H⁺] (no allocation). A step of
 * unknown enthalpy counts as zero. The protons lost, mol × Σᵢ i αᵢ, are left in `lastLost`.
 */
function systemEnthalpy(sys: AcidSystem, mol: number, pH: number): number {
  const invH = Math.pow(10, pH);
  let t = 1;
  let sum = 1;
  let cum = 0;
  let hsum = 0;
  let isum = 0;
  for (let i = 0; i < sys.pKa.length; i++) {
    t *= Math.pow(10, -sys.pKa[i]) * invH;
    cum += sys.dH[i] ?? 0;
    sum += t;
    hsum += t * cum;
    isum += t * (i + 1);
  }
  lastLost = (mol * isum) / sum;
  return (mol * hsum) / sum;
}

const ACID_ADVICE = 'Add the acid to the water slowly, with stirring and cooling — never water to acid: the acid meeting a little water boils and spatters';
const CAUSTIC_ADVICE =
  'Dissolve the caustic in portions into cold water, with stirring, letting the batch cool between portions; caustic left to sit in a lump heats locally and spatters';
const NEUTRAL_ADVICE = 'Add the acid or the base slowly, with stirring and cooling: neutralising them heats the batch';
const SALT_ADVICE = 'Add it in portions with stirring, and let the batch settle to temperature between portions';

function advice(steps: HeatStep[], rise: number, finalC: number, state: BatchState): string[] {
  if (rise < 0)
    return [
      `The batch cools by about ${fmt(-rise, 2)} K as it is made up: let it come back to working temperature before use or adjustment; salts near their solubility may crystallise while it is cold`,
    ];
  const out: string[] = [];
  const hottest = steps.reduce((best, s) => (s.kJ < best.kJ ? s : best), steps[0]);
  const it = hottest.index !== null ? state.items[hottest.index] : null;
  const hill = it?.main?.hill ?? '';
  if (hottest.kind === 'neutralisation') out.push(NEUTRAL_ADVICE);
  else if (it && it.members.some((m) => m.group === 'strong-acid' || m.group === 'acid')) out.push(ACID_ADVICE);
  else if (CAUSTIC_HILLS.has(hill)) out.push(CAUSTIC_ADVICE);
  else out.push(SALT_ADVICE);
  out.push(
    `Use a vessel rated for at least ${Math.ceil(finalC / 5) * 5} °C: many plastic tanks and carboys are rated to about 60 °C, and glass should be borosilicate`,
  );
  if (finalC >= 100) out.push('The estimate passes 100 °C: the batch would boil and spatter. Make it up more dilute, or in stages with cooling');
  return out;
}
