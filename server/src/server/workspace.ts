/**
 * The server's state of the open notes: the documents (incremental sync, with the edited range of each
 * change recorded), one analysed document per open URI (computed once per version and settings), and
 * the settings of each document. Closing a document drops everything held for it.
 */
import { TextDocuments } from 'vscode-languageserver';
import { TextDocument } from 'vscode-languageserver-textdocument';
import type { NotesLanguage } from '../notes/types';
import { readSettings, type ServerSettings } from '../service/config';
import { createLanguageService, type AnalysedDocument, type ChangeHint, type LanguageService, type WorkspaceShelf } from '../service/languageService';

export function languageOfDocument(languageId: string, uri: string): NotesLanguage | undefined {
  // A client that opened a document under something other than a string URI gets nothing for it.
  if (typeof uri !== 'string') return undefined;
  if (languageId === 'fnote' || uri.endsWith('.fnote')) return 'fnote';
  if (languageId === 'markdown' || uri.endsWith('.md') || uri.endsWith('.markdown')) return 'markdown';
  return undefined;
}

/** An analysed document, the version of the text it was computed from, and the service that made it. */
export interface Snapshot {
  uri: string;
  version: number;
  doc: AnalysedDocument;
  service: LanguageService;
}

export interface WorkspaceOptions {
  /** Called with the size of each newly analysed text (UTF-16 units), and on close with 0. */
  onAnalysed?: (chars: number) => void;
}

export class NotesWorkspace {
  readonly documents: TextDocuments<TextDocument>;
  readonly defaults = readSettings(undefined);
  /** Ask the client for a document's `ionwright` settings; absent: the client cannot be asked. */
  fetchSettings?: (uri: string) => Promise<unknown>;
  /** Settings pushed with didChangeConfiguration, for clients that cannot be asked. */
  private pushed: ServerSettings | undefined;
  private readonly hints = new Map<string, ChangeHint | null>();
  private readonly snapshots = new Map<string, { settings: ServerSettings; snap: Snapshot; shelf: WorkspaceShelf | undefined }>();
  private readonly settingsRequests = new Map<string, Promise<ServerSettings>>();
  private current = new Map<string, ServerSettings>();
  /** The workspace's shelf file (`shelf.md`, `*.shelf.md`, `shelf.fnote`), for notes that have no shelf of their own. */
  private shelf: WorkspaceShelf | undefined;
  /** Called when the workspace's shelf changes: the open notes' batches are read again. */
  onShelfChanged?: () => void;

  constructor(private readonly options: WorkspaceOptions = {}) {
    const hints = this.hints;
    this.documents = new TextDocuments<TextDocument>({
      create: TextDocument.create,
      update: (doc, changes, version) => {
        // One ranged change between two analyses: the analysis redoes only the blocks around it. Several:
        // it finds the changed region itself.
        const prev = hints.get(doc.uri);
        let hint: ChangeHint | null = null;
        if (changes.length === 1 && 'range' in changes[0] && prev === undefined) {
          const c = changes[0];
          const start = doc.offsetAt(c.range.start);
          hint = { start, oldEnd: doc.offsetAt(c.range.end), newEnd: start + c.text.length };
        }
        hints.set(doc.uri, prev === undefined ? hint : null);
        return TextDocument.update(doc, changes, version);
      },
    });
  }

  /** The language service with the default settings (for what no one note's settings decide). */
  get defaultService(): LanguageService {
    return createLanguageService(this.defaults.service);
  }

  /** Settings of a document as last read (defaults until read). */
  settingsOf(uri: string): ServerSettings {
    return this.current.get(uri) ?? this.defaults;
  }

  /** Read a document's settings from the client (once per document until the configuration changes). */
  async refreshSettings(uri: string): Promise<ServerSettings> {
    let p = this.settingsRequests.get(uri);
    if (!p) {
      const fetch = this.fetchSettings;
      p = fetch
        ? fetch(uri).then(
            (raw) => readSettings(raw),
            () => this.defaults,
          )
        : Promise.resolve(this.pushed ?? this.defaults);
      this.settingsRequests.set(uri, p);
    }
    const s = await p;
    if (this.documents.get(uri)) this.current.set(uri, s);
    return s;
  }

  /** The configuration changed: forget what was read; `raw` is what a client that cannot be asked pushed. */
  configurationChanged(raw: unknown) {
    if (!this.fetchSettings && raw !== undefined) this.pushed = readSettings(raw);
    this.settingsRequests.clear();
    this.current = new Map();
  }

  /** A document was opened (or opened again): nothing computed for an earlier text of it may be served. */
  opened(uri: string) {
    this.snapshots.delete(uri);
    this.hints.delete(uri);
  }

  /** A document was closed: drop its analysis, its cache of blocks, its settings. */
  closed(uri: string) {
    this.snapshots.delete(uri);
    this.hints.delete(uri);
    this.settingsRequests.delete(uri);
    this.current.delete(uri);
    this.options.onAnalysed?.(0);
  }

  /** The analysed document of the current version, computed once per version and settings. */
  snapshot(uri: string): Snapshot | undefined {
    const td = this.documents.get(uri);
    if (!td) return undefined;
    const language = languageOfDocument(td.languageId, td.uri);
    if (!language) return undefined;
    const settings = this.settingsOf(uri);
    const hit = this.snapshots.get(uri);
    const shelf = this.shelf;
    if (hit && hit.snap.version === td.version && hit.settings === settings && hit.shelf === shelf) return hit.snap;
    const text = td.getText();
    // A client that sent something other than text for a document gets nothing for it.
    if (typeof text !== 'string') return undefined;
    const hint = this.hints.get(uri);
    this.hints.delete(uri);
    const service = createLanguageService(settings.service);
    const options = shelf ? { workspaceShelf: shelf } : {};
    const doc = service.analyse(text, language, hit && hit.settings === settings ? { doc: hit.snap.doc, hint: hint ?? undefined } : undefined, options);
    const snap: Snapshot = { uri, version: td.version, doc, service };
    this.snapshots.set(uri, { settings, snap, shelf });
    this.options.onAnalysed?.(text.length);
    return snap;
  }

  /** Set (or clear) the workspace's shelf; the open notes are read again with it. */
  setWorkspaceShelf(shelf: WorkspaceShelf | undefined): void {
    if (shelf === this.shelf) return;
    this.shelf = shelf;
    this.onShelfChanged?.();
  }

  get workspaceShelf(): WorkspaceShelf | undefined {
    return this.shelf;
  }

  /** The version of an open document now (undefined when it is not open). */
  versionOf(uri: string): number | undefined {
    return this.documents.get(uri)?.version;
  }
}
