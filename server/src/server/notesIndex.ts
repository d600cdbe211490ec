/**
 * The workspace's notes as the navigation features see them (workspace symbols, definitions, the
 * substances completion ranks by use): a summary per note — its named batches and its vocabulary — for
 * the open notes (their current version, from the workspace's snapshots) and for the notes of the
 * workspace folder that are not open (read by the host where it can read files: on Node, see folder.ts;
 * the browser build has no files to read and indexes the open notes only).
 *
 * A folder note is analysed once when it is read (or changes on disk) and only its summary is kept.
 */
import { createLanguageService, type NoteSummary, type Vocabulary } from '../service/languageService';
import { isShelfFile } from '../service/document';
import { languageOfDocument, type NotesWorkspace } from './workspace';

/** What the host can read of a workspace folder. */
export interface FolderReader {
  /** The notes files under a folder (a `file:` URI), each with its text; bounded by the host. */
  notes(folderUri: string): AsyncIterable<{ uri: string; text: string }>;
  /** One note's text now, or undefined when it cannot be read (gone, too large, not a note). */
  read(uri: string): Promise<string | undefined>;
}

export class NotesIndex {
  private readonly files = new Map<string, NoteSummary>();
  private others: { key: string; vocabulary: Vocabulary } | undefined;
  private generation = 0;

  constructor(private readonly workspace: NotesWorkspace) {}

  /** A note of the folder was read (or changed on disk). */
  setFile(uri: string, text: string) {
    const language = languageOfDocument('', uri);
    if (!language) return;
    const service = createLanguageService(this.workspace.defaults.service);
    const doc = service.analyse(text, language);
    this.files.set(uri, service.noteSummary(doc, uri));
    this.generation++;
    // The workspace's shelf file: its shelf blocks are the lab's reagents for every note without its own.
    if (isShelfFile(uri)) {
      const own = doc.shelves.length ? doc.shelf : undefined;
      if (own) this.workspace.setWorkspaceShelf({ shelf: own.shelf, source: uri, rangeOf: (start, end) => doc.lines.range(start, end) });
      else if (this.workspace.workspaceShelf?.source === uri) this.workspace.setWorkspaceShelf(undefined);
    }
  }

  deleteFile(uri: string) {
    if (this.files.delete(uri)) this.generation++;
    if (this.workspace.workspaceShelf?.source === uri) this.workspace.setWorkspaceShelf(undefined);
  }

  get fileCount(): number {
    return this.files.size;
  }

  /** Every note's summary (but `except`'s): the open notes first (their current version), then the folder's notes that are not open. */
  summaries(except?: string): NoteSummary[] {
    const out: NoteSummary[] = [];
    const open = new Set<string>();
    for (const td of this.workspace.documents.all()) {
      open.add(td.uri);
      if (td.uri === except) continue;
      const snap = this.workspace.snapshot(td.uri);
      if (snap) out.push(snap.service.noteSummary(snap.doc, td.uri));
    }
    for (const [uri, s] of this.files) if (!open.has(uri) && uri !== except) out.push(s);
    return out;
  }

  /** The vocabulary of every note but `uri` (merged again only when one of them changed). */
  vocabularyExcept(uri: string): Vocabulary {
    const open = this.workspace.documents
      .all()
      .filter((d) => d.uri !== uri)
      .map((d) => `${d.uri}@${d.version}`);
    const key = `${this.generation}|${uri}|${open.join(',')}`;
    if (this.others?.key === key) return this.others.vocabulary;
    const service = createLanguageService(this.workspace.defaults.service);
    const vocabulary = service.mergeVocabularies(this.summaries(uri).map((s) => s.vocabulary));
    this.others = { key, vocabulary };
    return vocabulary;
  }
}
