/** One file's text to its analysis and findings: pure, shared by the commands, `check` and its workers. */
import { languageOf } from '../service/document';
import { createLanguageService, type AnalysedDocument, type LspDiagnostic } from '../service/languageService';

const service = createLanguageService();

/** The analysis of one file's text, its language taken from its name. */
export function analyseFile(path: string, text: string): AnalysedDocument {
  const doc = service.analyse(text, languageOf(path) ?? 'markdown');
  if (text.includes('\u0000')) {
    doc.diagnostics.unshift({
      code: 'not-text',
      severity: 'warning',
      start: 0,
      end: 0,
      message: 'This file contains NUL bytes; it does not look like a text file.',
    });
  }
  return doc;
}

/** The findings of one file: plain, structured-clonable objects (a worker posts them back as they are). */
export function checkText(path: string, text: string): LspDiagnostic[] {
  return service.diagnostics(analyseFile(path, text));
}
