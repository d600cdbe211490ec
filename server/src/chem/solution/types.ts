/** What the solution stage of a batch returns: plain data, read by hovers, tables, preview, report and JSON. */
import type { Equilibrium } from './solver';

export interface SolutionSpecies {
  /** ASCII label with caret charge (`HPO4^2-`, `CaSO4(aq)`). */
  label: string;
  /** Unicode display (`HPO₄²⁻`). */
  display: string;
  charge: number;
  concentrationM: number;
  activity: number;
  name?: string;
}

export interface SolidSaturation {
  /** The solid's formula (ASCII) and display. */
  solid: string;
  display: string;
  name: string;
  /** log10(IAP / Ksp). */
  saturationIndex: number;
  /** log10 Ksp at the batch's temperature, as tabulated (hydroxides against OH⁻). */
  logKsp: number;
  source: string;
  note?: string;
}

export interface PrecipitateAmount {
  solid: string;
  display: string;
  name: string;
  molPerL: number;
  /** Mass that would come out of the batch (its final volume), g. */
  massG: number;
}

/** How an ingredient was read into the model. */
export interface IngredientInModel {
  formula: string;
  /** What it gives in water (`2 Na⁺ + H₂EDTA²⁻`), or why it is left out. */
  as: string;
  leftOut?: string;
}

export interface BatchSolution {
  temperatureC: number;
  /** −log10 a(H⁺), as made up (before anything comes out). */
  pH: number;
  /** From the equilibrium species, M. */
  ionicStrengthM: number;
  activityModel: 'Davies' | 'ideal';
  converged: boolean;
  iterations: number;
  /** Every species, most concentrated first. */
  species: SolutionSpecies[];
  /** Every solid of the table the batch's components can form, most oversaturated first. */
  saturation: SolidSaturation[];
  /** dC(base)/dpH, mol/(L·pH). */
  bufferCapacity: number | null;
  /** What would come out at equilibrium, where any solid is oversaturated. */
  precipitates: PrecipitateAmount[];
  /** The solution left once they have come out. */
  afterPrecipitation: { pH: number; ionicStrengthM: number } | null;
  /** I above the Davies equation's range (0.5 M). */
  outOfRange: boolean;
  /** Constants used at their 25 °C value at another temperature (no enthalpy tabulated). */
  at25: string[];
  ingredients: IngredientInModel[];
  /** Ions of the batch the tables do not know: counted in I and the charge only. */
  inert: string[];
  /** The model's limits, one line each. */
  notes: string[];
  /** The solved tableau, for the species distribution over pH (not serialised). */
  equilibrium: Equilibrium;
}

/** A `to pH` line's solved amount, or why it cannot be solved. */
export type SolvedAmount = { moles: number; pH: number } | { error: string };

/** A buffer line's design: the two forms with their amounts. */
export interface BufferDesign {
  system: string;
  totalM: number;
  pH: number;
  acid: { formula: string; moles: number };
  base: { formula: string; moles: number };
  /**
   * The buffering step's base : acid concentration ratio in the batch as designed (its two species, `forms`),
   * and Henderson–Hasselbalch's ideal ratio 10^(pH − pKa) for the same step.
   */
  ratio: number;
  idealRatio: number | null;
  /** The step's pKa (I = 0), the one nearest the target, and its acid and base species. */
  pKa: number | null;
  forms: [string, string] | null;
  /** More than 1 pH unit from that pKa: little capacity. */
  weak: boolean;
}
