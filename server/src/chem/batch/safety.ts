/**
 * Stage 6 of a batch (beside the checks): the safety reading (chem/safety/) — ingredients that react
 * dangerously together, and the heat of making the batch up.
 *
 * What it is given: every counted line (its analysis, moles, mass to weigh, assay, line) and every line not
 * counted whose formula is readable (moles and mass unknown: its reactive groups still count, an amount that
 * matters counts as concentrated), the final volume, and the pH of the batch's equilibrium where it has
 * one. The pH is read only where a pH-dependent rule or a neutralisation asks for it: a batch whose
 * equilibrium is solved on first read (solution.ts) is not solved for the safety reading unless it must be,
 * and then once, for the outputs too.
 *
 * Findings:
 * - `batch-incompatible` (warning) on the later of the lines a hazard names, on that line's characters; the
 *   message names both substances, what forms, the harm and the usual caution.
 * - `batch-heat` (warning) where the estimated |ΔT| of making up exceeds `heatThresholdK` (default 15 K,
 *   allowing for the estimate's typical error), on the line of the ingredient that gives the most heat (the
 *   batch's opening line where no one ingredient does), with the advice of the trade.
 */
import type { ChemDiagnostic } from '../diagnostic';
import { DEFAULT_HEAT_THRESHOLD_K, heatMessage, readBatchSafetyDeferred, type Hazard, type HeatReading, type SafetyIngredient } from '../safety';
import type { ChemSettings } from '../settings';
import type { BatchAmounts } from './amounts';
import type { BatchHeaders } from './read';
import type { SolutionStage } from './solution';
import { finding } from './tokens';
import type { BatchHeat, BatchHeatStep, BatchSolution } from './types';

export interface BatchSafety {
  hazards: Hazard[];
  /** The heat, or (where it cannot raise the warning) a function that computes it when it is shown. */
  heat: BatchHeat | null | (() => BatchHeat | null);
  diagnostics: ChemDiagnostic[];
}

let enabled = true;

/** The stage's result where there is nothing to read (shared, read-only). */
const EMPTY: BatchSafety = Object.freeze({
  hazards: Object.freeze([]) as unknown as Hazard[],
  heat: null,
  diagnostics: Object.freeze([]) as unknown as ChemDiagnostic[],
});

/** Switch the safety reading off or on (the benchmark measures `check` with and without it in the same run). */
export function setSafetyStage(on: boolean): void {
  enabled = on;
}

/** A line of the batch as the safety reading is given it, with the characters a finding on it goes on. */
interface Placed {
  ingredient: SafetyIngredient;
  start: number;
  end: number;
  /** Its place among the counted lines; null for a line not counted. */
  counted: number | null;
}

/**
 * Read the batch's safety (after the solution stage and the checks). A lazy equilibrium in `solution` is
 * memoised in place, so that the pH read here and the batch's `solution` read later are one solve.
 */
export function safetyStage(
  amounts: BatchAmounts,
  headers: BatchHeaders,
  solution: SolutionStage,
  settings: ChemSettings,
  openLine: { start: number; end: number },
): BatchSafety {
  if (!enabled) return EMPTY;
  // One object shape per line and per batch, no spreads: the stage runs on every batch of every check.
  const placed: Placed[] = [];
  const counted = amounts.counted;
  for (let k = 0; k < counted.length; k++) {
    const c = counted[k];
    const line = c.line;
    const ingredient: SafetyIngredient = {
      analysis: line.analysis,
      moles: c.moles,
      massG: c.massG,
      assay: line.assay,
      volumeML: c.volumeML,
      line: line.lineStart,
    };
    if (line.name) ingredient.name = line.name;
    placed.push({ ingredient, start: line.lineStart, end: line.lineEnd, counted: k });
  }
  let notCounted = false;
  for (const s of amounts.skipped) {
    if (s.kind !== 'ingredient' || !s.analysis || !s.analysis.ok) continue;
    const ingredient: SafetyIngredient = { analysis: s.analysis, moles: null, massG: null, assay: 1, volumeML: null, line: s.lineStart };
    placed.push({ ingredient, start: s.lineStart, end: s.lineEnd, counted: null });
    notCounted = true;
  }
  if (placed.length === 0) return EMPTY;
  if (notCounted) placed.sort((x, y) => x.start - y.start);
  const ingredients: SafetyIngredient[] = new Array(placed.length);
  for (let k = 0; k < placed.length; k++) ingredients[k] = placed[k].ingredient;
  const pH = pHReader(solution, notCounted);
  const batch = {
    ingredients,
    volumeL: headers.volumeL,
    waterG: null,
    temperatureC: headers.temperatureGiven ? headers.temperatureC : undefined,
    // Read only where a rule asks (chem/safety/context.ts reads it on first use).
    get pH() {
      return pH();
    },
  };
  const threshold = settings.heatThresholdK ?? DEFAULT_HEAT_THRESHOLD_K;
  const reading = readBatchSafetyDeferred(batch, { heatThresholdK: threshold });
  const diagnostics: ChemDiagnostic[] = [];
  for (const h of reading.hazards) {
    const at = placed[h.at];
    diagnostics.push(finding('batch-incompatible', at.start, at.end, h.message, 'warning'));
  }
  // Each step keeps its ingredient's place in the batch's `ingredients` (the reading's indices count the lines not counted too).
  const placeSteps = (heat: BatchHeat | null) => {
    if (heat) for (const st of heat.steps as BatchHeatStep[]) st.ingredientIndex = st.index === null ? null : placed[st.index].counted;
    return heat;
  };
  // A heat that cannot raise the warning is computed when shown (the hover, the tables, the JSON).
  if (typeof reading.heat === 'function') {
    const later = reading.heat;
    return { hazards: reading.hazards, heat: () => placeSteps(later() as BatchHeat | null), diagnostics };
  }
  const heat = placeSteps(reading.heat as BatchHeat | null);
  if (heat && heat.exceeds) {
    const at = hottest(heat, placed) ?? openLine;
    diagnostics.push(finding('batch-heat', at.start, at.end, heatMessage(heat), 'warning'));
  }
  return { hazards: reading.hazards, heat, diagnostics };
}

/** The line of the step that gives (or, for a cooling batch, takes) the most heat, where it is one ingredient's. */
function hottest(heat: HeatReading, placed: readonly Placed[]): Placed | undefined {
  const sign = (heat.temperatureRiseK ?? 0) >= 0 ? -1 : 1;
  let best: { kJ: number; index: number | null } | undefined;
  for (const st of heat.steps) {
    if (st.kind === 'not-counted') continue;
    if (!best || sign * st.kJ > sign * best.kJ) best = { kJ: st.kJ, index: st.index };
  }
  return best && best.index !== null ? placed[best.index] : undefined;
}

/**
 * The equilibrium's pH, read on first use, where it speaks for the whole batch: null (the safety reading
 * then makes its own estimate, or lets the pair decide) without a converged equilibrium, where a readable
 * line is not counted (an acid left out of the equilibrium would leave its pH beside the point), where an
 * ingredient is left out of it, or where it counts an ion its tables do not know as forming nothing (the
 * hypochlorite of bleach, whose acid–base chemistry is what a hazard rule turns on).
 */
function pHReader(stage: SolutionStage, notCounted: boolean): () => number | null {
  if (notCounted) return () => null;
  const of = (x: BatchSolution | null) => (x && x.converged && x.inert.length === 0 && !x.ingredients.some((i) => i.leftOut) ? x.pH : null);
  const s = stage.solution;
  if (typeof s === 'function') {
    let made: BatchSolution | undefined;
    const once = () => (made ??= s());
    stage.solution = once;
    return () => of(once());
  }
  return () => of(s);
}
