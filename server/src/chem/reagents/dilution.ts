/**
 * Dilution from a stock: c₁V₁ = c₂V₂. The stock volume to take is V₁ = c₂V₂ / c₁, with both
 * concentrations in one kind of unit (molar, mass per volume, normality of the same substance, % v/v),
 * or molar against mass per volume with the molar mass. The stock may be a reagent bottle
 * (`NiSO4 0.1 M from 1.5 M`) or another batch of the same document (its concentration, from its analysis).
 */
import { finding, type ReagentFinding } from './findings';

type ConcKind = 'molar' | 'massPerVolume' | 'normal' | 'volumePercent';

/** Concentration units a dilution reads, to their kind's base (mol/L, g/L, eq/L, % v/v). */
const CONC_UNITS: Record<string, { kind: ConcKind; factor: number }> = {
  M: { kind: 'molar', factor: 1 },
  'mol/L': { kind: 'molar', factor: 1 },
  mM: { kind: 'molar', factor: 1e-3 },
  'mmol/L': { kind: 'molar', factor: 1e-3 },
  µM: { kind: 'molar', factor: 1e-6 },
  uM: { kind: 'molar', factor: 1e-6 },
  'g/L': { kind: 'massPerVolume', factor: 1 },
  'mg/mL': { kind: 'massPerVolume', factor: 1 },
  'mg/L': { kind: 'massPerVolume', factor: 1e-3 },
  'µg/mL': { kind: 'massPerVolume', factor: 1e-3 },
  '%w/v': { kind: 'massPerVolume', factor: 10 },
  N: { kind: 'normal', factor: 1 },
  mN: { kind: 'normal', factor: 1e-3 },
  '%v/v': { kind: 'volumePercent', factor: 1 },
};

export interface Concentration {
  value: number;
  unit: string;
}

export interface Dilution {
  /** Volume of stock to take, mL. */
  stockVolumeML: number;
  /** Stock : final, e.g. 15 for a 1:15 dilution (final volume over stock volume). */
  factor: number;
  /** The solvent to add up to the mark, mL: an estimate (volumes are not strictly additive). */
  solventVolumeML: number;
  /** Amount of the substance taken (mol), where the concentrations are molar or convertible. */
  moles?: number;
  basis: string;
  findings: ReagentFinding[];
}

/**
 * The stock volume for a target concentration in `finalVolumeL` (`NiSO4 0.1 M from 1.5 M` in a 1 L batch:
 * 66.7 mL of stock). `molarMass` converts between molar and mass-per-volume units.
 */
export function dilution(target: Concentration, stock: Concentration, finalVolumeL: number, molarMass?: number): Dilution | { findings: ReagentFinding[] } {
  const fail = (message: string) => ({ findings: [finding('dilution-impossible', 'error', message)] });
  const t = CONC_UNITS[target.unit];
  const s = CONC_UNITS[stock.unit];
  if (!t || !s) return fail(`A dilution needs concentrations in M, mM, g/L, mg/L, %w/v, N or %v/v (got ${!t ? target.unit : stock.unit}).`);
  if (!(finalVolumeL > 0)) return fail('A dilution needs the final volume (`volume: 1 L`).');
  if (!(stock.value > 0)) return fail('The stock concentration must be more than zero.');
  if (!(target.value >= 0)) return fail('The target concentration must be zero or more.');
  let tBase = target.value * t.factor;
  let sBase = stock.value * s.factor;
  let kind = t.kind;
  if (t.kind !== s.kind) {
    const pair = new Set([t.kind, s.kind]);
    if (pair.size === 2 && pair.has('molar') && pair.has('massPerVolume') && molarMass) {
      // Convert both to mol/L.
      if (t.kind === 'massPerVolume') tBase /= molarMass;
      if (s.kind === 'massPerVolume') sBase /= molarMass;
      kind = 'molar';
    } else
      return fail(
        `A ${target.unit} target cannot be made from a ${stock.unit} stock${pair.has('molar') && pair.has('massPerVolume') ? ' without the molar mass' : ''}.`,
      );
  }
  if (tBase > sBase * (1 + 1e-12))
    return fail(`The target (${target.value} ${target.unit}) is stronger than the stock (${stock.value} ${stock.unit}): a dilution cannot make it.`);
  const stockL = (tBase * finalVolumeL) / sBase;
  const stockVolumeML = stockL * 1000;
  const factor = tBase > 0 ? sBase / tBase : Infinity;
  const findings: ReagentFinding[] = [];
  if (stockVolumeML < 0.1 && stockVolumeML > 0)
    findings.push(finding('measuring-precision', 'warning', `${stockVolumeML.toPrecision(3)} mL of stock is too little to measure well: dilute in two steps.`));
  const moles = kind === 'molar' ? tBase * finalVolumeL : kind === 'massPerVolume' && molarMass ? (tBase * finalVolumeL) / molarMass : undefined;
  const r: Dilution = {
    stockVolumeML,
    factor,
    solventVolumeML: Math.max(0, finalVolumeL * 1000 - stockVolumeML),
    basis: `V₁ = c₂V₂/c₁ = ${target.value} ${target.unit} × ${finalVolumeL * 1000} mL ÷ ${stock.value} ${stock.unit} = ${Number(stockVolumeML.toPrecision(4))} mL`,
    findings,
  };
  if (moles !== undefined) r.moles = moles;
  return r;
}
