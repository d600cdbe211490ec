/**
 * The analysed document: every formula, equation and batch of a notes document analysed, with its
 * diagnostics at absolute offsets.
 *
 * It is built block by block (Markdown blocks; `.fnote` lines and batch blocks). Each block's result is
 * memoised by its text, so re-analysing a document whose blocks are mostly unchanged costs little, and
 * `updateDocument` re-splits only the blocks around an edit and shifts the ones after it.
 */
import { analyseFormula, type FormulaAnalysis } from '../chem/analyse';
import { analyseBatch, type BatchAnalysis } from '../chem/batch';
import { shiftDiagnostic, type ChemDiagnostic } from '../chem/diagnostic';
import { analyseReaction, type ReactionAnalysis } from '../chem/equation';
import { closesFnoteBatch, markdownBlocksFrom, opensFnoteBatch, readLine, scanDocument, scanMarkdownBlock, type MdBlock } from '../notes/scan';
import type { BatchRef, FormulaRef, LineRef, NoteItem, NotesLanguage, ReactionRef, SectionRef } from '../notes/types';
import { LineIndex } from './positions';
import { DEFAULT_SETTINGS, type ServiceSettings } from './settings';

export interface FormulaOccurrence {
  ref: FormulaRef;
  analysis: FormulaAnalysis;
}

export interface ReactionOccurrence {
  ref: ReactionRef;
  analysis: ReactionAnalysis;
}

export interface BatchOccurrence {
  ref: BatchRef;
  analysis: BatchAnalysis;
}

/** The analysis of one block, at offsets relative to the block's start (shared between equal blocks). */
export interface BlockResult {
  formulas: FormulaOccurrence[];
  reactions: ReactionOccurrence[];
  batches: BatchOccurrence[];
  diagnostics: ChemDiagnostic[];
  heading?: { title: string; level: number; start: number; headingEnd: number };
}

/** A block placed in a document: moving it is O(1); its items are shifted only when read. */
export interface PlacedBlock {
  start: number;
  end: number;
  rel: BlockResult;
}

export interface AnalysedDocument {
  text: string;
  language: NotesLanguage;
  lines: LineIndex;
  /** Items at absolute offsets, in document order (materialised on first use). */
  readonly formulas: FormulaOccurrence[];
  readonly reactions: ReactionOccurrence[];
  readonly batches: BatchOccurrence[];
  /** Every finding, absolute offsets, in document order. */
  readonly diagnostics: ChemDiagnostic[];
  readonly sections: SectionRef[];
  settings: ServiceSettings;
  blocks: PlacedBlock[];
  /** The block containing `offset` (or ending right at it), if any. */
  blockAt(offset: number): PlacedBlock | undefined;
}

export function languageOf(fileName: string): NotesLanguage | undefined {
  const lower = fileName.toLowerCase();
  if (lower.endsWith('.fnote')) return 'fnote';
  if (lower.endsWith('.md') || lower.endsWith('.markdown')) return 'markdown';
  return undefined;
}

// ── one block ─────────────────────────────────────────────────────────────

const EMPTY: BlockResult = Object.freeze({ formulas: [], reactions: [], batches: [], diagnostics: [] }) as never;

/** A scanned item moved by `by` characters. */
function shiftItem(item: NoteItem, by: number): NoteItem {
  return item.kind === 'formula' ? shiftFormulaRef(item, by) : item.kind === 'reaction' ? shiftReactionRef(item, by) : shiftBatchRef(item, by);
}

/** Analyse the scanned items of a block (offsets relative to the block). */
function analyseItems(items: readonly NoteItem[], language: NotesLanguage, settings: ServiceSettings, heading?: BlockResult['heading']): BlockResult {
  const formulas: FormulaOccurrence[] = [];
  const reactions: ReactionOccurrence[] = [];
  const batches: BatchOccurrence[] = [];
  const diagnostics: ChemDiagnostic[] = [];
  for (const item of items) {
    if (item.kind === 'formula') {
      const analysis = analyseFormula(item.text, settings.chem);
      formulas.push({ ref: item, analysis });
      for (const d of analysis.diagnostics) {
        if (d.severity === 'information' && item.source === 'prose') continue;
        diagnostics.push(shiftDiagnostic(d, item.start));
      }
    } else if (item.kind === 'reaction') {
      const analysis = analyseReaction(item.text);
      reactions.push({ ref: item, analysis });
      for (const d of analysis.diagnostics) diagnostics.push(shiftDiagnostic(d, item.start));
    } else {
      const analysis = analyseBatch(item.lines, item.openName?.text ?? null, settings.chem);
      batches.push({ ref: item, analysis });
      diagnostics.push(...analysis.diagnostics);
      if (!item.closed) {
        diagnostics.push({
          code: 'batch-unclosed', severity: 'warning', start: item.open.start, end: item.open.end,
          message: language === 'fnote' ? "This batch has no 'end' line; it runs to the end of the file." : 'This batch block is never closed; it runs to the end of the document.',
        });
      }
    }
  }
  diagnostics.sort((a, b) => a.start - b.start || a.end - b.end);
  return heading ? { formulas, reactions, batches, diagnostics, heading } : { formulas, reactions, batches, diagnostics };
}

/** Scan and analyse one block; offsets relative to the block's start. */
function analyseBlock(text: string, b: Span, language: NotesLanguage, settings: ServiceSettings): BlockResult {
  if (language === 'fnote') {
    const scan = scanDocument(text.slice(b.start, b.end), 'fnote', { prose: settings.prose });
    const h = scan.sections[0];
    return analyseItems(scan.items, language, settings, h ? { title: h.title, level: h.level, start: h.start, headingEnd: h.headingEnd } : undefined);
  }
  const md = b as MdBlock;
  const items: NoteItem[] = [];
  scanMarkdownBlock(text, md, { prose: settings.prose }, items);
  const rel = items.map((i) => shiftItem(i, -b.start));
  const heading = md.kind === 'heading'
    ? { title: text.slice(md.titleStart, md.titleEnd).replace(/\s+/g, ' '), level: md.level as number, start: 0, headingEnd: b.end - b.start }
    : undefined;
  return analyseItems(rel, language, settings, heading);
}

const shiftLine = (x: LineRef, by: number): LineRef => ({ text: x.text, start: x.start + by, end: x.end + by });
const shiftFormulaRef = (x: FormulaRef, by: number): FormulaRef => ({ kind: 'formula', text: x.text, start: x.start + by, end: x.end + by, source: x.source });
const shiftReactionRef = (x: ReactionRef, by: number): ReactionRef => ({ kind: 'reaction', text: x.text, start: x.start + by, end: x.end + by, source: x.source });
const shiftBatchRef = (r: BatchRef, by: number): BatchRef => {
  const out: BatchRef = { kind: 'batch', start: r.start + by, end: r.end + by, open: shiftLine(r.open, by), lines: r.lines.map((l) => shiftLine(l, by)), closed: r.closed };
  if (r.openName) out.openName = shiftLine(r.openName, by);
  return out;
};

export function shiftBatch(b: BatchOccurrence, by: number): BatchOccurrence {
  const r = b.ref;
  const a = b.analysis;
  return {
    ref: shiftBatchRef(r, by),
    analysis: {
      ...a,
      diagnostics: a.diagnostics.map((d) => shiftDiagnostic(d, by)),
      ingredients: a.ingredients.map((i) => ({
        ...i, lineStart: i.lineStart + by, lineEnd: i.lineEnd + by, formulaStart: i.formulaStart + by, formulaEnd: i.formulaEnd + by, amount: { ...i.amount, start: i.amount.start + by, end: i.amount.end + by },
      })),
      skipped: a.skipped.map((l) => ({
        ...l, lineStart: l.lineStart + by, lineEnd: l.lineEnd + by, ...(l.formulaStart !== undefined ? { formulaStart: l.formulaStart + by, formulaEnd: (l.formulaEnd as number) + by } : {}),
      })),
    },
  };
}

export const shiftFormula = (f: FormulaOccurrence, by: number): FormulaOccurrence => (by === 0 ? f : { ref: shiftFormulaRef(f.ref, by), analysis: f.analysis });
export const shiftReaction = (r: ReactionOccurrence, by: number): ReactionOccurrence => (by === 0 ? r : { ref: shiftReactionRef(r.ref, by), analysis: r.analysis });
export { shiftDiagnostic };

/** Block results memoised by text, per settings object (settings objects are interned by the server). */
const blockCaches = new WeakMap<ServiceSettings, Map<string, Map<string, BlockResult>>>();
const BLOCK_CACHE_LIMIT = 200_000;

function blockResult(text: string, b: Span, language: NotesLanguage, settings: ServiceSettings): PlacedBlock {
  const { start, end, kind } = b;
  if (kind === 'code' || kind === 'html') return { start, end, rel: EMPTY };
  let byKind = blockCaches.get(settings);
  if (!byKind) blockCaches.set(settings, (byKind = new Map()));
  const k = language + kind;
  let cache = byKind.get(k);
  if (!cache) byKind.set(k, (cache = new Map()));
  const sub = text.slice(start, end);
  let rel = cache.get(sub);
  if (!rel) {
    rel = analyseBlock(text, b, language, settings);
    if (cache.size >= BLOCK_CACHE_LIMIT) cache.clear();
    cache.set(sub, rel);
  }
  return { start, end, rel };
}

// ── splitting ─────────────────────────────────────────────────────────────

interface Span {
  start: number;
  end: number;
  kind: string;
}

/** `.fnote` blocks: one per line, except a `batch` … `end` block, which is one. */
function fnoteBlocksFrom(text: string, from: number, stopAt?: (pos: number) => boolean): { blocks: Span[]; stoppedAt: number | null } {
  const blocks: Span[] = [];
  let pos = from;
  while (pos < text.length) {
    if (stopAt && pos > from && stopAt(pos)) return { blocks, stoppedAt: pos };
    const l = readLine(text, pos);
    const body = text.slice(l.start, l.end).trimStart();
    if (opensFnoteBatch(body)) {
      let last = l;
      while (last.next < text.length) {
        const nl = readLine(text, last.next);
        last = nl;
        if (closesFnoteBatch(text.slice(nl.start, nl.end).trimStart())) break;
      }
      blocks.push({ start: l.start, end: last.end, kind: 'batch' });
      pos = last.next;
    } else {
      if (body.trim() !== '') blocks.push({ start: l.start, end: l.end, kind: 'line' });
      pos = l.next;
    }
  }
  return { blocks, stoppedAt: null };
}

function split(text: string, language: NotesLanguage, from: number, stopAt?: (pos: number) => boolean): { blocks: Span[]; stoppedAt: number | null } {
  return language === 'fnote' ? fnoteBlocksFrom(text, from, stopAt) : markdownBlocksFrom(text, from, stopAt);
}

// ── assembling ────────────────────────────────────────────────────────────

class Doc implements AnalysedDocument {
  private cache: { f?: FormulaOccurrence[]; r?: ReactionOccurrence[]; b?: BatchOccurrence[]; d?: ChemDiagnostic[]; s?: SectionRef[] } = {};

  constructor(
    readonly text: string,
    readonly language: NotesLanguage,
    readonly settings: ServiceSettings,
    readonly blocks: PlacedBlock[],
    readonly lines: LineIndex,
  ) {}

  get sections(): SectionRef[] {
    if (this.cache.s) return this.cache.s;
    const heads: NonNullable<BlockResult['heading']>[] = [];
    for (const b of this.blocks) if (b.rel.heading) heads.push({ ...b.rel.heading, start: b.rel.heading.start + b.start, headingEnd: b.rel.heading.headingEnd + b.start });
    return (this.cache.s = heads.map((h, k) => ({ ...h, end: k + 1 < heads.length ? heads[k + 1].start : this.text.length })));
  }

  private collect<T>(pick: (r: BlockResult) => T[], shift: (x: T, by: number) => T): T[] {
    const out: T[] = [];
    for (const b of this.blocks) for (const x of pick(b.rel)) out.push(shift(x, b.start));
    return out;
  }

  get formulas() {
    return (this.cache.f ??= this.collect((r) => r.formulas, shiftFormula));
  }
  get reactions() {
    return (this.cache.r ??= this.collect((r) => r.reactions, shiftReaction));
  }
  get batches() {
    return (this.cache.b ??= this.collect((r) => r.batches, shiftBatch));
  }
  get diagnostics() {
    return (this.cache.d ??= this.collect((r) => r.diagnostics, shiftDiagnostic));
  }

  blockAt(offset: number): PlacedBlock | undefined {
    let lo = 0;
    let hi = this.blocks.length - 1;
    let ans = -1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      if (this.blocks[mid].start <= offset) {
        ans = mid;
        lo = mid + 1;
      } else hi = mid - 1;
    }
    const b = ans >= 0 ? this.blocks[ans] : undefined;
    return b && offset <= b.end ? b : undefined;
  }
}

export function analyseDocument(text: string, language: NotesLanguage, settings: ServiceSettings = DEFAULT_SETTINGS): AnalysedDocument {
  const { blocks } = split(text, language, 0);
  const results = blocks.map((b) => blockResult(text, b, language, settings));
  return new Doc(text, language, settings, results, new LineIndex(text));
}

/** Where two versions of a text differ: [start, oldEnd) in the old text became [start, newEnd) in the new. */
export interface ChangeHint {
  start: number;
  oldEnd: number;
  newEnd: number;
}

/** The changed region by common prefix and suffix. */
export function diffRegion(a: string, b: string): ChangeHint {
  const n = Math.min(a.length, b.length);
  let p = 0;
  while (p < n && a.charCodeAt(p) === b.charCodeAt(p)) p++;
  let q = 0;
  while (q < n - p && a.charCodeAt(a.length - 1 - q) === b.charCodeAt(b.length - 1 - q)) q++;
  return { start: p, oldEnd: a.length - q, newEnd: b.length - q };
}

const precededByBlank = (text: string, pos: number): boolean => {
  if (pos === 0) return true;
  // The line before `pos` is blank: only spaces or tabs between the two line breaks.
  let i = pos - 1;
  if (text.charCodeAt(i) === 10 && text.charCodeAt(i - 1) === 13) i--;
  if (text.charCodeAt(i) !== 10 && text.charCodeAt(i) !== 13) return false;
  i--;
  while (i >= 0 && (text.charCodeAt(i) === 32 || text.charCodeAt(i) === 9)) i--;
  return i < 0 || text.charCodeAt(i) === 10 || text.charCodeAt(i) === 13;
};

/**
 * The analysed document for a new version of `prev.text`: blocks before the edit are kept, the blocks
 * around it are split and analysed again (from the block cache where their text is known), and the blocks
 * after it are moved. The result equals `analyseDocument(text, …)`; the tests check that.
 */
export function updateDocument(prev: AnalysedDocument, text: string, hint: ChangeHint = diffRegion(prev.text, text)): AnalysedDocument {
  const { language, settings } = prev;
  const old = prev.blocks;
  const delta = text.length - prev.text.length;
  // First block to redo: the last one starting at or before the edit, moved back to a clean restart point.
  let lo = 0;
  let hi = old.length - 1;
  let i0 = 0;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (old[mid].start <= hint.start) {
      i0 = mid;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  if (language === 'markdown') while (i0 > 0 && !precededByBlank(prev.text, old[i0].start)) i0--;
  const from = old.length && old[i0].start <= hint.start ? old[i0].start : 0;
  if (from === 0) i0 = 0;
  // Resume with the old blocks once a new block starts where an old one did, past the edit.
  let resumeAt = -1;
  const stopAt = (pos: number) => {
    if (pos < hint.newEnd) return false;
    const target = pos - delta;
    let a = i0;
    let b = old.length - 1;
    while (a <= b) {
      const mid = (a + b) >> 1;
      if (old[mid].start === target) {
        if (target >= hint.oldEnd) {
          resumeAt = mid;
          return true;
        }
        return false;
      }
      if (old[mid].start < target) a = mid + 1;
      else b = mid - 1;
    }
    return false;
  };
  const { blocks, stoppedAt } = split(text, language, from, stopAt);
  const fresh = blocks.map((b) => blockResult(text, b, language, settings));
  const kept = old.slice(0, i0);
  const moved = stoppedAt !== null && resumeAt >= 0 ? old.slice(resumeAt).map((b) => (delta === 0 ? b : { start: b.start + delta, end: b.end + delta, rel: b.rel })) : [];
  const lines = prev.lines.update(text, hint.start, hint.oldEnd, hint.newEnd);
  return new Doc(text, language, settings, kept.concat(fresh, moved), lines);
}
