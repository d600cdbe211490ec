/**
 * Thin LSP wiring over the language service: the open notes (workspace.ts), debounced validation, the
 * handlers (handlers.ts; each request checks its parameters, honours cancellation and never lets an
 * exception reach the protocol library: requests.ts), the commands (commands.ts). The
 * lifecycle (nothing before initialize, nothing after shutdown) is enforced where messages enter
 * (lifecycle.ts), so this file can assume an initialised connection. The logic lives in ../service.
 */
import { CodeActionKind, TextDocumentSyncKind, type Connection, type InitializeParams, type InitializeResult, type WorkspaceEdit } from 'vscode-languageserver';
import type { TextEdit } from '../service/languageService';
import { SERVER_COMMANDS } from '../shared/commands';
import { VERSION } from '../shared/version';
import { commandHandler } from './commands';
import { registerDocumentEvents, registerFeatures } from './handlers';
import { CollectionBudget } from './memory';
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
}

/** How edits are sent: versioned (`documentChanges`) where the client supports it, else plain `changes`. */
export interface EditShape {
  readonly versioned: boolean;
  edit(snap: Snapshot, edits: TextEdit[]): WorkspaceEdit;
}

const CODE_ACTION_KINDS = [CodeActionKind.QuickFix, CodeActionKind.RefactorRewrite];

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

  connection.onInitialize((params: InitializeParams | undefined): InitializeResult => {
    const caps = params?.capabilities ?? {};
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
        executeCommandProvider: { commands: Object.values(SERVER_COMMANDS) },
      },
      serverInfo: { name: 'ionwright', version: VERSION },
    };
  });

  registerDocumentEvents(connection, workspace, validator, log);
  registerFeatures(connection, workspace, shape, request);
  connection.onExecuteCommand(request('executeCommand', commandHandler(connection, workspace, shape)));

  documents.listen(connection);
  connection.listen();
  return { documents, validator, workspace };
}
