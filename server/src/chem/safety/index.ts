/**
 * The safety reading of a batch: dangerous pairs of ingredients, and the heat of making it up. Pure
 * chemistry over plain data; nothing here knows lines of text, diagnostics or the editor.
 *
 * ── Integration (for the batch pipeline, chem/batch/) ──────────────────────────────────────────────────
 * Call `readBatchSafety` once per batch, after the amounts and (where there is one) the solution
 * chemistry, beside the checks:
 *
 *   const safety = readBatchSafety({
 *     ingredients: counted.map((c) => ({
 *       analysis: c.line.analysis,           // FormulaAnalysis of what is weighed or poured
 *       name: c.line.name,                   // where the line named it (optional)
 *       moles: c.moles, massG: c.massG,      // moles of the substance; grams of the reagent as supplied
 *       assay: c.line.assay,                 // 0–1, default 1
 *       volumeML: c.volumeML ?? null,        // liquids measured by volume
 *       line: c.line.lineStart,              // any key that grows down the block (a line number, an offset):
 *                                            // returned in `lines`, it decides which line is the later one
 *     })),
 *     volumeL: headers.volumeL,              // final volume, or null
 *     pH: solution?.pH ?? null,              // the solution chemistry's pH, where it has one
 *     waterG: null,                          // or the pipeline's own figure for the batch water
 *   }, { heatThresholdK: settings.heatThresholdK });
 *
 * - `safety.hazards[k]` → one `batch-incompatible` warning on the line of ingredient `at` (the later of the
 *   lines it names), message `message`; JSON `hazards: [{kind, message, ingredients, lines}]` as the
 *   contract has it (the other fields — harm, rule, source, pH, indices — are extras).
 * - `safety.heat` → JSON `heat: {kJ, temperatureRiseK, method}` (+ `steps`); where `heat.exceeds`, one
 *   `batch-heat` warning on the batch's first line (or on the ingredient of the largest step), message
 *   `heatMessage(heat)`. `heat` is null where no ingredient's heat is known.
 * - Lines the amounts stage did not count can still carry a hazard: pass them with `moles: null,
 *   massG: null` (their groups still count; amounts that matter, such as concentrations, then count as
 *   concentrated).
 * - Hovers and the report: `SAFETY_NOTICE` is the sentence to show with any of it.
 * - Cards: `ghsFor(analysis)` (GHS statements and pictograms, or null), `enthalpyOfSolution(analysis)`
 *   (with `why` it warms or cools the water), `reactiveGroups(analysis)`.
 * - `safety.pH` is the pH the reading used (the solution chemistry's, or its own ideal-solution estimate
 *   where a rule or a neutralisation needed one); null otherwise.
 * - Text fields (`heat.method`, `heat.notes`, `heat.advice`, the dilution and neutralisation steps'
 *   `method`) are written when first read: they are enumerable getters, so JSON and structured clone
 *   (the CLI's worker threads) carry them as plain strings.
 * - Cost: the groups, acid–base shares and table look-ups are memoised per analysis; the bench notebook's
 *   1,354 batches (2.6 MB) are read in about 8–10 ms, about 4–5 % of its check (`npm run bench`,
 *   "safety reading of all … batches").
 */
import { batchState } from './context';
import { findHazards } from './hazards';
import { heatBoundedBelow, heatOfMakingUp } from './heat';
import type { HeatReading, SafetyBatch, SafetyOptions, SafetyReading } from './types';

export type { Hazard, HeatReading, HeatStep, HeatStepKind, SafetyBatch, SafetyIngredient, SafetyOptions, SafetyReading } from './types';
export type { GroupMember, ReactiveGroup } from './groups';
export type { HarmClass, HazardKind, PairRule } from './rules';
export type { GhsReading, GhsStatement } from './ghs';
export type { SolutionEnthalpy } from './heat';
export { GROUP_LABEL, reactiveGroups } from './groups';
export { PAIR_RULES } from './rules';
export { ghsFor, H_STATEMENTS, PICTOGRAMS, SDS_NOTE } from './ghs';
export { DEFAULT_HEAT_THRESHOLD_K, enthalpyOfSolution, estimateAccuracy, hydrateStep } from './heat';
export { HAZARD_CAUTION } from './hazards';

/** The sentence every safety hover, report and card shows. */
export const SAFETY_NOTICE =
  "These warnings are an aid, not a safety assessment: they know only the reactions and data in Ionwright's tables. Follow the safety data sheets (SDS), your lab's own procedures, local codes and licensed practice.";

/** The safety reading of one batch: hazards and heat. */
export function readBatchSafety(batch: SafetyBatch, options: SafetyOptions = {}): SafetyReading {
  const state = batchState(batch);
  const hazards = findHazards(state);
  const heat = heatOfMakingUp(state, options, batch.temperatureC ?? 20);
  return { hazards, heat, pH: state.pHIfUsed() };
}

/**
 * The safety reading with the heat put off where it cannot raise the warning (`heatBoundedBelow`): `heat`
 * is then a function that computes it, for the outputs that show it. The hazards are always read.
 */
export function readBatchSafetyDeferred(
  batch: SafetyBatch,
  options: SafetyOptions = {},
): { hazards: SafetyReading['hazards']; heat: HeatReading | null | (() => HeatReading | null); pH: () => SafetyReading['pH'] } {
  const state = batchState(batch);
  const hazards = findHazards(state);
  const heat = heatBoundedBelow(state, options)
    ? () => heatOfMakingUp(state, options, batch.temperatureC ?? 20)
    : heatOfMakingUp(state, options, batch.temperatureC ?? 20);
  return { hazards, heat, pH: () => state.pHIfUsed() };
}

/** Only the hazards of a batch. */
export function batchHazards(batch: SafetyBatch): SafetyReading['hazards'] {
  return findHazards(batchState(batch));
}

/** Only the heat of making up a batch. */
export function batchHeat(batch: SafetyBatch, options: SafetyOptions = {}): HeatReading | null {
  return heatOfMakingUp(batchState(batch), options, batch.temperatureC ?? 20);
}

const num = (x: number, digits = 2) => Number(x.toPrecision(digits)).toString().replace('-', '−');

/** The `batch-heat` message: the estimate, the threshold, and the advice of the trade. */
export function heatMessage(heat: HeatReading): string {
  const dir = (heat.temperatureRiseK ?? 0) >= 0 ? 'warms' : 'cools';
  const dT = Math.abs(heat.temperatureRiseK ?? 0);
  const final = heat.finalC === null ? '' : ` (from ${num(heat.startC)} to about ${num(heat.finalC, 3)} °C)`;
  return `Making up this batch ${dir} it by about ${num(dT)} K${final}, more than ${num(heat.thresholdK)} K (estimate: ${num(heat.kJ, 3)} kJ). ${heat.advice.join('. ')}. ${SAFETY_NOTICE}`;
}
