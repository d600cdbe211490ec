/**
 * Thin LSP wiring over the language service: documents (incremental sync), a version-keyed cache of
 * analysed documents, debounced validation, settings, and one `safe()` wrapper so that no exception
 * reaches the protocol library. The logic lives in ../service.
 */
import {
  CodeActionKind,
  ResponseError,
  TextDocuments,
  TextDocumentSyncKind,
  type CancellationToken,
  type CodeAction as LspCodeAction,
  type Connection,
  type InitializeResult,
} from 'vscode-languageserver';
import { TextDocument } from 'vscode-languageserver-textdocument';
import type { NotesLanguage } from '../notes/types';
import { codeActions, sectionTableEdit, tableEditAt, tableEditForSelection, type TextEdit } from '../service/actions';
import { documentDiagnostics } from '../service/diagnostics';
import { analyseDocument, updateDocument, type AnalysedDocument, type ChangeHint } from '../service/document';
import { formulaCardMarkdown, hover } from '../service/hover';
import { targetAt } from '../service/lookup';
import type { Position, Range } from '../service/positions';
import { codeLenses, documentSymbols } from '../service/symbols';
import { analyseFormula } from '../chem/analyse';
import { readSettings, type ServerSettings } from '../service/config';
import { DebouncedValidator, realTimers, type Timers } from './validator';

export const COMMANDS = {
  insertTable: 'ionwright.server.insertTable',
  insertSectionTable: 'ionwright.server.insertSectionTable',
  insertTableAt: 'ionwright.server.insertTableAt',
  cardMarkdown: 'ionwright.server.cardMarkdown',
} as const;

export function languageOfDocument(languageId: string, uri: string): NotesLanguage | undefined {
  if (languageId === 'fnote' || uri.endsWith('.fnote')) return 'fnote';
  if (languageId === 'markdown' || uri.endsWith('.md') || uri.endsWith('.markdown')) return 'markdown';
  return undefined;
}

const isPosition = (p: unknown): p is Position => !!p && typeof (p as Position).line === 'number' && typeof (p as Position).character === 'number';
const isRange = (r: unknown): r is Range => !!r && isPosition((r as Range).start) && isPosition((r as Range).end);

export interface ServerOptions {
  timers?: Timers;
}

export function startServer(connection: Connection, options: ServerOptions = {}) {
  // The edited range of each change is recorded, so that re-analysis only redoes the blocks around it.
  const hints = new Map<string, ChangeHint | null>();
  const documents = new TextDocuments<TextDocument>({
    create: TextDocument.create,
    update: (doc, changes, version) => {
      const prevHint = hints.get(doc.uri);
      let hint: ChangeHint | null = null;
      if (changes.length === 1 && 'range' in changes[0] && prevHint === undefined) {
        const c = changes[0];
        const start = doc.offsetAt(c.range.start);
        const oldEnd = doc.offsetAt(c.range.end);
        hint = { start, oldEnd, newEnd: start + c.text.length };
      }
      // Several changes between two analyses: let the analysis find the region itself.
      hints.set(doc.uri, prevHint === undefined ? hint : null);
      return TextDocument.update(doc, changes, version);
    },
  });
  const cache = new Map<string, { version: number; settings: ServerSettings; doc: AnalysedDocument }>();
  const settingsByUri = new Map<string, Promise<ServerSettings>>();
  let canReadConfiguration = false;
  const defaults = readSettings(undefined);

  const log = (msg: string) => connection.console.error(`ionwright: ${msg}`);

  /** Run a handler; an exception is logged and answered with null instead of reaching the library. */
  const safe = <A extends unknown[], R>(name: string, fn: (...args: A) => R | Promise<R>) =>
    async (...args: A): Promise<R | null> => {
      try {
        return await fn(...args);
      } catch (e) {
        if (e instanceof ResponseError) throw e;
        log(`${name} failed: ${(e as Error)?.stack ?? String(e)}`);
        return null;
      }
    };

  /** Settings pushed with didChangeConfiguration, for clients that cannot be asked (workspace/configuration). */
  let pushed: ServerSettings | undefined;
  const settingsFor = (uri: string): Promise<ServerSettings> => {
    if (!canReadConfiguration) return Promise.resolve(pushed ?? defaults);
    let p = settingsByUri.get(uri);
    if (!p) {
      p = connection.workspace
        .getConfiguration({ scopeUri: uri, section: 'ionwright' })
        .then((raw) => readSettings(raw))
        .catch(() => defaults);
      settingsByUri.set(uri, p);
    }
    return p;
  };
  let currentSettings = new Map<string, ServerSettings>();

  /** The analysed document for the current version (computed once per version and settings). */
  const analysed = (uri: string): AnalysedDocument | undefined => {
    const td = documents.get(uri);
    if (!td) return undefined;
    const lang = languageOfDocument(td.languageId, td.uri);
    if (!lang) return undefined;
    const settings = currentSettings.get(uri) ?? defaults;
    const hit = cache.get(uri);
    if (hit && hit.version === td.version && hit.settings === settings) return hit.doc;
    const hint = hints.get(uri);
    hints.delete(uri);
    const doc =
      hit && hit.settings === settings && hit.doc.language === lang
        ? updateDocument(hit.doc, td.getText(), hint ?? undefined)
        : analyseDocument(td.getText(), lang, settings.service);
    cache.set(uri, { version: td.version, settings, doc });
    return doc;
  };

  const validateNow = (uri: string) => {
    const td = documents.get(uri);
    if (!td) return;
    const version = td.version;
    const doc = analysed(uri);
    if (!doc) return;
    // Stale: a newer version arrived while this one was analysed.
    if (documents.get(uri)?.version !== version) return;
    void connection.sendDiagnostics({ uri, version, diagnostics: documentDiagnostics(doc) as never });
  };
  const validator = new DebouncedValidator(options.timers ?? realTimers, (uri) => {
    try {
      validateNow(uri);
    } catch (e) {
      log(`validation failed: ${(e as Error)?.stack ?? String(e)}`);
    }
  });

  const refreshSettings = async (uri: string) => {
    const s = await settingsFor(uri);
    currentSettings.set(uri, s);
    return s;
  };

  connection.onInitialize((params): InitializeResult => {
    canReadConfiguration = !!params.capabilities.workspace?.configuration;
    return {
      capabilities: {
        textDocumentSync: { openClose: true, change: TextDocumentSyncKind.Incremental },
        hoverProvider: true,
        codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix, CodeActionKind.RefactorRewrite] },
        documentSymbolProvider: true,
        codeLensProvider: { resolveProvider: false },
        executeCommandProvider: { commands: Object.values(COMMANDS) },
      },
      serverInfo: { name: 'ionwright', version: '0.1.0' },
    };
  });

  // TextDocuments reports an open as an open and a change; the open validates at once, the change is skipped.
  const justOpened = new Set<string>();
  documents.onDidOpen((e) => {
    justOpened.add(e.document.uri);
    void safe('open', async () => {
      await refreshSettings(e.document.uri);
      validator.schedule(e.document.uri, 0);
    })();
  });
  documents.onDidChangeContent(
    safe('change', (e) => {
      if (justOpened.delete(e.document.uri)) return;
      validator.schedule(e.document.uri, (currentSettings.get(e.document.uri) ?? defaults).validationDelayMs);
    }),
  );
  documents.onDidClose(
    safe('close', (e) => {
      validator.cancel(e.document.uri);
      justOpened.delete(e.document.uri);
      cache.delete(e.document.uri);
      hints.delete(e.document.uri);
      settingsByUri.delete(e.document.uri);
      currentSettings.delete(e.document.uri);
      void connection.sendDiagnostics({ uri: e.document.uri, diagnostics: [] });
    }),
  );
  connection.onDidChangeConfiguration((params) => {
    const raw = (params?.settings as { ionwright?: unknown } | undefined)?.ionwright;
    if (!canReadConfiguration && raw !== undefined) pushed = readSettings(raw);
    void safe('configuration', async () => {
      settingsByUri.clear();
      currentSettings = new Map();
      for (const td of documents.all()) {
        await refreshSettings(td.uri);
        validator.schedule(td.uri, 0);
      }
    })();
  });

  const docAndOffset = (uri: unknown, position: unknown, token?: CancellationToken) => {
    if (typeof uri !== 'string' || !isPosition(position) || token?.isCancellationRequested) return undefined;
    const doc = analysed(uri);
    if (!doc) return undefined;
    return { doc, offset: doc.lines.offsetAt(position) };
  };

  connection.onHover(
    safe('hover', (params, token) => {
      const at = docAndOffset(params.textDocument?.uri, params.position, token);
      if (!at) return null;
      const h = hover(at.doc, at.offset);
      return h ? { contents: { kind: 'markdown' as const, value: h.markdown }, range: h.range } : null;
    }),
  );

  const toLspActions = (uri: string, doc: AnalysedDocument, start: number, end: number, only?: string[]): LspCodeAction[] =>
    codeActions(doc, start, end, only).map((a) => ({
      title: a.title,
      kind: a.kind,
      edit: { changes: { [uri]: a.edits } },
      ...(a.isPreferred ? { isPreferred: true } : {}),
      ...(a.fixes ? { diagnostics: documentDiagnostics(doc).filter((d) => d.code === a.fixes!.code && JSON.stringify(d.range) === JSON.stringify(a.fixes!.range)) as never } : {}),
    }));

  connection.onCodeAction(
    safe('codeAction', (params, token) => {
      const uri = params.textDocument?.uri;
      if (typeof uri !== 'string' || !isRange(params.range) || token.isCancellationRequested) return null;
      const doc = analysed(uri);
      if (!doc) return null;
      let start = doc.lines.offsetAt(params.range.start);
      let end = doc.lines.offsetAt(params.range.end);
      if (end < start) [start, end] = [end, start];
      return toLspActions(uri, doc, start, end, params.context?.only);
    }),
  );

  connection.onDocumentSymbol(
    safe('documentSymbol', (params, token) => {
      if (token.isCancellationRequested || typeof params.textDocument?.uri !== 'string') return null;
      const doc = analysed(params.textDocument.uri);
      return doc ? (documentSymbols(doc) as never) : null;
    }),
  );

  connection.onCodeLens(
    safe('codeLens', (params, token) => {
      if (token.isCancellationRequested || typeof params.textDocument?.uri !== 'string') return null;
      const uri = params.textDocument.uri;
      const doc = analysed(uri);
      if (!doc) return null;
      return codeLenses(doc).map((l) => ({ range: l.range, command: { title: l.title, command: COMMANDS.insertTableAt, arguments: [{ uri, position: l.range.start }] } }));
    }),
  );

  const apply = async (uri: string, edit: TextEdit | undefined, label: string) => {
    if (!edit) return { applied: false, reason: 'nothing to tabulate here' };
    const r = await connection.workspace.applyEdit({ label, edit: { changes: { [uri]: [edit] } } });
    return { applied: r.applied };
  };

  connection.onExecuteCommand(
    safe('executeCommand', async (params) => {
      const arg = (params.arguments?.[0] ?? {}) as { uri?: unknown; position?: unknown; range?: unknown; formula?: unknown };
      switch (params.command) {
        case COMMANDS.cardMarkdown: {
          if (typeof arg.formula === 'string') return formulaCardMarkdown(analyseFormula(arg.formula.trim(), defaults.service.chem), defaults.service);
          const at = docAndOffset(arg.uri, arg.position);
          if (!at) return null;
          const t = targetAt(at.doc, at.offset);
          if (!t) return null;
          if (t.kind === 'formula') return formulaCardMarkdown(t.occ.analysis, at.doc.settings);
          if (t.kind === 'batch-line') return formulaCardMarkdown(t.ingredient.analysis, at.doc.settings);
          return hover(at.doc, at.offset)?.markdown ?? null;
        }
        case COMMANDS.insertTable: {
          if (typeof arg.uri !== 'string' || !isRange(arg.range)) throw new ResponseError(-32602, 'insertTable needs {uri, range}');
          const doc = analysed(arg.uri);
          if (!doc) return null;
          let s = doc.lines.offsetAt(arg.range.start);
          let e = doc.lines.offsetAt(arg.range.end);
          if (e < s) [s, e] = [e, s];
          return apply(arg.uri, tableEditForSelection(doc, s, e), 'Insert Ionwright table');
        }
        case COMMANDS.insertSectionTable: {
          const at = docAndOffset(arg.uri, arg.position);
          if (!at) return null;
          return apply(arg.uri as string, sectionTableEdit(at.doc, at.offset), 'Insert Ionwright section tables');
        }
        case COMMANDS.insertTableAt: {
          const at = docAndOffset(arg.uri, arg.position);
          if (!at) return null;
          return apply(arg.uri as string, tableEditAt(at.doc, at.offset)?.edit, 'Insert Ionwright table');
        }
        default:
          throw new ResponseError(-32601, `unknown command ${params.command}`);
      }
    }),
  );

  documents.listen(connection);
  connection.listen();
  return { documents, validator };
}
