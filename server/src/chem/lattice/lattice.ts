/**
 * Lattice energy of an ionic solid: the energy to separate one mole of it into gaseous ions (positive).
 * Every model value is an estimate and is labelled as one.
 *
 * - Kapustinskii equation: U = K ν |z₊ z₋| / r₀ · (1 − d / r₀), K = 1.2025 × 10⁻⁴ J m mol⁻¹
 *   (1202.5 kJ Å mol⁻¹), d = 0.345 Å, r₀ = r₊ + r₋ with Shannon six-coordinate radii, or thermochemical
 *   radii for polyatomic ions. Needs no structure.
 * - Born–Landé: U = N_A M z₊ z₋ e² / (4π ε₀ r₀) · (1 − 1/n), with the CRC Madelung constant M of the
 *   structure type and the Born exponent n averaged over the two ions (Pauling's values).
 * - Born–Mayer: the same with (1 − ρ/r₀), ρ = 0.345 Å, instead of (1 − 1/n).
 *   For both, r₀ is the sum of Shannon radii at the coordination numbers of the structure type.
 * - Born–Haber cycle: U = ΔatomH(M) + ΣIE + ΔatomH(X) − EA − ΔfH°(salt), from tabulated enthalpies
 *   (data/thermo.ts); an enthalpy at 298 K rather than a model, so the reference where data exist.
 *   Only for halides and hydrides: the second electron affinity of O²⁻ and S²⁻ cannot be measured.
 *
 * Constants: N_A e² / (4π ε₀) = 1389.35 kJ Å mol⁻¹ (CODATA 2018 values of e, ε₀, N_A).
 */
import type { ChargeAssessment, IonInReading } from '../charge/balance';
import { BORN_ROWS } from '../data/generated';
import { element } from '../data/elements';
import { shannonRadius } from '../data/radii';
import { structureOf, type StructureType } from '../data/structures';
import { ATOMISATION, ELECTRON_AFFINITY, FORMATION_SOLID, IONISATION, MELTING_POINT_C } from '../data/thermo';
import type { Formula } from '../formula/ast';
import type { AtomCounts } from '../formula/compute';
import type { ChemSettings } from '../settings';

export interface LatticeAlternative {
  method: string;
  kJPerMol: number;
}

export interface LatticeAssessment {
  kJPerMol: number;
  method: string;
  inputs: Record<string, unknown>;
  alternatives: LatticeAlternative[];
  /** True for the model-based methods; a Born–Haber value rests on measured enthalpies. */
  estimate: boolean;
  typicalError: string;
  /** Which salt the value is for (the anhydrous salt of a hydrate). */
  salt: string;
  meltingPointC?: number;
  meltingPointSource?: string;
  /** |z₊ z₋| of the salt's ions. */
  chargeProduct: number;
  /** r₊ + r₋ in Å with six-coordinate Shannon or thermochemical radii (as Kapustinskii uses), where both are known. */
  radiusSum?: number;
}

export const KAPUSTINSKII_K = 1202.5;
export const KAPUSTINSKII_D = 0.345;
export const COULOMB_KJ_A = 1389.35;
export const BORN_MAYER_RHO = 0.345;

export const METHODS = {
  kapustinskii: 'Kapustinskii equation',
  bornLande: 'Born–Landé equation',
  bornMayer: 'Born–Mayer equation',
  bornHaber: 'Born–Haber cycle',
} as const;

/**
 * Typical errors against the CRC lattice energy table (alkali halides, alkaline-earth oxides and fluorides,
 * silver halides), as measured by test/lattice.test.ts. The models are purely ionic: they run low, most of
 * all for salts with covalent character such as the silver halides.
 */
export const TYPICAL_ERROR: Record<string, string> = {
  [METHODS.kapustinskii]: 'estimate: median 6 % low, up to 9 % for alkali and alkaline-earth salts, ~25 % low for silver halides',
  [METHODS.bornLande]: 'estimate: median 5 % low, up to 8 % for alkali and alkaline-earth salts, ~25 % low for silver halides',
  [METHODS.bornMayer]: 'estimate: median 6 % low, up to 9 % for alkali and alkaline-earth salts, ~25 % low for silver halides',
  [METHODS.bornHaber]: 'about 1 % (lattice enthalpy at 298 K from tabulated enthalpies)',
};

interface Method {
  method: string;
  kJPerMol: number;
  inputs: Record<string, unknown>;
  estimate: boolean;
}

const NOBLE_N: Record<number, number> = {};
for (const [type, , n] of BORN_ROWS) {
  const z = { 'He-type': 2, 'Ne-type': 10, 'Ar-type': 18, 'Kr-type': 36, 'Xe-type': 54 }[type];
  if (z) NOBLE_N[z] = n;
}
/** d¹⁰ ions take the exponent of Cu⁺ (Ar type), Ag⁺ (Kr type) and Au⁺ (Xe type), as the CRC table groups them. */
const D10_N: Record<number, number> = { 28: NOBLE_N[18], 46: NOBLE_N[36], 78: NOBLE_N[54] };

/** Born exponent of a monatomic ion from its electron count, or undefined. */
export function bornExponent(symbol: string, charge: number): number | undefined {
  const e = element(symbol);
  if (!e) return undefined;
  const electrons = e.z - charge;
  return NOBLE_N[electrons] ?? D10_N[electrons];
}

interface IonRadius {
  radius: number;
  source: string;
  coordination?: string;
  fromMemory?: boolean;
}

function radiusOf(ion: IonInReading, cn: number): IonRadius | undefined {
  if (ion.element && Number.isInteger(ion.charge)) {
    const r = shannonRadius(ion.element, ion.charge, cn);
    if (r) return { radius: r.ionicRadius, source: 'Shannon (1976) ionic radius', coordination: r.coordinationLabel + (r.spin ? ` ${r.spin}` : '') };
    return undefined;
  }
  if (ion.radius !== undefined) return { radius: ion.radius, source: 'thermochemical radius (Jenkins et al.)', fromMemory: ion.radiusFromMemory };
  return undefined;
}

const round2 = (x: number) => Math.round(x * 100) / 100;

export function kapustinskii(nu: number, zc: number, za: number, rc: number, ra: number): number {
  const r0 = rc + ra;
  return (KAPUSTINSKII_K * nu * Math.abs(zc * za)) / r0 * (1 - KAPUSTINSKII_D / r0);
}

export function bornLande(madelung: number, zc: number, za: number, r0: number, n: number): number {
  return (COULOMB_KJ_A * madelung * Math.abs(zc * za)) / r0 * (1 - 1 / n);
}

export function bornMayer(madelung: number, zc: number, za: number, r0: number): number {
  return (COULOMB_KJ_A * madelung * Math.abs(zc * za)) / r0 * (1 - BORN_MAYER_RHO / r0);
}

/** Born–Haber lattice enthalpy of MₐXᵦ (halides and hydrides) from tabulated enthalpies, or undefined. */
export function bornHaber(salt: string, metal: string, m: number, zc: number, anion: string, x: number): { kJPerMol: number; inputs: Record<string, unknown> } | undefined {
  const dfH = FORMATION_SOLID[salt];
  const atomM = ATOMISATION[metal];
  const ies = IONISATION[metal];
  const atomX = ATOMISATION[anion];
  const ea = ELECTRON_AFFINITY[anion];
  if (dfH === undefined || atomM === undefined || !ies || ies.length < zc || atomX === undefined || ea === undefined) return undefined;
  const ie = ies.slice(0, zc).reduce((a, b) => a + b, 0);
  const u = m * (atomM + ie) + x * (atomX - ea) - dfH;
  return {
    kJPerMol: u,
    inputs: { formationEnthalpy: dfH, atomisationMetal: atomM, ionisationEnergies: ies.slice(0, zc), atomisationAnion: atomX, electronAffinity: ea, cations: m, anions: x, source: 'NBS/CRC thermochemical tables (values recalled, not checked against the book)' },
  };
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
  const nu = c.count + a.count;
  const methods: Method[] = [];

  const rc6 = radiusOf(c, 6);
  const ra6 = radiusOf(a, 6);
  if (rc6 && ra6) {
    methods.push({
      method: METHODS.kapustinskii,
      kJPerMol: kapustinskii(nu, c.charge, a.charge, rc6.radius, ra6.radius),
      estimate: true,
      inputs: {
        charges: { cation: c.charge, anion: a.charge }, nu,
        radii: { cation: rc6.radius, anion: ra6.radius }, radiusSources: { cation: `${rc6.source}${rc6.coordination ? `, ${rc6.coordination}` : ''}`, anion: `${ra6.source}${ra6.coordination ? `, ${ra6.coordination}` : ''}${ra6.fromMemory ? ' (value from memory)' : ''}` },
        r0: round2(rc6.radius + ra6.radius), K: KAPUSTINSKII_K, d: KAPUSTINSKII_D,
      },
    });
  }
  const st: StructureType | undefined = structureOf(saltText);
  if (st && c.element && a.element) {
    const rc = radiusOf(c, st.cationCN);
    const ra = radiusOf(a, st.anionCN);
    if (rc && ra) {
      const r0 = rc.radius + ra.radius;
      const common = { charges: { cation: c.charge, anion: a.charge }, structure: st.structure, madelung: st.madelung, r0: round2(r0), radii: { cation: rc.radius, anion: ra.radius }, coordination: { cation: rc.coordination, anion: ra.coordination }, ...(st.note ? { note: st.note } : {}) };
      const nc = bornExponent(c.element, c.charge);
      const na = bornExponent(a.element, a.charge);
      methods.push({ method: METHODS.bornMayer, kJPerMol: bornMayer(st.madelung, c.charge, a.charge, r0), estimate: true, inputs: { ...common, rho: BORN_MAYER_RHO } });
      if (nc !== undefined && na !== undefined) {
        const n = (nc + na) / 2;
        methods.push({ method: METHODS.bornLande, kJPerMol: bornLande(st.madelung, c.charge, a.charge, r0, n), estimate: true, inputs: { ...common, bornExponent: n, bornExponents: { cation: nc, anion: na } } });
      }
    }
  }
  if (c.element && a.element) {
    const bh = bornHaber(saltText, c.element, c.count, c.charge, a.element, a.count);
    if (bh) methods.push({ method: METHODS.bornHaber, kJPerMol: bh.kJPerMol, estimate: false, inputs: bh.inputs });
  }
  const finite = methods.filter((m) => Number.isFinite(m.kJPerMol) && m.kJPerMol > 0);
  if (finite.length === 0) return null;
  const rank = (m: Method) => {
    const pref = settings.latticePreference;
    const wanted = pref === 'kapustinskii' ? METHODS.kapustinskii : pref === 'born-lande' ? METHODS.bornLande : pref === 'born-mayer' ? METHODS.bornMayer : pref === 'born-haber' ? METHODS.bornHaber : undefined;
    if (wanted && m.method === wanted) return -1;
    return [METHODS.bornHaber, METHODS.bornMayer, METHODS.bornLande, METHODS.kapustinskii].indexOf(m.method as never);
  };
  finite.sort((x, y) => rank(x) - rank(y));
  const [best, ...rest] = finite;
  const mp = MELTING_POINT_C[saltText];
  return {
    kJPerMol: best.kJPerMol,
    method: best.method,
    inputs: best.inputs,
    alternatives: rest.map((m) => ({ method: m.method, kJPerMol: m.kJPerMol })),
    estimate: best.estimate,
    typicalError: TYPICAL_ERROR[best.method],
    salt: saltText,
    chargeProduct: Math.abs(c.charge * a.charge),
    ...(rc6 && ra6 ? { radiusSum: round2(rc6.radius + ra6.radius) } : {}),
    ...(mp !== undefined ? { meltingPointC: mp, meltingPointSource: 'CRC Handbook (value recalled, not checked against the book)' } : {}),
  };
}
