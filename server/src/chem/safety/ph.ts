/**
 * What each ingredient brings to the acid–base balance of a batch, and an estimate of the batch's pH from
 * the charge balance, for the safety reading where the solution chemistry gives no pH (and for the heat of
 * neutralisation, which needs the species before and after mixing).
 *
 * Model: ideal solution (no activity corrections), 25 °C. Every ingredient is split into ions that take
 * no part in acid–base equilibria (Na⁺, Cl⁻, NO₃⁻…: their charges are "fixed") and acid–base systems
 * (phosphate, ammonium, acetate…: data/acids.ts) of known total amount. The pH is the one root of the
 * charge balance
 *
 *   [H⁺] − Kw/[H⁺] + Σ fixed charge / V + Σ_systems C · z̄(pH) = 0,
 *
 * found by bisection (the left side falls monotonically with pH). A strong base leaves only its cation
 * (hydroxide, oxide, alkoxide and hydride anions become OH⁻, which the balance finds by itself); a strong
 * acid leaves only its anion. This is a nominal estimate, labelled as such: activities, complexation and
 * precipitation are not modelled.
 */
import type { FormulaAnalysis } from '../analyse';
import { ACID_SYSTEMS, ANION_SYSTEMS, MOLECULAR_ACID_BASE, PKW, type AcidSystem } from './data/acids';
import { mainPart } from './substance';

/** What one formula unit brings: fixed charge and acid–base systems (units per formula unit). */
export interface AcidBaseShare {
  fixed: number;
  systems: ReadonlyArray<readonly [string, number]>;
  /** Whether the substance brings anything to the acid–base balance at all. */
  active: boolean;
}

/** Anions that react completely with water to give OH⁻ (and, for amide and nitride, NH3). */
const BASIC_ANIONS = new Set(['hydroxide', 'methoxide', 'ethoxide', 'propoxide', 'butoxide', 'peroxide', 'superoxide', 'acetylide', 'amide']);
const BASIC_MONATOMIC = new Set(['O', 'H', 'N', 'C', 'P']);

const NONE: AcidBaseShare = Object.freeze({ fixed: 0, systems: [], active: false });
/** Per analysis (analyses are shared and read-only, so the answer never changes). */
const memo = new WeakMap<FormulaAnalysis, AcidBaseShare>();

/** The acid–base share of a substance, from its reading (memoised; read-only). */
export function acidBaseShare(a: FormulaAnalysis): AcidBaseShare {
  let hit = memo.get(a);
  if (!hit) memo.set(a, (hit = compute(a)));
  return hit;
}

function compute(a: FormulaAnalysis): AcidBaseShare {
  if (!a.ok || !a.formula) return NONE;
  const main = mainPart(a);
  const c = a.charges;
  if (c && c.basis === 'ionic' && c.ions && c.balanced) {
    let fixed = 0;
    let basic = false;
    const systems = new Map<string, number>();
    const add = (id: string, n: number) => systems.set(id, (systems.get(id) ?? 0) + n);
    for (const ion of c.ions) {
      if (ion.role === 'neutral') continue;
      const n = ion.count;
      if (ion.role === 'cation') {
        if (ion.kind === 'proton' || ion.ionName === 'hydronium') continue; // H⁺: the acid's anion carries the charge
        if (ion.ionName === 'ammonium') add('ammonium', n);
        else if (ion.kind === 'metal' && ion.element === 'Fe' && ion.charge === 3) add('fe3', n);
        else if (ion.kind === 'metal' && ion.element === 'Al' && ion.charge === 3) add('al3', n);
        else fixed += ion.charge * n;
        continue;
      }
      const name = ion.ionName;
      if (name && ANION_SYSTEMS[name]) {
        const [id, units] = ANION_SYSTEMS[name];
        // A cyanide of a heavy metal is bound (complexed or insoluble), not free cyanide in water.
        if (id === 'hcn' && c.ions.some((x) => x.role === 'cation' && x.kind === 'metal' && !ALKALI_LIKE.has(x.element ?? ''))) continue;
        add(id, units * n);
      } else if (name && BASIC_ANIONS.has(name)) {
        basic = true;
        if (name === 'amide') add('ammonium', n);
      } else if (ion.kind === 'monatomic-anion' && ion.element === 'F') add('hf', n);
      else if (ion.kind === 'monatomic-anion' && ion.element === 'S') add('h2s', n);
      else if (ion.kind === 'monatomic-anion' && ion.element && BASIC_MONATOMIC.has(ion.element)) {
        basic = true;
        if (ion.element === 'N') add('ammonium', n);
      } else fixed += ion.charge * n;
    }
    const list = [...systems];
    return { fixed, systems: list, active: list.length > 0 || basic || fixed !== 0 };
  }
  if (!main || a.charge !== 0) return NONE;
  const m = MOLECULAR_ACID_BASE[main.hill];
  if (!m) return NONE;
  const systems: Array<readonly [string, number]> = m.system ? [[m.system, m.units ?? 1]] : [];
  return { fixed: m.fixed ?? 0, systems, active: true };
}

/** Cations whose cyanides are free cyanide in water (alkali, alkaline-earth metals). */
export const ALKALI_LIKE = new Set(['Li', 'Na', 'K', 'Rb', 'Cs', 'Mg', 'Ca', 'Sr', 'Ba']);

/** The amounts in a solution: fixed charge (mol) and each system's total (mol). */
export interface AcidBaseAmounts {
  fixed: number;
  systems: Map<string, number>;
}

export function emptyAmounts(): AcidBaseAmounts {
  return { fixed: 0, systems: new Map() };
}

export function addShare(into: AcidBaseAmounts, share: AcidBaseShare, moles: number): void {
  into.fixed += share.fixed * moles;
  for (const [id, units] of share.systems) into.systems.set(id, (into.systems.get(id) ?? 0) + units * moles);
}

/** Fractions α₀…αₙ of a system's species at a pH (α₀ the most protonated). */
export function fractions(sys: AcidSystem, pH: number): number[] {
  const logs = [0];
  for (let i = 0; i < sys.pKa.length; i++) logs.push(logs[i] + pH - sys.pKa[i]);
  const top = Math.max(...logs);
  const w = logs.map((x) => Math.pow(10, x - top));
  const sum = w.reduce((s, x) => s + x, 0);
  return w.map((x) => x / sum);
}

/** Acid dissociation constants of each system, computed once. */
const KA = new Map<string, Float64Array>();
function kaOf(sys: AcidSystem): Float64Array {
  let k = KA.get(sys.id);
  if (!k) KA.set(sys.id, (k = Float64Array.from(sys.pKa, (p) => Math.pow(10, -p))));
  return k;
}

const LOW = -3;
const HIGH = 17;
const KW = Math.pow(10, -PKW);

/** dq/dpH of the last `balanceAt` call (kept outside the return value: no allocation in the solver). */
let lastSlope = 0;
const LN10 = Math.LN10;

/**
 * The charge balance of a solution at a pH (mol/L of charge): positive below the root, falling with pH.
 * The species of a system are weighted tᵢ = Π Kaⱼ/[H⁺] (t₀ = 1), computed without allocation. Its slope,
 * −ln 10 · ([H⁺] + [OH⁻] + Σ C · Var(protons lost)), is left in `lastSlope` for Newton's method.
 */
function balanceAt(pH: number, fixed: number, conc: Float64Array, z0: Int32Array, ka: readonly Float64Array[]): number {
  const h = Math.pow(10, -pH);
  const invH = 1 / h;
  const oh = KW * invH;
  let q = h - oh + fixed;
  let spread = h + oh;
  for (let s = 0; s < conc.length; s++) {
    const k = ka[s];
    let t = 1;
    let sum = 1;
    let m1 = 0;
    let m2 = 0;
    for (let i = 0; i < k.length; i++) {
      t *= k[i] * invH;
      sum += t;
      m1 += t * (i + 1);
      m2 += t * (i + 1) * (i + 1);
    }
    const mean = m1 / sum;
    q += conc[s] * (z0[s] - mean);
    spread += conc[s] * (m2 / sum - mean * mean);
  }
  lastSlope = -LN10 * spread;
  return q;
}

/** A solution's systems as arrays for the solver (concentrations in mol/L). */
export interface CompiledSolution {
  fixed: number;
  conc: Float64Array;
  z0: Int32Array;
  ka: Float64Array[];
}

/** The systems of a solution as arrays for the solver. */
export function compile(amounts: AcidBaseAmounts, volumeL: number): CompiledSolution {
  const n = amounts.systems.size;
  const conc = new Float64Array(n);
  const z0 = new Int32Array(n);
  const ka: Float64Array[] = [];
  let k = 0;
  for (const [id, mol] of amounts.systems) {
    const sys = ACID_SYSTEMS[id];
    conc[k] = mol > 0 ? mol / volumeL : 0;
    z0[k] = sys.z0;
    ka.push(kaOf(sys));
    k++;
  }
  return { fixed: amounts.fixed / volumeL, conc, z0, ka };
}

/**
 * The pH at which the charge balance of the amounts in `volumeL` litres closes (ideal solution, 25 °C):
 * Newton's method kept inside a bracket that bisection narrows whenever a step would leave it (the
 * balance falls monotonically, so the root is unique), to 10⁻⁷ pH units; null for a non-positive volume.
 */
export function solvePH(amounts: AcidBaseAmounts | CompiledSolution, volumeL: number): number | null {
  if (!(volumeL > 0)) return null;
  const { fixed, conc, z0, ka } = 'conc' in amounts ? amounts : compile(amounts, volumeL);
  let lo = LOW;
  let hi = HIGH;
  if (balanceAt(lo, fixed, conc, z0, ka) <= 0) return lo;
  if (balanceAt(hi, fixed, conc, z0, ka) >= 0) return hi;
  let x = 7;
  for (let iter = 0; iter < 100; iter++) {
    const f = balanceAt(x, fixed, conc, z0, ka);
    if (f > 0) lo = x;
    else if (f < 0) hi = x;
    else return x;
    let next = x - f / lastSlope;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) < 1e-7 || hi - lo < 1e-7) return next;
    x = next;
  }
  return x;
}

const SCRATCH: CompiledSolution = { fixed: 0, conc: new Float64Array(0), z0: new Int32Array(0), ka: [] };

/**
 * Whether a solution's pH lies below (−1), within (0) or above (+1) the band [lo, hi], without solving
 * for it (two evaluations of the balance, in scratch arrays: nothing is allocated for most calls).
 */
export function pHBand(amounts: AcidBaseAmounts, volumeL: number, lo: number, hi: number): -1 | 0 | 1 {
  const n = amounts.systems.size;
  if (SCRATCH.conc.length < n) {
    SCRATCH.conc = new Float64Array(2 * n);
    SCRATCH.z0 = new Int32Array(2 * n);
  }
  const conc = SCRATCH.conc.subarray(0, n);
  const z0 = SCRATCH.z0.subarray(0, n);
  const ka = SCRATCH.ka;
  ka.length = 0;
  let k = 0;
  for (const [id, mol] of amounts.systems) {
    const sys = ACID_SYSTEMS[id];
    conc[k] = mol > 0 ? mol / volumeL : 0;
    z0[k] = sys.z0;
    ka.push(kaOf(sys));
    k++;
  }
  const fixed = amounts.fixed / volumeL;
  if (balanceAt(lo, fixed, conc, z0, ka) < 0) return -1;
  if (balanceAt(hi, fixed, conc, z0, ka) > 0) return 1;
  return 0;
}

/** The share of a system in its protonated form below step `k` (the acid HA of step k) at a pH. */
export function protonatedShare(sysId: string, pH: number, step = 0): number {
  const f = fractions(ACID_SYSTEMS[sysId], pH);
  let s = 0;
  for (let i = 0; i <= step; i++) s += f[i];
  return s;
}
