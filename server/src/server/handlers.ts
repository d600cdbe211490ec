/**
 * The server's handlers: the document events (open, change, close, configuration) that drive validation,
 * and the language features (hover, code actions, symbols, code lenses), each a request checked and
 * converted to LSP types here, computed by the language service (the typing and navigation features:
 * editing.ts).
 */
import type { CodeAction as LspCodeAction, Connection } from 'vscode-languageserver';
import type { Range } from '../service/languageService';
import { CLIENT_COMMANDS, SERVER_COMMANDS } from '../shared/commands';
import { invalidParams, isRange, oneLine, positionOf, uriOf, type makeRequestWrapper } from './requests';
import type { EditShape } from './server';
import type { DebouncedValidator } from './validator';
import type { NotesWorkspace, Snapshot } from './workspace';

type RequestWrapper = ReturnType<typeof makeRequestWrapper>;

/** Open, change, close and configuration: what is validated when. */
export function registerDocumentEvents(
  connection: Connection,
  workspace: NotesWorkspace,
  validator: DebouncedValidator,
  log: (line: string) => void,
  /** Called once the settings of every open note were read again after a configuration change. */
  afterConfiguration: () => void = () => undefined,
) {
  const { documents } = workspace;
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
      afterConfiguration();
    })().catch((e) => log(`ionwright: configuration failed: ${oneLine(e)}`));
  });
}

/** Hover, code actions, symbols and code lenses. */
export function registerFeatures(connection: Connection, workspace: NotesWorkspace, shape: EditShape, request: RequestWrapper) {
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
      // The totals lens runs nothing (an empty command: shown, not clickable). Inserting a table is the
      // server's command (any client can run it); copying to the clipboard is the editor's, so that lens
      // names the client's command (VS Code; other clients can ask the server for the text with
      // ionwright.server.weighingList).
      const command = { none: '', insertTable: SERVER_COMMANDS.insertTableAt, copyWeighingList: CLIENT_COMMANDS.copyWeighingList } as const;
      return snap.service.codeLenses(snap.doc).map((l) => ({
        range: l.range,
        command:
          l.action === 'none'
            ? { title: l.title, command: '' }
            : { title: l.title, command: command[l.action], arguments: [{ uri: snap.uri, position: l.range.start }] },
      }));
    }),
  );
}
