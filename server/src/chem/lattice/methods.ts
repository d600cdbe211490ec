/**
 * The lattice-energy methods, one function each, and the set of them for one binary salt. Every model value
 * is an estimate; the Born–Haber cycle is a lattice enthalpy from tabulated enthalpies.
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
import { BORN_ROWS } from '../data/generated';
import { element } from '../data/elements';
import { shannonRadius } from '../data/radii';
import type { StructureType } from '../data/structures';
import { ATOMISATION, ATOMISATION_SOURCE, ELECTRON_AFFINITY, FORMATION_SOLID, IONISATION, SOURCES } from '../data/thermo';

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

export type MethodName = (typeof METHODS)[keyof typeof METHODS];
export const MODEL_METHODS: readonly MethodName[] = [METHODS.bornMayer, METHODS.bornLande, METHODS.kapustinskii];

export interface Method {
  method: MethodName;
  kJPerMol: number;
  inputs: Record<string, unknown>;
  estimate: boolean;
}

/** What the methods need of an ion: its element (monatomic ions), charge, count, or a thermochemical radius. */
export interface LatticeIon {
  text: string;
  element?: string;
  charge: number;
  count: number;
  radius?: number;
  radiusFromMemory?: boolean;
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

function radiusOf(ion: LatticeIon, cn: number): IonRadius | undefined {
  if (ion.element && Number.isInteger(ion.charge)) {
    const r = shannonRadius(ion.element, ion.charge, cn);
    if (r) return { radius: r.ionicRadius, source: 'Shannon (1976) ionic radius', coordination: r.coordinationLabel + (r.spin ? ` ${r.spin}` : '') };
    return undefined;
  }
  if (ion.radius !== undefined) return { radius: ion.radius, source: 'thermochemical radius (Jenkins et al.)', fromMemory: ion.radiusFromMemory };
  return undefined;
}

export const round2 = (x: number) => Math.round(x * 100) / 100;

export function kapustinskii(nu: number, zc: number, za: number, rc: number, ra: number): number {
  const r0 = rc + ra;
  return ((KAPUSTINSKII_K * nu * Math.abs(zc * za)) / r0) * (1 - KAPUSTINSKII_D / r0);
}

export function bornLande(madelung: number, zc: number, za: number, r0: number, n: number): number {
  return ((COULOMB_KJ_A * madelung * Math.abs(zc * za)) / r0) * (1 - 1 / n);
}

export function bornMayer(madelung: number, zc: number, za: number, r0: number): number {
  return ((COULOMB_KJ_A * madelung * Math.abs(zc * za)) / r0) * (1 - BORN_MAYER_RHO / r0);
}

const atomisationLabel = (el: string) => (ATOMISATION_SOURCE[el]?.source === 'CODATA' ? SOURCES.atomisationCodata : SOURCES.atomisationNbs);

/** Born–Haber lattice enthalpy of MₐXᵦ (halides and hydrides) from tabulated enthalpies, or undefined. */
export function bornHaber(
  salt: string,
  metal: string,
  m: number,
  zc: number,
  anion: string,
  x: number,
): { kJPerMol: number; inputs: Record<string, unknown> } | undefined {
  const dfH = FORMATION_SOLID[salt];
  const atomM = ATOMISATION[metal];
  const ies = IONISATION[metal];
  const atomX = ATOMISATION[anion];
  const ea = ELECTRON_AFFINITY[anion];
  if (dfH === undefined || atomM === undefined || !ies || ies.length < zc || atomX === undefined || ea === undefined) return undefined;
  const used = ies.slice(0, zc);
  const ie = used.reduce((a, b) => a + b, 0);
  const u = m * (atomM + ie) + x * (atomX - ea) - dfH;
  const r1 = (v: number) => Math.round(v * 10) / 10;
  return {
    kJPerMol: u,
    inputs: {
      formationEnthalpy: dfH,
      atomisationMetal: atomM,
      ionisationEnergies: used.map(r1),
      atomisationAnion: atomX,
      electronAffinity: r1(ea),
      cations: m,
      anions: x,
      source: `ΔfH°: ${SOURCES.formation}; ΔatomH: ${atomisationLabel(metal)} (${metal}), ${atomisationLabel(anion)} (${anion}); IE: ${SOURCES.ionisation}; EA: ${SOURCES.affinity}`,
    },
  };
}

/** Every method that applies to the salt of one cation and one anion, in no particular order. */
export function latticeMethods(saltText: string, c: LatticeIon, a: LatticeIon, st: StructureType | undefined): { methods: Method[]; radiusSum?: number } {
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
        charges: { cation: c.charge, anion: a.charge },
        nu,
        radii: { cation: rc6.radius, anion: ra6.radius },
        radiusSources: {
          cation: `${rc6.source}${rc6.coordination ? `, ${rc6.coordination}` : ''}`,
          anion: `${ra6.source}${ra6.coordination ? `, ${ra6.coordination}` : ''}${ra6.fromMemory ? ' (value from memory)' : ''}`,
        },
        r0: round2(rc6.radius + ra6.radius),
        K: KAPUSTINSKII_K,
        d: KAPUSTINSKII_D,
      },
    });
  }
  if (st && c.element && a.element) {
    const rc = radiusOf(c, st.cationCN);
    const ra = radiusOf(a, st.anionCN);
    if (rc && ra) {
      const r0 = rc.radius + ra.radius;
      const common = {
        charges: { cation: c.charge, anion: a.charge },
        structure: st.structure,
        madelung: st.madelung,
        r0: round2(r0),
        radii: { cation: rc.radius, anion: ra.radius },
        coordination: { cation: rc.coordination, anion: ra.coordination },
        ...(st.note ? { note: st.note } : {}),
      };
      const nc = bornExponent(c.element, c.charge);
      const na = bornExponent(a.element, a.charge);
      methods.push({
        method: METHODS.bornMayer,
        kJPerMol: bornMayer(st.madelung, c.charge, a.charge, r0),
        estimate: true,
        inputs: { ...common, rho: BORN_MAYER_RHO },
      });
      if (nc !== undefined && na !== undefined) {
        const n = (nc + na) / 2;
        methods.push({
          method: METHODS.bornLande,
          kJPerMol: bornLande(st.madelung, c.charge, a.charge, r0, n),
          estimate: true,
          inputs: { ...common, bornExponent: n, bornExponents: { cation: nc, anion: na } },
        });
      }
    }
  }
  if (c.element && a.element) {
    const bh = bornHaber(saltText, c.element, c.count, c.charge, a.element, a.count);
    if (bh) methods.push({ method: METHODS.bornHaber, kJPerMol: bh.kJPerMol, estimate: false, inputs: bh.inputs });
  }
  return {
    methods: methods.filter((m) => Number.isFinite(m.kJPerMol) && m.kJPerMol > 0),
    ...(rc6 && ra6 ? { radiusSum: round2(rc6.radius + ra6.radius) } : {}),
  };
}

/**
 * Salts of a d¹⁰ coinage-metal cation (Cu⁺, Ag⁺, Au⁺) with chloride, bromide or iodide: the textbook case of
 * covalent character in a "salt" (polarisable anion, polarising d¹⁰ cation; Fajans' rules), for which the
 * purely ionic models run well below the Born–Haber value.
 */
export function isCovalentHalide(c: LatticeIon, a: LatticeIon): boolean {
  return !!c.element && !!a.element && c.charge === 1 && ['Cu', 'Ag', 'Au'].includes(c.element) && ['Cl', 'Br', 'I'].includes(a.element);
}
