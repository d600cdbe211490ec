/**
 * Thin LSP wiring over the language service: the open notes (workspace.ts), debounced validation, the
 * request handlers (each checks its parameters, honours cancellation and never lets an exception reach
 * the protocol library: requests.ts), the commands (commands.ts) and conversion to LSP types. The
 * lifecycle (nothing before initialize, nothing after shutdown) is enforced where messages enter
 * (lifecycle.ts), so this file can assume an initialised connection. The logic lives in ../service.
 */
import {
  CodeActionKind,
  TextDocumentSyncKind,
  type CodeAction as LspCodeAction,
  type Connection,
  type InitializeParams,
  type InitializeResult,
  type WorkspaceEdit,
} from 'vscode-languageserver';
import type { Range, TextEdit } from '../service/languageService';
import { SERVER_COMMANDS } from '../shared/commands';
import { VERSION } from '../shared/version';
import { commandHandler } from './commands';
import { CollectionBudget } from './memory';
import { invalidParams, isRange, makeRequestWrapper, oneLine, positionOf, uriOf } from './requests';
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

  // TextDocuments reports an open as an open and a change; the open validates at once, the change is skipped.
  const justOpened = new Set<string>();
  documents.onDidOpen((e) => {
    const uri = e.document.uri;
    workspace.opened(uri);
    justOpened.add(uri);
    workspace.refreshSettings(uri).then(
      () => validator.schedule(uri, 0),
      (err) => log(`ionwright: open failed: ${oneLine(err)}`),
    );
  });
  documents.onDidChangeContent((e) => {
    if (justOpened.delete(e.document.uri)) return;
    validator.schedule(e.document.uri, workspace.settingsOf(e.document.uri).validationDelayMs);
  });
  documents.onDidClose((e) => {
    const uri = e.document.uri;
    validator.cancel(uri);
    justOpened.delete(uri);
    workspace.closed(uri);
    void connection.sendDiagnostics({ uri, diagnostics: [] });
  });
  connection.onDidChangeConfiguration((params) => {
    workspace.configurationChanged((params?.settings as { ionwright?: unknown } | undefined)?.ionwright);
    void (async () => {
      for (const td of documents.all()) {
        await workspace.refreshSettings(td.uri);
        validator.schedule(td.uri, 0);
      }
    })().catch((e) => log(`ionwright: configuration failed: ${oneLine(e)}`));
  });

  connection.onHover(
    request('hover', (params) => {
      const snap = workspace.snapshot(uriOf(params));
      if (!snap) return null;
      const h = snap.service.hover(snap.doc, positionOf(params));
      return h ? { contents: { kind: 'markdown' as const, value: h.markdown }, range: h.range } : null;
    }),
  );

  const toLspActions = (snap: Snapshot, range: Range, only?: string[]): LspCodeAction[] =>
    snap.service.codeActions(snap.doc, range, only).map((a) => ({
      title: a.title,
      kind: a.kind,
      edit: shape.edit(snap, a.edits),
      ...(a.isPreferred ? { isPreferred: true } : {}),
      ...(a.fixes ? { diagnostics: [a.fixes.diagnostic] as never } : {}),
    }));

  connection.onCodeAction(
    request('codeAction', (params) => {
      const uri = uriOf(params);
      if (!isRange(params.range)) throw invalidParams('range must be {start, end} positions');
      const only = params.context?.only as unknown;
      if (only !== undefined && only !== null && !(Array.isArray(only) && only.every((k) => typeof k === 'string')))
        throw invalidParams('context.only must be a list of code action kinds (strings)');
      const snap = workspace.snapshot(uri);
      if (!snap) return null;
      return toLspActions(snap, params.range, (only ?? undefined) as string[] | undefined);
    }),
  );

  connection.onDocumentSymbol(
    request('documentSymbol', (params) => {
      const snap = workspace.snapshot(uriOf(params));
      return snap ? (snap.service.documentSymbols(snap.doc) as never) : null;
    }),
  );

  connection.onCodeLens(
    request('codeLens', (params) => {
      const snap = workspace.snapshot(uriOf(params));
      if (!snap) return null;
      return snap.service.codeLenses(snap.doc).map((l) => ({
        range: l.range,
        command: { title: l.title, command: SERVER_COMMANDS.insertTableAt, arguments: [{ uri: snap.uri, position: l.range.start }] },
      }));
    }),
  );

  connection.onExecuteCommand(request('executeCommand', commandHandler(connection, workspace, shape)));

  documents.listen(connection);
  connection.listen();
  return { documents, validator, workspace };
}
