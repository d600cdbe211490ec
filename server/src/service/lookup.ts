/** What is at an offset of an analysed document. */
import type { Ingredient } from '../chem/batch';
import {
  shiftBatch,
  shiftFormula,
  shiftReaction,
  type AnalysedDocument,
  type BatchOccurrence,
  type FormulaOccurrence,
  type ReactionOccurrence,
} from './document';

export type Target =
  | { kind: 'formula'; occ: FormulaOccurrence; start: number; end: number }
  | { kind: 'reaction'; occ: ReactionOccurrence; start: number; end: number }
  | { kind: 'batch-line'; occ: BatchOccurrence; ingredient: Ingredient; start: number; end: number }
  | { kind: 'batch-header'; occ: BatchOccurrence; start: number; end: number };

/** Last index whose `start` is ≤ offset in a list sorted by start (−1 when none). */
function lastStartingBefore<T>(list: readonly T[], offset: number, start: (x: T) => number): number {
  let lo = 0;
  let hi = list.length - 1;
  let ans = -1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (start(list[mid]) <= offset) {
      ans = mid;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  return ans;
}

/** The item under the cursor (an offset inside it or right at its end); only that block's items are read. */
export function targetAt(doc: AnalysedDocument, offset: number): Target | undefined {
  const block = doc.blockAt(offset);
  if (!block) return undefined;
  const rel = block.rel;
  const o = offset - block.start;
  const b = lastStartingBefore(rel.batches, o, (x) => x.ref.start);
  if (b >= 0 && o <= rel.batches[b].ref.end) {
    const occ = shiftBatch(rel.batches[b], block.start);
    const ing = occ.analysis.ingredients.find((i) => offset >= i.lineStart && offset <= i.lineEnd);
    if (ing) return { kind: 'batch-line', occ, ingredient: ing, start: ing.lineStart, end: ing.lineEnd };
    return { kind: 'batch-header', occ, start: occ.ref.open.start, end: occ.ref.open.end };
  }
  const f = lastStartingBefore(rel.formulas, o, (x) => x.ref.start);
  if (f >= 0 && o <= rel.formulas[f].ref.end) {
    const occ = shiftFormula(rel.formulas[f], block.start);
    return { kind: 'formula', occ, start: occ.ref.start, end: occ.ref.end };
  }
  const r = lastStartingBefore(rel.reactions, o, (x) => x.ref.start);
  if (r >= 0 && o <= rel.reactions[r].ref.end) {
    const occ = shiftReaction(rel.reactions[r], block.start);
    return { kind: 'reaction', occ, start: occ.ref.start, end: occ.ref.end };
  }
  return undefined;
}

/** Formulas whose text lies within [start, end). */
export function formulasIn(doc: AnalysedDocument, start: number, end: number): FormulaOccurrence[] {
  const from = Math.max(
    0,
    lastStartingBefore(doc.formulas, start, (x) => x.ref.start),
  );
  const out: FormulaOccurrence[] = [];
  for (let i = from; i < doc.formulas.length; i++) {
    const f = doc.formulas[i];
    if (f.ref.start >= end) break;
    if (f.ref.end > start && f.ref.start < end) out.push(f);
  }
  return out;
}
