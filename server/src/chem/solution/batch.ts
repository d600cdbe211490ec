/**
 * The solution stage of a batch: its ingredients read into components (reading.ts), the totals over the
 * final volume, the equilibrium of the made-up solution (solver.ts) with its saturation indices and what
 * would come out; a `to pH` ingredient's amount solved; a buffer line designed.
 *
 * Every solve here is of the batch as made up (homogeneous, nothing come out yet): its pH and species.
 * Where a solid is oversaturated, a second solve lets the solids come out and gives their amounts and the
 * pH after.
 */
import type { FormulaAnalysis } from '../analyse';
import { analyseFormula } from '../analyse';
import { BoundedCache } from '../cache';
import { pairFormulas, type BufferSystem } from './buffers';
import { labelDisplay } from './labels';
import { readIngredient, type IngredientReading } from './reading';
import { brent } from './roots';
import { bufferCapacity, solveEquilibrium, type Equilibrium } from './solver';
import { systemFor, type ComponentSpec } from './system';
import { ACID_SYSTEMS } from './tables/acids';
import { PROTON } from './tables/ions';
import type { BatchSolution, BufferDesign, IngredientInModel, SolidSaturation, SolutionSpecies, SolvedAmount } from './types';

/** A recipe in mol: what each component of the model gets from the ingredients. */
class Recipe {
  readonly mol = new Map<string, { charge: number; mol: number }>();
  add(r: IngredientReading, moles: number) {
    for (const s of r.shares) {
      const at = this.mol.get(s.label);
      if (at) at.mol += s.count * moles;
      else this.mol.set(s.label, { charge: s.charge, mol: s.count * moles });
    }
  }
  clone(): Recipe {
    const c = new Recipe();
    for (const [k, v] of this.mol) c.mol.set(k, { ...v });
    return c;
  }
  /** The system and totals (mol/L) at T kelvin. */
  tableau(volumeL: number, T: number) {
    const specs: ComponentSpec[] = [];
    for (const [label, v] of this.mol) if (label !== PROTON.label && v.mol > 1e-300) specs.push({ label, charge: v.charge });
    const system = systemFor(specs, T);
    const totals = new Float64Array(system.nc);
    system.components.forEach((c, j) => (totals[j] = (this.mol.get(c)?.mol ?? 0) / volumeL));
    return { system, totals };
  }
}

export interface SolutionIngredient {
  analysis: FormulaAnalysis;
  moles: number;
}

export interface SolutionRequest {
  volumeL: number;
  temperatureC: number;
  ingredients: SolutionIngredient[];
  activity?: 'davies' | 'ideal';
}

const NOTES = {
  model: 'Davies activity coefficients (valid to I ≈ 0.5 M); closed to air (no CO₂ exchanged); no redox; 25 °C constants unless a temperature is given.',
  estimate: 'pH and precipitation are estimates of an ideal model: measure the pH of the made-up batch.',
};

const solidMass = new Map<string, number>();
function molarMassOf(formula: string): number {
  let m = solidMass.get(formula);
  if (m === undefined) {
    m = analyseFormula(formula).molarMass?.value ?? 0;
    solidMass.set(formula, m);
  }
  return m;
}

/** The equilibrium of a recipe, as made up. */
function solve(recipe: Recipe, volumeL: number, T: number, activity: 'davies' | 'ideal'): Equilibrium {
  const { system, totals } = recipe.tableau(volumeL, T);
  return solveEquilibrium(system, totals, { activity });
}

/** Results by the recipe's content: the same batch elsewhere in the notes, or typed again, is not solved again. */
const results = new BoundedCache<Solved>(2000, 16 * 1024 * 1024);

export function clearSolutionCache() {
  results.clear();
}

function recipeKey(recipe: Recipe, volumeL: number, T: number, activity: string): string {
  const parts: string[] = [];
  for (const [k, v] of recipe.mol) parts.push(`${k}=${(v.mol / volumeL).toPrecision(15)}`);
  return `${T}|${activity}|${parts.sort().join(',')}`;
}

/** The components a batch's ingredients give (H⁺ left out): what decides which solids it can form. */
export function componentsOf(ingredients: readonly SolutionIngredient[]): Set<string> {
  const out = new Set<string>();
  for (const i of ingredients)
    if (i.moles > 0) for (const s of readIngredient(i.analysis).shares) if (s.label !== PROTON.label && s.count > 0) out.add(s.label);
  return out;
}

/** The solution of a batch whose every amount is known. */
export function batchSolution(req: SolutionRequest): BatchSolution {
  const T = req.temperatureC + 273.15;
  const activity = req.activity ?? 'davies';
  const recipe = new Recipe();
  const readings: Array<{ display: string; reading: IngredientReading }> = [];
  for (const i of req.ingredients) {
    const r = readIngredient(i.analysis);
    recipe.add(r, i.moles);
    readings.push({ display: i.analysis.display, reading: r });
  }
  const key = recipeKey(recipe, req.volumeL, T, activity);
  const hit = results.get(key);
  if (hit) return hit.withReadings(readings);
  const eq = solve(recipe, req.volumeL, T, activity);
  const out = new Solved(eq, recipe, req.volumeL, req.temperatureC, readings);
  results.set(key, out, 800 + 200 * eq.system.ns);
  return out;
}

const countedLabel = (t: string) => {
  const m = /^(\d+) (.*)$/.exec(t);
  return m ? `${m[1]} ${labelDisplay(m[2])}` : labelDisplay(t);
};

/**
 * A batch's equilibrium, described on demand: the lists of species and solids, the buffer capacity and the
 * notes are made when first read (the check of a folder reads only the findings); what would come out is
 * solved at once where a solid is oversaturated, since the findings say it.
 */
class Solved implements BatchSolution {
  readonly temperatureC: number;
  readonly pH: number;
  readonly ionicStrengthM: number;
  readonly activityModel: 'Davies' | 'ideal';
  readonly converged: boolean;
  readonly iterations: number;
  readonly outOfRange: boolean;
  readonly at25: string[];
  readonly precipitates: BatchSolution['precipitates'] = [];
  readonly afterPrecipitation: BatchSolution['afterPrecipitation'] = null;
  private made: {
    species?: SolutionSpecies[];
    saturation?: SolidSaturation[];
    capacity?: number | null;
    notes?: string[];
    ingredients?: IngredientInModel[];
    inert?: string[];
  } = {};

  constructor(
    readonly equilibrium: Equilibrium,
    private readonly recipe: Recipe,
    private readonly volumeL: number,
    temperatureC: number,
    private readonly readings: ReadonlyArray<{ display: string; reading: IngredientReading }>,
  ) {
    const eq = equilibrium;
    this.temperatureC = temperatureC;
    this.pH = eq.pH;
    this.ionicStrengthM = eq.I;
    this.activityModel = eq.activity === 'davies' ? 'Davies' : 'ideal';
    this.converged = eq.converged;
    this.iterations = eq.iterations;
    this.outOfRange = eq.outOfRange;
    this.at25 = eq.system.at25;
    if (eq.converged && eq.si.some((x) => x > 1e-6)) {
      const { system, totals } = recipe.tableau(volumeL, eq.system.T);
      // To 1e-8 of the balances: what comes out is a rough mass in the findings, and this is the costly solve.
      const after = solveEquilibrium(system, totals, { activity: eq.activity, precipitate: true, start: eq.X, tolerance: 1e-8 });
      if (after.converged && after.precipitates.length) {
        this.precipitates = after.precipitates.map((p) => {
          const row = system.solids[p.solid].model.row;
          return {
            solid: row.formula,
            display: system.solids[p.solid].model.display,
            name: row.name,
            molPerL: p.molPerL,
            massG: p.molPerL * volumeL * molarMassOf(row.formula),
          };
        });
        this.afterPrecipitation = { pH: after.pH, ionicStrengthM: after.I };
      }
    }
  }

  /** The same solution, for a batch whose ingredients are written otherwise (a composition met before). */
  withReadings(readings: ReadonlyArray<{ display: string; reading: IngredientReading }>): Solved {
    const copy = Object.create(Solved.prototype) as Solved;
    Object.assign(copy, this, { readings, made: { species: this.made.species, saturation: this.made.saturation, capacity: this.made.capacity } });
    return copy;
  }

  get species(): SolutionSpecies[] {
    if (this.made.species) return this.made.species;
    const eq = this.equilibrium;
    const list = eq.system.species.map((s, i) => {
      const c = Math.pow(10, eq.logC[i]);
      const out: SolutionSpecies = { label: s.label, display: s.display, charge: s.charge, concentrationM: c, activity: c * Math.pow(10, eq.logGamma[i]) };
      if (s.model?.name) out.name = s.model.name;
      return out;
    });
    list.sort((a, b) => b.concentrationM - a.concentrationM);
    return (this.made.species = list);
  }

  get saturation(): SolidSaturation[] {
    if (this.made.saturation) return this.made.saturation;
    const eq = this.equilibrium;
    const list = eq.system.solids.map((s, k) => {
      const out: SolidSaturation = {
        solid: s.model.row.formula,
        display: s.model.display,
        name: s.model.row.name,
        saturationIndex: eq.si[k],
        logKsp: s.model.row.logKsp,
        source: s.model.citation,
      };
      if (s.model.row.note) out.note = s.model.row.note;
      return out;
    });
    list.sort((a, b) => b.saturationIndex - a.saturationIndex);
    return (this.made.saturation = list);
  }

  get bufferCapacity(): number | null {
    if (this.made.capacity === undefined) this.made.capacity = this.converged ? bufferCapacity(this.equilibrium) : null;
    return this.made.capacity;
  }

  get ingredients(): IngredientInModel[] {
    return (this.made.ingredients ??= this.readings.map(({ display, reading: r }) => {
      const out: IngredientInModel = { formula: display, as: r.as.map(countedLabel).join(' + ') };
      if (r.leftOut) out.leftOut = r.leftOut;
      return out;
    }));
  }

  get inert(): string[] {
    return (this.made.inert ??= [...new Set(this.readings.flatMap((x) => x.reading.inert))]);
  }

  get notes(): string[] {
    if (this.made.notes) return this.made.notes;
    const eq = this.equilibrium;
    const sys = eq.system;
    const notes = [NOTES.model, NOTES.estimate];
    if (eq.outOfRange)
      notes.unshift(`I = ${eq.I.toPrecision(2)} M is above the Davies equation's range (about 0.5 M): the activities, pH and saturation indices are rough.`);
    if (Math.abs(this.temperatureC - 25) > 0.05 && sys.at25.length)
      notes.push(
        `At ${this.temperatureC} °C; no enthalpy is tabulated for ${sys.at25.length} of the constants used (${sys.at25.slice(0, 4).map(labelDisplay).join(', ')}${sys.at25.length > 4 ? ', …' : ''}): their 25 °C values are used.`,
      );
    for (const n of new Set(sys.species.map((x) => x.model?.system?.note).filter((x): x is string => !!x))) notes.push(n);
    if (this.inert.length) notes.push(`Not in the equilibrium tables, counted as ions that form nothing: ${this.inert.map(labelDisplay).join(', ')}.`);
    return (this.made.notes = notes);
  }

  /** The oversaturated solids, most first, without making the whole list. */
  oversaturated(): Array<{ solid: string; display: string; name: string; saturationIndex: number }> {
    const eq = this.equilibrium;
    const out: Array<{ solid: string; display: string; name: string; saturationIndex: number }> = [];
    eq.system.solids.forEach((s, k) => {
      if (eq.si[k] > 0) out.push({ solid: s.model.row.formula, display: s.model.display, name: s.model.row.name, saturationIndex: eq.si[k] });
    });
    return out.sort((a, b) => b.saturationIndex - a.saturationIndex);
  }
}

/** The oversaturated solids of a solution, most first. */
export function oversaturated(s: BatchSolution): Array<{ solid: string; display: string; name: string; saturationIndex: number }> {
  return s instanceof Solved ? s.oversaturated() : s.saturation.filter((x) => x.saturationIndex > 0);
}

// ── solving for an amount ──────────────────────────────────────────────────

/** The most one litre of batch may take of an ingredient solved for (mol): beyond it, "not reachable". */
const MAX_MOL_PER_L = 20;

function recipeOf(ingredients: readonly SolutionIngredient[]): Recipe {
  const r = new Recipe();
  for (const i of ingredients) r.add(readIngredient(i.analysis), i.moles);
  return r;
}

/** pH of the recipe plus n mol of the reading (homogeneous, as made up). */
function pHWith(base: Recipe, add: IngredientReading, n: number, volumeL: number, T: number, activity: 'davies' | 'ideal'): { pH: number; converged: boolean } {
  const r = base.clone();
  if (n > 0) r.add(add, n);
  const eq = solve(r, volumeL, T, activity);
  return { pH: eq.pH, converged: eq.converged };
}

const fixed2 = (x: number) => x.toFixed(2);

/**
 * The amount of `analysis` that brings the batch (the other ingredients) to `targetPH`: bracketed over
 * decades of the amount, then Brent's method on log10 of it.
 */
export function solveForPH(
  others: readonly SolutionIngredient[],
  analysis: FormulaAnalysis,
  targetPH: number,
  volumeL: number,
  temperatureC: number,
  activity: 'davies' | 'ideal' = 'davies',
): SolvedAmount {
  const T = temperatureC + 273.15;
  const reading = readIngredient(analysis);
  const who = analysis.display;
  if (reading.shares.length === 0)
    return { error: `${who} is not in the equilibrium model (${reading.leftOut ?? 'not read'}), so no amount of it can be solved for a pH.` };
  const base = recipeOf(others);
  const p0 = pHWith(base, reading, 0, volumeL, T, activity);
  if (!p0.converged) return { error: `The equilibrium of the batch without ${who} did not converge, so no amount can be solved.` };
  const probe = pHWith(base, reading, 1e-3 * volumeL, volumeL, T, activity);
  const rises = probe.pH > p0.pH;
  if (Math.abs(probe.pH - p0.pH) < 1e-7) return { error: `${who} does not move the pH of this batch: only an acid or a base can be solved for a pH.` };
  if (Math.abs(p0.pH - targetPH) < 1e-9) return { moles: 0, pH: p0.pH };
  if (rises !== targetPH > p0.pH)
    return {
      error: `${who} ${rises ? 'raises' : 'lowers'} the pH, and the batch without it is already at pH ${fixed2(p0.pH)}, ${rises ? 'above' : 'below'} ${fixed2(targetPH)}: ${rises ? 'an acid' : 'a base'} is needed.`,
    };
  // Bracket over decades of the amount per litre.
  const f = (logN: number) => pHWith(base, reading, Math.pow(10, logN) * volumeL, volumeL, T, activity).pH - targetPH;
  let lo = -12;
  let flo = f(lo);
  if (flo > 0 === rises && Math.abs(flo) > 1e-9) {
    // Even a trace overshoots: the answer is (practically) none.
    return { moles: Math.pow(10, lo) * volumeL, pH: flo + targetPH };
  }
  let hi = lo;
  let fhi = flo;
  while (hi < Math.log10(MAX_MOL_PER_L)) {
    lo = hi;
    flo = fhi;
    hi = Math.min(hi + 1, Math.log10(MAX_MOL_PER_L));
    fhi = f(hi);
    if (fhi > 0 === rises || fhi === 0) break;
  }
  if (fhi > 0 !== rises && fhi !== 0)
    return {
      error: `Even ${MAX_MOL_PER_L} mol/L of ${who} brings the batch only to pH ${fixed2(fhi + targetPH)}, not ${fixed2(targetPH)}.`,
    };
  const root = brent(f, lo, hi, flo, fhi, 1e-10, 80);
  return { moles: Math.pow(10, root.x) * volumeL, pH: root.fx + targetPH };
}

/** The basis units of the system one formula unit of `reading` carries. */
function systemUnits(reading: IngredientReading, id: string): number {
  const s = ACID_SYSTEMS.find((x) => x.id === id);
  if (!s) return 0;
  const basis = s.forms[s.forms.length - 1].label;
  return reading.shares.find((x) => x.label === basis)?.count ?? 0;
}

/**
 * A buffer of `totalM` (the system's forms together) at `targetPH`, in the batch of `others`: for each pair of
 * the system, the share s ∈ [0, 1] of the base form that gives the pH (Brent), the pair whose range holds
 * the target and whose midpoint is nearest it.
 */
export function designBuffer(
  others: readonly SolutionIngredient[],
  buffer: BufferSystem,
  counterIon: 'Na' | 'K',
  totalM: number,
  targetPH: number,
  volumeL: number,
  temperatureC: number,
  activity: 'davies' | 'ideal' = 'davies',
): BufferDesign | { error: string } {
  const T = temperatureC + 273.15;
  const base = recipeOf(others);
  const N = totalM * volumeL;
  interface Candidate {
    acid: { formula: string; analysis: FormulaAnalysis; reading: IngredientReading; k: number };
    base: { formula: string; analysis: FormulaAnalysis; reading: IngredientReading; k: number };
    amounts: (s: number) => [number, number];
    pH: (s: number) => number;
    lo: number;
    hi: number;
    mid: number;
  }
  const candidates: Candidate[] = [];
  for (const pair of buffer.pairs) {
    const f = pairFormulas(pair, counterIon);
    const acidA = analyseFormula(f.acid);
    const baseA = analyseFormula(f.base);
    const acid = { formula: f.acid, analysis: acidA, reading: readIngredient(acidA), k: 0 };
    const bas = { formula: f.base, analysis: baseA, reading: readIngredient(baseA), k: 0 };
    acid.k = systemUnits(acid.reading, buffer.system);
    bas.k = systemUnits(bas.reading, buffer.system);
    if (acid.k === 0 && bas.k === 0) continue;
    // s = 0: all acid form; s = 1: all base form (a titrant goes from none to one per system unit).
    const amounts = (s: number): [number, number] => {
      if (acid.k > 0 && bas.k > 0) return [((1 - s) * N) / acid.k, (s * N) / bas.k];
      if (acid.k > 0) return [N / acid.k, s * N];
      return [(1 - s) * N, N / bas.k];
    };
    const pH = (s: number) => {
      const r = base.clone();
      const [na, nb] = amounts(s);
      if (na > 0) r.add(acid.reading, na);
      if (nb > 0) r.add(bas.reading, nb);
      return solve(r, volumeL, T, activity).pH;
    };
    const lo = pH(0);
    const hi = pH(1);
    candidates.push({ acid, base: bas, amounts, pH, lo, hi, mid: pH(0.5) });
  }
  if (candidates.length === 0) return { error: `No ${buffer.names[0]} forms could be read.` };
  const holding = candidates.filter((c) => targetPH >= Math.min(c.lo, c.hi) - 1e-9 && targetPH <= Math.max(c.lo, c.hi) + 1e-9);
  if (holding.length === 0) {
    const lo = Math.min(...candidates.map((c) => Math.min(c.lo, c.hi)));
    const hi = Math.max(...candidates.map((c) => Math.max(c.lo, c.hi)));
    return { error: `A ${buffer.names[0]} buffer of ${totalM} M in this batch spans pH ${fixed2(lo)} to ${fixed2(hi)}; ${fixed2(targetPH)} is outside it.` };
  }
  holding.sort((a, b) => Math.abs(a.mid - targetPH) - Math.abs(b.mid - targetPH));
  const c = holding[0];
  const g = (s: number) => c.pH(s) - targetPH;
  const root = brent(g, 0, 1, c.lo - targetPH, c.hi - targetPH, 1e-12, 80);
  const [na, nb] = c.amounts(root.x);
  // The step that buffers: the pKa (I = 0) nearest the target. Its two forms' concentrations in the batch
  // made up, against Henderson–Hasselbalch's ideal ratio 10^(pH − pKa), show what the activities do.
  const sys = ACID_SYSTEMS.find((x) => x.id === buffer.system);
  const pKa = sys?.pKa ?? [];
  const step = pKa.length ? pKa.reduce((m, p, k) => (Math.abs(p - targetPH) < Math.abs(pKa[m] - targetPH) ? k : m), 0) : -1;
  let ratio = NaN;
  if (sys && step >= 0) {
    const r = base.clone();
    if (na > 0) r.add(c.acid.reading, na);
    if (nb > 0) r.add(c.base.reading, nb);
    const eq = solve(r, volumeL, T, activity);
    const conc = (label: string) => {
      const i = eq.system.species.findIndex((x) => x.label === label);
      return i < 0 ? 0 : Math.pow(10, eq.logC[i]);
    };
    ratio = conc(sys.forms[step + 1].label) / conc(sys.forms[step].label);
  }
  const nearest = step >= 0 ? pKa[step] : null;
  return {
    system: buffer.names[0],
    totalM,
    pH: root.fx + targetPH,
    acid: { formula: c.acid.formula, moles: na },
    base: { formula: c.base.formula, moles: nb },
    ratio,
    idealRatio: nearest === null ? null : Math.pow(10, targetPH - nearest),
    pKa: nearest,
    forms: sys && step >= 0 ? [sys.forms[step].label, sys.forms[step + 1].label] : null,
    weak: nearest !== null && Math.abs(targetPH - nearest) > 1,
  };
}

export { labelDisplay };
