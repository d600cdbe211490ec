/**
 * Code actions and the edits behind the editor commands: quick fixes that replace a formula with a
 * corrected one or an equation with its balanced form, and the insertion of computed tables.
 * Everything here returns edits; nothing is applied without the user asking.
 */
import type { ChemDiagnostic } from '../chem/diagnostic';
import type { AnalysedDocument } from './document';
import { formulasIn, targetAt } from './lookup';
import type { Range } from './positions';
import { batchTable, formulaTable, sectionsOf, sectionTables } from './tables';

export interface TextEdit {
  range: Range;
  newText: string;
}

export interface CodeAction {
  title: string;
  kind: 'quickfix' | 'refactor.rewrite' | 'source';
  edits: TextEdit[];
  /** The diagnostic it fixes, by its range and code. */
  fixes?: { code: string; range: Range };
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
    const fixes = { code: d.code, range: doc.lines.range(d.start, d.end) };
    const suggestions = (d.data?.suggestions as string[] | undefined) ?? [];
    if (d.code === 'charge-imbalance') {
      const target = formulaRangeOf(doc, d);
      if (!target) continue;
      suggestions.forEach((sug, k) => out.push({ title: `Replace with ${sug}`, kind: 'quickfix', edits: [{ range: doc.lines.range(target.start, target.end), newText: sug }], fixes, isPreferred: k === 0 }));
    } else if (d.code === 'unknown-element') {
      suggestions.forEach((sug, k) => out.push({ title: `Change to '${sug}'`, kind: 'quickfix', edits: [{ range: doc.lines.range(d.start, d.end), newText: sug }], fixes, isPreferred: k === 0 && suggestions.length === 1 }));
    } else if (d.code === 'unbalanced-equation' && typeof d.data?.balanced === 'string') {
      out.push({ title: 'Balance the equation', kind: 'quickfix', edits: [{ range: doc.lines.range(d.start, d.end), newText: d.data.balanced as string }], fixes, isPreferred: true });
    }
  }
  return out;
}

/** Where a table goes: after the end of the line that ends the block, with a blank line around it. */
function insertAfter(doc: AnalysedDocument, offset: number, table: string): TextEdit {
  const p = doc.lines.positionAt(offset);
  const nextLine = p.line + 1;
  const atEnd = nextLine >= doc.lines.lineCount;
  const pos = atEnd ? doc.lines.positionAt(doc.text.length) : { line: nextLine, character: 0 };
  return { range: { start: pos, end: pos }, newText: atEnd ? `\n\n${table}\n` : `\n${table}\n\n` };
}

/** The paragraph (run of non-blank lines) around an offset, in offsets. */
function paragraphAround(doc: AnalysedDocument, offset: number): { start: number; end: number } {
  const text = doc.text;
  const { line } = doc.lines.positionAt(offset);
  const lineText = (n: number) => text.slice(doc.lines.starts[n], n + 1 < doc.lines.lineCount ? doc.lines.starts[n + 1] : text.length);
  let a = line;
  let b = line;
  while (a > 0 && lineText(a - 1).trim() !== '') a--;
  while (b + 1 < doc.lines.lineCount && lineText(b + 1).trim() !== '') b++;
  const endLine = lineText(b).replace(/\r?\n$|\r$/, '');
  return { start: doc.lines.starts[a], end: doc.lines.starts[b] + endLine.length };
}

/** The edit that inserts the computed table for what is at the cursor: the batch, else the paragraph's formulas. */
export function tableEditAt(doc: AnalysedDocument, offset: number): { title: string; edit: TextEdit } | undefined {
  const t = targetAt(doc, offset);
  if (t && (t.kind === 'batch-line' || t.kind === 'batch-header')) {
    return { title: `Insert the table of batch '${t.occ.analysis.name ?? 'batch'}' below it`, edit: insertAfter(doc, t.occ.ref.end, batchTable(t.occ.analysis, doc.settings)) };
  }
  const para = paragraphAround(doc, offset);
  const formulas = formulasIn(doc, para.start, para.end + 1);
  if (formulas.length === 0) return undefined;
  const table = formulaTable(formulas.map((f) => f.analysis), doc.settings);
  if (!table) return undefined;
  return { title: 'Insert a table of these formulas below the paragraph', edit: insertAfter(doc, para.end, table) };
}

/** The edit for the formulas in a selection (or, with an empty selection, the whole section at the cursor). */
export function tableEditForSelection(doc: AnalysedDocument, start: number, end: number): TextEdit | undefined {
  if (end > start) {
    const formulas = formulasIn(doc, start, end);
    const table = formulaTable(formulas.map((f) => f.analysis), doc.settings);
    if (!table) return undefined;
    return insertAfter(doc, end, table);
  }
  return sectionTableEdit(doc, start);
}

/** The tables of the whole section at the cursor, inserted at the end of the section. */
export function sectionTableEdit(doc: AnalysedDocument, offset: number): TextEdit | undefined {
  const sections = sectionsOf(doc);
  const s = [...sections].reverse().find((x) => x.start <= offset) ?? sections[0];
  if (!s) return undefined;
  const tables = sectionTables(s, doc.settings);
  if (!tables) return undefined;
  // The section ends where the next heading starts: insert before it.
  let endOffset = s.end;
  while (endOffset > 0 && /\s/.test(doc.text[endOffset - 1])) endOffset--;
  return insertAfter(doc, endOffset, tables);
}

/** All code actions for a range. */
export function codeActions(doc: AnalysedDocument, start: number, end: number, only?: string[]): CodeAction[] {
  const want = (kind: string) => !only || only.length === 0 || only.some((o) => kind === o || kind.startsWith(o + '.'));
  const out: CodeAction[] = [];
  if (want('quickfix')) out.push(...quickFixes(doc, start, end));
  if (want('refactor.rewrite')) {
    const t = tableEditAt(doc, start);
    if (t) out.push({ title: t.title, kind: 'refactor.rewrite', edits: [t.edit] });
  }
  return out;
}
