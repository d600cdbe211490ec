/**
 * The server end to end over stdio, driven by the protocol library's own client side
 * (vscode-languageserver-protocol): initialize, open, diagnostics, hover, code action, execute command,
 * incremental change, settings, and malformed requests answered without a crash.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  ApplyWorkspaceEditRequest,
  CodeActionRequest,
  ConfigurationRequest,
  createProtocolConnection,
  DidChangeConfigurationNotification,
  DidChangeTextDocumentNotification,
  DidOpenTextDocumentNotification,
  DocumentSymbolRequest,
  ExecuteCommandRequest,
  ExitNotification,
  HoverRequest,
  InitializedNotification,
  InitializeRequest,
  ShutdownRequest,
  StreamMessageReader,
  StreamMessageWriter,
  type Diagnostic,
  type ProtocolConnection,
  type PublishDiagnosticsParams,
  type WorkspaceEdit,
} from 'vscode-languageserver-protocol/node';

const SERVER = join(__dirname, '../../dist/server.js');
let proc: ChildProcess;
let conn: ProtocolConnection;
let stderr = '';
const published: PublishDiagnosticsParams[] = [];
const applied: WorkspaceEdit[] = [];
let settings: Record<string, unknown> = {};

/** Wait until a diagnostics publication matches, without fixed sleeps. */
function diagnosticsFor(uri: string, pred: (p: PublishDiagnosticsParams) => boolean = () => true, timeoutMs = 10_000): Promise<PublishDiagnosticsParams> {
  return new Promise((resolve, reject) => {
    const t0 = Date.now();
    const tick = () => {
      const hit = [...published].reverse().find((p) => p.uri === uri && pred(p));
      if (hit) return resolve(hit);
      if (Date.now() - t0 > timeoutMs) return reject(new Error(`no diagnostics for ${uri}`));
      setTimeout(tick, 5);
    };
    tick();
  });
}

const URI = 'file:///lab/rinse.md';
const TEXT = ['# Rinse trials — ünïcødé 🧪', '', 'We weighed `NaCl` and `NaXx`; the label says `CaNO3`.', '', '`Fe + O2 -> Fe2O3`', ''].join('\n');

beforeAll(async () => {
  proc = spawn('node', [SERVER, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
  proc.stderr!.on('data', (d) => (stderr += d));
  conn = createProtocolConnection(new StreamMessageReader(proc.stdout!), new StreamMessageWriter(proc.stdin!));
  conn.onNotification('textDocument/publishDiagnostics', (p: PublishDiagnosticsParams) => {
    published.push(p);
  });
  conn.onRequest(ApplyWorkspaceEditRequest.type, (p) => {
    applied.push(p.edit);
    return { applied: true };
  });
  conn.onRequest(ConfigurationRequest.type, (p) => p.items.map(() => settings));
  conn.listen();
  const init = await conn.sendRequest(InitializeRequest.type, {
    processId: process.pid,
    rootUri: null,
    workspaceFolders: null,
    capabilities: { workspace: { configuration: true, applyEdit: true }, textDocument: { hover: { contentFormat: ['markdown'] } } },
  });
  expect(init.capabilities.hoverProvider).toBe(true);
  expect(init.capabilities.textDocumentSync).toMatchObject({ change: 2 });
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

const line2 = TEXT.split('\n')[2];

describe('LSP over stdio', () => {
  it('publishes diagnostics on open, with exact UTF-16 ranges', async () => {
    const p = await diagnosticsFor(URI);
    const by = (code: string) => p.diagnostics.find((d: Diagnostic) => d.code === code)!;
    expect(by('unknown-element').range).toEqual({ start: { line: 2, character: line2.indexOf('Xx') }, end: { line: 2, character: line2.indexOf('Xx') + 2 } });
    expect(by('charge-imbalance').range.start).toEqual({ line: 2, character: line2.indexOf('CaNO3') });
    expect(by('unbalanced-equation').range.start).toEqual({ line: 4, character: 1 });
    expect(p.version).toBe(1);
  });

  it('answers a hover with the card', async () => {
    const h = await conn.sendRequest(HoverRequest.type, { textDocument: { uri: URI }, position: { line: 2, character: line2.indexOf('NaCl') + 1 } });
    expect((h!.contents as { value: string }).value).toMatch(/^\*\*NaCl\*\* · sodium chloride \(common salt\) · \*\*58\.44 g\/mol\*\*/);
    expect(h!.range!.start).toEqual({ line: 2, character: line2.indexOf('NaCl') });
  });

  it('offers quick fixes whose edits apply', async () => {
    const pos = { line: 2, character: line2.indexOf('CaNO3') + 2 };
    const acts = (await conn.sendRequest(CodeActionRequest.type, {
      textDocument: { uri: URI },
      range: { start: pos, end: pos },
      context: { diagnostics: [] },
    })) as Array<{ title: string; edit: WorkspaceEdit; kind: string }>;
    const fix = acts.find((a) => a.title === 'Replace with Ca(NO₃)₂')!;
    expect(fix.kind).toBe('quickfix');
    expect(fix.edit.changes![URI][0]).toEqual({
      range: { start: { line: 2, character: line2.indexOf('CaNO3') }, end: { line: 2, character: line2.indexOf('CaNO3') + 5 } },
      newText: 'Ca(NO3)2',
    });
  });

  it('runs the insert-table command through workspace/applyEdit', async () => {
    const r = await conn.sendRequest(ExecuteCommandRequest.type, {
      command: 'ionwright.server.insertTable',
      arguments: [{ uri: URI, range: { start: { line: 2, character: 0 }, end: { line: 2, character: line2.length } } }],
    });
    expect(r).toEqual({ applied: true });
    const text = applied[applied.length - 1].changes![URI][0].newText;
    expect(text).toContain('| NaCl | 58.44 |');
    const card = await conn.sendRequest(ExecuteCommandRequest.type, { command: 'ionwright.server.cardMarkdown', arguments: [{ formula: 'KBr' }] });
    expect(card).toMatch(/^\*\*KBr\*\*/);
  });

  it('lists sections and reactions as symbols', async () => {
    const syms = (await conn.sendRequest(DocumentSymbolRequest.type, { textDocument: { uri: URI } })) as Array<{
      name: string;
      children: Array<{ name: string }>;
    }>;
    expect(syms[0].name).toBe('Rinse trials — ünïcødé 🧪');
    expect(syms[0].children.map((c) => c.name)).toEqual(['Fe + O2 -> Fe2O3']);
  });

  it('re-validates after an incremental change, and reports the new version', async () => {
    const start = { line: 2, character: line2.indexOf('NaXx') + 2 };
    await conn.sendNotification(DidChangeTextDocumentNotification.type, {
      textDocument: { uri: URI, version: 2 },
      contentChanges: [{ range: { start, end: { line: start.line, character: start.character + 2 } }, text: 'Cl' }],
    });
    const p = await diagnosticsFor(URI, (x) => x.version === 2);
    expect(p.diagnostics.map((d) => d.code)).not.toContain('unknown-element');
    expect(p.diagnostics.map((d) => d.code)).toContain('charge-imbalance');
  });

  it('reads settings, and survives invalid values', async () => {
    settings = { energyUnit: 'kcal/mol', decimalPlaces: 'many', bond: { ionicAbove: -3 }, proseDetection: 42 };
    await conn.sendNotification(DidChangeConfigurationNotification.type, { settings: {} });
    // The configuration is re-read, then the document re-validated; the hover then uses kcal/mol.
    const deadline = Date.now() + 10_000;
    let value = '';
    while (Date.now() < deadline) {
      const h = await conn.sendRequest(HoverRequest.type, { textDocument: { uri: URI }, position: { line: 2, character: line2.indexOf('NaCl') + 1 } });
      value = (h!.contents as { value: string }).value;
      if (value.includes('kcal/mol')) break;
      await new Promise((r) => setTimeout(r, 20));
    }
    expect(value).toContain('kcal/mol');
    expect(value).toContain('58.44 g/mol'); // decimals fell back to 2
  });

  it('answers a burst of malformed or out-of-range requests without a crash, then still serves', async () => {
    const bad: Array<Promise<unknown>> = [];
    for (let i = 0; i < 100; i++) {
      bad.push(conn.sendRequest(HoverRequest.type, { textDocument: { uri: 'file:///nope.md' }, position: { line: 0, character: 0 } }));
      bad.push(conn.sendRequest(HoverRequest.type, { textDocument: { uri: URI }, position: { line: 10_000 + i, character: 99_999 } }));
      bad.push(conn.sendRequest(HoverRequest.type, { textDocument: { uri: URI }, position: { line: -1, character: -5 } }));
      bad.push(
        conn.sendRequest(CodeActionRequest.type, {
          textDocument: { uri: URI },
          range: { start: { line: 4, character: 10 }, end: { line: 0, character: 0 } },
          context: { diagnostics: [] },
        }),
      );
      bad.push(conn.sendRequest('textDocument/hover', { nonsense: true }).catch((e) => e));
      bad.push(conn.sendRequest('ionwright/doesNotExist', {}).catch((e) => e));
      bad.push(conn.sendRequest(ExecuteCommandRequest.type, { command: 'ionwright.server.insertTable', arguments: [{ uri: 42 }] }).catch((e) => e));
      bad.push(conn.sendRequest(ExecuteCommandRequest.type, { command: 'no.such.command' }).catch((e) => e));
    }
    const results = await Promise.all(bad);
    expect(results.length).toBe(800);
    const h = await conn.sendRequest(HoverRequest.type, { textDocument: { uri: URI }, position: { line: 2, character: line2.indexOf('NaCl') + 1 } });
    expect((h!.contents as { value: string }).value).toContain('NaCl');
    expect(proc.exitCode).toBeNull();
    expect(stderr).not.toMatch(/TypeError|ReferenceError/);
  });
});

describe('a client that cannot be asked for settings', () => {
  it('takes the settings pushed with didChangeConfiguration', async () => {
    const p = spawn('node', [SERVER, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
    const c = createProtocolConnection(new StreamMessageReader(p.stdout!), new StreamMessageWriter(p.stdin!));
    c.listen();
    try {
      await c.sendRequest(InitializeRequest.type, { processId: process.pid, rootUri: null, workspaceFolders: null, capabilities: {} });
      await c.sendNotification(InitializedNotification.type, {});
      await c.sendNotification(DidChangeConfigurationNotification.type, { settings: { ionwright: { energyUnit: 'kcal/mol', decimalPlaces: 3 } } });
      const uri = 'file:///lab/push.md';
      await c.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'markdown', version: 1, text: 'Weighed `NaCl`.\n' } });
      let value = '';
      for (let i = 0; i < 200 && !value.includes('kcal/mol'); i++) {
        const h = await c.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line: 0, character: 10 } });
        value = (h?.contents as { value: string } | undefined)?.value ?? '';
        if (!value.includes('kcal/mol')) await new Promise((r) => setTimeout(r, 10));
      }
      expect(value).toContain('kcal/mol');
      expect(value).toContain('58.440 g/mol');
    } finally {
      p.kill();
    }
  });
});
