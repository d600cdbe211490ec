/**
 * What an ingredient line weighs or pours, read from the start of the line: a shelf label (`Acid A 10 mL`,
 * where the document or workspace has a shelf), a formula (`NiSO4·6H2O 25 g`) or a name (`nickel sulfate
 * hexahydrate 25 g`, `borax 2 g`). A formula is tried first; a line whose first word is no formula is read
 * as a name (chem/names). A name is taken only when it is read exactly: a near name (chlorate for
 * chloride) or one with more than one reading is a finding that offers the readings, never a guess.
 */
import { analyseFormula, type FormulaAnalysis } from '../analyse';
import { shiftDiagnostic, type ChemDiagnostic } from '../diagnostic';
import { joinSpacedAdduct } from '../formula/spaced';
import { nameAtStart, type NameCandidate } from '../names/read';
import { labelAtStart, type ShelfEntry } from '../reagents';
import type { ChemSettings } from '../settings';
import { finding, tokens, type Token } from './tokens';
import type { BatchContext } from './types';

export interface SubstanceReading {
  /** Where the substance is written on the line (the formula, the name or the label), and as written. */
  formula: Token;
  analysis: FormulaAnalysis;
  /** The tokens after it. */
  rest: Token[];
  via: 'formula' | 'name' | 'shelf';
  /** A name read: the name as the tool writes it. */
  name?: string;
  /** A shelf label read: its entry. */
  shelf?: ShelfEntry;
  /** The name is of a solution (bleach, muriatic acid): its assay must come from the label. */
  solution?: { typical: string };
  /** What the reading assumed, and the names a letter away that it is not. */
  notes: string[];
  /** Findings of the substance (absolute offsets); information findings left out. */
  diagnostics: ChemDiagnostic[];
}

const hasErrors = (a: FormulaAnalysis) => a.diagnostics.some((d) => d.severity === 'error');
const list = (cs: readonly NameCandidate[]) => cs.map((c) => `${c.name} (${c.formula})`).join(', ');
const NAME_NOTES = new WeakMap<readonly NameCandidate[], string[]>();
/** A word that is written as a word (lower case, or a capital and lower case), not a formula. */
const WORDY = /^[A-Za-z][a-z]{2,}(?:[-'][A-Za-z]+)*$/;

/** Read the substance at the start of an ingredient line. */
export function readSubstance(text: string, base: number, settings: ChemSettings, context: BatchContext): SubstanceReading {
  const toks = joinSpacedAdduct(tokens(text, base), text, base);
  const after = (end: number) => toks.filter((t) => t.start >= end);
  if (context.shelf?.entries.length) {
    const label = labelAtStart(context.shelf, text);
    if (label) {
      const { entry } = label;
      const span = { text: text.slice(label.start, label.end), start: base + label.start, end: base + label.end };
      const analysis = analyseFormula(entry.substance.formula, settings);
      // The entry itself is on the line (`shelf`): the outputs write it from there.
      return { formula: span, analysis, rest: after(span.end), via: 'shelf', shelf: entry, notes: [], diagnostics: [] };
    }
  }
  const first = toks[0];
  const analysis = analyseFormula(first.text, settings);
  const asFormula = (): SubstanceReading => ({
    formula: first,
    analysis,
    rest: toks.slice(1),
    via: 'formula',
    notes: [],
    diagnostics: analysis.diagnostics.filter((d) => d.severity !== 'information').map((d) => shiftDiagnostic(d, first.start)),
  });
  if (!hasErrors(analysis) || !/^[A-Za-z(]/.test(first.text)) return asFormula();
  const n = nameAtStart(text);
  if (n.end <= n.start) return asFormula();
  const span = { text: text.slice(n.start, n.end), start: base + n.start, end: base + n.end };
  if (n.status === 'exact' && n.formula) {
    const named = analyseFormula(n.formula, settings);
    // The notes of a reading, written once per cached reading (its arrays are shared between lines).
    let base = NAME_NOTES.get(n.lookalikes);
    if (!base) {
      base = [...n.notes];
      if (n.lookalikes.length) base.push(`Read as ${n.name} (${n.formula}); not ${list(n.lookalikes)}.`);
      NAME_NOTES.set(n.lookalikes, base);
    }
    const notes = base.slice();
    const out: SubstanceReading = {
      formula: span,
      analysis: named,
      rest: after(span.end),
      via: 'name',
      name: n.name,
      notes,
      diagnostics: named.diagnostics.filter((d) => d.severity === 'error').map((d) => ({ ...d, start: span.start, end: span.end })),
    };
    if (n.solution) out.solution = n.solution;
    return out;
  }
  // A near or ambiguous name is never taken; an unknown one is said as a name where it reads as words.
  const words = span.text.split(/\s+/).length;
  if (n.status === 'unknown' && words === 1 && !WORDY.test(first.text)) return asFormula();
  // A name of any length is quoted short: the finding stands on its characters.
  const message =
    span.text.length > 80
      ? `'${span.text.slice(0, 60)}…' (${span.text.length} characters) is neither a formula nor a name the tool knows.`
      : n.status === 'ambiguous' && n.candidates.length
        ? `${n.message ?? `'${span.text}' has more than one reading`} (${list(n.candidates)})`
        : (n.message ?? `'${span.text}' is neither a formula nor a name the tool knows.`);
  return {
    formula: span,
    analysis,
    rest: after(span.end),
    via: 'name',
    notes: [],
    diagnostics: [finding('batch-name', span.start, span.end, message)],
  };
}
