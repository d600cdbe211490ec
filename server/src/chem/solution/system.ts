/**
 * The tableau of one set of components at one temperature: the components (H⁺ first), every species of
 * the model formed from them only, every solid that dissolves into them only, as dense arrays for the
 * solver. Compiled once per set and temperature (cached): batches of the same ingredients share it.
 *
 * A component the tables do not know (an ion such as MnO₄⁻ or [Fe(CN)₆]⁴⁻) is an inert component: it
 * forms nothing and counts in the ionic strength and the charge only.
 */
import { BoundedCache } from '../cache';
import { COMPONENTS, FORMED_SPECIES, logKAt, MODEL_SOLIDS, type ModelSolid, type ModelSpecies, type SpeciesKind } from './model';
import { labelDisplay } from './labels';
import { PROTON } from './tables/ions';

export interface SystemSpecies {
  label: string;
  /** The label in Unicode. */
  display: string;
  charge: number;
  kind: SpeciesKind | 'inert';
  /** The table's species (absent for an inert component). */
  model?: ModelSpecies;
}

export interface SystemSolid {
  model: ModelSolid;
  /** Coefficients over the components (length nc). */
  b: Float64Array;
  logK: number;
}

export interface TableauSystem {
  key: string;
  /** Kelvin. */
  T: number;
  /** Component labels; 0 is H⁺. */
  components: string[];
  nc: number;
  /** Species: the nc components first (in the same order), then the formed species. */
  species: SystemSpecies[];
  ns: number;
  /** Stoichiometry, ns × nc, row-major. */
  A: Float64Array;
  logK: Float64Array;
  charge: Float64Array;
  z2: Float64Array;
  /** Σ_j a_ij z_j² − z_i²: how log c_i moves with the Davies factor (−∂ log c_i / ∂f). */
  zShift: Float64Array;
  /** The stoichiometry's nonzero entries by row (compressed rows): species i has col/val[rowPtr[i] … rowPtr[i+1]). */
  rowPtr: Int32Array;
  col: Int32Array;
  val: Float64Array;
  solids: SystemSolid[];
  /** Labels of the constants used at their 25 °C value although T differs (no ΔH° tabulated). */
  at25: string[];
}

export interface ComponentSpec {
  label: string;
  /** Needed for an inert component (the tables give the others'). */
  charge: number;
}

const cache = new BoundedCache<TableauSystem>(2000, 24 * 1024 * 1024);

/** A species or solid of the model flattened for compiling: its components as arrays and as bits, its 25 °C log K. */
interface Flat {
  species: ModelSpecies;
  keys: string[];
  coefs: number[];
  lo: number;
  hi: number;
  logK25: number;
  /** The system's entry for it (shared by every system it is in: read-only). */
  entry: SystemSpecies;
}
interface FlatSolid {
  solid: ModelSolid;
  keys: string[];
  coefs: number[];
  lo: number;
  hi: number;
  logK25: number;
}

/** One bit per component the tables know (H⁺ none: every system has it), 30 to a word. */
const BIT = new Map<string, number>();
for (const c of COMPONENTS.keys()) if (c !== PROTON.label) BIT.set(c, BIT.size);
if (BIT.size > 60) throw new Error('solution tables: more components than the bit sets hold');
function bits(keys: readonly string[]): { lo: number; hi: number } {
  let lo = 0;
  let hi = 0;
  for (const k of keys) {
    const b = BIT.get(k);
    if (b === undefined) continue;
    if (b < 30) lo |= 1 << b;
    else hi |= 1 << (b - 30);
  }
  return { lo, hi };
}

const FLATS: Flat[] = FORMED_SPECIES.map((s) => {
  const keys = [...s.stoich.keys()];
  return {
    species: s,
    keys,
    coefs: [...s.stoich.values()],
    ...bits(keys),
    logK25: logKAt(s.k, 298.15),
    entry: { label: s.label, display: labelDisplay(s.label), charge: s.charge, kind: s.kind, model: s },
  };
});
const FLAT_SOLIDS: FlatSolid[] = MODEL_SOLIDS.map((m) => {
  const keys = [...m.stoich.keys()];
  return { solid: m, keys, coefs: [...m.stoich.values()], ...bits(keys), logK25: logKAt(m.k, 298.15) };
});
const COMPONENT_ENTRY = new Map<string, SystemSpecies>(
  [...COMPONENTS.values()].map((c) => [c.label, { label: c.label, display: labelDisplay(c.label), charge: c.charge, kind: 'component' }]),
);

/** Whether any solid of the table dissolves into these components only (without compiling the system). */
export function formsASolid(labels: ReadonlySet<string>): boolean {
  const { lo, hi } = bits([...labels]);
  return FLAT_SOLIDS.some((f) => (f.lo & ~lo) === 0 && (f.hi & ~hi) === 0);
}

/** Forget the compiled systems (benchmarks of a cold start). */
export function clearSystemCache() {
  cache.clear();
}

/** The system of these components (H⁺ is added) at T kelvin; cached. */
export function systemFor(components: readonly ComponentSpec[], T: number): TableauSystem {
  const others = components.filter((c) => c.label !== PROTON.label).sort((a, b) => (a.label < b.label ? -1 : a.label > b.label ? 1 : 0));
  const key = `${T}|${others.map((c) => (COMPONENTS.has(c.label) ? c.label : `${c.label}#${c.charge}`)).join(' ')}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const sys = compile(key, [{ label: PROTON.label, charge: 1 }, ...others], T);
  cache.set(key, sys, 2 * key.length + sys.ns * (sys.nc * 8 + 160) + sys.solids.length * (sys.nc * 8 + 96));
  return sys;
}

function compile(key: string, comps: ComponentSpec[], T: number): TableauSystem {
  const index = new Map<string, number>();
  comps.forEach((c, j) => index.set(c.label, j));
  const nc = comps.length;
  const species: SystemSpecies[] = comps.map(
    (c) => COMPONENT_ENTRY.get(c.label) ?? { label: c.label, display: labelDisplay(c.label), charge: c.charge, kind: 'inert' },
  );
  // The species formed of these components only: a species's components as bits, a subset test each.
  let lo = 0;
  let hi = 0;
  for (const c of comps) {
    const bit = BIT.get(c.label);
    if (bit === undefined) continue;
    if (bit < 30) lo |= 1 << bit;
    else hi |= 1 << (bit - 30);
  }
  const formed: Flat[] = [];
  for (const f of FLATS) if ((f.lo & ~lo) === 0 && (f.hi & ~hi) === 0) formed.push(f);
  for (const f of formed) species.push(f.entry);
  const ns = species.length;
  const A = new Float64Array(ns * nc);
  const logK = new Float64Array(ns);
  const charge = new Float64Array(ns);
  const z2 = new Float64Array(ns);
  const at25: string[] = [];
  const off25 = Math.abs(T - 298.15) > 0.05;
  for (let j = 0; j < nc; j++) {
    A[j * nc + j] = 1;
    charge[j] = species[j].charge;
    z2[j] = charge[j] * charge[j];
  }
  formed.forEach((f, k) => {
    const i = nc + k;
    charge[i] = f.species.charge;
    z2[i] = charge[i] * charge[i];
    for (let t = 0; t < f.keys.length; t++) A[i * nc + (index.get(f.keys[t]) as number)] = f.coefs[t];
    logK[i] = off25 ? logKAt(f.species.k, T) : f.logK25;
    if (off25 && f.species.k.partial) at25.push(f.species.label);
  });
  const solids: SystemSolid[] = [];
  for (const f of FLAT_SOLIDS) {
    if ((f.lo & ~lo) !== 0 || (f.hi & ~hi) !== 0) continue;
    const b = new Float64Array(nc);
    for (let t = 0; t < f.keys.length; t++) b[index.get(f.keys[t]) as number] = f.coefs[t];
    solids.push({ model: f.solid, b, logK: off25 ? logKAt(f.solid.k, T) : f.logK25 });
    if (off25 && f.solid.k.partial) at25.push(f.solid.row.formula);
  }
  const zShift = new Float64Array(ns);
  for (let i = 0; i < ns; i++) {
    let v = -z2[i];
    for (let j = 0; j < nc; j++) v += A[i * nc + j] * z2[j];
    zShift[i] = v;
  }
  const rowPtr = new Int32Array(ns + 1);
  let nnz = 0;
  for (let i = 0; i < ns; i++) for (let j = 0; j < nc; j++) if (A[i * nc + j] !== 0) nnz++;
  const col = new Int32Array(nnz);
  const val = new Float64Array(nnz);
  nnz = 0;
  for (let i = 0; i < ns; i++) {
    rowPtr[i] = nnz;
    for (let j = 0; j < nc; j++)
      if (A[i * nc + j] !== 0) {
        col[nnz] = j;
        val[nnz++] = A[i * nc + j];
      }
  }
  rowPtr[ns] = nnz;
  return { key, T, components: comps.map((c) => c.label), nc, species, ns, A, logK, charge, z2, zShift, rowPtr, col, val, solids, at25 };
}
