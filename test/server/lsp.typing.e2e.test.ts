/**
 * The typing and navigation features end to end over stdio (dist/server.js), with a workspace folder on
 * disk: completion lists, inlay hint text, semantic token positions, folding ranges, workspace symbols
 * (open notes and the folder's), definitions across notes, the two code lenses and the weighing list,
 * and the setting that turns inlay hints off.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CodeLensRequest,
  CompletionRequest,
  ConfigurationRequest,
  createProtocolConnection,
  DefinitionRequest,
  DidChangeConfigurationNotification,
  DidOpenTextDocumentNotification,
  ExecuteCommandRequest,
  ExitNotification,
  FoldingRangeRequest,
  HoverRequest,
  InitializedNotification,
  InitializeRequest,
  InlayHintRequest,
  SemanticTokensRangeRequest,
  SemanticTokensRequest,
  ShutdownRequest,
  StreamMessageReader,
  StreamMessageWriter,
  WorkspaceSymbolRequest,
  type CompletionList,
  type InitializeResult,
  type ProtocolConnection,
  type SymbolInformation,
} from 'vscode-languageserver-protocol/node';
import { decodeTokens } from '../../server/src/service/semanticTokens';
import { tmpdir } from 'node:os';
import { tempFolders } from '../temp';

const tempDir = tempFolders();

const SERVER = join(__dirname, '../../dist/server.js');
let proc: ChildProcess;
let conn: ProtocolConnection;
let init: InitializeResult;
let settings: Record<string, unknown> = {};
let folder: string;

const TEXT = [
  '# Strike trials 🧪',
  '',
  'The rinse uses `CuSO4·5H2O` and `2 H2 + O2 -> 2 H2O`; we reused Rinse B from the shelf note.',
  '',
  '```batch',
  'name: Strike S-1',
  'volume: 500 mL',
  'NiCl2 0.2 M',
  'KNO3 5 g',
  'Na',
  '```',
  '',
].join('\n');
let URI: string;
const lines = TEXT.split('\n');

async function symbolsUntil(query: string, pred: (s: SymbolInformation[]) => boolean): Promise<SymbolInformation[]> {
  const t0 = Date.now();
  for (;;) {
    const s = ((await conn.sendRequest(WorkspaceSymbolRequest.type, { query })) ?? []) as SymbolInformation[];
    if (pred(s) || Date.now() - t0 > 10_000) return s;
    await new Promise((r) => setTimeout(r, 20));
  }
}

beforeAll(async () => {
  folder = tempDir(join(tmpdir(), 'ionwright-ws-'));
  mkdirSync(join(folder, 'shelf'), { recursive: true });
  writeFileSync(
    join(folder, 'shelf', 'rinses.md'),
    '# Rinses\n\n```batch\nname: Rinse B\nvolume: 1 L\nNaHCO3 2 g\n```\n\nWe keep `NaHCO3` and `NaHCO3` at hand.\n',
  );
  // The lab's shelf file: its labels are read in every note without a shelf of its own.
  writeFileSync(join(folder, 'lab.shelf.md'), '# Shelf\n\n```shelf\nAcid A: H2SO4 @ 96 %; density 1.84 g/mL; lot SA-2231\n```\n');
  mkdirSync(join(folder, 'node_modules'), { recursive: true });
  writeFileSync(join(folder, 'node_modules', 'skip.md'), '```batch\nname: Not indexed\nKCl 1 g\n```\n');
  URI = pathToFileURL(join(folder, 'strike.md')).href;
  proc = spawn('node', [SERVER, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
  proc.stderr!.resume();
  conn = createProtocolConnection(new StreamMessageReader(proc.stdout!), new StreamMessageWriter(proc.stdin!));
  conn.onNotification('textDocument/publishDiagnostics', () => undefined);
  conn.onRequest(ConfigurationRequest.type, (p) => p.items.map(() => settings));
  conn.listen();
  init = await conn.sendRequest(InitializeRequest.type, {
    processId: process.pid,
    rootUri: pathToFileURL(folder).href,
    workspaceFolders: [{ uri: pathToFileURL(folder).href, name: 'lab' }],
    capabilities: { workspace: { configuration: true } },
  });
  await conn.sendNotification(InitializedNotification.type, {});
  await conn.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri: URI, languageId: 'markdown', version: 1, text: TEXT } });
});

afterAll(async () => {
  try {
    await conn.sendRequest(ShutdownRequest.type);
    await conn.sendNotification(ExitNotification.type);
  } catch {
    /* already gone */
  }
  proc.kill();
});

describe('the workspace shelf file', () => {
  it('lets an open note name a reagent by its shelf label', async () => {
    const uri = pathToFileURL(join(folder, 'pickle.md')).href;
    const text = '```batch\nvolume: 1 L\nAcid A 10 mL\n```\n';
    await conn.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'markdown', version: 1, text } });
    let md = '';
    for (let t0 = Date.now(); Date.now() - t0 < 10_000 && !md.includes('shelf: Acid A'); await new Promise((r) => setTimeout(r, 50))) {
      const h = (await conn.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line: 2, character: 2 } })) as {
        contents: { value: string };
      } | null;
      md = h?.contents.value ?? '';
    }
    expect(md).toContain('shelf: Acid A');
    // 10 mL × 1.84 g/mL (the shelf's density) = 18.4 g poured.
    expect(md).toContain('18.4 g');
  });
});

describe('typing features over stdio', () => {
  it('announces the capabilities with a standard legend', () => {
    const c = init.capabilities;
    expect(c.completionProvider).toMatchObject({ triggerCharacters: [' '] });
    expect(c.inlayHintProvider).toBeTruthy();
    expect(c.semanticTokensProvider).toMatchObject({ full: true, range: true, legend: { tokenTypes: expect.arrayContaining(['type', 'number', 'operator']) } });
    expect(c.foldingRangeProvider).toBe(true);
    expect(c.workspaceSymbolProvider).toBe(true);
    expect(c.definitionProvider).toBe(true);
  });

  it('completes substances at the start of a batch line, the folder note’s first by use', async () => {
    await symbolsUntil('Rinse', (s) => s.length > 0);
    const list = (await conn.sendRequest(CompletionRequest.type, { textDocument: { uri: URI }, position: { line: 9, character: 2 } })) as CompletionList;
    const formulas = list.items.filter((i) => i.kind === 12).map((i) => i.label);
    // NaHCO3 is written three times in the folder's note; then the tool's tables.
    expect(formulas[0]).toBe('NaHCO3');
    // CIAAW 2021: Na 22.990 + H 1.008 + C 12.011 + 3 × O 15.999 = 84.01 g/mol.
    expect(list.items.find((i) => i.label === 'NaHCO3')!.detail).toBe('84.01 g/mol');
    expect(list.items.find((i) => i.label === 'NaCl')!.textEdit).toEqual({
      range: { start: { line: 9, character: 0 }, end: { line: 9, character: 2 } },
      newText: 'NaCl ',
    });
  });

  it('completes units after an amount', async () => {
    const list = (await conn.sendRequest(CompletionRequest.type, {
      textDocument: { uri: URI },
      position: { line: 7, character: 'NiCl2 0.2 '.length },
    })) as CompletionList;
    expect(list.items.map((i) => i.label)).toEqual(expect.arrayContaining(['g', 'mg', 'kg', 'mol', 'mmol', 'M', 'mM', 'wt%']));
  });

  it('answers inlay hints with the mass to weigh (and the batch pH after its opening line)', async () => {
    const hints = await conn.sendRequest(InlayHintRequest.type, {
      textDocument: { uri: URI },
      range: { start: { line: 0, character: 0 }, end: { line: 12, character: 0 } },
    });
    // 0.2 mol/L × 0.5 L × 129.59 g/mol (NiCl2; CIAAW 2021: Ni 58.693 + 2 × Cl 35.45) = 12.96 g.
    expect(hints!.filter((h) => String(h.label).startsWith('⇒'))).toEqual([
      expect.objectContaining({ position: { line: 7, character: 11 }, label: '⇒ 12.96 g', paddingLeft: true }),
    ]);
    expect(hints!.filter((h) => String(h.label).startsWith('pH'))).toHaveLength(1);
  });

  it('answers semantic tokens at the formulas’ positions, whole and for a range', async () => {
    const full = await conn.sendRequest(SemanticTokensRequest.type, { textDocument: { uri: URI } });
    const toks = decodeTokens(full!.data).map((t) => [t.line, t.character, lines[t.line].slice(t.character, t.character + t.length), t.type]);
    const l2 = lines[2];
    expect(toks).toEqual(
      expect.arrayContaining([
        [2, l2.indexOf('CuSO4'), 'CuSO4', 'type'],
        [2, l2.indexOf('·'), '·', 'operator'],
        [2, l2.indexOf('->'), '->', 'operator'],
        [5, 0, 'name', 'property'],
        [7, 0, 'NiCl2', 'type'],
        [7, 6, '0.2', 'number'],
      ]),
    );
    const part = await conn.sendRequest(SemanticTokensRangeRequest.type, {
      textDocument: { uri: URI },
      range: { start: { line: 7, character: 0 }, end: { line: 8, character: 99 } },
    });
    expect(decodeTokens(part!.data).map((t) => lines[t.line].slice(t.character, t.character + t.length))).toEqual(['NiCl2', '0.2', 'KNO3', '5']);
  });

  it('answers folding ranges for the section and the batch', async () => {
    const f = await conn.sendRequest(FoldingRangeRequest.type, { textDocument: { uri: URI } });
    expect(f!.map((r) => [r.startLine, r.endLine])).toEqual([
      [0, 10],
      [4, 10],
    ]);
  });

  it('lists batches of the open note and of the workspace folder (node_modules skipped)', async () => {
    const s = await symbolsUntil('', (x) => x.length >= 2);
    expect(s.map((x) => [x.name, x.location.uri])).toEqual([
      ['Strike S-1', URI],
      ['Rinse B', pathToFileURL(join(folder, 'shelf', 'rinses.md')).href],
    ]);
  });

  it('goes from a batch name in prose to the batch in another note', async () => {
    const def = await conn.sendRequest(DefinitionRequest.type, {
      textDocument: { uri: URI },
      position: { line: 2, character: lines[2].indexOf('Rinse B') + 2 },
    });
    expect(def).toEqual([
      { uri: pathToFileURL(join(folder, 'shelf', 'rinses.md')).href, range: { start: { line: 3, character: 6 }, end: { line: 3, character: 13 } } },
    ]);
  });

  it('puts three lenses on a batch: totals, Insert table, Copy as weighing list (plain text)', async () => {
    const lenses = await conn.sendRequest(CodeLensRequest.type, { textDocument: { uri: URI } });
    expect(lenses!.map((l) => [l.command!.title.replace(/^2 ingredients · .*/, 'totals'), l.command!.command])).toEqual([
      ['totals', ''],
      ['Insert table', 'ionwright.server.insertTableAt'],
      ['Copy as weighing list', 'ionwright.copyWeighingList'],
    ]);
    const text = await conn.sendRequest(ExecuteCommandRequest.type, { command: 'ionwright.server.weighingList', arguments: lenses![2].command!.arguments });
    expect(text).toMatch(/^Strike S-1, final volume 500 mL — INCOMPLETE: 1 line not counted\n/);
    // NiCl2: 58.693 + 2 × 35.45 = 129.59 g/mol (CIAAW 2021); 0.1 mol of it is 12.96 g.
    expect(text).toMatch(/NiCl₂\s+0\.2 M\s+129\.59\s+12\.96/);
    expect(text).toContain('Cautions:');
  });

  it('turns inlay hints off with ionwright.inlayHints.enabled', async () => {
    settings = { inlayHints: { enabled: false } };
    await conn.sendNotification(DidChangeConfigurationNotification.type, { settings: { ionwright: settings } });
    const t0 = Date.now();
    let hints: unknown = undefined;
    while (Date.now() - t0 < 5000) {
      hints = await conn.sendRequest(InlayHintRequest.type, {
        textDocument: { uri: URI },
        range: { start: { line: 0, character: 0 }, end: { line: 12, character: 0 } },
      });
      if (hints === null) break;
      await new Promise((r) => setTimeout(r, 20));
    }
    expect(hints).toBeNull();
    settings = {};
  });
});

describe('the workspace of a virtual folder, read through the client', () => {
  it('reads file: folders from disk and asks the client for the others', async () => {
    const p = spawn('node', [SERVER, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
    p.stderr!.resume();
    const c = createProtocolConnection(new StreamMessageReader(p.stdout!), new StreamMessageWriter(p.stdin!));
    const asked: Array<[string, unknown]> = [];
    c.onRequest('ionwright/listNotes', (params: { folderUri: string }) => {
      asked.push(['ionwright/listNotes', params.folderUri]);
      return params.folderUri === 'vscode-vfs://github/lab/notes' ? ['vscode-vfs://github/lab/notes/bath.md'] : [];
    });
    c.onRequest('ionwright/readNote', (params: { uri: string }) => {
      asked.push(['ionwright/readNote', params.uri]);
      return '```batch\nname: Remote rinse R-1\nKCl 2 g\n```\n';
    });
    c.listen();
    try {
      await c.sendRequest(InitializeRequest.type, {
        processId: process.pid,
        rootUri: null,
        workspaceFolders: [
          { uri: pathToFileURL(folder).href, name: 'lab' },
          { uri: 'vscode-vfs://github/lab/notes', name: 'remote' },
        ],
        capabilities: {},
        initializationOptions: { workspaceNotes: true },
      });
      await c.sendNotification(InitializedNotification.type, {});
      let names: string[] = [];
      for (let t0 = Date.now(); Date.now() - t0 < 10_000 && names.length < 2; await new Promise((r) => setTimeout(r, 20)))
        names = (((await c.sendRequest(WorkspaceSymbolRequest.type, { query: '' })) ?? []) as SymbolInformation[]).map((s) => s.name);
      expect(names.sort()).toEqual(['Remote rinse R-1', 'Rinse B']);
      // The disk folder was read from disk: the client was asked about the virtual one only.
      expect(asked).toEqual([
        ['ionwright/listNotes', 'vscode-vfs://github/lab/notes'],
        ['ionwright/readNote', 'vscode-vfs://github/lab/notes/bath.md'],
      ]);
    } finally {
      c.dispose();
      p.kill();
    }
  });
});
