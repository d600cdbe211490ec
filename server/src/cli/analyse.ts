/** One file's text to its analysis and findings: pure, shared by the commands, `check` and its workers. */
import { languageOf } from '../service/document';
import { createLanguageService, type AnalysedDocument, type LspDiagnostic, type WorkspaceShelf } from '../service/languageService';

const service = createLanguageService();

/** The workspace's shelf file as read: its path and text (plain data a worker can be sent). */
export interface ShelfSource {
  path: string;
  text: string;
}

let shelfMemo: { source: ShelfSource; shelf: WorkspaceShelf | undefined } | undefined;

/** The shelf a shelf file holds (its shelf blocks), read once per file and text; undefined where it has none. */
export function shelfOf(source: ShelfSource | undefined): WorkspaceShelf | undefined {
  if (!source) return undefined;
  if (shelfMemo && shelfMemo.source.path === source.path && shelfMemo.source.text === source.text) return shelfMemo.shelf;
  const doc = service.analyse(source.text, languageOf(source.path) ?? 'markdown');
  const shelf = doc.shelves.length && doc.shelf ? { shelf: doc.shelf.shelf, source: source.path } : undefined;
  shelfMemo = { source, shelf };
  return shelf;
}

/** The analysis of one file's text, its language taken from its name; notes without a shelf use the workspace's. */
export function analyseFile(path: string, text: string, shelf?: ShelfSource): AnalysedDocument {
  const workspaceShelf = shelf && shelf.path !== path ? shelfOf(shelf) : undefined;
  const doc = service.analyse(text, languageOf(path) ?? 'markdown', undefined, workspaceShelf ? { workspaceShelf } : undefined);
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
export function checkText(path: string, text: string, shelf?: ShelfSource): LspDiagnostic[] {
  return service.diagnostics(analyseFile(path, text, shelf));
}
