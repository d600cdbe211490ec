/**
 * Thin LSP wiring over the language service: the open notes (workspace.ts), debounced validation, the
 * handlers (handlers.ts; each request checks its parameters, honours cancellation and never lets an
 * exception reach the protocol library: requests.ts), the commands (commands.ts). The
 * lifecycle (nothing before initialize, nothing after shutdown) is enforced where messages enter
 * (lifecycle.ts), so this file can assume an initialised connection. The logic lives in ../service.
 */
import {
  CodeActionKind,
  DidChangeWatchedFilesNotification,
  FileChangeType,
  TextDocumentSyncKind,
  type Connection,
  type InitializeParams,
  type InitializeResult,
  type WorkspaceEdit,
} from 'vscode-languageserver';
import { SEMANTIC_TOKENS_LEGEND, type TextEdit } from '../service/languageService';
import { SERVER_COMMANDS } from '../shared/commands';
import { VERSION } from '../shared/version';
import { commandHandler } from './commands';
import { clientFolderReader } from './clientFolder';
import { registerEditingFeatures } from './editing';
import { registerDocumentEvents, registerFeatures } from './handlers';
import { CollectionBudget } from './memory';
import { NotesIndex, type FolderReader } from './notesIndex';
import { makeRequestWrapper, oneLine } from './requests';
import { DebouncedValidator, realTimers, type Timers } from './validator';
import { NotesWorkspace, type Snapshot } from './workspace';

export { languageOfDocument } from './workspace';
/** The server's command ids (shared with the client: ../shared/commands.ts). */
export const COMMANDS = SERVER_COMMANDS;

export interface ServerOptions {
  timers?: Timers;
  /** Ask the host for a garbage collection (Node with gc exposed); absent: never asked. */
  collectGarbage?: () => void;
  /**
   * Read the workspace folder's notes (Node: folder.ts, for `file:` folders). Folders it cannot read (the
   * browser: all; virtual workspaces) are read through the client where it offers to (clientFolder.ts);
   * else the open notes are the workspace.
   */
  folder?: FolderReader;
}

/** How edits are sent: versioned (`documentChanges`) where the client supports it, else plain `changes`. */
export interface EditShape {
  readonly versioned: boolean;
  edit(snap: Snapshot, edits: TextEdit[]): WorkspaceEdit;
}

const CODE_ACTION_KINDS = [CodeActionKind.QuickFix, CodeActionKind.RefactorRewrite];

/** `file:` folders through the host's own reader where it has one, everything else (and all, without one) through the client's. */
function byScheme(local: FolderReader | undefined, viaClient: FolderReader | undefined): FolderReader | undefined {
  if (!local || !viaClient) return local ?? viaClient;
  const pick = (uri: string) => (uri.startsWith('file:') ? local : viaClient);
  return { notes: (folderUri) => pick(folderUri).notes(folderUri), read: (uri) => pick(uri).read(uri) };
}

export function startServer(connection: Connection, options: ServerOptions = {}) {
  const timers = options.timers ?? realTimers;
  const log = (line: string) => connection.console.error(line);
  const request = makeRequestWrapper(log);
  const budget = new CollectionBudget(options.collectGarbage, timers);
  const workspace = new NotesWorkspace({ onAnalysed: (chars) => budget.note(chars) });
  const { documents } = workspace;
  let versioned = false;
  const shape: EditShape = {
    get versioned() {
      return versioned;
    },
    edit: (snap, edits) =>
      versioned ? { documentChanges: [{ textDocument: { uri: snap.uri, version: snap.version }, edits }] } : { changes: { [snap.uri]: edits } },
  };

  const validateNow = (uri: string) => {
    const snap = workspace.snapshot(uri);
    // Stale: a newer version arrived while this one was analysed.
    if (!snap || workspace.versionOf(uri) !== snap.version) return;
    void connection.sendDiagnostics({ uri, version: snap.version, diagnostics: snap.service.editorDiagnostics(snap.doc) as never });
  };
  const validator = new DebouncedValidator(timers, (uri) => {
    try {
      validateNow(uri);
    } catch (e) {
      log(`ionwright: validation failed: ${oneLine(e)}`);
    }
  });

  const index = new NotesIndex(workspace);
  // A new or changed shelf file: the open notes' batches are read again with it.
  workspace.onShelfChanged = () => {
    for (const td of workspace.documents.all()) validator.schedule(td.uri, 0);
  };
  let folders: string[] = [];
  let watchFiles = false;
  let refreshHints = false;
  let refreshTokens = false;
  let folder: FolderReader | undefined;

  connection.onInitialize((params: InitializeParams | undefined): InitializeResult => {
    const caps = params?.capabilities ?? {};
    const named = Array.isArray(params?.workspaceFolders) ? params.workspaceFolders.map((f) => f?.uri) : [params?.rootUri];
    folders = named.filter((u): u is string => typeof u === 'string');
    watchFiles = caps.workspace?.didChangeWatchedFiles?.dynamicRegistration === true;
    refreshHints = caps.workspace?.inlayHint?.refreshSupport === true;
    refreshTokens = caps.workspace?.semanticTokens?.refreshSupport === true;
    const offered = (params?.initializationOptions as { workspaceNotes?: unknown } | undefined)?.workspaceNotes === true;
    folder = byScheme(options.folder, offered ? clientFolderReader(connection) : undefined);
    if (caps.workspace?.configuration) {
      workspace.fetchSettings = (uri) => connection.workspace.getConfiguration({ scopeUri: uri, section: 'ionwright' });
    }
    versioned = caps.workspace?.workspaceEdit?.documentChanges === true;
    return {
      capabilities: {
        textDocumentSync: { openClose: true, change: TextDocumentSyncKind.Incremental },
        hoverProvider: true,
        codeActionProvider: { codeActionKinds: CODE_ACTION_KINDS },
        documentSymbolProvider: true,
        codeLensProvider: { resolveProvider: false },
        completionProvider: { triggerCharacters: [' '], resolveProvider: false },
        inlayHintProvider: { resolveProvider: false },
        semanticTokensProvider: { legend: SEMANTIC_TOKENS_LEGEND, full: true, range: true },
        foldingRangeProvider: true,
        workspaceSymbolProvider: true,
        definitionProvider: true,
        executeCommandProvider: { commands: Object.values(SERVER_COMMANDS) },
      },
      serverInfo: { name: 'ionwright', version: VERSION },
    };
  });

  registerDocumentEvents(connection, workspace, validator, log, () => {
    if (refreshHints) void connection.languages.inlayHint.refresh().catch(() => undefined);
    if (refreshTokens) void connection.languages.semanticTokens.refresh();
  });
  registerFeatures(connection, workspace, shape, request);
  registerEditingFeatures(connection, workspace, index, request);
  connection.onInitialized(() => {
    if (!folder) return;
    // The folder is read in the background, one note at a time; the open notes are served meanwhile.
    void (async () => {
      const reader = folder as FolderReader;
      for (const f of folders) for await (const note of reader.notes(f)) index.setFile(note.uri, note.text);
      connection.console.info(`ionwright: indexed ${index.fileCount} notes of the workspace folder.`);
    })().catch((e) => log(`ionwright: reading the workspace folder failed: ${oneLine(e)}`));
    if (watchFiles)
      void connection.client
        .register(DidChangeWatchedFilesNotification.type, { watchers: [{ globPattern: '**/*.{md,markdown,fnote}' }] })
        .catch((e) => log(`ionwright: watching the notes files failed: ${oneLine(e)}`));
  });
  connection.onDidChangeWatchedFiles((params) => {
    if (!folder) return;
    void (async () => {
      for (const c of params?.changes ?? []) {
        if (typeof c?.uri !== 'string') continue;
        if (c.type === FileChangeType.Deleted) index.deleteFile(c.uri);
        else {
          const text = await (folder as FolderReader).read(c.uri);
          if (text === undefined) index.deleteFile(c.uri);
          else index.setFile(c.uri, text);
        }
      }
    })().catch((e) => log(`ionwright: a changed notes file could not be read: ${oneLine(e)}`));
  });
  connection.onExecuteCommand(request('executeCommand', commandHandler(connection, workspace, shape)));

  documents.listen(connection);
  connection.listen();
  return { documents, validator, workspace, index };
}
