/**
 * The analysed document: the scan of a notes document with every formula, equation and batch analysed,
 * and its diagnostics with absolute offsets. Computed once per document version by the caller (the server
 * caches it; the CLI makes one per file).
 */
import { analyseFormula, type FormulaAnalysis } from '../chem/analyse';
import { analyseBatch, type BatchAnalysis } from '../chem/batch';
import { analyseReaction, type ReactionAnalysis } from '../chem/equation';
import type { ChemDiagnostic } from '../chem/diagnostic';
import { scanDocument } from '../notes/scan';
import type { BatchRef, FormulaRef, NotesLanguage, ReactionRef, ScanResult, SectionRef } from '../notes/types';
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

export interface AnalysedDocument {
  text: string;
  language: NotesLanguage;
  lines: LineIndex;
  scan: ScanResult;
  formulas: FormulaOccurrence[];
  reactions: ReactionOccurrence[];
  batches: BatchOccurrence[];
  sections: SectionRef[];
  /** Every finding, absolute offsets, in document order. */
  diagnostics: ChemDiagnostic[];
  settings: ServiceSettings;
}

export function languageOf(fileName: string): NotesLanguage | undefined {
  const lower = fileName.toLowerCase();
  if (lower.endsWith('.fnote')) return 'fnote';
  if (lower.endsWith('.md') || lower.endsWith('.markdown')) return 'markdown';
  return undefined;
}

export function analyseDocument(text: string, language: NotesLanguage, settings: ServiceSettings = DEFAULT_SETTINGS): AnalysedDocument {
  const scan = scanDocument(text, language, { prose: settings.prose });
  const formulas: FormulaOccurrence[] = [];
  const reactions: ReactionOccurrence[] = [];
  const batches: BatchOccurrence[] = [];
  const diagnostics: ChemDiagnostic[] = [];
  for (const item of scan.items) {
    if (item.kind === 'formula') {
      const analysis = analyseFormula(item.text, settings.chem);
      formulas.push({ ref: item, analysis });
      for (const d of analysis.diagnostics) {
        if (d.severity === 'information' && item.source === 'prose') continue;
        diagnostics.push({ ...d, start: d.start + item.start, end: d.end + item.start });
      }
    } else if (item.kind === 'reaction') {
      const analysis = analyseReaction(item.text);
      reactions.push({ ref: item, analysis });
      for (const d of analysis.diagnostics) diagnostics.push({ ...d, start: d.start + item.start, end: d.end + item.start });
    } else {
      const analysis = analyseBatch(item.lines, item.openName?.text ?? null, settings.chem);
      batches.push({ ref: item, analysis });
      diagnostics.push(...analysis.diagnostics);
      if (!item.closed) {
        diagnostics.push({ code: 'batch-unclosed', severity: 'warning', start: item.open.start, end: item.open.end, message: language === 'fnote' ? "This batch has no 'end' line; it runs to the end of the file." : 'This batch block is never closed; it runs to the end of the document.' });
      }
    }
  }
  diagnostics.sort((a, b) => a.start - b.start || a.end - b.end);
  return { text, language, lines: new LineIndex(text), scan, formulas, reactions, batches, sections: scan.sections, diagnostics, settings };
}
