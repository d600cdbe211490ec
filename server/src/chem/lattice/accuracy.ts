/**
 * How far each model runs from the Born–Haber cycle, per structure type, measured on the project's own
 * tables: every salt of data/reference/structure-types.csv (and every other binary halide of
 * formation-enthalpies.csv, for Kapustinskii, which needs no structure) that has a Born–Haber value is
 * computed with each model, and the relative errors (model − cycle) / cycle are summarised per structure type.
 *
 * The card is headed by the Born–Haber value where one exists; otherwise by the model with the smallest
 * median error for the salt's structure type (where at least MIN_REFERENCES salts of that type have a
 * cycle), and it prints that type's error, not a global one. The silver and copper(I) halides (d¹⁰ cation,
 * polarisable anion) are kept apart as their own group: all ionic models run far low for them.
 */
import { element } from '../data/elements';
import { structureTable } from '../data/structures';
import { FORMATION_SOLID } from '../data/thermo';
import { isCovalentHalide, latticeMethods, METHODS, MODEL_METHODS, type LatticeIon, type MethodName } from './methods';

export const MIN_REFERENCES = 2;
/** The group name of the silver and copper(I) chloride, bromide and iodide. */
export const COVALENT_GROUP = 'silver and copper(I) halides';
/** The group name of every salt with a cycle, the d¹⁰ halides left out. */
export const ALL_IONIC = 'all salts with a Born–Haber value';

export interface MethodError {
  method: MethodName;
  n: number;
  /** Signed relative errors (model − Born–Haber) / Born–Haber, sorted. */
  errors: number[];
  median: number;
  min: number;
  max: number;
  salts: string[];
}

export interface GroupAccuracy {
  group: string;
  methods: Partial<Record<MethodName, MethodError>>;
  /** The model with the smallest median |error|, where the group has enough references. */
  best?: MethodName;
}

const ANION_CHARGE: Record<string, number> = { F: -1, Cl: -1, Br: -1, I: -1, H: -1, O: -2, S: -2, Se: -2, Te: -2 };

/** A binary salt `MₐXᵦ` written cation first, as ions, or undefined. */
export function binaryIons(formula: string): { cation: LatticeIon; anion: LatticeIon } | undefined {
  const m = /^([A-Z][a-z]?)(\d*)([A-Z][a-z]?)(\d*)$/.exec(formula);
  if (!m) return undefined;
  const [, ce, cn, ae, an] = m;
  const za = ANION_CHARGE[ae];
  if (za === undefined || !element(ce)) return undefined;
  const cc = cn ? Number(cn) : 1;
  const ac = an ? Number(an) : 1;
  const zc = (-za * ac) / cc;
  if (!Number.isInteger(zc) || zc <= 0) return undefined;
  return { cation: { text: ce, element: ce, charge: zc, count: cc }, anion: { text: ae, element: ae, charge: za, count: ac } };
}

function median(s: number[]): number {
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
}

let table: Map<string, GroupAccuracy> | undefined;

/** The accuracy of each model per structure type (and for the d¹⁰ halides, and over all), computed once. */
export function accuracyTable(): ReadonlyMap<string, GroupAccuracy> {
  if (table) return table;
  const raw = new Map<string, Map<MethodName, Array<[string, number]>>>();
  const put = (group: string, method: MethodName, salt: string, e: number) => {
    let g = raw.get(group);
    if (!g) raw.set(group, (g = new Map()));
    let l = g.get(method);
    if (!l) g.set(method, (l = []));
    l.push([salt, e]);
  };
  const structures = structureTable();
  const salts = new Set([...structures.keys(), ...Object.keys(FORMATION_SOLID)]);
  for (const salt of salts) {
    const ions = binaryIons(salt);
    if (!ions) continue;
    const st = structures.get(salt);
    const { methods } = latticeMethods(salt, ions.cation, ions.anion, st);
    const bh = methods.find((m) => m.method === METHODS.bornHaber);
    if (!bh) continue;
    const covalent = isCovalentHalide(ions.cation, ions.anion);
    for (const m of methods) {
      if (m.method === METHODS.bornHaber) continue;
      const e = (m.kJPerMol - bh.kJPerMol) / bh.kJPerMol;
      if (covalent) put(COVALENT_GROUP, m.method, salt, e);
      else {
        if (st) put(st.structure, m.method, salt, e);
        put(ALL_IONIC, m.method, salt, e);
      }
    }
  }
  table = new Map();
  for (const [group, byMethod] of raw) {
    const methods: GroupAccuracy['methods'] = {};
    for (const [method, list] of byMethod) {
      list.sort((x, y) => x[1] - y[1]);
      const errors = list.map(([, e]) => e);
      methods[method] = {
        method,
        n: errors.length,
        errors,
        median: median(errors),
        min: errors[0],
        max: errors[errors.length - 1],
        salts: list.map(([s]) => s),
      };
    }
    const ranked = MODEL_METHODS.filter((m) => (methods[m]?.n ?? 0) >= MIN_REFERENCES).sort(
      (x, y) => Math.abs(methods[x]!.median) - Math.abs(methods[y]!.median),
    );
    table.set(group, { group, methods, ...(ranked.length ? { best: ranked[0] } : {}) });
  }
  return table;
}

const pc = (x: number) => `${Math.round(Math.abs(x) * 100)} %`;
const dir = (x: number) => (x < 0 ? 'low' : 'high');

/** "runs a median 9 % low (n = 8; 2 % to 16 % low)" for one method in one group, or undefined. */
export function errorPhrase(e: MethodError | undefined): string | undefined {
  if (!e) return undefined;
  let range = '';
  if (e.n > 1) {
    const [a, b] = [pc(e.min), pc(e.max)];
    if (Math.sign(e.min) !== Math.sign(e.max) && e.min !== 0 && e.max !== 0) range = `; ${a} low to ${b} high`;
    else if (a === b) range = `; each about ${a} ${dir(e.median)}`;
    else range = e.max < 0 ? `; ${b} to ${a} low` : `; ${a} to ${b} high`;
  }
  return `runs a median ${pc(e.median)} ${dir(e.median)} against Born–Haber (n = ${e.n}${range})`;
}
