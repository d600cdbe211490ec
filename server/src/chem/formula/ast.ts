/**
 * The formula AST. Every node knows its offsets in the text that was parsed (UTF-16 code units,
 * end exclusive), so a diagnostic can point at the exact characters.
 */
export interface ElementNode {
  kind: 'element';
  symbol: string;
  count: number;
  start: number;
  end: number;
  /** End of the symbol itself (start of its count, if any). */
  symbolEnd: number;
  /** Oxidation state written in Stock notation right after the symbol: `Fe(III)`. */
  stock?: number;
}

/** A named group that stands for atoms: organic shorthand (Me, Et, Ph, OAc) or a ligand (en, acac, ox). */
export interface AbbrevNode {
  kind: 'abbrev';
  name: string;
  atoms: Readonly<Record<string, number>>;
  /** Charge the group carries as a ligand or counter-ion (acac −1, ox −2, OAc −1); 0 for neutral groups. */
  charge: number;
  count: number;
  start: number;
  end: number;
}

export interface GroupNode {
  kind: 'group';
  open: '(' | '[' | '{';
  items: FormulaItem[];
  count: number;
  start: number;
  end: number;
}

export type FormulaItem = ElementNode | AbbrevNode | GroupNode;

/** One component of an adduct: `CuSO4`, `5H2O` in `CuSO4·5H2O`. */
export interface FormulaPart {
  multiplier: number;
  /** Text of the multiplier as written ('' when none). */
  multiplierText: string;
  items: FormulaItem[];
  start: number;
  end: number;
}

export type StateSymbol = 's' | 'l' | 'g' | 'aq' | 'cr';

export interface Formula {
  /** The text that was parsed. */
  text: string;
  parts: FormulaPart[];
  /** Net charge as written (0 when none is written). */
  charge: number;
  /** Where the charge is written, if it is. */
  chargeSpan?: { start: number; end: number };
  /**
   * How the charge was read: `explicit` (`^2-`, `²⁻`), `bare` (`Cl-`, `Ca++`),
   * `bare-digit` (`Fe3+`: the trailing digit read as the charge), or `none`.
   */
  chargeNotation: 'explicit' | 'bare' | 'bare-digit' | 'none';
  /**
   * For a bare trailing `<digits><sign>` (`SO42-`, `NH4+`), the other reading: the chemistry layer
   * keeps whichever reading names a known ion or balances (see chem/analyse.ts).
   */
  alternative?: Formula;
  state?: StateSymbol;
  stateSpan?: { start: number; end: number };
  /**
   * Where a count is written as `x` (`(NH4)2Sx`, a polysulfide of unstated chain length): such an item's
   * count is NaN, so nothing computes a number from it (molar mass, composition) by mistake.
   */
  variableCounts?: Array<{ start: number; end: number }>;
}
