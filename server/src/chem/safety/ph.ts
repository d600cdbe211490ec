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
 * found by Newton's method inside a bracket (the left side falls monotonically with pH, so the root is
 * unique; a step that would leave the bracket bisects it instead). A strong base leaves only its cation
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
const LN10 = Math.LN10;

/** An ingredient's acid–base share and its amount, as the solver takes them. */
export interface Part {
  share: AcidBaseShare;
  moles: number;
}

// The solution being solved, in scratch arrays: the solver allocates nothing (it runs for most batches).
let conc = new Float64Array(16);
let z0s = new Int32Array(16);
const kas: Float64Array[] = [];
const ids: string[] = [];
let count = 0;
let fixedConc = 0;

function load(parts: readonly Part[], volumeL: number): void {
  count = 0;
  fixedConc = 0;
  ids.length = 0;
  for (const p of parts) add(p.share, p.moles);
  for (let k = 0; k < count; k++) conc[k] /= volumeL;
  fixedConc /= volumeL;
}

function loadOne(share: AcidBaseShare, moles: number, volumeL: number): void {
  count = 0;
  fixedConc = 0;
  ids.length = 0;
  add(share, moles);
  for (let k = 0; k < count; k++) conc[k] /= volumeL;
  fixedConc /= volumeL;
}

function add(share: AcidBaseShare, moles: number): void {
  {
    fixedConc += share.fixed * moles;
    for (const [id, units] of share.systems) {
      let k = ids.indexOf(id);
      if (k < 0) {
        k = count++;
        if (k >= conc.length) {
          const c = new Float64Array(2 * conc.length);
          c.set(conc);
          conc = c;
          const z = new Int32Array(2 * z0s.length);
          z.set(z0s);
          z0s = z;
        }
        const sys = ACID_SYSTEMS[id];
        ids[k] = id;
        z0s[k] = sys.z0;
        kas[k] = kaOf(sys);
        conc[k] = 0;
      }
      conc[k] += units * moles;
    }
  }
}

/** dq/dpH of the last `balanceAt` call. */
let lastSlope = 0;

/**
 * The charge balance of the loaded solution at a pH (mol/L of charge): positive below the root, falling
 * with pH. The species of a system are weighted tᵢ = Π Kaⱼ/[H⁺] (t₀ = 1). Its slope, −ln 10 · ([H⁺] +
 * [OH⁻] + Σ C · Var(protons lost)), is left in `lastSlope` for Newton's method.
 */
function balanceAt(pH: number): number {
  const h = Math.pow(10, -pH);
  const invH = 1 / h;
  const oh = KW * invH;
  let q = h - oh + fixedConc;
  let spread = h + oh;
  for (let s = 0; s < count; s++) {
    const k = kas[s];
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
    q += conc[s] * (z0s[s] - mean);
    spread += conc[s] * (m2 / sum - mean * mean);
  }
  lastSlope = -LN10 * spread;
  return q;
}

/**
 * The pH at which the charge balance of the parts in `volumeL` litres closes (ideal solution, 25 °C):
 * Newton's method kept inside a bracket that bisection narrows whenever a step would leave it (the
 * balance falls monotonically, so the root is unique; one beyond −3 or 17 gives the bound), to 10⁻⁷
 * pH units; null for a non-positive volume.
 */
export function solveParts(parts: readonly Part[], volumeL: number): number | null {
  if (!(volumeL > 0)) return null;
  load(parts, volumeL);
  return solveLoaded();
}

/** The pH of one substance alone in `volumeL` litres (see `solveParts`). */
export function solveOne(share: AcidBaseShare, moles: number, volumeL: number): number | null {
  if (!(volumeL > 0)) return null;
  loadOne(share, moles, volumeL);
  return solveLoaded();
}

/** Whether one substance alone in `volumeL` litres lies below (−1), within (0) or above (+1) the pH band [lo, hi]. */
export function bandOne(share: AcidBaseShare, moles: number, volumeL: number, lo: number, hi: number): -1 | 0 | 1 {
  loadOne(share, moles, volumeL);
  if (balanceAt(lo) < 0) return -1;
  if (balanceAt(hi) > 0) return 1;
  return 0;
}

function solveLoaded(): number {
  let lo = LOW;
  let hi = HIGH;
  // A first guess from the strong part alone: the excess of fixed charge as H⁺ or OH⁻.
  let x = fixedConc < -1e-7 ? -Math.log10(-fixedConc) : fixedConc > 1e-7 ? PKW + Math.log10(fixedConc) : 7;
  if (!(x > lo && x < hi)) x = 7;
  for (let iter = 0; iter < 100; iter++) {
    const f = balanceAt(x);
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

/** The pH of summed amounts (see `solveParts`). */
export function solvePH(amounts: AcidBaseAmounts, volumeL: number): number | null {
  return solveParts([{ share: { fixed: amounts.fixed, systems: [...amounts.systems], active: true }, moles: 1 }], volumeL);
}
