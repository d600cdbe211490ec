/**
 * Lattice energy of an ionic solid: the energy to separate one mole of it into gaseous ions (positive).
 * Every model value is an estimate and is labelled as one. The methods are in ./methods.ts; how far each
 * runs from the Born–Haber cycle per structure type is measured in ./accuracy.ts; molecular substances,
 * which have no ionic lattice, are recognised in ./molecular.ts.
 *
 * Which method heads the card (setting `best`): the Born–Haber cycle where its data exist; otherwise the
 * model with the smallest median error against Born–Haber for the salt's structure type (over all salts
 * with a cycle when the type has too few), and the card prints that type's measured error.
 */
import type { ChargeAssessment } from '../charge/balance';
import { structureOf } from '../data/structures';
import { MELTING_POINT_C, MOLECULAR_SUBSTANCES, SOURCES } from '../data/thermo';
import type { Formula } from '../formula/ast';
import type { AtomCounts } from '../formula/compute';
import type { ChemSettings } from '../settings';
import { accuracyTable, ALL_IONIC, COVALENT_GROUP, errorPhrase, MIN_REFERENCES, type GroupAccuracy } from './accuracy';
import { isCovalentHalide, latticeMethods, METHODS, MODEL_METHODS, type Method, type MethodName } from './methods';
import { covalentByCharge } from './molecular';

export { BORN_MAYER_RHO, COULOMB_KJ_A, KAPUSTINSKII_D, KAPUSTINSKII_K, METHODS, bornExponent, bornHaber, bornLande, bornMayer, kapustinskii } from './methods';
export { latticeWithheld, type LatticeWithheld } from './molecular';

export interface LatticeAlternative {
  method: string;
  kJPerMol: number;
}

export interface LatticeAssessment {
  kJPerMol: number;
  method: string;
  inputs: Record<string, unknown>;
  alternatives: LatticeAlternative[];
  /** True for the model-based methods; a Born–Haber value rests on tabulated enthalpies. */
  estimate: boolean;
  /** The measured error of the heading method for this salt's structure type (and any covalency warning). */
  typicalError: string;
  /** Which salt the value is for (the anhydrous salt of a hydrate). */
  salt: string;
  meltingPointC?: number;
  meltingPointSource?: string;
  /** |z₊ z₋| of the salt's ions. */
  chargeProduct: number;
  /** r₊ + r₋ in Å with six-coordinate Shannon or thermochemical radii (as Kapustinskii uses), where both are known. */
  radiusSum?: number;
  /** The structure type whose measured errors chose the method, or the group used instead. */
  accuracyGroup?: string;
  /** Set for the silver and copper(I) halides: the ionic models run far low (covalent character). */
  covalency?: string;
}

const BORN_HABER_ERROR = 'about 1 % against the CRC lattice energies (a lattice enthalpy at 298 K from tabulated enthalpies, recalled)';

/**
 * Differences in median error smaller than this are not taken to rank the models: compilations of lattice
 * energies differ by 1–2 % for the same salt (data/reference/README.md), so the default order stands.
 */
export const RANKING_MARGIN = 0.01;

/**
 * The heading order of the models for a group: the model with the smallest measured median |error| (on the
 * salts all candidates cover) first, unless an earlier one in the default order is within RANKING_MARGIN of it.
 */
function modelOrder(g: GroupAccuracy | undefined): MethodName[] {
  if (!g) return [...MODEL_METHODS];
  const have = MODEL_METHODS.filter((m) => (g.methods[m]?.n ?? 0) >= MIN_REFERENCES);
  if (have.length === 0) return [...MODEL_METHODS];
  // Compare on the salts every candidate covers, so that a method is not favoured by the salts it lacks.
  let common = new Set(g.methods[have[0]]!.salts);
  for (const m of have.slice(1)) common = new Set(g.methods[m]!.salts.filter((s) => common.has(s)));
  const medianOn = (m: MethodName) => {
    const e = g.methods[m]!;
    const xs =
      common.size >= MIN_REFERENCES
        ? e.salts
            .map((s, k) => [s, e.errors[k]] as const)
            .filter(([s]) => common.has(s))
            .map(([, x]) => x)
        : e.errors;
    const s = [...xs].sort((a, b) => a - b);
    return Math.abs(s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2);
  };
  const best = Math.min(...have.map(medianOn));
  const first = have.find((m) => medianOn(m) <= best + RANKING_MARGIN) as MethodName;
  return [first, ...MODEL_METHODS.filter((m) => m !== first)];
}

/** The group whose measured errors apply to a salt: the d¹⁰ halides, its structure type, or all salts. */
function groupFor(structure: string | undefined, covalent: boolean): { group: GroupAccuracy | undefined; own: boolean } {
  const t = accuracyTable();
  if (covalent) return { group: t.get(COVALENT_GROUP), own: true };
  const g = structure ? t.get(structure) : undefined;
  if (g && Object.values(g.methods).some((e) => (e?.n ?? 0) >= MIN_REFERENCES)) return { group: g, own: true };
  return { group: t.get(ALL_IONIC), own: false };
}

/** The typical-error text of a model in the context of a salt's group. */
function modelError(method: MethodName, structure: string | undefined, covalent: boolean): string {
  const { group, own } = groupFor(structure, covalent);
  const phrase = errorPhrase(group?.methods[method]);
  const short = method.replace(' equation', '');
  if (!phrase) return `estimate: no salt of this kind with a Born–Haber value to measure the ${short} equation against`;
  if (covalent) return `estimate: for the ${COVALENT_GROUP} the ${short} equation ${phrase}`;
  if (own && structure) return `estimate: for the ${structure} type the ${short} equation ${phrase}`;
  const why = structure ? `too few salts of the ${structure} type have one` : 'no structure type is assigned';
  return `estimate: over ${ALL_IONIC} (${why}) the ${short} equation ${phrase}`;
}

function covalencyText(): string {
  const g = accuracyTable().get(COVALENT_GROUP);
  const meds = MODEL_METHODS.map((m) => g?.methods[m]?.median).filter((x): x is number => x !== undefined);
  const lo = Math.round(Math.abs(Math.max(...meds)) * 100);
  const hi = Math.round(Math.abs(Math.min(...meds)) * 100);
  return `covalent character (d¹⁰ cation, polarisable halide): like the silver halides, the purely ionic models run a median ${lo}–${hi} % low for the ${COVALENT_GROUP}; the Born–Haber value is the one to use`;
}

/** A model's error over all salts with a Born–Haber value, and for the d¹⁰ halides (the report's caption). */
function globalModelError(method: MethodName): string {
  const t = accuracyTable();
  const short = method.replace(' equation', '');
  const all = errorPhrase(t.get(ALL_IONIC)?.methods[method]);
  const d10 = t.get(COVALENT_GROUP)?.methods[method];
  return `estimate: over ${ALL_IONIC} the ${short} equation ${all ?? 'has no reference'}${d10 ? `; a median ${Math.round(Math.abs(d10.median) * 100)} % low for the ${COVALENT_GROUP}` : ''}`;
}

/** Typical error of each method over all salts with a Born–Haber value (computed on first read). */
export const TYPICAL_ERROR: Record<string, string> = {};
for (const method of Object.values(METHODS)) {
  Object.defineProperty(TYPICAL_ERROR, method, {
    enumerable: true,
    get: () => (method === METHODS.bornHaber ? BORN_HABER_ERROR : globalModelError(method)),
  });
}

/** Lattice energy of the formula's ionic solid, best value first; null for molecules and what cannot be read as one salt. */
export function estimateLattice(formula: Formula, _atoms: AtomCounts, charges: ChargeAssessment | null, settings: ChemSettings): LatticeAssessment | null {
  if (!charges || !charges.balanced || charges.basis !== 'ionic' || !charges.ions || formula.charge !== 0) return null;
  const ions = charges.ions.filter((i) => i.role !== 'neutral');
  const cations = ions.filter((i) => i.role === 'cation');
  const anions = ions.filter((i) => i.role === 'anion');
  if (cations.length !== 1 || anions.length !== 1) return null;
  const [c] = cations;
  const [a] = anions;
  if (c.kind === 'proton' || !Number.isInteger(c.charge) || !Number.isInteger(a.charge) || new Set(c.states).size > 1) return null;
  if (!Number.isInteger(c.count) || !Number.isInteger(a.count)) return null;
  const saltText = `${c.text}${c.count === 1 ? '' : c.count}${/[A-Z].*[A-Z0-9]/.test(a.text) && a.count > 1 ? `(${a.text})${a.count}` : `${a.text}${a.count === 1 ? '' : a.count}`}`;
  // Molecular substances have no ionic lattice (./molecular.ts).
  if (MOLECULAR_SUBSTANCES.has(saltText) || covalentByCharge(charges)) return null;

  const st = structureOf(saltText);
  const { methods, radiusSum } = latticeMethods(saltText, c, a, st);
  if (methods.length === 0) return null;
  const covalent = isCovalentHalide(c, a);
  const { group } = groupFor(st?.structure, covalent);
  const order: string[] = [METHODS.bornHaber, ...modelOrder(group)];
  const pref = settings.latticePreference;
  const wanted =
    pref === 'kapustinskii'
      ? METHODS.kapustinskii
      : pref === 'born-lande'
        ? METHODS.bornLande
        : pref === 'born-mayer'
          ? METHODS.bornMayer
          : pref === 'born-haber'
            ? METHODS.bornHaber
            : undefined;
  const head = methods.find((m) => m.method === wanted) ?? [...methods].sort((x, y) => order.indexOf(x.method) - order.indexOf(y.method))[0];
  // The others in a fixed order, so that cards list them alike.
  const fixed: string[] = [METHODS.bornHaber, ...MODEL_METHODS];
  const rest = methods.filter((m) => m !== head).sort((x, y) => fixed.indexOf(x.method) - fixed.indexOf(y.method));
  const covalency = covalent ? covalencyText() : undefined;
  const base = head.method === METHODS.bornHaber ? BORN_HABER_ERROR : modelError(head.method as MethodName, st?.structure, covalent);
  const mp = MELTING_POINT_C[saltText];
  return {
    kJPerMol: head.kJPerMol,
    method: head.method,
    inputs: head.inputs,
    alternatives: rest.map((m: Method) => ({ method: m.method, kJPerMol: m.kJPerMol })),
    estimate: head.estimate,
    typicalError: covalency ? `${base}; ${covalency}` : base,
    salt: saltText,
    chargeProduct: Math.abs(c.charge * a.charge),
    ...(radiusSum !== undefined ? { radiusSum } : {}),
    ...(group ? { accuracyGroup: group.group } : {}),
    ...(covalency ? { covalency } : {}),
    ...(mp !== undefined ? { meltingPointC: mp, meltingPointSource: SOURCES.meltingPoint } : {}),
  };
}
