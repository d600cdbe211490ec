/**
 * Scaling a batch: every amount (g, mol, mL) multiplied by new size / old size, every concentration
 * (M, g/L, %, ppm, N, mol/kg, wt%) left as it is, so the batch made at the new size has the same
 * composition. Then each mass and volume is rounded to what the bench can weigh or measure.
 *
 * The rounding rule (common practice; balance classes as sold, USP <41> for the minimum weight idea):
 * - masses to 4 significant figures, but never finer than the readability d of the smallest balance
 *   class whose capacity takes the mass: analytical (≤ 220 g, d = 0.1 mg), precision (≤ 6.2 kg,
 *   d = 0.01 g), bench scale (≤ 60 kg, d = 1 g), floor scale (≤ 1500 kg, d = 100 g);
 * - volumes to 3 significant figures, never finer than the vessel that measures them: micropipette
 *   (≤ 1 mL, 1 µL), graduated pipette (≤ 10 mL, 0.01 mL), burette or measuring cylinder (≤ 100 mL,
 *   0.5 mL), measuring cylinder (≤ 1 L, 5 mL), graduated vessel (≤ 10 L, 50 mL), tank gauge (0.5 L);
 * - an amount of fewer than 200 d (its last digit more than 0.5 % of it) is flagged: weigh it on a finer
 *   balance or take it from a stock solution.
 */
import { finding, type ReagentFinding } from './findings';

export interface Measure {
  name: string;
  /** Largest amount it takes (g or mL). */
  capacity: number;
  /** Smallest step it reads (g or mL). */
  readability: number;
}

export const BALANCES: readonly Measure[] = [
  { name: 'analytical balance', capacity: 220, readability: 1e-4 },
  { name: 'precision balance', capacity: 6200, readability: 1e-2 },
  { name: 'bench scale', capacity: 60_000, readability: 1 },
  { name: 'floor scale', capacity: 1_500_000, readability: 100 },
];

export const VOLUME_MEASURES: readonly Measure[] = [
  { name: 'micropipette', capacity: 1, readability: 1e-3 },
  { name: 'graduated pipette', capacity: 10, readability: 1e-2 },
  { name: 'burette or 100 mL cylinder', capacity: 100, readability: 0.5 },
  { name: '1 L measuring cylinder', capacity: 1000, readability: 5 },
  { name: 'graduated vessel', capacity: 10_000, readability: 50 },
  { name: 'tank gauge', capacity: Infinity, readability: 500 },
];

export interface Rounded {
  /** The rounded amount (g or mL). */
  value: number;
  /** As written, in a convenient unit: `12.35 g`, `1.250 kg`, `0.0123 g`, `66.7 mL`. */
  text: string;
  measure: Measure;
  /** The step it was rounded to (g or mL). */
  step: number;
  findings: ReagentFinding[];
}

const MASS_UNITS: Array<[string, number]> = [
  ['kg', 1000],
  ['g', 1],
  ['mg', 1e-3],
];
const VOLUME_UNITS: Array<[string, number]> = [
  ['L', 1000],
  ['mL', 1],
  ['µL', 1e-3],
];

function roundTo(x: number, sig: number, measures: readonly Measure[], units: Array<[string, number]>, what: string): Rounded {
  const measure = measures.find((m) => x <= m.capacity) ?? measures[measures.length - 1];
  if (!(x > 0)) return { value: 0, text: `0 ${units[1][0]}`, measure, step: measure.readability, findings: [] };
  const sigStep = 10 ** (Math.floor(Math.log10(x)) - sig + 1);
  const step = Math.max(sigStep, measure.readability);
  const value = Math.round(x / step) * step;
  // Write it in the largest unit that keeps the value at 1 or more, with the digits the step allows.
  const [unit, f] = units.find(([, uf]) => value >= uf) ?? units[units.length - 1];
  const decimals = Math.max(0, Math.min(10, -Math.floor(Math.log10(step / f) + 1e-9)));
  const text = `${(value / f).toFixed(decimals)} ${unit}`;
  const findings: ReagentFinding[] = [];
  if (x < 200 * measure.readability)
    findings.push(
      finding(
        'measuring-precision',
        'warning',
        `${text} is under 200 steps of the ${measure.name} (${measure.readability} ${units[1][0]}): its last digit is more than 0.5 % of the amount; ${what === 'mass' ? 'weigh it on a finer balance or take it from a stock solution' : 'measure it with a finer vessel or dilute the stock first'}.`,
      ),
    );
  return { value, text, measure, step, findings };
}

/** A mass to weigh, rounded to 4 significant figures and the balance that takes it. */
export const roundMass = (grams: number): Rounded => roundTo(grams, 4, BALANCES, MASS_UNITS, 'mass');

/** A volume to measure, rounded to 3 significant figures and the vessel that takes it. */
export const roundVolume = (mL: number): Rounded => roundTo(mL, 3, VOLUME_MEASURES, VOLUME_UNITS, 'volume');

/** Units scaled with the batch (amounts) and their kind; every other unit is a concentration, kept. */
const EXTENSIVE: Record<string, { kind: 'mass' | 'amount' | 'volume'; factor: number }> = {
  kg: { kind: 'mass', factor: 1000 },
  g: { kind: 'mass', factor: 1 },
  mg: { kind: 'mass', factor: 1e-3 },
  µg: { kind: 'mass', factor: 1e-6 },
  ug: { kind: 'mass', factor: 1e-6 },
  mol: { kind: 'amount', factor: 1 },
  mmol: { kind: 'amount', factor: 1e-3 },
  µmol: { kind: 'amount', factor: 1e-6 },
  umol: { kind: 'amount', factor: 1e-6 },
  L: { kind: 'volume', factor: 1000 },
  l: { kind: 'volume', factor: 1000 },
  mL: { kind: 'volume', factor: 1 },
  ml: { kind: 'volume', factor: 1 },
  µL: { kind: 'volume', factor: 1e-3 },
  uL: { kind: 'volume', factor: 1e-3 },
};

export interface ScaleLine {
  /** Whatever the caller identifies the line by (its index, its offset). */
  key: string | number;
  value: number;
  unit: string;
  /** The computed mass to weigh (g) or volume to pour (mL) of a concentration line, to round at the new size. */
  computedMassG?: number;
  computedVolumeML?: number;
}

export interface ScaledLine {
  key: string | number;
  /** `scaled` (an amount), `kept` (a concentration). */
  how: 'scaled' | 'kept';
  value: number;
  unit: string;
  /** The amount written for the bench: rounded as the header says. Absent for a kept concentration with nothing computed. */
  rounded?: Rounded;
}

export interface BatchSize {
  volumeL?: number;
  totalMassG?: number;
}

export interface Scaled {
  factor: number;
  lines: ScaledLine[];
  findings: ReagentFinding[];
}

/**
 * Scale a batch from one size to another (final volume or total mass: the same kind both sides). Amounts
 * scale, concentrations stay; what is weighed or poured is rounded for the bench.
 */
export function scaleBatch(lines: readonly ScaleLine[], from: BatchSize, to: BatchSize): Scaled | { findings: ReagentFinding[] } {
  let factor: number | undefined;
  if (from.volumeL && to.volumeL) factor = to.volumeL / from.volumeL;
  else if (from.totalMassG && to.totalMassG) factor = to.totalMassG / from.totalMassG;
  if (!factor || !Number.isFinite(factor) || factor <= 0)
    return { findings: [finding('basis-missing', 'error', 'Scaling needs the old and the new size, both as a final volume or both as a total mass.')] };
  const findings: ReagentFinding[] = [];
  const out = lines.map((l): ScaledLine => {
    const ext = EXTENSIVE[l.unit];
    if (ext) {
      const base = l.value * ext.factor * factor;
      const rounded = ext.kind === 'mass' ? roundMass(base) : ext.kind === 'volume' ? roundVolume(base) : undefined;
      if (rounded) findings.push(...rounded.findings);
      const value = ext.kind === 'amount' ? Number((l.value * factor).toPrecision(4)) : (rounded?.value ?? base) / ext.factor;
      const r: ScaledLine = { key: l.key, how: 'scaled', value, unit: l.unit };
      if (rounded) r.rounded = rounded;
      return r;
    }
    const r: ScaledLine = { key: l.key, how: 'kept', value: l.value, unit: l.unit };
    if (l.computedMassG !== undefined) r.rounded = roundMass(l.computedMassG * factor);
    else if (l.computedVolumeML !== undefined) r.rounded = roundVolume(l.computedVolumeML * factor);
    if (r.rounded) findings.push(...r.rounded.findings);
    return r;
  });
  return { factor, lines: out, findings };
}
