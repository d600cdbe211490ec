/**
 * The species universe of the solution model, built once from the tables: every species and solid
 * resolved to the components (the tableau's basis: H⁺, the free metal ions, the anions of strong acids,
 * the basis form of each acid–base system), with its log K at I = 0 and 25 °C and what is needed to take
 * it to another temperature.
 *
 * A constant measured at I = 0.1 M (EDTA and citrate rows) is brought to I = 0 here with the Davies
 * equation at 25 °C, the same equation the solver applies, so that the model gives back the measured
 * constant at 0.1 M.
 */
import { daviesLogGamma, debyeHuckelA, vantHoff } from './activity';
import { ACID_SYSTEMS, WATER, type AcidSystem } from './tables/acids';
import { COMPLEXES } from './tables/complexes';
import { METAL_IONS, PROTON, STRONG_ANIONS, type FreeIon } from './tables/ions';
import { SOLIDS, type SolidRow } from './tables/solids';
import { citation, type Sourced } from './tables/sources';
import { formulaDisplay } from './labels';

/** A temperature-dependent log K: L0 + vantHoff(L1, H1, T); `partial` where some term has no ΔH°. */
export interface LogK {
  /** Terms without a tabulated enthalpy (used at 25 °C). */
  fixed: number;
  /** Terms with one: their log K at 25 °C and their ΔH° sum, kJ/mol. */
  withH: number;
  dH: number;
  /** Some nonzero term has no ΔH°: the constant is (partly) the 25 °C value at other temperatures. */
  partial: boolean;
}

export const logKAt = (k: LogK, T: number) => k.fixed + (k.dH === 0 ? k.withH : vantHoff(k.withH, k.dH, T));

const NO_K: LogK = { fixed: 0, withH: 0, dH: 0, partial: false };

function sumK(parts: Array<[LogK, number]>): LogK {
  const out = { fixed: 0, withH: 0, dH: 0, partial: false };
  for (const [k, w] of parts) {
    out.fixed += w * k.fixed;
    out.withH += w * k.withH;
    out.dH += w * k.dH;
    out.partial ||= k.partial && w !== 0;
  }
  return out;
}

const constant = (logK: number, dH: number | null | undefined): LogK =>
  dH === null || dH === undefined ? { fixed: logK, withH: 0, dH: 0, partial: logK !== 0 } : { fixed: 0, withH: logK, dH, partial: false };

export type SpeciesKind = 'component' | 'acid' | 'water' | 'complex';

export interface ModelSpecies {
  label: string;
  charge: number;
  /** Component labels and their coefficients (H⁺ included where it takes part). */
  stoich: ReadonlyMap<string, number>;
  k: LogK;
  kind: SpeciesKind;
  /** The acid–base system of an acid form or a basis. */
  system?: AcidSystem;
  name?: string;
  source?: Sourced;
}

export interface ModelSolid {
  row: SolidRow;
  /** The formula in Unicode, and the row's citation. */
  display: string;
  citation: string;
  /** Dissolution into components; log K of the dissolution written in them. */
  stoich: ReadonlyMap<string, number>;
  k: LogK;
}

/** The components the tables know (H⁺ first), by label. */
export const COMPONENTS = new Map<string, FreeIon & { system?: AcidSystem }>();
/** Every species by label (components included, as themselves). */
export const SPECIES = new Map<string, ModelSpecies>();

const A25 = debyeHuckelA(25);

function addComponent(ion: FreeIon, system?: AcidSystem) {
  COMPONENTS.set(ion.label, system ? { ...ion, system } : ion);
  SPECIES.set(ion.label, {
    label: ion.label,
    charge: ion.charge,
    stoich: new Map([[ion.label, 1]]),
    k: NO_K,
    kind: 'component',
    name: ion.name,
    ...(system ? { system } : {}),
  });
}

addComponent(PROTON);
for (const ion of [...METAL_IONS, ...STRONG_ANIONS]) addComponent(ion);

// Water: OH⁻ = H2O − H⁺, log K = −pKw.
SPECIES.set('OH^-', {
  label: 'OH^-',
  charge: -1,
  stoich: new Map([[PROTON.label, -1]]),
  k: constant(-WATER.pKw, WATER.dH),
  kind: 'water',
  name: 'hydroxide',
  source: WATER,
});

/** pKa at I = 0 of a system's steps (the measured ones brought to I = 0 where they were not). */
function thermodynamicPKa(s: AcidSystem): number[] {
  const I = s.ionicStrength ?? 0;
  const n = s.forms.length;
  return s.pKa.map((pK, step) => {
    if (!I) return pK;
    // Step `step`: forms[step] → H⁺ + forms[step+1]; the basis charge plus protons gives each form's charge.
    const zHA = s.charge + (n - 1 - step);
    const zA = zHA - 1;
    return pK - daviesLogGamma(1, I, A25) - daviesLogGamma(zA, I, A25) + daviesLogGamma(zHA, I, A25);
  });
}

for (const s of ACID_SYSTEMS) {
  const basis = s.forms[s.forms.length - 1];
  addComponent({ label: basis.label, formula: basis.formula ?? basis.label, charge: s.charge, name: basis.name }, s);
  const pKa = thermodynamicPKa(s);
  const n = s.forms.length;
  for (let f = 0; f < n - 1; f++) {
    const form = s.forms[f];
    // forms[f] = basis + h H⁺: the steps f … n−2, each a protonation with log K = pKa and ΔH = −ΔH(dissociation).
    const parts: Array<[LogK, number]> = [];
    for (let step = f; step < n - 1; step++) {
      const dH = s.dH?.[step];
      parts.push([constant(pKa[step], dH === null || dH === undefined ? null : -dH), 1]);
    }
    SPECIES.set(form.label, {
      label: form.label,
      charge: s.charge + form.h,
      stoich: new Map([
        [basis.label, 1],
        [PROTON.label, form.h],
      ]),
      k: sumK(parts),
      kind: 'acid',
      system: s,
      name: form.name,
      source: s,
    });
  }
}

/** Charge of a label written with a caret (`Fe(OH)2^+` → +1, `CaSO4(aq)` → 0). */
export function labelCharge(label: string): number {
  const m = /\^(\d*)([+-])$/.exec(label);
  if (!m) return 0;
  return (m[1] ? Number(m[1]) : 1) * (m[2] === '+' ? 1 : -1);
}

/** A reaction over species of the model, resolved to components: stoichiometry and log K. */
function resolve(from: Readonly<Record<string, number>>, what: string): { stoich: Map<string, number>; k: LogK; charge: number } {
  const stoich = new Map<string, number>();
  const parts: Array<[LogK, number]> = [];
  let charge = 0;
  for (const [label, nu] of Object.entries(from)) {
    const sp = SPECIES.get(label);
    if (!sp) throw new Error(`solution tables: ${what} uses ${label}, which is not a species of the model`);
    parts.push([sp.k, nu]);
    charge += nu * sp.charge;
    for (const [c, a] of sp.stoich) {
      const v = (stoich.get(c) ?? 0) + nu * a;
      if (v === 0) stoich.delete(c);
      else stoich.set(c, v);
    }
  }
  return { stoich, k: sumK(parts), charge };
}

for (const row of COMPLEXES) {
  const r = resolve(row.from, row.label);
  let logK = row.logK;
  if (row.ionicStrength) {
    // log β(I=0) = log β(I) + log γ(complex) − Σ ν log γ(reactants), all at the row's I.
    let g = daviesLogGamma(r.charge, row.ionicStrength, A25);
    for (const [label, nu] of Object.entries(row.from)) g -= nu * daviesLogGamma((SPECIES.get(label) as ModelSpecies).charge, row.ionicStrength, A25);
    logK += g;
  }
  SPECIES.set(row.label, {
    label: row.label,
    charge: r.charge,
    stoich: r.stoich,
    k: sumK([
      [r.k, 1],
      [constant(logK, row.dH), 1],
    ]),
    kind: 'complex',
    source: row,
  });
}

/** The solids, resolved: log K of dissolution into components = log Ksp − Σ ν log K(species formed). */
export const MODEL_SOLIDS: readonly ModelSolid[] = SOLIDS.map((row) => {
  const r = resolve(row.into, row.formula);
  if (r.charge !== 0) throw new Error(`solution tables: ${row.formula} dissolves into a net charge ${r.charge}`);
  return {
    row,
    display: formulaDisplay(row.formula),
    citation: citation(row),
    stoich: r.stoich,
    k: sumK([
      [constant(row.logKsp, row.dH), 1],
      [r.k, -1],
    ]),
  };
});

/** The labels of the species that are not components, in table order. */
export const FORMED_SPECIES: readonly ModelSpecies[] = [...SPECIES.values()].filter((s) => s.kind !== 'component');
