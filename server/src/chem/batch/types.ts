/** What a batch analysis returns: plain data, read by the tables, hovers, preview, report and `batch --json`. */
import type { FormulaAnalysis } from '../analyse';
import type { Caution } from '../cautions';
import type { SolubilityRow } from '../data/solubility';
import type { ChemDiagnostic, DiagnosticCode } from '../diagnostic';
import type { IonShare } from '../ions/dissociation';
import type { BatchSolution, BufferDesign } from '../solution/types';
import type { Shelf } from '../reagents';
import type { Upkeep } from '../upkeep';
import type { Hazard, HeatReading, HeatStep } from '../safety';
import type { AmountUnit } from './units';

export type { AmountUnit } from './units';
export type { BatchSolution, BufferDesign, IngredientInModel, PrecipitateAmount, SolidSaturation, SolutionSpecies } from '../solution/types';
export type { IonShare } from '../ions/dissociation';

export interface BatchLine {
  text: string;
  /** Offset of the line's first character in the document. */
  start: number;
}

/** An ingredient compared with its solubility in water (an estimate; see solubility.ts). */
export interface SolubilityCheck {
  /** The anhydrous substance compared, typeset (`CuSO₄`). */
  salt: string;
  row: SolubilityRow;
  /** Grams of the anhydrous substance in the batch. */
  anhydrousG: number;
  /** Estimated grams of it per 100 g water in the batch; null where the estimate leaves no water. */
  per100gWater: number | null;
  exceeds: boolean;
}

export interface Ingredient {
  formulaText: string;
  formula: string;
  analysis: FormulaAnalysis;
  lineStart: number;
  lineEnd: number;
  formulaStart: number;
  formulaEnd: number;
  /** As written: a number and a unit (`2.5 g`), `to pH 7.00` (solved), or a buffer's total (`0.1 M`). */
  amount: { value: number; unit: AmountUnit | 'to pH'; text: string; start: number; end: number };
  /** Fraction 0–1 of what is weighed that is the substance. */
  assay: number;
  molarMass: number;
  moles: number | null;
  /** Mass to weigh, g (assay included). */
  massG: number | null;
  concentrationM: number | null;
  /** Share 0–1 of the weighed mass (the counted ingredients), with or without `total:`. */
  massFraction: number | null;
  /** Share 0–1 of the batch's `total:` mass; null where no total is given. */
  fractionOfTotal: number | null;
  ions: IonShare[];
  /** Why it is not split into ions, when it is not. */
  undissociated?: string;
  cautions: Caution[];
  /** Where the substance is in the solubility table and the batch has a final volume. */
  solubility?: SolubilityCheck;
  /** A `to pH` line: the pH its amount was solved for, and the pH reached. */
  solvedFor?: { targetPH: number; pH: number };
  /** One of a buffer line's two forms, with the line's design. */
  buffer?: { role: 'acid' | 'base'; design: BufferDesign };
  /** How it is measured out: weighed, poured (a liquid by volume), or taken from a stock. */
  measure: 'weigh' | 'pour' | 'stock';
  /** Volume of the reagent as supplied to pour (a liquid), or of the stock to take, mL; null where weighed. */
  volumeML: number | null;
  /** How the substance was written on the line: a formula, a name, a shelf label. */
  via: 'formula' | 'name' | 'shelf';
  /** The name the line gave, as the tool writes it (a name read exactly). */
  name?: string;
  /** The shelf entry a label named. */
  shelf?: { label: string; substance: string; assayPercent?: number; densityGPerML?: number; lot?: string; supplier?: string };
  /** The density used for a liquid and its source, in one line. */
  density?: string;
  /** How the amount was worked out, in one line. */
  basis?: string;
  /** A dilution: the stock it is taken from (`from 1.5 M`, `from batch "Acid stock"`). */
  stock?: string;
  /** What the reading and the amount rest on (assumptions, the role of a normality, lookalike names). */
  notes: string[];
  /** Handling cautions of a concentrated reagent poured. */
  handling: string[];
}

/** A line of the block that is not counted, and why. */
export interface SkippedLine {
  kind: 'ingredient' | 'header';
  /** The line as written (without the blanks around it). */
  text: string;
  /** Absolute offsets of `text`. */
  lineStart: number;
  lineEnd: number;
  /** Why it is not counted: the messages of its errors (or of the warning that set it aside). */
  reason: string;
  /** Code of the first finding that set it aside. */
  code: DiagnosticCode;
  /** The formula as written on an ingredient line, with its offsets. */
  formulaText?: string;
  formulaStart?: number;
  formulaEnd?: number;
  /** The formula's analysis where it is readable: its cautions still apply. */
  analysis?: FormulaAnalysis;
  cautions: Caution[];
}

export interface BatchIon {
  ion: string;
  key: string;
  charge: number;
  concentrationM: number;
}

export interface BatchAnalysis {
  name: string | null;
  volumeL: number | null;
  totalMassG: number | null;
  /** The counted ingredient lines, in order. */
  ingredients: Ingredient[];
  /** Every other non-blank line that was not counted, in order; a batch with any is incomplete. */
  skipped: SkippedLine[];
  ions: BatchIon[];
  ionicStrengthM: number | null;
  netChargeEqPerL: number | null;
  /** Estimated grams of water (final volume × 1 g/mL less the dissolved mass); null without a volume. */
  waterG: number | null;
  diagnostics: ChemDiagnostic[];
  cautions: Caution[];
  notes: string[];
  /** `temperature:` (25 °C unless given) and `pH:` (the pH the batch is expected at; null where not given). */
  temperatureC: number;
  statedPH: number | null;
  /** The equilibrium of the made-up solution; null without a final volume or where nothing is aqueous. */
  solution: BatchSolution | null;
  /** Why there is no solution, where there is none. */
  noSolution?: string;
  /** Bath upkeep (titre lines, `tank:`, additions): only where the batch has a titre line or a tank. */
  upkeep?: Upkeep;
  /**
   * Ingredients (counted or not) that react dangerously together, each raised as `batch-incompatible` on the
   * later line; empty when none. `lines` are the `lineStart` offsets of the lines named (shifted with the batch).
   */
  hazards: Hazard[];
  /** The heat of making up (dissolution, dilution, neutralisation) and its temperature change, an estimate; null where no ingredient's heat is known. */
  heat: BatchHeat | null;
}

/** A step of the heat of making up, with its ingredient's place in `ingredients` (null for a neutralisation between ingredients). */
export interface BatchHeatStep extends HeatStep {
  ingredientIndex: number | null;
}

/** The heat of making up a batch, each step with its line. */
export interface BatchHeat extends HeatReading {
  steps: BatchHeatStep[];
}

/** A batch of the same document that a line may take a stock from (`NiSO4 0.1 M from batch "Nickel stock"`). */
export interface StockBatch {
  name: string;
  volumeL: number | null;
  /** The stock's computed concentrations, by Hill formula of the substance (hydrate water excluded) and as written. */
  ingredients: ReadonlyArray<{ formula: string; hill: string; anhydrousHill: string; concentrationM: number | null }>;
}

/**
 * What a batch is read with besides its own lines: the lab's shelf (labels a line may name) and the other
 * batches of the document (stocks a line may be diluted from). Both optional; without them a label or a
 * stock reference is a finding on the line.
 */
export interface BatchContext {
  shelf?: Shelf;
  stockOf?: (name: string) => StockBatch | undefined;
}
