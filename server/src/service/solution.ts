/**
 * How a batch's equilibrium is written for people, once for every output (hover, tables, plain text,
 * preview, report): the pH line, the major species, the solids near or over saturation, the limits of the
 * model in one line, a solved `to pH` line and a designed buffer. The numbers come from the solution
 * stage (chem/solution); nothing here computes chemistry.
 */
import type { BatchAnalysis, BatchSolution, Ingredient, SolidSaturation, SolutionSpecies } from '../chem/batch';
import { labelDisplay } from '../chem/solution/labels';
import { MINUS, sig } from './format';

/** A concentration in the unit a chemist reads it in: `0.137 M`, `10.1 mM`, `2.4 µM`, `3.1×10⁻¹² M`. */
export function concText(c: number): string {
  const a = Math.abs(c);
  if (a >= 0.1 || a === 0) return `${sig(c, 3)} M`;
  if (a >= 1e-4) return `${sig(c * 1e3, 3)} mM`;
  if (a >= 1e-7) return `${sig(c * 1e6, 3)} µM`;
  return `${sig(c, 2)} M`;
}

/** A pH to two decimals (a true minus sign below zero). */
export const pHText = (pH: number) => (pH < 0 ? MINUS : '') + Math.abs(pH).toFixed(2);

/** A saturation index with its sign: `+3.03`, `−0.41`. */
export const siText = (si: number) => `${si >= 0 ? '+' : MINUS}${Math.abs(si).toFixed(2)}`;

/** Buffer capacity in mol/(L·pH), or mmol where it is small. */
export function capacityText(beta: number | null): string {
  if (beta === null || !Number.isFinite(beta)) return '—';
  if (beta >= 0.1) return `${sig(beta, 2)} mol/(L·pH)`;
  if (beta >= 1e-4) return `${sig(beta * 1e3, 2)} mmol/(L·pH)`;
  return `${sig(beta * 1e6, 2)} µmol/(L·pH) (unbuffered)`;
}

/** Whether a solid is oversaturated, near saturation (within one log unit) or well under. */
export function saturationWord(si: number): 'oversaturated' | 'near saturation' | 'undersaturated' {
  return si > 0 ? 'oversaturated' : si > -1 ? 'near saturation' : 'undersaturated';
}

/**
 * The major species: H⁺ and OH⁻ left to the pH, the rest most concentrated first, those at 0.5 % or more of
 * the most concentrated one, at most `max`; `more` counts the rest.
 */
export function majorSpecies(s: BatchSolution, max = 8): { major: SolutionSpecies[]; more: number } {
  const list = s.species.filter((x) => x.label !== 'H^+' && x.label !== 'OH^-' && x.concentrationM > 0);
  const top = list[0]?.concentrationM ?? 0;
  const major = list.filter((x) => x.concentrationM >= 0.005 * top).slice(0, max);
  return { major, more: list.length - major.length };
}

/** The solids worth naming: over or within one log unit of saturation. */
export const nearSaturation = (s: BatchSolution): SolidSaturation[] => s.saturation.filter((x) => x.saturationIndex > -1);

/** The pH line: `pH 7.59` and what it is, with the stated pH where there is one. */
export function pHLine(b: BatchAnalysis, s: BatchSolution): string {
  const stated = b.statedPH !== null ? `; stated ${pHText(b.statedPH)}` : '';
  return `pH ${pHText(s.pH)} (equilibrium estimate${stated})`;
}

/** The model's limits in one short line. */
export function limitsLine(s: BatchSolution): string {
  const range = s.outOfRange ? ` — I = ${sig(s.ionicStrengthM, 2)} M is above that range: rough` : '';
  return `An estimate: ${s.activityModel === 'Davies' ? 'Davies activities (to I ≈ 0.5 M)' : 'ideal solution'}${range}, ${sig(s.temperatureC, 3)} °C, no gases exchanged with air, no redox; measure the pH.`;
}

/** What would come out, for a solid that is oversaturated. */
export function precipitateText(s: BatchSolution, solid: SolidSaturation): string | undefined {
  const p = s.precipitates.find((x) => x.solid === solid.solid);
  if (!p) return undefined;
  const grams = p.massG >= 1 ? `${sig(p.massG, 3)} g` : p.massG >= 1e-3 ? `${sig(p.massG * 1e3, 3)} mg` : `${sig(p.massG * 1e6, 2)} µg`;
  return `about ${grams} would come out${s.afterPrecipitation ? ` (pH then ${pHText(s.afterPrecipitation.pH)})` : ''}`;
}

/** A `to pH` line's or a buffer form's solved amount in words, for its hover and table notes. */
export function solvedText(i: Ingredient): string | undefined {
  if (i.solvedFor) return `amount solved for pH ${pHText(i.solvedFor.targetPH)} with the equilibrium model (reached ${pHText(i.solvedFor.pH)})`;
  if (i.buffer) {
    const d = i.buffer.design;
    if (!d.forms || d.pKa === null || d.idealRatio === null) return `${d.system} buffer ${sig(d.totalM, 3)} M at pH ${pHText(d.pH)}`;
    const [a, b] = d.forms.map(labelDisplay);
    return `${d.system} buffer ${sig(d.totalM, 3)} M at pH ${pHText(d.pH)}: ${b} : ${a} ${sig(d.ratio, 3)} : 1 with activities; Henderson–Hasselbalch at pKa ${d.pKa.toFixed(2)} (I = 0) would give ${sig(d.idealRatio, 3)} : 1`;
  }
  return undefined;
}
