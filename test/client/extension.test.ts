/**
 * The bundled VS Code client (dist/extension.js) loaded in Node with a stand-in for the `vscode` module:
 * activation returns `extendMarkdownIt`, which installs the preview plugin on the preview's markdown-it,
 * reads `ionwright.preview.typesetFormulas`, and re-reads it (and refreshes the preview) when the
 * configuration changes. What VS Code itself does with the plugin is outside this test.
 */
import MarkdownIt from 'markdown-it';
import Module from 'node:module';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

/** Everything the bundle touches on `vscode` at load time: namespaces and classes (stand-ins). */
const NAMES = (
  'CallHierarchyIncomingCall CallHierarchyItem CallHierarchyOutgoingCall CancellationError CancellationTokenSource CodeActionKind CodeActionTriggerKind CodeLens Color ColorInformation ' +
  'ColorPresentation CompletionItem CompletionItemKind CompletionItemTag CompletionList CompletionTriggerKind DiagnosticRelatedInformation DiagnosticSeverity DiagnosticTag Disposable ' +
  'DocumentHighlight DocumentHighlightKind DocumentLink DocumentSymbol EventEmitter FileType FoldingRange FoldingRangeKind Hover InlayHint InlayHintLabelPart InlineCompletionItem ' +
  'InlineCompletionList InlineCompletionTriggerKind InlineValueEvaluatableExpression InlineValueText InlineValueVariableLookup LinkedEditingRanges Location LogLevel MarkdownString ' +
  'ParameterInformation Position ProgressLocation Range RelativePattern SelectionRange SemanticTokens SemanticTokensEdit SemanticTokensEdits SignatureHelp SignatureHelpTriggerKind ' +
  'SignatureInformation SnippetString SnippetTextEdit SymbolInformation SymbolKind SymbolTag TabInputCustom TabInputNotebook TabInputText TabInputTextDiff TextDocumentSaveReason ' +
  'TextEdit TypeHierarchyItem Uri WorkspaceEdit commands env languages version window workspace Diagnostic CodeAction'
).split(' ');

/** A stand-in that accepts any call, construction or property access. */
function stub(path: string): any {
  return new Proxy(function () {}, {
    get: (_t, p) => (p === 'then' ? undefined : p === Symbol.toPrimitive ? () => path : p === 'prototype' ? {} : stub(`${path}.${String(p)}`)),
    apply: () => stub(`${path}()`),
    construct: () => stub(`new ${path}`),
  });
}

const config: { preview: { typesetFormulas: boolean } } = { preview: { typesetFormulas: true } };
const executed: string[] = [];
let onConfigChange: ((e: { affectsConfiguration(s: string): boolean }) => void) | undefined;
const special: Record<string, unknown> = {
  version: '1.91.0',
  // The browser entry finds its server's worker script under the extension's URI.
  Uri: new Proxy(
    {},
    {
      get: (_t, p) =>
        p === 'joinPath' ? (base: { path: string }, ...parts: string[]) => ({ toString: () => [base.path, ...parts].join('/') }) : stub(`Uri.${String(p)}`),
    },
  ),
  workspace: new Proxy(
    {},
    {
      get: (_t, p) => {
        if (p === 'getConfiguration') return () => ({ get: (k: string) => (k === 'ionwright' ? config : undefined) });
        if (p === 'onDidChangeConfiguration') return (cb: typeof onConfigChange) => ((onConfigChange = cb), { dispose() {} });
        return stub(`workspace.${String(p)}`);
      },
    },
  ),
  commands: new Proxy(
    {},
    {
      get: (_t, p) => (p === 'executeCommand' ? async (c: string) => void executed.push(c) : stub(`commands.${String(p)}`)),
    },
  ),
};
const vscode = new Proxy(
  {},
  {
    get: (_t, p) => (typeof p === 'string' && p in special ? special[p] : p === '__esModule' ? undefined : stub(String(p))),
    ownKeys: () => NAMES,
    getOwnPropertyDescriptor: (_t, p) =>
      NAMES.includes(p as string) ? { configurable: true, enumerable: true, value: special[p as string] ?? stub(String(p)) } : undefined,
  },
);

const load = (Module as unknown as { _load: (...a: unknown[]) => unknown })._load;
(Module as unknown as { _load: (...a: unknown[]) => unknown })._load = function (request: unknown, ...rest: unknown[]) {
  return request === 'vscode' ? vscode : load.call(this, request, ...rest);
};
afterAll(() => {
  (Module as unknown as { _load: typeof load })._load = load;
});

describe('the bundled client', () => {
  // npm test builds dist/ first.
  const ext = Module.createRequire(__filename)(join(__dirname, '../../dist/extension.js'));
  const api = ext.activate({ subscriptions: [], asAbsolutePath: (p: string) => p });

  it('returns extendMarkdownIt, which typesets formulas in the preview', () => {
    expect(typeof api.extendMarkdownIt).toBe('function');
    const md = api.extendMarkdownIt(new MarkdownIt());
    expect(md.render('`CuSO4.5H2O`')).toContain('CuSO<sub>4</sub><span class="iw-dot">·</span>5H<sub>2</sub>O');
  });

  it('follows ionwright.preview.typesetFormulas, and refreshes the preview when it changes', () => {
    const md = api.extendMarkdownIt(new MarkdownIt());
    config.preview.typesetFormulas = false;
    onConfigChange?.({ affectsConfiguration: (s) => s === 'ionwright' });
    expect(md.render('`NaCl`')).toBe('<p><code>NaCl</code></p>\n');
    expect(executed).toContain('markdown.preview.refresh');
    config.preview.typesetFormulas = true;
    onConfigChange?.({ affectsConfiguration: (s) => s === 'ionwright' });
    expect(md.render('`NaCl`')).toContain('class="iw-formula"');
  });

  it('ignores changes to other settings', () => {
    const before = executed.length;
    onConfigChange?.({ affectsConfiguration: (s) => s === 'editor' });
    expect(executed.length).toBe(before);
  });
});

describe('the bundled browser client (package.json browser)', () => {
  // VS Code for the Web starts the server in a Web Worker made from the extension's own files.
  const created: string[] = [];
  const g = globalThis as { Worker?: unknown };
  const before = g.Worker;
  g.Worker = class {
    constructor(url: string) {
      created.push(url);
    }
    postMessage() {}
    addEventListener() {}
    removeEventListener() {}
    terminate() {}
  };
  afterAll(() => {
    g.Worker = before;
  });
  // Activated once the desktop bundle's tests are done (the stand-in keeps one configuration listener).
  let api: { extendMarkdownIt(md: InstanceType<typeof MarkdownIt>): InstanceType<typeof MarkdownIt> };
  beforeAll(() => {
    const ext = Module.createRequire(__filename)(join(__dirname, '../../dist/browser/extension.js'));
    api = ext.activate({ subscriptions: [], extensionUri: { path: '/ext' } });
  });

  it('starts the server from dist/browser/server.js in a worker', () => {
    expect(created).toEqual(['/ext/dist/browser/server.js']);
  });

  it('returns extendMarkdownIt, which typesets formulas in the preview', () => {
    const md = api.extendMarkdownIt(new MarkdownIt());
    expect(md.render('`CuSO4.5H2O`')).toContain('CuSO<sub>4</sub><span class="iw-dot">·</span>5H<sub>2</sub>O');
  });
});
