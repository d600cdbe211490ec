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
import { analysisDerivedCache } from '../cache';
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
const memo = analysisDerivedCache<AcidBaseShare>(20_000, 4 * 1024 * 1024);

/** The acid–base share of a substance, from its reading (memoised by formula text; read-only). */
export function acidBaseShare(a: FormulaAnalysis): AcidBaseShare {
  let hit = memo.get(a.input);
  if (!hit) {
    hit = compute(a);
    memo.set(a.input, hit, 96 + 48 * hit.systems.length);
  }
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

/** Mean charge of a system's species at a pH. */
function meanCharge(sys: AcidSystem, pH: number): number {
  const f = fractions(sys, pH);
  let z = 0;
  for (let i = 0; i < f.length; i++) z += f[i] * (sys.z0 - i);
  return z;
}

const LOW = -3;
const HIGH = 17;

/**
 * The pH at which the charge balance of the amounts in `volumeL` litres closes (ideal solution, 25 °C),
 * by bisection to 10⁻⁶ pH units; null for a non-positive volume.
 */
export function solvePH(amounts: AcidBaseAmounts, volumeL: number): number | null {
  if (!(volumeL > 0)) return null;
  const fixed = amounts.fixed / volumeL;
  const sys: Array<[AcidSystem, number]> = [];
  for (const [id, mol] of amounts.systems) if (mol > 0) sys.push([ACID_SYSTEMS[id], mol / volumeL]);
  const balance = (pH: number) => {
    const h = Math.pow(10, -pH);
    let q = h - Math.pow(10, pH - PKW) + fixed;
    for (const [s, c] of sys) q += c * meanCharge(s, pH);
    return q;
  };
  let lo = LOW;
  let hi = HIGH;
  if (balance(lo) <= 0) return lo;
  if (balance(hi) >= 0) return hi;
  while (hi - lo > 1e-6) {
    const mid = 0.5 * (lo + hi);
    if (balance(mid) > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** The share of a system in its protonated form below step `k` (the acid HA of step k) at a pH. */
export function protonatedShare(sysId: string, pH: number, step = 0): number {
  const f = fractions(ACID_SYSTEMS[sysId], pH);
  let s = 0;
  for (let i = 0; i <= step; i++) s += f[i];
  return s;
}
