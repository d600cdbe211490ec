/**
 * The substances a note uses, counted: every neutral, readable formula of its code spans, prose and
 * formula lines and every batch ingredient, keyed by its display form (`CuSO4.5H2O` and `CuSO4·5H2O` are
 * one substance), with the text it was first written as. Completion ranks what a chemist has already
 * written first; the workspace index keeps one vocabulary per note.
 *
 * Counted per block and memoised by the block's result (blocks an edit did not touch are shared between
 * versions of a note), so a new version costs one pass over its blocks' small maps.
 */
import type { FormulaAnalysis } from '../chem/analyse';
import type { AnalysedDocument, BlockResult } from './document';

export interface VocabularyEntry {
  /** The display form (`CuSO₄·5H₂O`): the key. */
  key: string;
  /** The formula as first written (inserted by completion). */
  text: string;
  count: number;
  analysis: FormulaAnalysis;
}

export type Vocabulary = ReadonlyMap<string, VocabularyEntry>;

/** A substance worth offering: read without error, neutral, with a molar mass. */
export const isWeighable = (a: FormulaAnalysis): boolean => a.ok && a.charge === 0 && a.molarMass !== null && Number.isFinite(a.molarMass.value);

function add(into: Map<string, VocabularyEntry>, text: string, analysis: FormulaAnalysis, count = 1) {
  if (!isWeighable(analysis)) return;
  const key = analysis.display;
  const hit = into.get(key);
  if (hit) hit.count += count;
  else into.set(key, { key, text, count, analysis });
}

const byBlock = new WeakMap<BlockResult, Map<string, VocabularyEntry>>();
const byDoc = new WeakMap<AnalysedDocument, Vocabulary>();

function blockVocabulary(rel: BlockResult): Map<string, VocabularyEntry> {
  let v = byBlock.get(rel);
  if (v) return v;
  v = new Map();
  for (const f of rel.formulas) add(v, f.ref.text, f.analysis);
  for (const b of rel.batches) for (const i of b.analysis.ingredients) add(v, i.formulaText, i.analysis);
  byBlock.set(rel, v);
  return v;
}

/** The vocabulary of one analysed note (memoised per document and per block). */
export function documentVocabulary(doc: AnalysedDocument): Vocabulary {
  const hit = byDoc.get(doc);
  if (hit) return hit;
  const out = new Map<string, VocabularyEntry>();
  for (const b of doc.blocks) {
    const v = blockVocabulary(b.rel);
    if (v.size === 0) continue;
    for (const e of v.values()) {
      const have = out.get(e.key);
      if (have) have.count += e.count;
      else out.set(e.key, { ...e });
    }
  }
  byDoc.set(doc, out);
  return out;
}

/** Several vocabularies as one: counts added, the first text kept. */
export function mergeVocabularies(list: readonly Vocabulary[]): Vocabulary {
  if (list.length === 1) return list[0];
  const out = new Map<string, VocabularyEntry>();
  for (const v of list)
    for (const e of v.values()) {
      const have = out.get(e.key);
      if (have) have.count += e.count;
      else out.set(e.key, { ...e });
    }
  return out;
}
