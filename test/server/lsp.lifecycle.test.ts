/**
 * The server's lifecycle and its defences, over stdio, as LSP 3.17 says: nothing before initialize,
 * nothing after shutdown, one initialize, an initialize without capabilities, an unreadable frame ending
 * the server (so that the client starts a new one), cancellation answered, a reopened document never
 * served from its old text, malformed parameters answered with InvalidParams and no stack trace, and
 * edits tagged with the version they were computed on.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  CancellationTokenSource,
  CodeActionRequest,
  createProtocolConnection,
  DidChangeTextDocumentNotification,
  DidOpenTextDocumentNotification,
  ExecuteCommandRequest,
  HoverRequest,
  InitializedNotification,
  InitializeRequest,
  ApplyWorkspaceEditRequest,
  StreamMessageReader,
  StreamMessageWriter,
  type ProtocolConnection,
  type WorkspaceEdit,
} from 'vscode-languageserver-protocol/node';

const SERVER = join(__dirname, '../../dist/server.js');

/** Raw frames in (a number: wait that many ms), raw output back: for what a protocol library would refuse to send. */
function raw(frames: Array<string | number>, waitMs = 1500): Promise<{ out: string; err: string; code: number | null }> {
  return new Promise((resolve) => {
    const p = spawn(process.execPath, [SERVER, '--stdio']);
    let out = '';
    let err = '';
    p.stdout.on('data', (d) => (out += d));
    p.stderr.on('data', (d) => (err += d));
    const timer = setTimeout(() => p.kill(), waitMs);
    p.on('exit', (code) => {
      clearTimeout(timer);
      resolve({ out, err, code });
    });
    void (async () => {
      for (const f of frames) {
        if (typeof f === 'number') await new Promise((r) => setTimeout(r, f));
        else if (p.exitCode === null) p.stdin.write(f);
      }
    })();
  });
}
const frame = (o: object) => {
  const s = JSON.stringify(o);
  return `Content-Length: ${Buffer.byteLength(s)}\r\n\r\n${s}`;
};
const responses = (out: string) =>
  out
    .split(/Content-Length: \d+\r\n\r\n/)
    .filter(Boolean)
    .map((s) => JSON.parse(s) as { id?: number; result?: unknown; error?: { code: number; message: string } });
const hoverReq = (id: number) =>
  frame({ jsonrpc: '2.0', id, method: 'textDocument/hover', params: { textDocument: { uri: 'file:///a.md' }, position: { line: 0, character: 0 } } });
const initReq = (id: number, params: object = { processId: null, rootUri: null, capabilities: {} }) =>
  frame({ jsonrpc: '2.0', id, method: 'initialize', params });

describe('lifecycle (LSP 3.17)', () => {
  it('answers a request before initialize with ServerNotInitialized and drops notifications', async () => {
    const { out } = await raw(
      [
        frame({
          jsonrpc: '2.0',
          method: 'textDocument/didOpen',
          params: { textDocument: { uri: 'file:///a.md', languageId: 'markdown', version: 1, text: '`NaXx`' } },
        }),
        hoverReq(1),
      ],
      800,
    );
    const r = responses(out);
    expect(r).toHaveLength(1);
    expect(r[0]).toMatchObject({ id: 1, error: { code: -32002 } });
  });

  // A client sends exit once shutdown is answered: the frames wait a moment before it.
  it('refuses a second initialize, and requests after shutdown, with InvalidRequest; exit after shutdown ends with 0', async () => {
    const { out, code } = await raw(
      [
        initReq(1),
        frame({ jsonrpc: '2.0', method: 'initialized', params: {} }),
        initReq(2),
        frame({ jsonrpc: '2.0', id: 3, method: 'shutdown' }),
        hoverReq(4),
        300,
        frame({ jsonrpc: '2.0', method: 'exit' }),
      ],
      3000,
    );
    const byId = new Map(responses(out).map((m) => [m.id, m]));
    expect(byId.get(1)?.result).toBeTruthy();
    expect(byId.get(2)?.error?.code).toBe(-32600);
    expect(byId.get(3)).toMatchObject({ result: null });
    expect(byId.get(4)?.error?.code).toBe(-32600);
    expect(code).toBe(0);
  });

  it('handles an initialize without capabilities, and reports the version from package.json', async () => {
    const { out } = await raw([initReq(1, { processId: null, rootUri: null })], 800);
    const [r] = responses(out);
    expect((r.result as { capabilities: { hoverProvider: boolean } }).capabilities.hoverProvider).toBe(true);
    expect((r.result as { serverInfo: { version: string } }).serverInfo.version).toBe((await import('../../package.json')).version);
  });

  for (const [what, bad] of [
    ['a malformed Content-Length', 'Content-Length: abc\r\n\r\n{}'],
    ['no Content-Length', 'Content-Type: application/json\r\n\r\n{}'],
  ] as const) {
    it(`logs ${what} and exits with a failure status`, async () => {
      const { err, code } = await raw([bad, initReq(1)], 3000);
      expect(code).toBe(1);
      expect(err).toMatch(/cannot be read .*Content-Length/);
      expect(err).not.toMatch(/\n\s+at /);
    });
  }
});

async function connect(capabilities: object = {}): Promise<{ conn: ProtocolConnection; proc: ChildProcess; stderr: () => string; applied: WorkspaceEdit[] }> {
  const proc = spawn(process.execPath, [SERVER, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
  let err = '';
  proc.stderr!.on('data', (d) => (err += d));
  const conn = createProtocolConnection(new StreamMessageReader(proc.stdout!), new StreamMessageWriter(proc.stdin!));
  const applied: WorkspaceEdit[] = [];
  conn.onRequest(ApplyWorkspaceEditRequest.type, (p) => {
    applied.push(p.edit);
    return { applied: true };
  });
  conn.onNotification('textDocument/publishDiagnostics', () => {});
  conn.listen();
  await conn.sendRequest(InitializeRequest.type, { processId: process.pid, rootUri: null, workspaceFolders: null, capabilities });
  await conn.sendNotification(InitializedNotification.type, {});
  return { conn, proc, stderr: () => err, applied };
}

describe('requests', () => {
  it('answers cancelled requests with RequestCancelled', async () => {
    const { conn, proc } = await connect();
    try {
      const uri = 'file:///lab/cancel.md';
      await conn.sendNotification(DidOpenTextDocumentNotification.type, {
        textDocument: { uri, languageId: 'markdown', version: 1, text: 'Weighed `NaCl`.\n'.repeat(2000) },
      });
      const outcomes = await Promise.all(
        Array.from({ length: 500 }, (_, i) => {
          const src = new CancellationTokenSource();
          const p = conn.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line: i, character: 10 } }, src.token).then(
            () => 'answered',
            (e: { code?: number }) => (e.code === -32800 ? 'cancelled' : `other ${e.code}`),
          );
          src.cancel();
          return p;
        }),
      );
      const cancelled = outcomes.filter((o) => o === 'cancelled').length;
      // A request whose answer was on its way before the cancellation arrived may still be answered.
      expect(cancelled).toBeGreaterThan(450);
      expect(outcomes.filter((o) => o.startsWith('other'))).toEqual([]);
    } finally {
      proc.kill();
    }
  });

  it('serves a document opened again under the same version from its new text', async () => {
    const { conn, proc } = await connect();
    try {
      const uri = 'file:///lab/reopen.md';
      const hoverAt0 = async () =>
        ((await conn.sendRequest(HoverRequest.type, { textDocument: { uri }, position: { line: 0, character: 2 } }))?.contents as { value: string } | undefined)
          ?.value ?? '';
      await conn.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'markdown', version: 1, text: '`NaCl`\n' } });
      expect(await hoverAt0()).toContain('NaCl');
      await conn.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'markdown', version: 1, text: '`KBr`\n' } });
      expect(await hoverAt0()).toContain('KBr');
    } finally {
      proc.kill();
    }
  });

  it('answers malformed parameters with InvalidParams and logs no stack trace', async () => {
    const { conn, proc, stderr } = await connect();
    try {
      const uri = 'file:///lab/bad.md';
      await conn.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'markdown', version: 1, text: '`CaNO3`\n' } });
      const range = { start: { line: 0, character: 1 }, end: { line: 0, character: 1 } };
      for (const only of ['quickfix', [1, 2], { a: 1 }]) {
        const e = await conn.sendRequest(CodeActionRequest.type, { textDocument: { uri }, range, context: { diagnostics: [], only: only as never } }).then(
          () => null,
          (x) => x,
        );
        expect(e?.code).toBe(-32602);
        expect(e?.message).toMatch(/context\.only/);
      }
      const e2 = await conn.sendRequest('textDocument/hover', { textDocument: { uri: 5 }, position: {} }).then(
        () => null,
        (x) => x,
      );
      expect(e2?.code).toBe(-32602);
      // Still serving.
      const acts = await conn.sendRequest(CodeActionRequest.type, { textDocument: { uri }, range, context: { diagnostics: [], only: ['quickfix'] } });
      expect(acts?.length).toBeGreaterThan(0);
      expect(stderr()).not.toMatch(/\n\s+at /);
    } finally {
      proc.kill();
    }
  });

  it('tags quick fixes and command edits with the version they were computed on, where the client supports it', async () => {
    const { conn, proc, applied } = await connect({ workspace: { applyEdit: true, workspaceEdit: { documentChanges: true } } });
    try {
      const uri = 'file:///lab/versioned.md';
      await conn.sendNotification(DidOpenTextDocumentNotification.type, {
        textDocument: { uri, languageId: 'markdown', version: 1, text: 'Label says `CaNO3`.\n' },
      });
      await conn.sendNotification(DidChangeTextDocumentNotification.type, {
        textDocument: { uri, version: 7 },
        contentChanges: [{ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, text: 'The ' }],
      });
      const at = { line: 0, character: 'The Label says `Ca'.length };
      const acts = (await conn.sendRequest(CodeActionRequest.type, {
        textDocument: { uri },
        range: { start: at, end: at },
        context: { diagnostics: [] },
      })) as Array<{ title: string; edit: WorkspaceEdit }>;
      const fix = acts.find((a) => a.title.includes('Ca(NO₃)₂'))!;
      expect(fix.edit.changes).toBeUndefined();
      expect(fix.edit.documentChanges).toEqual([{ textDocument: { uri, version: 7 }, edits: [expect.objectContaining({ newText: 'Ca(NO3)2' })] }]);
      const r = await conn.sendRequest(ExecuteCommandRequest.type, { command: 'ionwright.server.insertTableAt', arguments: [{ uri, position: at }] });
      expect(r).toEqual({ applied: true });
      expect(applied.at(-1)?.documentChanges?.[0]).toMatchObject({ textDocument: { uri, version: 7 } });
    } finally {
      proc.kill();
    }
  });
});

describe('hostile requests', () => {
  it('2,000 requests and notifications with random parameters: every request answered, no crash, no stack trace', async () => {
    const fc = (await import('fast-check')).default;
    const { conn, proc, stderr } = await connect({ workspace: { applyEdit: true, workspaceEdit: { documentChanges: true } } });
    try {
      const uri = 'file:///lab/hostile.md';
      await conn.sendNotification(DidOpenTextDocumentNotification.type, {
        textDocument: { uri, languageId: 'markdown', version: 1, text: 'Weighed `NaCl` and `CaNO3`.\n\n```batch\nvolume: 1 L\nKCl 3 g\n```\n' },
      });
      const methods = [
        'textDocument/hover',
        'textDocument/codeAction',
        'textDocument/documentSymbol',
        'textDocument/codeLens',
        'textDocument/completion',
        'textDocument/inlayHint',
        'textDocument/semanticTokens/full',
        'textDocument/semanticTokens/range',
        'textDocument/foldingRange',
        'textDocument/definition',
        'workspace/symbol',
        'workspace/executeCommand',
        'textDocument/didChange',
        'textDocument/didOpen',
        'textDocument/didClose',
        'workspace/didChangeConfiguration',
        '$/cancelRequest',
      ];
      const notifications = new Set([
        'textDocument/didChange',
        'textDocument/didOpen',
        'textDocument/didClose',
        'workspace/didChangeConfiguration',
        '$/cancelRequest',
      ]);
      const params = fc.oneof(
        fc.jsonValue(),
        fc.record(
          {
            textDocument: fc.record({ uri: fc.oneof(fc.constant(uri), fc.string(), fc.integer()) }),
            position: fc.oneof(fc.record({ line: fc.integer(), character: fc.integer() }), fc.jsonValue()),
            range: fc.jsonValue(),
            context: fc.record({ only: fc.jsonValue(), diagnostics: fc.jsonValue() }),
          },
          { requiredKeys: [] },
        ),
        fc.record({
          command: fc.constantFrom(
            'ionwright.server.insertTable',
            'ionwright.server.insertTableAt',
            'ionwright.server.cardMarkdown',
            'ionwright.server.weighingList',
            'x',
          ),
          arguments: fc.array(fc.jsonValue(), { maxLength: 2 }),
        }),
      );
      const logged: string[] = [];
      conn.onNotification('window/logMessage', (m: { message: string }) => void logged.push(m.message));
      const sample = fc.sample(fc.tuple(fc.constantFrom(...methods), params), { numRuns: 2000, seed: 1312 });
      const answers: Array<Promise<unknown>> = [];
      for (const [m, p] of sample) {
        if (notifications.has(m)) await conn.sendNotification(m, p as never);
        else
          answers.push(
            conn.sendRequest(m, p as never).then(
              () => 'ok',
              (e: { code?: number }) => e.code,
            ),
          );
      }
      const outcomes = await Promise.all(answers);
      expect(outcomes.length).toBeGreaterThan(500);
      // Every answer is a result or a protocol error the spec names (no InternalError from a crash).
      for (const o of outcomes) expect(['ok', -32602, -32601, -32800, -32600]).toContain(o);
      const h = await conn.sendRequest(HoverRequest.type, { textDocument: { uri: 'file:///lab/after.md' }, position: { line: 0, character: 0 } });
      expect(h).toBeNull();
      expect(proc.exitCode).toBeNull();
      expect(stderr()).not.toMatch(/\n\s+at /);
      // No handler met an exception it did not expect (those are logged as '<request> failed: …').
      expect(logged.filter((l) => / failed: /.test(l))).toEqual([]);
    } finally {
      proc.kill();
    }
  }, 60_000);
});
