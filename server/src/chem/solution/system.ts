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
import { PROTON } from './tables/ions';

export interface SystemSpecies {
  label: string;
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
  const species: SystemSpecies[] = comps.map((c) => {
    const known = COMPONENTS.get(c.label);
    return known ? { label: c.label, charge: known.charge, kind: 'component' } : { label: c.label, charge: c.charge, kind: 'inert' };
  });
  const formed: ModelSpecies[] = [];
  for (const s of FORMED_SPECIES) {
    let inside = true;
    for (const c of s.stoich.keys())
      if (!index.has(c)) {
        inside = false;
        break;
      }
    if (inside) formed.push(s);
  }
  for (const s of formed) species.push({ label: s.label, charge: s.charge, kind: s.kind, model: s });
  const ns = species.length;
  const A = new Float64Array(ns * nc);
  const logK = new Float64Array(ns);
  const charge = new Float64Array(ns);
  const z2 = new Float64Array(ns);
  const at25 = new Set<string>();
  const off25 = Math.abs(T - 298.15) > 0.05;
  for (let j = 0; j < nc; j++) A[j * nc + j] = 1;
  species.forEach((s, i) => {
    charge[i] = s.charge;
    z2[i] = s.charge * s.charge;
    if (!s.model) return;
    for (const [c, a] of s.model.stoich) A[i * nc + (index.get(c) as number)] = a;
    logK[i] = logKAt(s.model.k, T);
    if (off25 && s.model.k.partial) at25.add(s.label);
  });
  const solids: SystemSolid[] = [];
  for (const m of MODEL_SOLIDS) {
    let inside = true;
    for (const c of m.stoich.keys()) if (!index.has(c)) inside = false;
    if (!inside) continue;
    const b = new Float64Array(nc);
    for (const [c, a] of m.stoich) b[index.get(c) as number] = a;
    solids.push({ model: m, b, logK: logKAt(m.k, T) });
    if (off25 && m.k.partial) at25.add(m.row.formula);
  }
  return { key, T, components: comps.map((c) => c.label), nc, species, ns, A, logK, charge, z2, solids, at25: [...at25] };
}
