/** Outline (document symbols) and code lenses: sections, batches and reactions. */
import type { AnalysedDocument } from './document';
import type { Range } from './positions';
import { plural, sig, volumeText } from './format';
import { batchWarnings, countsText, notCountedText, weighedMass } from './tables';

/** LSP SymbolKind values used here. */
export const SymbolKind = { Namespace: 3, Struct: 23, Event: 24 } as const;

export interface DocumentSymbol {
  name: string;
  detail?: string;
  kind: number;
  range: Range;
  selectionRange: Range;
  children: DocumentSymbol[];
}

export function documentSymbols(doc: AnalysedDocument): DocumentSymbol[] {
  const top: DocumentSymbol[] = [];
  const sections = doc.sections.map((s) => ({
    name: s.title || '(untitled section)',
    kind: SymbolKind.Namespace,
    range: doc.lines.range(s.start, s.end),
    selectionRange: doc.lines.range(s.start, s.headingEnd),
    children: [] as DocumentSymbol[],
    start: s.start,
  }));
  const home = (offset: number) => [...sections].reverse().find((s) => s.start <= offset)?.children ?? top;
  const items: Array<{ offset: number; sym: DocumentSymbol }> = [];
  for (const b of doc.batches) {
    const a = b.analysis;
    items.push({
      offset: b.ref.start,
      sym: {
        name: a.name ?? 'batch',
        detail: `${countsText(a)}${a.volumeL !== null ? `, ${volumeText(a.volumeL)}` : ''}`,
        kind: SymbolKind.Struct,
        range: doc.lines.range(b.ref.start, b.ref.end),
        selectionRange: doc.lines.range(b.ref.open.start, b.ref.open.end),
        children: [],
      },
    });
  }
  for (const r of doc.reactions) {
    items.push({
      offset: r.ref.start,
      sym: {
        name: r.ref.text.length > 60 ? r.ref.text.slice(0, 57) + '…' : r.ref.text,
        detail: r.analysis.balance.status === 'already-balanced' ? 'balanced' : 'not balanced',
        kind: SymbolKind.Event,
        range: doc.lines.range(r.ref.start, r.ref.end),
        selectionRange: doc.lines.range(r.ref.start, r.ref.end),
        children: [],
      },
    });
  }
  items.sort((x, y) => x.offset - y.offset);
  for (const it of items) home(it.offset).push(it.sym);
  return [...sections.map(({ start: _s, ...rest }) => rest), ...top].sort((a, b) => a.range.start.line - b.range.start.line);
}

export interface CodeLens {
  range: Range;
  title: string;
  /** Offset the lens's command acts on. */
  offset: number;
  /** What the lens does: nothing (it says the totals), insert the batch's table, or copy it as a weighing list (plain text). */
  action: 'none' | 'insertTable' | 'copyWeighingList';
}

/** Three lenses per batch: its totals at a glance, *Insert table* and *Copy as weighing list*. */
export function codeLenses(doc: AnalysedDocument): CodeLens[] {
  return doc.batches.flatMap((b): CodeLens[] => {
    const a = b.analysis;
    const bits = [plural(a.ingredients.length, 'ingredient')];
    if (a.skipped.length) bits.push(`⚠ ${notCountedText(a)} (incomplete)`);
    bits.push(`${sig(weighedMass(a))} g to weigh`);
    if (a.ionicStrengthM !== null) bits.push(`I = ${sig(a.ionicStrengthM, 3)} M`);
    const warnings = batchWarnings(a).length;
    if (warnings) bits.push(`⚠ ${plural(warnings, 'warning')}`);
    if (a.cautions.length) bits.push('⚠ cautions');
    const range = doc.lines.range(b.ref.open.start, b.ref.open.end);
    const offset = b.ref.open.start;
    return [
      { range, title: bits.join(' · '), offset, action: 'none' },
      { range, title: 'Insert table', offset, action: 'insertTable' },
      { range, title: 'Copy as weighing list', offset, action: 'copyWeighingList' },
    ];
  });
}
