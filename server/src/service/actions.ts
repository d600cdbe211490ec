/**
 * Code actions and the edits behind the editor commands: quick fixes that replace a formula with a
 * corrected one or an equation with its balanced form, and the insertion of computed tables.
 * Everything here returns edits; nothing is applied without the user asking.
 */
import type { ChemDiagnostic } from '../chem/diagnostic';
import { toLsp, type LspDiagnostic } from './diagnostics';
import type { AnalysedDocument } from './document';
import { formulasIn, targetAt } from './lookup';
import type { Range } from './positions';
import { formulaText } from './format';
import { batchTable, formulaTable, sectionsOf, sectionTables } from './tables';
import { formActions, scaleActions } from './batchEdits';

export interface TextEdit {
  range: Range;
  newText: string;
}

export interface CodeAction {
  title: string;
  kind: 'quickfix' | 'refactor.rewrite' | 'source';
  edits: TextEdit[];
  /** The diagnostic it fixes, by its range and code, and in LSP shape. */
  fixes?: { code: ChemDiagnostic['code']; range: Range; diagnostic: LspDiagnostic };
  isPreferred?: boolean;
}

const overlaps = (a: { start: number; end: number }, s: number, e: number) => a.start <= e && a.end >= s;

/** The offset range of the formula text that contains a diagnostic (a formula occurrence or a batch ingredient). */
function formulaRangeOf(doc: AnalysedDocument, d: ChemDiagnostic): { start: number; end: number } | undefined {
  for (const f of formulasIn(doc, d.start, Math.max(d.end, d.start + 1))) if (f.ref.start <= d.start && f.ref.end >= d.end) return f.ref;
  for (const b of doc.batches) {
    if (b.ref.start > d.start || b.ref.end < d.end) continue;
    const i = b.analysis.ingredients.find((x) => x.formulaStart <= d.start && x.formulaEnd >= d.end);
    if (i) return { start: i.formulaStart, end: i.formulaEnd };
    const l = b.analysis.skipped.find((x) => x.formulaStart !== undefined && x.formulaStart <= d.start && (x.formulaEnd as number) >= d.end);
    if (l) return { start: l.formulaStart as number, end: l.formulaEnd as number };
  }
  return undefined;
}

/** Quick fixes for the diagnostics that touch [start, end]. */
export function quickFixes(doc: AnalysedDocument, start: number, end: number): CodeAction[] {
  const out: CodeAction[] = [];
  for (const d of doc.diagnostics) {
    if (!overlaps(d, start, end)) continue;
    const diagnostic = toLsp(doc.lines, d);
    const fixes = { code: d.code, range: diagnostic.range, diagnostic };
    const suggestions = (d.data?.suggestions as string[] | undefined) ?? [];
    if (d.code === 'charge-imbalance') {
      const target = formulaRangeOf(doc, d);
      if (!target) continue;
      // The title in Unicode notation; the edit in the notation the user wrote (the suggestion as made).
      suggestions.forEach((sug, k) =>
        out.push({
          title: `Replace with ${formulaText(sug)}`,
          kind: 'quickfix',
          edits: [{ range: doc.lines.range(target.start, target.end), newText: sug }],
          fixes,
          isPreferred: k === 0,
        }),
      );
    } else if (d.code === 'unknown-element') {
      suggestions.forEach((sug, k) =>
        out.push({
          title: `Change to '${sug}'`,
          kind: 'quickfix',
          edits: [{ range: doc.lines.range(d.start, d.end), newText: sug }],
          fixes,
          isPreferred: k === 0 && suggestions.length === 1,
        }),
      );
    } else if (d.code === 'unbalanced-equation' && typeof d.data?.balanced === 'string') {
      out.push({
        title: typeof d.data.display === 'string' ? `Balance the equation: ${d.data.display}` : 'Balance the equation',
        kind: 'quickfix',
        edits: [{ range: doc.lines.range(d.start, d.end), newText: d.data.balanced as string }],
        fixes,
        isPreferred: true,
      });
    }
  }
  return out;
}

/** An edit to insert, or why there is none. */
export type EditOutcome = { edit: TextEdit; title?: string } | { reason: string };

/** The document's own line ending: that of its first line (LF when it has a single line). */
export function lineEnding(text: string): string {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 10) return '\n';
    if (c === 13) return text.charCodeAt(i + 1) === 10 ? '\r\n' : '\r';
  }
  return '\n';
}

/** The whole block (all its pieces) that contains `offset`, or the last one before it. */
function blockAround(doc: AnalysedDocument, offset: number): { start: number; end: number; open: boolean } | undefined {
  const blocks = doc.blocks;
  let lo = 0;
  let hi = blocks.length - 1;
  let i = -1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (blocks[mid].start <= offset) {
      i = mid;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  if (i < 0) return undefined;
  while (i > 0 && blocks[i].cont) i--;
  let j = i;
  while (j + 1 < blocks.length && blocks[j + 1].cont) j++;
  return { start: blocks[i].start, end: blocks[j].end, open: !!blocks[j].open };
}

/**
 * Insert a table after the block that holds `offset` (or the last block before it), never inside a fence
 * or a paragraph, with a blank line before and after it, in the document's own line ending.
 */
function insertAfterBlock(doc: AnalysedDocument, offset: number, table: string): EditOutcome {
  const text = doc.text;
  const eol = lineEnding(text);
  const body = table.replace(/\s+$/, '').replace(/\r\n|\r|\n/g, eol);
  const block = blockAround(doc, offset);
  if (!block) {
    const at = doc.lines.positionAt(0);
    return { edit: { range: { start: at, end: at }, newText: body + eol + eol } };
  }
  if (block.open) return { reason: 'the block here is a fence that is never closed, so anything after it would be inside it; close the fence first' };
  // The end of the block's last line (its content, before the line ending).
  let end = block.end;
  while (end > block.start && (text.charCodeAt(end - 1) === 10 || text.charCodeAt(end - 1) === 13)) end--;
  let next = end;
  if (text.charCodeAt(next) === 13) next++;
  if (text.charCodeAt(next) === 10) next++;
  const atEnd = next >= text.length;
  let blankAfter = true;
  if (!atEnd) {
    for (let k = next; k < text.length; k++) {
      const c = text.charCodeAt(k);
      if (c === 10 || c === 13) break;
      if (c !== 32 && c !== 9) {
        blankAfter = false;
        break;
      }
    }
  }
  const pos = doc.lines.positionAt(end);
  const newText = eol + eol + body + (atEnd ? eol : blankAfter ? '' : eol);
  return { edit: { range: { start: pos, end: pos }, newText } };
}

/** The edit that inserts the computed table for what is at the cursor: the batch, else the paragraph's formulas. */
export function tableEditAt(doc: AnalysedDocument, offset: number): EditOutcome {
  const t = targetAt(doc, offset);
  if (t && (t.kind === 'batch-line' || t.kind === 'batch-header')) {
    const outcome = insertAfterBlock(doc, t.occ.ref.start, batchTable(t.occ.analysis, doc.settings));
    return 'edit' in outcome ? { ...outcome, title: `Insert the table of batch '${t.occ.analysis.name ?? 'batch'}' below it` } : outcome;
  }
  const block = blockAround(doc, offset);
  if (!block || offset > block.end) return { reason: 'there are no formulas here to tabulate' };
  const formulas = formulasIn(doc, block.start, block.end + 1);
  const table = formulas.length
    ? formulaTable(
        formulas.map((f) => f.analysis),
        doc.settings,
      )
    : '';
  if (!table) return { reason: 'there are no formulas here to tabulate' };
  const outcome = insertAfterBlock(doc, block.start, table);
  return 'edit' in outcome ? { ...outcome, title: 'Insert a table of these formulas below the paragraph' } : outcome;
}

/** The edit for the formulas in a selection (or, with an empty selection, the whole section at the cursor). */
export function tableEditForSelection(doc: AnalysedDocument, start: number, end: number): EditOutcome {
  if (end > start) {
    const formulas = formulasIn(doc, start, end);
    const table = formulaTable(
      formulas.map((f) => f.analysis),
      doc.settings,
    );
    if (!table) return { reason: 'there are no formulas in the selection to tabulate' };
    // After the block where the selection ends: a selection ending mid-paragraph does not split it.
    return insertAfterBlock(doc, Math.max(start, end - 1), table);
  }
  return sectionTableEdit(doc, start);
}

/** The tables of the whole section at the cursor, inserted after the section's last block. */
export function sectionTableEdit(doc: AnalysedDocument, offset: number): EditOutcome {
  const sections = sectionsOf(doc);
  const s = [...sections].reverse().find((x) => x.start <= offset) ?? sections[0];
  if (!s) return { reason: 'there is nothing to tabulate in this section' };
  const tables = sectionTables(s, doc.settings);
  if (!tables) return { reason: 'there is nothing to tabulate in this section' };
  // The section ends where the next heading starts: after its last block, before that heading.
  let endOffset = s.end;
  while (endOffset > s.start && /\s/.test(doc.text[endOffset - 1])) endOffset--;
  return insertAfterBlock(doc, Math.max(s.start, endOffset - 1), tables);
}

/** All code actions for a range. */
export function codeActions(doc: AnalysedDocument, start: number, end: number, only?: string[]): CodeAction[] {
  const want = (kind: string) => !only || only.length === 0 || only.some((o) => kind === o || kind.startsWith(o + '.'));
  const out: CodeAction[] = [];
  if (want('quickfix')) out.push(...quickFixes(doc, start, end), ...formActions(doc, start, end));
  if (want('refactor.rewrite')) {
    const t = tableEditAt(doc, start);
    if ('edit' in t) out.push({ title: t.title ?? 'Insert a table', kind: 'refactor.rewrite', edits: [t.edit] });
    out.push(...scaleActions(doc, start));
  }
  return out;
}
