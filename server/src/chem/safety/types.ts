/** What the safety reading is given and what it returns: plain data. */
import type { FormulaAnalysis } from '../analyse';
import type { HarmClass, HazardKind } from './rules';

/** One ingredient of a batch, as the pipeline knows it after its amounts stage. */
export interface SafetyIngredient {
  /** The analysis of the substance as weighed or poured (hydrate water included). */
  analysis: FormulaAnalysis;
  /** The name the line gave, where it named the substance instead of writing its formula. */
  name?: string;
  /** Moles of the substance (the pure substance, whatever its assay); null where not known. */
  moles: number | null;
  /** Grams weighed or poured of the reagent as supplied (the assay included); null where not known. */
  massG: number | null;
  /** Fraction 0–1 of the reagent that is the substance (1 where none is given). */
  assay?: number;
  /** Millilitres of the reagent measured out, for a liquid; null or absent for a solid. */
  volumeML?: number | null;
  /** The line the ingredient is on, as the caller counts lines (returned in `lines`; used to find the later line). */
  line: number;
}

export interface SafetyBatch {
  ingredients: readonly SafetyIngredient[];
  /** Final volume of the batch in litres; null where none is given. */
  volumeL?: number | null;
  /** The batch's pH from the solution chemistry, where it gives one (it takes precedence over the estimate here). */
  pH?: number | null;
  /** Grams of water in the batch, where the pipeline knows better than the estimate here. */
  waterG?: number | null;
  /** Temperature of the water before making up, °C (default 20). */
  temperatureC?: number;
}

export interface SafetyOptions {
  /** |ΔT| above which the heat reading advises (default 15 K; the setting behind `batch-heat`). */
  heatThresholdK?: number;
}

/** A dangerous pair (or one substance, or one substance with the batch's water). */
export interface Hazard {
  /** What forms (`chlorine`, `hydrogen-cyanide`, `explosive-compound`…): the rule's kind. */
  kind: HazardKind;
  /** The harm in one of a few plain classes. */
  harm: HarmClass;
  /** One sentence or three: both substances, the product, the harm in plain words, the advice and the usual caution. */
  message: string;
  /** The formulas of the ingredients involved, typeset, in line order. */
  ingredients: string[];
  /** Their lines, as the caller gave them, in the same order. */
  lines: number[];
  /** Index (into the batch's ingredients) of the later line: the warning goes there. */
  at: number;
  /** The indices of the ingredients involved, in line order. */
  indices: number[];
  /** The rule that applied and where it comes from. */
  rule: string;
  source: string;
  /** The pH the rule used, where it depends on pH. */
  pH?: { value: number; from: 'solution' | 'estimate' };
}

export type HeatStepKind = 'solution' | 'dilution' | 'neutralisation' | 'estimate' | 'not-counted';

/** One contribution to the heat of making up. */
export interface HeatStep {
  kind: HeatStepKind;
  /** The ingredient's formula, typeset; null for the neutralisation between ingredients. */
  ingredient: string | null;
  /** Index into the batch's ingredients; null for the neutralisation. */
  index: number | null;
  /** ΔH of this step, kJ (negative: heat given out). */
  kJ: number;
  /** Per mole of the ingredient, where it applies. */
  kJPerMol?: number;
  /** How it was obtained, in one line. */
  method: string;
  source?: string;
  /** For an estimated enthalpy of solution: its typical error over this step, kJ. */
  uncertaintyKJ?: number;
}

export interface HeatReading {
  /** ΔH of making up the batch, kJ (negative: the batch warms). */
  kJ: number;
  /** ΔT = −ΔH / (m·cp), K; negative is cooling; null where the batch's water is not known. */
  temperatureRiseK: number | null;
  /** How the figure was obtained, in one line. */
  method: string;
  steps: HeatStep[];
  /** The typical error of the estimated steps on ΔT, K (0 where every step is tabulated); `exceeds` allows for it. */
  uncertaintyK: number;
  /** m·cp used, J/K, and its parts. */
  heatCapacityJPerK: number | null;
  solutionMassG: number | null;
  /** The starting and the estimated final temperature, °C. */
  startC: number;
  finalC: number | null;
  thresholdK: number;
  /** |ΔT| above the threshold by more than `uncertaintyK`: the pipeline raises `batch-heat`. */
  exceeds: boolean;
  /** The advice of the trade, where it exceeds. */
  advice: string[];
  /** What was not counted, and the model's limits. */
  notes: string[];
}

export interface SafetyReading {
  hazards: Hazard[];
  heat: HeatReading | null;
  /** The pH the reading used: the solution chemistry's, or its own estimate (ideal solution); null where it needed none (no acid-sensitive substance, no neutralisation) or the batch is dry. */
  pH: { value: number; from: 'solution' | 'estimate' } | null;
}
