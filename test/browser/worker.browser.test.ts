/**
 * The browser build of the server (dist/browser/server.js) as VS Code for the Web runs it: in a Web
 * Worker of headless Chromium, spoken to with JSON-RPC message objects posted to the worker. For the same
 * note, its diagnostics, hovers, completion, semantic tokens, inlay hints and folding ranges must equal
 * those of the Node server over stdio. The page is served from a routed origin (nothing goes over the
 * network). Also: the browser builds fail on any Node import, and the bundles require nothing.
 */
import { spawn } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { createProtocolConnection, StreamMessageReader, StreamMessageWriter } from 'vscode-languageserver-protocol/node';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HAVE_BROWSER, launch, REQUIRE_BROWSER } from '../browser';

const ROOT = join(__dirname, '../..');
const ORIGIN = 'http://ionwright.test';
const URI = 'file:///lab/strike.md';
const NOTE =
  readFileSync(join(ROOT, 'test/fixtures/nvim-note.md'), 'utf8') +
  '\n## Bath\n\n```batch\nname: Strike W-2\nvolume: 250 mL\nNiSO4·6H2O 0.1 M\nH3BO3 10 g\nNaXx 1 g\n```\n';
const LINES = NOTE.split('\n');
const lineOf = (needle: string) => LINES.findIndex((l) => l.includes(needle));

/** The requests both servers are asked, in order, after the note is open. */
const REQUESTS: Array<[string, unknown]> = [
  ...['NaCl', 'CaNO3', 'Fe + O2', 'NiSO4', 'H3BO3'].map((t): [string, unknown] => [
    'textDocument/hover',
    { textDocument: { uri: URI }, position: { line: lineOf(t), character: LINES[lineOf(t)].indexOf(t) + 1 } },
  ]),
  ['textDocument/completion', { textDocument: { uri: URI }, position: { line: lineOf('H3BO3'), character: 2 } }],
  ['textDocument/completion', { textDocument: { uri: URI }, position: { line: lineOf('NiSO4'), character: LINES[lineOf('NiSO4')].length - 1 } }],
  ['textDocument/semanticTokens/full', { textDocument: { uri: URI } }],
  ['textDocument/inlayHint', { textDocument: { uri: URI }, range: { start: { line: 0, character: 0 }, end: { line: LINES.length, character: 0 } } }],
  ['textDocument/foldingRange', { textDocument: { uri: URI } }],
  ['textDocument/documentSymbol', { textDocument: { uri: URI } }],
  ['workspace/symbol', { query: 'strike' }],
];

interface Answers {
  diagnostics: unknown;
  answers: unknown[];
}

/** The Node server over stdio: the same messages, its answers. */
async function nodeAnswers(): Promise<Answers> {
  const proc = spawn(process.execPath, [join(ROOT, 'dist/server.js'), '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
  proc.stderr!.resume();
  const conn = createProtocolConnection(new StreamMessageReader(proc.stdout!), new StreamMessageWriter(proc.stdin!));
  const diagnostics = new Promise((resolve) => conn.onNotification('textDocument/publishDiagnostics', (p: { diagnostics: unknown }) => resolve(p.diagnostics)));
  conn.listen();
  try {
    await conn.sendRequest('initialize', { processId: null, rootUri: null, workspaceFolders: null, capabilities: {} });
    await conn.sendNotification('initialized', {});
    await conn.sendNotification('textDocument/didOpen', { textDocument: { uri: URI, languageId: 'markdown', version: 1, text: NOTE } });
    const d = await diagnostics;
    const answers: unknown[] = [];
    for (const [method, params] of REQUESTS) answers.push(await conn.sendRequest(method, params));
    await conn.sendRequest('shutdown');
    await conn.sendNotification('exit');
    return { diagnostics: d, answers };
  } finally {
    conn.dispose();
    proc.kill();
  }
}

/** The worker in the page: the same messages, posted as objects; its answers. */
async function workerAnswers(page: Page): Promise<Answers & { errors: string[] }> {
  return page.evaluate(
    async ({ uri, text, requests }) => {
      const worker = new Worker('/server.js');
      const errors: string[] = [];
      worker.onerror = (e) => errors.push(String(e.message));
      const waiting = new Map<number, (r: unknown) => void>();
      let published: (d: unknown) => void = () => undefined;
      const diagnostics = new Promise((r) => (published = r));
      worker.onmessage = (e: MessageEvent) => {
        const m = e.data as { id?: number; method?: string; params?: { diagnostics?: unknown }; result?: unknown; error?: unknown };
        if (m.method === 'textDocument/publishDiagnostics') published(m.params?.diagnostics);
        else if (m.id !== undefined && !m.method) waiting.get(m.id)?.(m.error ? { error: m.error } : m.result);
      };
      let id = 0;
      const request = (method: string, params: unknown) =>
        new Promise<unknown>((resolve) => {
          waiting.set(++id, resolve);
          worker.postMessage({ jsonrpc: '2.0', id, method, params });
        });
      const notify = (method: string, params: unknown) => worker.postMessage({ jsonrpc: '2.0', method, params });
      await request('initialize', { processId: null, rootUri: null, workspaceFolders: null, capabilities: {} });
      notify('initialized', {});
      notify('textDocument/didOpen', { textDocument: { uri, languageId: 'markdown', version: 1, text } });
      const d = await diagnostics;
      const answers: unknown[] = [];
      for (const [method, params] of requests) answers.push(await request(method, params));
      await request('shutdown', null);
      worker.terminate();
      return { diagnostics: d, answers, errors };
    },
    { uri: URI, text: NOTE, requests: REQUESTS },
  );
}

describe.runIf(HAVE_BROWSER || REQUIRE_BROWSER)('the browser build of the server in a Web Worker', () => {
  let browser: Browser;
  let node: Answers;
  let web: Answers & { errors: string[] };

  beforeAll(async () => {
    const bundle = readFileSync(join(ROOT, 'dist/browser/server.js'), 'utf8');
    browser = await launch();
    const page = await browser.newPage();
    const requests: string[] = [];
    page.on('request', (r) => requests.push(r.url()));
    await page.route(`${ORIGIN}/**`, (route) => {
      const path = new URL(route.request().url()).pathname;
      if (path === '/server.js') return route.fulfill({ contentType: 'text/javascript', body: bundle });
      return route.fulfill({ contentType: 'text/html', body: '<!doctype html><title>worker host</title>' });
    });
    await page.goto(`${ORIGIN}/index.html`);
    [node, web] = await Promise.all([nodeAnswers(), workerAnswers(page)]);
    expect(requests.every((u) => u.startsWith(ORIGIN))).toBe(true);
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
  });

  it('starts without an error in the worker', () => {
    expect(web.errors).toEqual([]);
  });

  it('publishes the same diagnostics as the Node server', () => {
    expect((web.diagnostics as unknown[]).length).toBeGreaterThanOrEqual(4);
    expect(web.diagnostics).toEqual(node.diagnostics);
  });

  it('answers hovers, completion, semantic tokens, inlay hints, folding and symbols as the Node server does', () => {
    REQUESTS.forEach(([method], k) => {
      expect(web.answers[k], method).toEqual(node.answers[k]);
    });
    // Not vacuous: the hovers hold cards, and the batch gets its inlay hint.
    expect(JSON.stringify(web.answers[0])).toContain('58.44 g/mol');
    expect(JSON.stringify(web.answers[REQUESTS.findIndex(([m]) => m === 'textDocument/inlayHint')])).toContain('⇒');
  });
});

/** The worker with a host that reads the workspace for it, as the browser client does: the symbols and definitions it then gives. */
async function workspaceAnswers(page: Page) {
  return page.evaluate(async () => {
    const worker = new Worker('/server.js');
    const shelf = '# Shelf\n\n```batch\nname: Rinse B\nvolume: 1 L\nNaHCO3 2 g\n```\n';
    const asked: string[] = [];
    const waiting = new Map<number, (r: unknown) => void>();
    worker.onmessage = (e: MessageEvent) => {
      const m = e.data as { id?: number; method?: string; params?: { uri?: string; folderUri?: string }; result?: unknown };
      if (m.method && m.id !== undefined) {
        // A request of the server's: the workspace, read by the host.
        asked.push(m.method);
        let result: unknown = null;
        if (m.method === 'ionwright/listNotes') result = m.params?.folderUri === 'file:///lab' ? ['file:///lab/shelf.md'] : [];
        if (m.method === 'ionwright/readNote') result = m.params?.uri === 'file:///lab/shelf.md' ? shelf : null;
        worker.postMessage({ jsonrpc: '2.0', id: m.id, result });
      } else if (m.id !== undefined) waiting.get(m.id)?.(m.result);
    };
    let id = 0;
    const request = (method: string, params: unknown) =>
      new Promise<unknown>((resolve) => {
        waiting.set(++id, resolve);
        worker.postMessage({ jsonrpc: '2.0', id, method, params });
      });
    const notify = (method: string, params: unknown) => worker.postMessage({ jsonrpc: '2.0', method, params });
    await request('initialize', {
      processId: null,
      rootUri: 'file:///lab',
      workspaceFolders: [{ uri: 'file:///lab', name: 'lab' }],
      capabilities: {},
      initializationOptions: { workspaceNotes: true },
    });
    notify('initialized', {});
    notify('textDocument/didOpen', { textDocument: { uri: 'file:///lab/today.md', languageId: 'markdown', version: 1, text: 'We used Rinse B.\n' } });
    let symbols: unknown = [];
    for (let k = 0; k < 200 && !(symbols as unknown[]).length; k++) {
      symbols = await request('workspace/symbol', { query: 'rinse' });
      await new Promise((r) => setTimeout(r, 10));
    }
    const definition = await request('textDocument/definition', { textDocument: { uri: 'file:///lab/today.md' }, position: { line: 0, character: 10 } });
    worker.terminate();
    return { symbols, definition, asked };
  });
}

describe.runIf(HAVE_BROWSER || REQUIRE_BROWSER)('the browser build with a host that reads the workspace for it', () => {
  it('indexes the notes the host lists: workspace symbols and definitions reach them', async () => {
    const browser = await launch();
    try {
      const page = await browser.newPage();
      const bundle = readFileSync(join(ROOT, 'dist/browser/server.js'), 'utf8');
      await page.route(`${ORIGIN}/**`, (route) =>
        new URL(route.request().url()).pathname === '/server.js'
          ? route.fulfill({ contentType: 'text/javascript', body: bundle })
          : route.fulfill({ contentType: 'text/html', body: '<!doctype html><title>worker host</title>' }),
      );
      await page.goto(`${ORIGIN}/index.html`);
      const r = await workspaceAnswers(page);
      expect(r.asked).toEqual(['ionwright/listNotes', 'ionwright/readNote']);
      const range = { start: { line: 3, character: 6 }, end: { line: 3, character: 13 } };
      expect(r.symbols).toEqual([{ name: 'Rinse B', kind: 23, location: { uri: 'file:///lab/shelf.md', range }, containerName: 'Shelf' }]);
      expect(r.definition).toEqual([{ uri: 'file:///lab/shelf.md', range }]);
    } finally {
      await browser.close();
    }
  }, 60_000);
});

describe('the browser builds', () => {
  it('require no module at run time (the client only vscode)', () => {
    const server = readFileSync(join(ROOT, 'dist/browser/server.js'), 'utf8');
    expect([...server.matchAll(/\brequire\("([^"]+)"\)/g)].map((m) => m[1])).toEqual([]);
    const client = readFileSync(join(ROOT, 'dist/browser/extension.js'), 'utf8');
    expect(new Set([...client.matchAll(/\brequire\("([^"]+)"\)/g)].map((m) => m[1]))).toEqual(new Set(['vscode']));
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8'));
    expect(pkg.browser).toBe('./dist/browser/extension.js');
  });

  it('fail when a Node module creeps into what they bundle', async () => {
    const { build } = await import('esbuild');
    const { noNodeApis } = await import('../../scripts/no-node-apis.mjs');
    const dir = join(tmpdir(), `ionwright-no-node-${process.pid}`);
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, 'service.ts'), "import { readFileSync } from 'node:fs';\nexport const read = () => readFileSync('x');\n");
    writeFileSync(join(dir, 'entry.ts'), "import { read } from './service';\nconsole.log(read);\n");
    await expect(
      build({ entryPoints: [join(dir, 'entry.ts')], bundle: true, platform: 'browser', write: false, logLevel: 'silent', plugins: [noNodeApis] }),
    ).rejects.toThrow(/'node:fs' is a Node module, imported by .*service\.ts/);
  });
});
