/**
 * The language service: one object per settings, with every feature a caller needs over an analysed
 * note. The LSP server, the command line and the tests all go through it; each feature lives in its own
 * module (hover.ts, actions.ts, symbols.ts, tables.ts, card.ts …) and this façade only wires them up, so
 * a new feature (completion, inlay hints) gets one module and one method here.
 *
 * Positions are LSP positions (0-based line, UTF-16 character); results are plain objects in LSP shape.
 * Nothing here reads files or speaks a protocol: the caller hands over text.
 */
import { analyseFormula, type FormulaAnalysis } from '../chem/analyse';
import { analyseReaction, type ReactionAnalysis } from '../chem/equation';
import type { NotesLanguage } from '../notes/types';
import { codeActions, sectionTableEdit, tableEditAt, tableEditForSelection, type CodeAction, type EditOutcome, type TextEdit } from './actions';
import { batchJson } from './batchJson';
import { batchAt, parseScaleTarget, scaleEdits, type ScaleOutcome } from './batchEdits';
import { cardJson, cardText, type CardJson } from './card';
import { documentDiagnostics, editorDiagnostics, type LspDiagnostic } from './diagnostics';
import { analyseDocument, updateDocument, type AnalysedDocument, type ChangeHint, type DocumentOptions, type WorkspaceShelf } from './document';
import { formulaCardMarkdown, hover, type HoverResult } from './hover';
import { targetAt } from './lookup';
import type { Position, Range } from './positions';
import { DEFAULT_SETTINGS, type ServiceSettings } from './settings';
import { codeLenses, documentSymbols, type CodeLens, type DocumentSymbol } from './symbols';
import { batchTable, batchText, documentTables } from './tables';
import { completion, type CompletionList } from './completion';
import { foldingRanges, type FoldingRange } from './folding';
import { inlayHints, type InlayHint } from './inlayHints';
import { definition, noteSummary, workspaceSymbols, type Location, type NoteSummary, type WorkspaceSymbol } from './navigation';
import { SEMANTIC_TOKENS_LEGEND, semanticTokens } from './semanticTokens';
import { documentVocabulary, mergeVocabularies, type Vocabulary } from './vocabulary';

export type {
  AnalysedDocument,
  ChangeHint,
  DocumentOptions,
  WorkspaceShelf,
  CodeAction,
  CodeLens,
  CompletionList,
  DocumentSymbol,
  EditOutcome,
  FoldingRange,
  HoverResult,
  InlayHint,
  Location,
  LspDiagnostic,
  NoteSummary,
  Position,
  ScaleOutcome,
  Range,
  TextEdit,
  Vocabulary,
  WorkspaceSymbol,
};
export { SEMANTIC_TOKENS_LEGEND };

/** Where a table is wanted: at the cursor (its batch or paragraph), for a selection, or for the section. */
export type TableScope = { at: Position } | { selection: Range } | { section: Position };

export interface LanguageService {
  readonly settings: ServiceSettings;
  /** Analyse a note; given the analysis of its previous version (and the edited range, when known), only the blocks around the change are read again. */
  analyse(text: string, language: NotesLanguage, previous?: { doc: AnalysedDocument; hint?: ChangeHint }, options?: DocumentOptions): AnalysedDocument;
  /** Every finding of the note. */
  diagnostics(doc: AnalysedDocument): LspDiagnostic[];
  /** The findings an editor is sent: at most `limit` (errors first), then one that counts the rest. */
  editorDiagnostics(doc: AnalysedDocument, limit?: number): LspDiagnostic[];
  hover(doc: AnalysedDocument, position: Position): HoverResult | null;
  codeActions(doc: AnalysedDocument, range: Range, only?: readonly string[]): CodeAction[];
  codeLenses(doc: AnalysedDocument): CodeLens[];
  documentSymbols(doc: AnalysedDocument): DocumentSymbol[];
  /** The edit that inserts a computed table, or why there is none. */
  tableEdit(doc: AnalysedDocument, scope: TableScope): EditOutcome;
  /** The card under the cursor as Markdown (a formula, a batch line's substance, else the hover). */
  cardMarkdownAt(doc: AnalysedDocument, position: Position): string | null;
  /** Every table of the note, as Markdown (what `ionwright table` prints). */
  tables(doc: AnalysedDocument): string;
  /** The batch tables of the note, as Markdown. */
  batchTables(doc: AnalysedDocument): string[];
  /** The batches of the note as aligned plain text (a terminal, a printed weighing list). */
  batchTexts(doc: AnalysedDocument): string[];
  /** The batches of the note as the contract's JSON. */
  batchesJson(doc: AnalysedDocument): ReturnType<typeof batchJson>[];
  /** One formula on its own. */
  formula(text: string): FormulaAnalysis;
  /** A formula's card: the contract's JSON, plain text (the command line), Markdown (hover and copy). */
  cardJson(formula: string): CardJson;
  cardText(formula: string): string;
  cardMarkdown(formula: string): string;
  reaction(text: string): ReactionAnalysis;
  /**
   * Completion in a batch block: header keys, substances (those the notes use, ranked by use — this note's
   * and `others`, the other notes' vocabulary — then the tool's tables), units after an amount, `pH` after
   * `to `.
   */
  completion(doc: AnalysedDocument, position: Position, others?: Vocabulary): CompletionList | null;
  /** The vocabularies of several notes as one (counts added). */
  mergeVocabularies(list: readonly Vocabulary[]): Vocabulary;
  /** The computed amounts beside the batch lines within `range`. */
  inlayHints(doc: AnalysedDocument, range: Range): InlayHint[];
  /** Semantic tokens (legend: SEMANTIC_TOKENS_LEGEND) of the note, or of `range`. */
  semanticTokens(doc: AnalysedDocument, range?: Range): { data: number[] };
  foldingRanges(doc: AnalysedDocument): FoldingRange[];
  /** A note's named batches and vocabulary, for the workspace's index. */
  noteSummary(doc: AnalysedDocument, uri: string): NoteSummary;
  /** The batches of the notes whose names match the query. */
  workspaceSymbols(notes: Iterable<NoteSummary>, query: string): WorkspaceSymbol[];
  /** Where what is under the cursor is defined (a batch's name → the batch), in the notes given (this one's included). */
  definition(doc: AnalysedDocument, position: Position, notes: readonly NoteSummary[], uri?: string): Location[];
  /**
   * The edits that scale the batch at the cursor to `target` (what the user typed: `×2`, `0.5`, `2 L`,
   * `5 kg`), every concentration kept and the amounts rounded for the bench; or why not.
   */
  scaleBatchEdit(doc: AnalysedDocument, position: Position, target: string): ScaleOutcome;
  /** The batch at the cursor as a weighing list (plain text a technician can print), or null. */
  weighingListAt(doc: AnalysedDocument, position: Position): string | null;
}

const services = new WeakMap<ServiceSettings, LanguageService>();

/** The language service for these settings (one per settings object). */
export function createLanguageService(settings: ServiceSettings = DEFAULT_SETTINGS): LanguageService {
  const known = services.get(settings);
  if (known) return known;
  const offset = (doc: AnalysedDocument, p: Position) => doc.lines.offsetAt(p);
  const service: LanguageService = {
    settings,
    analyse: (text, language, previous, options) =>
      previous && previous.doc.language === language && previous.doc.settings === settings
        ? updateDocument(previous.doc, text, previous.hint, options ?? previous.doc.options)
        : analyseDocument(text, language, settings, undefined, options),
    diagnostics: (doc) => documentDiagnostics(doc),
    editorDiagnostics: (doc, limit) => editorDiagnostics(doc, limit),
    hover: (doc, position) => hover(doc, offset(doc, position)),
    codeActions: (doc, range, only) => {
      let start = offset(doc, range.start);
      let end = offset(doc, range.end);
      if (end < start) [start, end] = [end, start];
      return codeActions(doc, start, end, only ? [...only] : undefined);
    },
    codeLenses: (doc) => codeLenses(doc),
    documentSymbols: (doc) => documentSymbols(doc),
    tableEdit: (doc, scope) => {
      if ('at' in scope) return tableEditAt(doc, offset(doc, scope.at));
      if ('section' in scope) return sectionTableEdit(doc, offset(doc, scope.section));
      let s = offset(doc, scope.selection.start);
      let e = offset(doc, scope.selection.end);
      if (e < s) [s, e] = [e, s];
      return tableEditForSelection(doc, s, e);
    },
    cardMarkdownAt: (doc, position) => {
      const at = offset(doc, position);
      const t = targetAt(doc, at);
      if (!t) return null;
      if (t.kind === 'formula') return formulaCardMarkdown(t.occ.analysis, doc.settings);
      if (t.kind === 'batch-line') return formulaCardMarkdown(t.ingredient.analysis, doc.settings);
      return hover(doc, at)?.markdown ?? null;
    },
    tables: (doc) => documentTables(doc, settings),
    batchTables: (doc) => doc.batches.map((b) => batchTable(b.analysis, settings)),
    batchTexts: (doc) => doc.batches.map((b) => batchText(b.analysis, settings)),
    batchesJson: (doc) => doc.batches.map((b) => batchJson(doc, b)),
    formula: (text) => analyseFormula(text.trim(), settings.chem),
    cardJson: (text) => cardJson(analyseFormula(text.trim(), settings.chem)),
    cardText: (text) => cardText(analyseFormula(text.trim(), settings.chem), settings),
    cardMarkdown: (text) => formulaCardMarkdown(analyseFormula(text.trim(), settings.chem), settings),
    reaction: (text) => analyseReaction(text.trim()),
    completion: (doc, position, others) => {
      const own = documentVocabulary(doc);
      return completion(doc, offset(doc, position), settings, others && others.size ? mergeVocabularies([own, others]) : own);
    },
    mergeVocabularies: (list) => mergeVocabularies(list),
    inlayHints: (doc, range) => inlayHints(doc, offset(doc, range.start), offset(doc, range.end), settings),
    semanticTokens: (doc, range) => semanticTokens(doc, range ? { start: offset(doc, range.start), end: offset(doc, range.end) } : undefined),
    foldingRanges: (doc) => foldingRanges(doc),
    noteSummary: (doc, uri) => noteSummary(doc, uri),
    workspaceSymbols: (notes, query) => workspaceSymbols(notes, query),
    definition: (doc, position, notes, uri) => definition({ doc, offset: offset(doc, position), notes, ...(uri ? { uri } : {}) }),
    scaleBatchEdit: (doc, position, target) => {
      const b = batchAt(doc, offset(doc, position));
      if (!b) return { reason: 'there is no batch at the cursor' };
      const t = parseScaleTarget(target);
      return 'reason' in t ? t : scaleEdits(doc, b, t);
    },
    weighingListAt: (doc, position) => {
      const t = targetAt(doc, offset(doc, position));
      return t && (t.kind === 'batch-line' || t.kind === 'batch-header') ? batchText(t.occ.analysis, settings) : null;
    },
  };
  services.set(settings, service);
  return service;
}
