/**
 * The analysed document: every formula, equation and batch of a notes document analysed, with its
 * diagnostics at absolute offsets.
 *
 * It is built block by block (Markdown blocks; `.fnote` lines and batch blocks). Each block's result is
 * memoised by its text, so re-analysing a document whose blocks are mostly unchanged costs little, and
 * `updateDocument` re-splits only the blocks around an edit and shifts the ones after it.
 */
import { analyseFormula, type FormulaAnalysis } from '../chem/analyse';
import { analyseBatch, type BatchAnalysis, type BatchContext, type StockBatch } from '../chem/batch';
import { anhydrousOf } from '../chem/batch';
import { parseShelf, type Shelf, type ShelfEntry } from '../chem/reagents';
import { squash } from '../chem/names/words';
import { shiftDiagnostic, type ChemDiagnostic } from '../chem/diagnostic';
import { analyseReaction, type ReactionAnalysis } from '../chem/equation';
import { BoundedCache, detach } from '../chem/cache';
import {
  closesFnoteBatch,
  markdownBlocksFrom,
  opensFnoteBatch,
  opensFnoteShelf,
  readLine,
  scanDocument,
  scanMarkdownBlock,
  shiftMdBlock,
  type MdBlock,
} from '../notes/scan';
import type { BatchRef, FormulaRef, LineRef, NoteItem, NotesLanguage, ReactionRef, SectionRef, ShelfRef } from '../notes/types';
import { LineIndex, type Range } from './positions';
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

export interface ShelfOccurrence {
  ref: ShelfRef;
  shelf: Shelf;
}

/**
 * What a block's batches were read with besides their own text: the shelf (by its key; '' for none) and
 * the stocks they asked for (by name, with the key of the stock batch found, '' where none was). A block
 * result is valid for a document only while these still hold there.
 */
export interface BlockDeps {
  shelf: string;
  stocks: Array<[string, string]>;
}

/** The analysis of one block, at offsets relative to the block's start (shared between equal blocks). */
export interface BlockResult {
  formulas: FormulaOccurrence[];
  reactions: ReactionOccurrence[];
  batches: BatchOccurrence[];
  diagnostics: ChemDiagnostic[];
  heading?: { title: string; level: number; start: number; headingEnd: number };
  /** Shelf blocks of the block. */
  shelves?: ShelfOccurrence[];
  /** Where the block has batches: what they were read with, and the block as split (relative), to read it again. */
  deps?: BlockDeps;
  span?: Span;
}

/**
 * The context of a document's batches: its shelf (its own shelf blocks, else the workspace's) and the
 * document's batches by name as stocks.
 */
export interface DocumentContext {
  shelf?: Shelf;
  /** Identifies the shelf's content ('' without a shelf). */
  shelfKey: string;
  /** A stock batch by name, with a key identifying its content ('' where there is none). */
  stock(name: string): { batch?: StockBatch; key: string };
}

/** A shelf from outside the document (the workspace's `shelf.md`): used where the document has none of its own. */
export interface WorkspaceShelf {
  shelf: Shelf;
  /** Where it was read (a URI or a path), for the hover. */
  source: string;
  /** The range of offsets of the shelf file (its entries' spans), for go-to-definition; absent: not known. */
  rangeOf?: (start: number, end: number) => Range;
}

/** The finding on the opening line of a batch or shelf block that is never closed. */
function unclosed(what: 'batch' | 'shelf', open: { start: number; end: number }, language: NotesLanguage): ChemDiagnostic {
  return {
    code: 'batch-unclosed',
    severity: 'warning',
    start: open.start,
    end: open.end,
    message:
      language === 'fnote'
        ? `This ${what} has no 'end' line; it runs to the end of the file.`
        : `This ${what} block is never closed; it runs to the end of the document.`,
  };
}

/** Whether a note is a workspace's shelf file: `shelf.md`, `<anything>.shelf.md`, `shelf.fnote` (any case; a path or a URI). */
export const isShelfFile = (uriOrPath: string): boolean => SHELF_FILE.test(uriOrPath);
const SHELF_FILE = /(?:^|[/\\.])shelf\.(?:md|markdown|fnote)$/i;

export interface DocumentOptions {
  workspaceShelf?: WorkspaceShelf;
}

/** A block placed in a document: moving it is O(1); its items are shifted only when read. */
export interface PlacedBlock {
  start: number;
  end: number;
  rel: BlockResult;
  /** A piece of a long block after its first (see LONG_BLOCK). */
  cont: boolean;
  /** A fence or `.fnote` batch never closed: it runs to the end of the document. */
  open: boolean;
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
  /** The document's shelf blocks, absolute offsets. */
  readonly shelves: ShelfOccurrence[];
  /** The shelf its batches are read with: its own (all its shelf blocks), else the workspace's, else none. */
  readonly shelf: { shelf: Shelf; source: 'document' | string } | undefined;
  readonly options: DocumentOptions;
}

export function languageOf(fileName: string): NotesLanguage | undefined {
  const lower = fileName.toLowerCase();
  if (lower.endsWith('.fnote')) return 'fnote';
  if (lower.endsWith('.md') || lower.endsWith('.markdown')) return 'markdown';
  return undefined;
}

// ── one block ─────────────────────────────────────────────────────────────

const EMPTY: BlockResult = Object.freeze({ formulas: [], reactions: [], batches: [], diagnostics: [] }) as never;

/** Analyse the scanned items of a block (offsets relative to the block). */
function analyseItems(
  items: readonly NoteItem[],
  language: NotesLanguage,
  settings: ServiceSettings,
  ctx: DocumentContext,
  heading?: BlockResult['heading'],
): BlockResult {
  const formulas: FormulaOccurrence[] = [];
  const reactions: ReactionOccurrence[] = [];
  const batches: BatchOccurrence[] = [];
  const diagnostics: ChemDiagnostic[] = [];
  let shelves: ShelfOccurrence[] | undefined;
  let deps: BlockDeps | undefined;
  for (const item of items) {
    if (item.kind === 'shelf') {
      const shelf = parseShelf(item.body.text, item.body.start);
      (shelves ??= []).push({ ref: item, shelf });
      for (const f of shelf.findings) diagnostics.push(shelfDiagnostic(f, item));
      if (!item.closed) diagnostics.push(unclosed('shelf', item.open, language));
      continue;
    }
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
      const d: BlockDeps = (deps ??= { shelf: ctx.shelfKey, stocks: [] });
      const context: BatchContext = {
        stockOf: (name: string) => {
          const found = ctx.stock(name);
          if (!d.stocks.some(([n]) => n === squash(name))) d.stocks.push([squash(name), found.key]);
          return found.batch;
        },
      };
      if (ctx.shelf) context.shelf = ctx.shelf;
      const analysis = analyseBatch(item.lines, item.openName?.text ?? null, settings.chem, item.open, context);
      batches.push({ ref: item, analysis });
      diagnostics.push(...analysis.diagnostics);
      if (!item.closed) diagnostics.push(unclosed('batch', item.open, language));
    }
  }
  if (diagnostics.length > 1) diagnostics.sort((a, b) => a.start - b.start || a.end - b.end);
  const r: BlockResult = heading ? { formulas, reactions, batches, diagnostics, heading } : { formulas, reactions, batches, diagnostics };
  if (shelves) r.shelves = shelves;
  if (deps) r.deps = deps;
  return r;
}

/** The codes of the shelf's findings; `shelf-syntax` for any other kind. */
const SHELF_CODES: Record<string, ChemDiagnostic['code']> = {
  'shelf-syntax': 'shelf-syntax',
  'shelf-substance': 'shelf-substance',
  'shelf-duplicate': 'shelf-duplicate',
  'assay-needed': 'shelf-assay-needed',
};

function shelfDiagnostic(
  f: { kind: string; severity: ChemDiagnostic['severity']; message: string; start?: number; end?: number },
  item: ShelfRef,
): ChemDiagnostic {
  const start = f.start ?? item.open.start;
  const code = SHELF_CODES[f.kind] ?? 'shelf-syntax';
  // A near or ambiguous name is not taken, like an unknown one: the line's entry is left off the shelf.
  const severity = code === 'shelf-substance' ? 'error' : f.severity;
  return { code, severity, start, end: Math.max(f.end ?? item.open.end, start), message: f.message };
}

/**
 * Scan and analyse one block on its own text (`own`, a flat copy of the block): every slice the result
 * keeps points into that copy, never into the document, so a cached result holds only its block.
 */
function analyseBlock(own: string, b: Span, language: NotesLanguage, settings: ServiceSettings, ctx: DocumentContext): BlockResult {
  const options = { prose: settings.prose };
  let r: BlockResult;
  if (b.kind === 'chunk') {
    // A later piece of a long block: prose.
    const items: NoteItem[] = [];
    scanMarkdownBlock(own, { kind: 'paragraph', start: 0, end: own.length }, options, items);
    r = analyseItems(items, language, settings, ctx);
  } else if (language === 'fnote') {
    const scan = scanDocument(own, 'fnote', options);
    const h = scan.sections[0];
    r = analyseItems(scan.items, language, settings, ctx, h ? { title: h.title, level: h.level, start: h.start, headingEnd: h.headingEnd } : undefined);
  } else {
    const md: MdBlock =
      b.kind === 'chunk-first'
        ? { kind: 'paragraph', start: 0, end: own.length }
        : { ...shiftMdBlock(b as MdBlock, -b.start, detach), ...(b.kind === 'heading-long' ? { kind: 'heading' as const } : {}) };
    const items: NoteItem[] = [];
    scanMarkdownBlock(own, md, options, items);
    const heading =
      md.kind === 'heading'
        ? { title: own.slice(md.titleStart, md.titleEnd).replace(/\s+/g, ' '), level: md.level as number, start: 0, headingEnd: own.length }
        : undefined;
    r = analyseItems(items, language, settings, ctx, heading);
  }
  if (b.kind === 'chunk-first' || b.kind === 'heading-long') r.diagnostics.unshift(longBlockNotice(own));
  if (r.deps)
    r.span =
      b.start === 0
        ? b
        : language === 'markdown' && (b as MdBlock).fence
          ? { ...shiftMdBlock(b as MdBlock, -b.start, detach), kind: b.kind }
          : { ...b, start: 0, end: b.end - b.start };
  return r;
}

const shiftLine = (x: LineRef, by: number): LineRef => ({ text: x.text, start: x.start + by, end: x.end + by });
const shiftFormulaRef = (x: FormulaRef, by: number): FormulaRef => ({ kind: 'formula', text: x.text, start: x.start + by, end: x.end + by, source: x.source });
const shiftReactionRef = (x: ReactionRef, by: number): ReactionRef => ({
  kind: 'reaction',
  text: x.text,
  start: x.start + by,
  end: x.end + by,
  source: x.source,
});
const shiftBatchRef = (r: BatchRef, by: number): BatchRef => {
  const out: BatchRef = {
    kind: 'batch',
    start: r.start + by,
    end: r.end + by,
    open: shiftLine(r.open, by),
    lines: r.lines.map((l) => shiftLine(l, by)),
    closed: r.closed,
  };
  if (r.openName) out.openName = shiftLine(r.openName, by);
  return out;
};

export function shiftBatch(b: BatchOccurrence, by: number): BatchOccurrence {
  const r = b.ref;
  const a = b.analysis;
  // The analysis copied with its lazy parts (the equilibrium, the heat) left lazy: descriptors, not values.
  const copy = Object.defineProperties({}, Object.getOwnPropertyDescriptors(a)) as BatchAnalysis;
  return {
    ref: shiftBatchRef(r, by),
    analysis: Object.assign(copy, {
      diagnostics: a.diagnostics.map((d) => shiftDiagnostic(d, by)),
      ingredients: a.ingredients.map((i) => ({
        ...i,
        lineStart: i.lineStart + by,
        lineEnd: i.lineEnd + by,
        formulaStart: i.formulaStart + by,
        formulaEnd: i.formulaEnd + by,
        amount: { ...i.amount, start: i.amount.start + by, end: i.amount.end + by },
      })),
      skipped: a.skipped.map((l) => ({
        ...l,
        lineStart: l.lineStart + by,
        lineEnd: l.lineEnd + by,
        ...(l.formulaStart !== undefined ? { formulaStart: l.formulaStart + by, formulaEnd: (l.formulaEnd as number) + by } : {}),
      })),
      hazards: a.hazards.length ? a.hazards.map((h) => ({ ...h, lines: h.lines.map((x) => x + by) })) : a.hazards,
    }),
  };
}

export const shiftFormula = (f: FormulaOccurrence, by: number): FormulaOccurrence => (by === 0 ? f : { ref: shiftFormulaRef(f.ref, by), analysis: f.analysis });
export const shiftReaction = (r: ReactionOccurrence, by: number): ReactionOccurrence =>
  by === 0 ? r : { ref: shiftReactionRef(r.ref, by), analysis: r.analysis };
export { shiftDiagnostic };

/**
 * Block results memoised by the block's text. Each analysed document has its own cache, handed on to the
 * documents `updateDocument` makes from it, so that a document's entries go when the editor lets go of
 * it; the cache is bounded by entries and by estimated bytes (its keys are flat copies of the blocks).
 */
export type BlockCache = BoundedCache<{ kind: string; rel: BlockResult }>;

export function newBlockCache(textLength: number): BlockCache {
  return new BoundedCache(8192 + (textLength >> 6), 64 * 1024 * 1024 + 40 * textLength);
}

/** Estimated bytes held by a block result (its items and their analyses are shared and counted roughly). */
const resultBytes = (own: string, r: BlockResult) =>
  2 * own.length + 256 * (r.formulas.length + r.reactions.length + r.diagnostics.length) + 4096 * r.batches.length;

/** Do the block's batches still hold in this context (the shelf and every stock they asked for unchanged)? */
function depsHold(deps: BlockDeps | undefined, ctx: DocumentContext): boolean {
  if (!deps) return true;
  if (deps.shelf !== ctx.shelfKey) return false;
  for (const [name, key] of deps.stocks) if (ctx.stock(name).key !== key) return false;
  return true;
}

function blockResult(text: string, b: Span, language: NotesLanguage, settings: ServiceSettings, cache: BlockCache, ctx: DocumentContext): PlacedBlock {
  const { start, end, kind } = b;
  if (kind === 'code' || kind === 'html') return place(b, EMPTY);
  const sub = text.slice(start, end);
  const hit = cache.get(sub);
  if (hit && hit.kind === kind && depsHold(hit.rel.deps, ctx)) return place(b, hit.rel);
  const own = detach(sub);
  const rel = analyseBlock(own, b, language, settings, ctx);
  cache.set(own, { kind, rel }, resultBytes(own, rel));
  return place(b, rel);
}

/** Is this span a shelf block (analysed first: the document's batches are read with its shelf)? */
function isShelfSpan(text: string, b: Span): boolean {
  if (b.kind === 'shelf') return true;
  const f = (b as MdBlock).fence;
  return b.kind === 'fence' && !!f && f.info.trim().toLowerCase() === 'shelf';
}

// ── the context: shelf and stocks ─────────────────────────────────────────

/** The shelf's content as a key: what a batch line reads of it (offsets left out). */
function shelfKeyOf(shelf: Shelf | undefined, source: string): string {
  if (!shelf) return '';
  const rows = shelf.entries.map((e) =>
    [
      e.label,
      e.substance.formula,
      e.substance.solution ? 's' : '',
      e.assayPercent ?? '',
      e.densityGPerML ?? '',
      e.lot ?? '',
      e.supplier ?? '',
      e.grade ?? '',
      e.note ?? '',
    ].join('\u0001'),
  );
  return source + '\u0002' + rows.join('\u0002');
}

const shiftSpan = (x: { start: number; end: number }, by: number) => ({ start: x.start + by, end: x.end + by });
const shiftEntry = (e: ShelfEntry, by: number): ShelfEntry =>
  by === 0
    ? e
    : { ...e, labelSpan: shiftSpan(e.labelSpan, by), span: shiftSpan(e.span, by), substance: { ...e.substance, span: shiftSpan(e.substance.span, by) } };
const shiftShelfRef = (r: ShelfRef, by: number): ShelfRef => ({
  kind: 'shelf',
  start: r.start + by,
  end: r.end + by,
  open: shiftLine(r.open, by),
  body: shiftLine(r.body, by),
  closed: r.closed,
});
const shiftShelf = (o: ShelfOccurrence, by: number): ShelfOccurrence =>
  by === 0
    ? o
    : {
        ref: shiftShelfRef(o.ref, by),
        shelf: {
          entries: o.shelf.entries.map((e) => shiftEntry(e, by)),
          findings: o.shelf.findings.map((f) => (f.start === undefined ? f : { ...f, start: f.start + by, end: (f.end as number) + by })),
        },
      };

/** The stock a batch offers others, by analysis (analyses are shared and read-only). */
const stockMemo = new WeakMap<BatchAnalysis, { batch: StockBatch; key: string }>();

function stockOfAnalysis(a: BatchAnalysis): { batch: StockBatch; key: string } {
  let hit = stockMemo.get(a);
  if (!hit) {
    const batch: StockBatch = {
      name: a.name ?? '',
      volumeL: a.volumeL,
      ingredients: a.ingredients.map((i) => ({
        formula: i.formula,
        hill: i.analysis.hill,
        anhydrousHill: anhydrousOf(i.analysis)?.hill ?? i.analysis.hill,
        concentrationM: i.concentrationM,
      })),
    };
    const key = [batch.name, batch.volumeL ?? '', ...batch.ingredients.map((i) => `${i.formula}=${i.concentrationM ?? ''}`)].join('\u0001');
    stockMemo.set(a, (hit = { batch, key }));
  }
  return hit;
}

/**
 * The context of a document's batches from its placed blocks: the shelf of its shelf blocks (else the
 * workspace's) and a lookup of its batches by name (the first of a name; built on first use).
 */
function contextOf(blocks: readonly PlacedBlock[], options: DocumentOptions): AssembledContext & { ctx: DocumentContext } {
  const shelves: ShelfOccurrence[] = [];
  for (const b of blocks) if (b.rel.shelves) for (const o of b.rel.shelves) shelves.push(shiftShelf(o, b.start));
  const extra: ChemDiagnostic[] = [];
  let shelf: Shelf | undefined;
  let source = 'document';
  if (shelves.length === 1) shelf = shelves[0].shelf;
  else if (shelves.length > 1) {
    // Several shelf blocks make one shelf; a label already on an earlier block is reported where repeated.
    const entries: ShelfEntry[] = [];
    const seen = new Map<string, number>();
    shelves.forEach((o, k) => {
      const own = new Set<string>();
      for (const e of o.shelf.entries) {
        const key = squash(e.label);
        const first = seen.get(key);
        if (first !== undefined && first !== k && !own.has(key))
          extra.push({
            code: 'shelf-duplicate',
            severity: 'warning',
            start: e.labelSpan.start,
            end: e.labelSpan.end,
            message: `The label '${e.label}' is on an earlier shelf block of this document: batch lines take the first.`,
          });
        if (first === undefined) seen.set(key, k);
        own.add(key);
        entries.push(e);
      }
    });
    shelf = { entries, findings: shelves.flatMap((o) => o.shelf.findings) };
  } else if (options.workspaceShelf) {
    shelf = options.workspaceShelf.shelf;
    source = options.workspaceShelf.source;
  }
  let byName: Map<string, BatchAnalysis> | undefined;
  const ctx: DocumentContext = {
    shelfKey: shelfKeyOf(shelf, source),
    stock(name) {
      if (!byName) {
        byName = new Map();
        for (const b of blocks)
          for (const o of b.rel.batches) if (o.analysis.name && !byName.has(squash(o.analysis.name))) byName.set(squash(o.analysis.name), o.analysis);
      }
      const a = byName.get(squash(name));
      return a ? stockOfAnalysis(a) : { key: '' };
    },
  };
  if (shelf) ctx.shelf = shelf;
  return { ctx, shelves, extra, shelf: shelf ? { shelf, source } : undefined };
}

/** What the document keeps of its context: its shelf blocks, the shelf its batches were read with, the shelf findings. */
interface AssembledContext {
  shelves: ShelfOccurrence[];
  shelf: { shelf: Shelf; source: string } | undefined;
  extra: ChemDiagnostic[];
}

/** Rounds of re-reading where a stock's batch changed (a chain of stocks up to this long settles). */
const CONTEXT_ROUNDS = 8;

/**
 * Place every block, analysing the shelf blocks first, then the rest with the document's shelf and
 * stocks; then re-read any block whose batches were read with a shelf or a stock that no longer holds
 * (a stock further down the document, or one that another re-reading changed), until none is left.
 */
function assemble(
  text: string,
  language: NotesLanguage,
  settings: ServiceSettings,
  cache: BlockCache,
  options: DocumentOptions,
  spans: Span[],
  before: PlacedBlock[],
  after: PlacedBlock[],
): AssembledContext & { blocks: PlacedBlock[] } {
  const fresh: Array<PlacedBlock | undefined> = spans.map((b) =>
    isShelfSpan(text, b) ? blockResult(text, b, language, settings, cache, NO_CONTEXT) : undefined,
  );
  const known = before.concat(
    fresh.filter((x): x is PlacedBlock => !!x),
    after,
  );
  let { ctx } = contextOf(known, options);
  spans.forEach((b, k) => {
    if (!fresh[k]) fresh[k] = blockResult(text, b, language, settings, cache, ctx);
  });
  const blocks = before.concat(fresh as PlacedBlock[], after);
  let out = contextOf(blocks, options);
  for (let round = 0; round < CONTEXT_ROUNDS; round++) {
    ctx = out.ctx;
    let changed = false;
    for (let k = 0; k < blocks.length; k++) {
      const b = blocks[k];
      if (!b.rel.deps || depsHold(b.rel.deps, ctx)) continue;
      const own = detach(text.slice(b.start, b.end));
      const rel = analyseBlock(own, b.rel.span as Span, language, settings, ctx);
      cache.set(own, { kind: (b.rel.span as Span).kind, rel }, resultBytes(own, rel));
      blocks[k] = { start: b.start, end: b.end, rel, cont: b.cont, open: b.open };
      changed = true;
    }
    if (!changed) break;
    out = contextOf(blocks, options);
  }
  return { blocks, shelves: out.shelves, shelf: out.shelf, extra: out.extra };
}

const NO_CONTEXT: DocumentContext = { shelfKey: '', stock: () => ({ key: '' }) };

function place(b: Span, rel: BlockResult): PlacedBlock {
  const fence = (b as MdBlock).fence as { closed?: boolean } | undefined;
  return { start: b.start, end: b.end, rel, cont: b.kind === 'chunk', open: !!b.open || (!!fence && fence.closed === false) };
}

// ── long blocks ───────────────────────────────────────────────────────────

/**
 * A paragraph (or `.fnote` line) longer than LONG_BLOCK characters is read in pieces, each analysed and
 * cached on its own, so that typing in a note that is one enormous line re-reads one piece, not the
 * whole line. Pieces end at whitespace chosen by the text around it (content-defined: a piece's end does
 * not move when text before it is edited), at least PIECE_MIN and at most about PIECE_MAX characters
 * long. A code span that runs across two pieces is not read as one; the first piece says so.
 */
export const LONG_BLOCK = 32_768;
const PIECE_MIN = 8_192;
const PIECE_MAX = 32_768;
const PIECE_HARD = 65_536;

function longBlockNotice(own: string): ChemDiagnostic {
  let end = 0;
  while (end < own.length && end < 200 && own.charCodeAt(end) !== 10 && own.charCodeAt(end) !== 13) end++;
  return {
    code: 'long-paragraph',
    severity: 'information',
    start: 0,
    end: Math.max(1, end),
    message: `This paragraph is longer than ${LONG_BLOCK.toLocaleString('en-US')} characters, so it is read in pieces of ${PIECE_MIN / 1024}–${PIECE_MAX / 1024} thousand characters: a code span that runs across two pieces is not read as one. Blank lines between paragraphs avoid this.`,
  };
}

const isSpace = (c: number) => c === 32 || c === 9 || c === 10 || c === 13;

/** The pieces of a long block [start, end); the first keeps a heading's kind and title. */
function pieces(text: string, block: Span): Span[] {
  const { start, end } = block;
  const out: Span[] = [];
  let from = start;
  while (end - from > PIECE_MAX) {
    let cut = -1;
    let forced = -1;
    for (let i = from + PIECE_MIN; i < end && i < from + PIECE_HARD; i++) {
      const c = text.charCodeAt(i);
      if (!isSpace(c)) continue;
      // A cut after whitespace whose 8 preceding characters hash to 0 mod 256; a line end is preferred.
      let h = c === 10 ? 0 : 2166136261;
      if (h !== 0) {
        for (let k = Math.max(from, i - 8); k < i; k++) h = Math.imul(h ^ text.charCodeAt(k), 16777619);
        h = (h >>> 0) & 255;
      }
      if (h === 0) {
        cut = i + 1;
        break;
      }
      if (forced < 0 && i >= from + PIECE_MAX) forced = i + 1;
      if (forced >= 0) break;
    }
    if (cut < 0) cut = forced >= 0 ? forced : Math.min(end, from + PIECE_HARD);
    if (end - cut < PIECE_MIN / 2) break;
    out.push({ start: from, end: cut, kind: out.length === 0 ? 'chunk-first' : 'chunk' });
    from = cut;
  }
  out.push({ start: from, end, kind: out.length === 0 ? 'chunk-first' : 'chunk' });
  if (block.kind === 'heading') {
    const h = block as MdBlock;
    const first = out[0];
    out[0] = {
      kind: 'heading-long',
      start: first.start,
      end: first.end,
      level: h.level,
      titleStart: h.titleStart,
      titleEnd: Math.min(h.titleEnd as number, first.end),
    } as unknown as Span;
  }
  return out;
}

/** Long paragraphs and `.fnote` lines replaced by their pieces. */
const isLong = (b: Span) => (b.kind === 'paragraph' || b.kind === 'heading' || b.kind === 'line') && b.end - b.start > LONG_BLOCK;

function withPieces(text: string, spans: Span[]): Span[] {
  if (!spans.some(isLong)) return spans;
  const out: Span[] = [];
  for (const b of spans) {
    if (isLong(b)) out.push(...pieces(text, b));
    else out.push(b);
  }
  return out;
}

// ── splitting ─────────────────────────────────────────────────────────────

interface Span {
  start: number;
  end: number;
  kind: string;
  /** A `.fnote` batch without its `end` line. */
  open?: boolean;
}

/** `.fnote` blocks: one per line, except a `batch` … `end` or `shelf` … `end` block, which is one. */
function fnoteBlocksFrom(text: string, from: number, stopAt?: (pos: number) => boolean): { blocks: Span[]; stoppedAt: number | null } {
  const blocks: Span[] = [];
  let pos = from;
  while (pos < text.length) {
    if (stopAt && pos > from && stopAt(pos)) return { blocks, stoppedAt: pos };
    const l = readLine(text, pos);
    const body = text.slice(l.start, l.end).trimStart();
    const shelf = opensFnoteShelf(body);
    if (shelf || opensFnoteBatch(body)) {
      let last = l;
      let closed = false;
      while (last.next < text.length) {
        const nl = readLine(text, last.next);
        last = nl;
        if (closesFnoteBatch(text.slice(nl.start, nl.end).trimStart())) {
          closed = true;
          break;
        }
      }
      const kind = shelf ? 'shelf' : 'batch';
      blocks.push(closed ? { start: l.start, end: last.end, kind } : { start: l.start, end: last.end, kind, open: true });
      pos = last.next;
    } else {
      if (body.trim() !== '') blocks.push({ start: l.start, end: l.end, kind: 'line' });
      pos = l.next;
    }
  }
  return { blocks, stoppedAt: null };
}

function split(text: string, language: NotesLanguage, from: number, stopAt?: (pos: number) => boolean): { blocks: Span[]; stoppedAt: number | null } {
  const r = language === 'fnote' ? fnoteBlocksFrom(text, from, stopAt) : markdownBlocksFrom(text, from, stopAt);
  return { blocks: withPieces(text, r.blocks), stoppedAt: r.stoppedAt };
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
    readonly blockCache: BlockCache,
    readonly options: DocumentOptions,
    readonly shelves: ShelfOccurrence[],
    /** The shelf the batches were read with: the document's shelf blocks as one, else the workspace's. */
    readonly shelf: { shelf: Shelf; source: string } | undefined,
    private readonly extra: ChemDiagnostic[],
  ) {}

  get sections(): SectionRef[] {
    if (this.cache.s) return this.cache.s;
    const heads: NonNullable<BlockResult['heading']>[] = [];
    for (const b of this.blocks)
      if (b.rel.heading) heads.push({ ...b.rel.heading, start: b.rel.heading.start + b.start, headingEnd: b.rel.heading.headingEnd + b.start });
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
    if (this.cache.d) return this.cache.d;
    const all = this.collect((r) => r.diagnostics, shiftDiagnostic);
    if (this.extra.length) {
      all.push(...this.extra);
      all.sort((a, b) => a.start - b.start || a.end - b.end);
    }
    return (this.cache.d = all);
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

/**
 * Analyse a whole document. Its block cache is its own unless one is handed in (the preview shares one
 * across renders of the same settings); `updateDocument` hands it on to the next version.
 */
export function analyseDocument(
  text: string,
  language: NotesLanguage,
  settings: ServiceSettings = DEFAULT_SETTINGS,
  cache: BlockCache = newBlockCache(text.length),
  options: DocumentOptions = {},
): AnalysedDocument {
  const { blocks } = split(text, language, 0);
  const a = assemble(text, language, settings, cache, options, blocks, [], []);
  return new Doc(text, language, settings, a.blocks, new LineIndex(text), cache, options, a.shelves, a.shelf, a.extra);
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
export function updateDocument(
  prev: AnalysedDocument,
  text: string,
  hint: ChangeHint = diffRegion(prev.text, text),
  options: DocumentOptions = prev.options,
): AnalysedDocument {
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
  // A piece of a long block is no restart point: its block is split again from its start.
  while (i0 > 0 && (old[i0].cont || (language === 'markdown' && !precededByBlank(prev.text, old[i0].start)))) i0--;
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
        if (target >= hint.oldEnd && !old[mid].cont) {
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
  const cache = (prev as Doc).blockCache ?? newBlockCache(text.length);
  const kept = old.slice(0, i0);
  const moved =
    stoppedAt !== null && resumeAt >= 0
      ? old.slice(resumeAt).map((b) => (delta === 0 ? b : { start: b.start + delta, end: b.end + delta, rel: b.rel, cont: b.cont, open: b.open }))
      : [];
  const a = assemble(text, language, settings, cache, options, blocks, kept, moved);
  const lines = prev.lines.update(text, hint.start, hint.oldEnd, hint.newEnd);
  return new Doc(text, language, settings, a.blocks, lines, cache, options, a.shelves, a.shelf, a.extra);
}
