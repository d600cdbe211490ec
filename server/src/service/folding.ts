/**
 * Folding ranges (LSP `textDocument/foldingRange`): each batch block (from its opening line to its
 * closing line), each fenced reaction block, and each section (from its heading to the last non-blank
 * line before the next heading of the same or a higher level, so that a section folds with its
 * subsections).
 */
import type { AnalysedDocument } from './document';
import { plural } from './format';

/** LSP FoldingRangeKind. */
export const FoldingKind = { Region: 'region' } as const;

export interface FoldingRange {
  startLine: number;
  endLine: number;
  kind?: string;
  /** What a folded range shows (LSP 3.17; clients that do not support it show their own). */
  collapsedText?: string;
}

/** The last line at or before `offset` that is not blank, but not before `floorLine`. */
function lastFilledLine(doc: AnalysedDocument, offset: number, floorLine: number): number {
  let line = doc.lines.positionAt(offset).line;
  const starts = doc.lines.starts;
  // An offset at the very start of a line belongs to the range before it only through the line above.
  if (offset > 0 && starts[line] === offset) line--;
  while (line > floorLine) {
    const s = starts[line];
    const e = line + 1 < starts.length ? starts[line + 1] : doc.text.length;
    if (doc.text.slice(s, e).trim() !== '') break;
    line--;
  }
  return line;
}

/** The line of the last character of [start, end) (a range ending right after a line break ends on the line before). */
function endLineOf(doc: AnalysedDocument, start: number, end: number): number {
  const p = doc.lines.positionAt(end);
  return p.character === 0 && end > start ? p.line - 1 : p.line;
}

export function foldingRanges(doc: AnalysedDocument): FoldingRange[] {
  const out: FoldingRange[] = [];
  const sections = doc.sections;
  for (let k = 0; k < sections.length; k++) {
    const s = sections[k];
    let end = doc.text.length;
    for (let j = k + 1; j < sections.length; j++)
      if (sections[j].level <= s.level) {
        end = sections[j].start;
        break;
      }
    const startLine = doc.lines.positionAt(s.start).line;
    const endLine = lastFilledLine(doc, end, startLine);
    if (endLine > startLine) out.push({ startLine, endLine, kind: FoldingKind.Region, collapsedText: s.title });
  }
  // Batches and fenced reaction blocks, read from the blocks where they are (block-relative offsets, so
  // that no batch is copied to absolute offsets for this).
  for (const blk of doc.blocks) {
    for (const b of blk.rel.batches) {
      const start = blk.start + b.ref.start;
      const startLine = doc.lines.positionAt(start).line;
      const endLine = endLineOf(doc, start, blk.start + b.ref.end);
      const a = b.analysis;
      const name = a.name ? `batch ${a.name}` : 'batch';
      if (endLine > startLine) out.push({ startLine, endLine, collapsedText: `${name} · ${plural(a.ingredients.length, 'ingredient')}` });
    }
    const first = blk.rel.reactions[0];
    if (!first || first.ref.source !== 'fence') continue;
    const startLine = doc.lines.positionAt(blk.start).line;
    const endLine = endLineOf(doc, blk.start, blk.end);
    if (endLine > startLine) out.push({ startLine, endLine, collapsedText: `reaction · ${plural(blk.rel.reactions.length, 'equation')}` });
  }
  return out.sort((x, y) => x.startLine - y.startLine || y.endLine - x.endLine);
}
