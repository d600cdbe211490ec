/**
 * What the reagent functions report besides their numbers: plain findings with a kind, a severity and a
 * message. Functions that read text (the shelf parser) give offsets too; the arithmetic functions take
 * numbers, and their caller puts the finding on the line it came from.
 *
 * The kinds are this module's own; the batch reader maps them to the diagnostic catalogue (chem/codes.ts)
 * when it wires them in (see the note in ./index.ts).
 */
export type ReagentFindingKind =
  /** A liquid by volume whose density the tool does not know (and none was given). */
  | 'unknown-liquid'
  /** A solution reagent given by volume or target without its assay. */
  | 'assay-needed'
  /** An assay outside the density table, or outside 0–100 %. */
  | 'assay-range'
  /** The label's density differs from the table's: the label's is used. */
  | 'density-label'
  /** A unit that needs the final volume, a total or a solvent mass the batch does not give. */
  | 'basis-missing'
  /** ppm read as mg/L or mg/kg, and where the two differ. */
  | 'ppm-basis'
  /** An approximation the figure rests on (molality from the final volume, % v/v and contraction). */
  | 'approximation'
  /** Which equivalents a normality was read with. */
  | 'normality-role'
  /** A dilution that cannot be made (target stronger than the stock, units that do not convert). */
  | 'dilution-impossible'
  /** Another form of an ingredient that is not the same substance. */
  | 'form-mismatch'
  /** An amount too small for the balance or the vessel that measures it. */
  | 'measuring-precision'
  /** Handling cautions for a concentrated acid or base by volume. */
  | 'handling'
  /** A shelf line that cannot be read. */
  | 'shelf-syntax'
  /** A shelf line whose substance is not read exactly (a near or ambiguous name). */
  | 'shelf-substance'
  /** Two shelf lines with one label. */
  | 'shelf-duplicate';

export interface ReagentFinding {
  kind: ReagentFindingKind;
  severity: 'error' | 'warning' | 'information';
  message: string;
  /** Offsets into the text given (shelf parser only). */
  start?: number;
  end?: number;
}

export const finding = (kind: ReagentFindingKind, severity: ReagentFinding['severity'], message: string, start?: number, end?: number): ReagentFinding =>
  start === undefined ? { kind, severity, message } : { kind, severity, message, start, end };
