/** Thin LSP wiring over the language service. */
import { TextDocuments, TextDocumentSyncKind, type Connection } from 'vscode-languageserver';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { analyseDocument, type AnalysedDocument } from '../service/document';
import { documentDiagnostics } from '../service/diagnostics';
import { DEFAULT_SETTINGS } from '../service/settings';
import type { NotesLanguage } from '../notes/types';

function languageOfDoc(doc: TextDocument): NotesLanguage | undefined {
  if (doc.languageId === 'markdown') return 'markdown';
  if (doc.languageId === 'fnote' || doc.uri.endsWith('.fnote')) return 'fnote';
  if (doc.uri.endsWith('.md') || doc.uri.endsWith('.markdown')) return 'markdown';
  return undefined;
}

export function startServer(connection: Connection) {
  const documents = new TextDocuments(TextDocument);
  const cache = new Map<string, { version: number; doc: AnalysedDocument }>();
  const analysed = (td: TextDocument): AnalysedDocument | undefined => {
    const lang = languageOfDoc(td);
    if (!lang) return undefined;
    const hit = cache.get(td.uri);
    if (hit && hit.version === td.version) return hit.doc;
    const doc = analyseDocument(td.getText(), lang, DEFAULT_SETTINGS);
    cache.set(td.uri, { version: td.version, doc });
    return doc;
  };
  connection.onInitialize(() => ({
    capabilities: { textDocumentSync: TextDocumentSyncKind.Incremental },
    serverInfo: { name: 'ionwright', version: '0.1.0' },
  }));
  documents.onDidChangeContent((e) => {
    const doc = analysed(e.document);
    if (doc) void connection.sendDiagnostics({ uri: e.document.uri, version: e.document.version, diagnostics: documentDiagnostics(doc) });
  });
  documents.onDidClose((e) => {
    cache.delete(e.document.uri);
    void connection.sendDiagnostics({ uri: e.document.uri, diagnostics: [] });
  });
  documents.listen(connection);
  connection.listen();
}
