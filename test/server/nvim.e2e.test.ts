/**
 * A real editor as the client: Neovim's built-in LSP client (0.7+) drives dist/server.js headlessly
 * through test/nvim/lsp_check.lua, which writes what it saw as JSON. npm test builds dist first.
 *
 * Without `nvim` on the PATH the suite is skipped with a warning, unless IONWRIGHT_REQUIRE_NVIM=1
 * (as in CI), where it fails.
 */
import { spawnSync, type SpawnSyncReturns } from 'node:child_process';
import { accessSync, constants, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { delimiter, join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const ROOT = join(__dirname, '../..');
const SCRIPT = join(ROOT, 'test/nvim/lsp_check.lua');
const NOTE = join(ROOT, 'test/fixtures/nvim-note.md');
const TYPING_NOTE = join(ROOT, 'test/fixtures/nvim-typing-note.md');
const SERVER = join(ROOT, 'dist/server.js');

function onPath(name: string): string | undefined {
  for (const dir of (process.env.PATH ?? '').split(delimiter)) {
    if (!dir) continue;
    const candidate = join(dir, name);
    try {
      accessSync(candidate, constants.X_OK);
      return candidate;
    } catch {
      // not here
    }
  }
  return undefined;
}

const NVIM = onPath('nvim');
const REQUIRED = process.env.IONWRIGHT_REQUIRE_NVIM === '1';
if (!NVIM && !REQUIRED)
  console.warn('nvim.e2e: nvim is not on the PATH, skipping the Neovim client test (set IONWRIGHT_REQUIRE_NVIM=1 to make this a failure).');

interface LspRange {
  start: { line: number; character: number };
  end: { line: number; character: number };
}
interface Report {
  error?: string;
  nvim: string;
  uri: string;
  server_info?: { name: string; version: string };
  offset_encoding?: string;
  diagnostics: { code: string; source: string; severity: number; message: string; range: LspRange }[];
  nvim_diagnostics: { code: string; source: string; severity: number; text: string }[];
  hovers: { target: string; position: { line: number; character: number }; kind?: string; markdown?: string | null; range?: LspRange }[];
  server_exit?: { code: number; signal: number };
  requests?: {
    method: string;
    target?: string;
    position?: { line: number; character: number };
    result: any;
    jumped?: { buffer: string; line: number; byte_col: number };
  }[];
  duration_ms: number;
}

let work: string;

/** Runs the script under a throw-away XDG home, so that neither the user's nor the machine's Neovim state is read or written. */
function runCheck(
  name: string,
  hoverTargets: string[],
  env: Record<string, string> = {},
  note = NOTE,
): { proc: SpawnSyncReturns<string>; report: Report | undefined; ms: number } {
  const home = join(work, name);
  mkdirSync(home, { recursive: true });
  const out = join(home, 'report.json');
  const xdg = Object.fromEntries(['CONFIG', 'DATA', 'STATE', 'CACHE'].map((k) => [`XDG_${k}_HOME`, join(home, k.toLowerCase())]));
  const t0 = Date.now();
  const proc = spawnSync(NVIM!, ['--headless', '--clean', '-u', 'NONE', '-n', '-S', SCRIPT, note, out, ...hoverTargets], {
    cwd: ROOT,
    encoding: 'utf8',
    timeout: 60_000,
    killSignal: 'SIGKILL',
    stdio: ['ignore', 'pipe', 'pipe'],
    env: { ...process.env, ...xdg, IONWRIGHT_NODE: process.execPath, ...env },
  });
  const ms = Date.now() - t0;
  const report = existsSync(out) ? (JSON.parse(readFileSync(out, 'utf8')) as Report) : undefined;
  return { proc, report, ms };
}

/** The 0-based line and UTF-16 range of `needle` inside the first line of the note holding `lineMarker`. */
function rangeIn(text: string, lineMarker: string, needle: string): LspRange {
  const lines = text.split('\n');
  const line = lines.findIndex((l) => l.includes(lineMarker));
  expect(line, `fixture line with ${lineMarker}`).toBeGreaterThanOrEqual(0);
  const character = lines[line].indexOf(needle, lines[line].indexOf(lineMarker)); // JS string indices are UTF-16 code units
  expect(character).toBeGreaterThanOrEqual(0);
  return { start: { line, character }, end: { line, character: character + needle.length } };
}

const overlaps = (a: LspRange, b: LspRange) =>
  a.start.line === b.start.line && a.end.line === b.end.line && a.start.character < b.end.character && b.start.character < a.end.character;

it.runIf(REQUIRED && !NVIM)('has nvim on the PATH (IONWRIGHT_REQUIRE_NVIM=1)', () => {
  throw new Error('IONWRIGHT_REQUIRE_NVIM=1 but nvim is not on the PATH: install neovim (Debian: apt-get install -y neovim) or unset IONWRIGHT_REQUIRE_NVIM.');
});

describe.skipIf(!NVIM)('Neovim built-in LSP client against dist/server.js', () => {
  const note = readFileSync(NOTE, 'utf8');
  let run: ReturnType<typeof runCheck>;

  beforeAll(() => {
    if (!existsSync(SERVER)) throw new Error(`${SERVER} is missing: run npm run build (npm test builds first).`);
    work = mkdtempSync(join(tmpdir(), 'ionwright-nvim-'));
    run = runCheck('main', ['NaCl']);
    const { proc, report } = run;
    if (proc.error || proc.status !== 0 || !report || report.error) {
      throw new Error(
        `lsp_check.lua failed (status ${proc.status}, signal ${proc.signal}, ${run.ms} ms): ${proc.error ?? ''}\n${report?.error ?? 'no report'}\nstderr: ${proc.stderr}`,
      );
    }
  }, 70_000);

  afterAll(() => {
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('the fixture puts characters outside the BMP and Latin-1 before a diagnosed formula', () => {
    // Otherwise a byte/UTF-32/UTF-16 mix-up would go unnoticed.
    const line = note.split('\n').find((l) => l.includes('`NaXx`'))!;
    const before = line.slice(0, line.indexOf('`NaXx`'));
    expect([...before].length).toBeLessThan(before.length); // a surrogate pair
    expect(Buffer.byteLength(before, 'utf8')).toBeGreaterThan(before.length);
  });

  it('starts the server with UTF-16 positions and gets its serverInfo', () => {
    expect(run.report!.offset_encoding).toBe('utf-16');
    expect(run.report!.server_info).toMatchObject({ name: 'ionwright' });
  });

  it('receives unknown-element on exactly Xx, charge-imbalance on CaNO3 and unbalanced-equation on the equation', () => {
    const { diagnostics } = run.report!;
    expect(diagnostics).toContainEqual(
      expect.objectContaining({ code: 'unknown-element', severity: 1, source: 'ionwright', range: rangeIn(note, '`NaXx`', 'Xx') }),
    );
    expect(diagnostics).toContainEqual(
      expect.objectContaining({ code: 'charge-imbalance', severity: 2, source: 'ionwright', range: rangeIn(note, '`CaNO3`', 'CaNO3') }),
    );
    expect(diagnostics).toContainEqual(
      expect.objectContaining({
        code: 'unbalanced-equation',
        severity: 2,
        source: 'ionwright',
        range: rangeIn(note, '`Fe + O2 -> Fe2O3`', 'Fe + O2 -> Fe2O3'),
      }),
    );
    // Nothing else in the note is flagged, in particular not the good formula or the prose around it.
    expect(diagnostics.map((d) => d.code).sort()).toEqual(['charge-imbalance', 'unbalanced-equation', 'unknown-element']);
    expect(diagnostics.every((d) => d.source === 'ionwright')).toBe(true);
    const good = rangeIn(note, '`NaCl`', 'NaCl');
    expect(diagnostics.filter((d) => overlaps(d.range, good))).toEqual([]);
  });

  it('lands the diagnostics on the same text after Neovim converts them to byte columns', () => {
    const byCode = Object.fromEntries(run.report!.nvim_diagnostics.map((d) => [d.code, d]));
    expect(byCode['unknown-element']).toMatchObject({ text: 'Xx', source: 'ionwright' });
    expect(byCode['charge-imbalance']).toMatchObject({ text: 'CaNO3', source: 'ionwright' });
    expect(byCode['unbalanced-equation']).toMatchObject({ text: 'Fe + O2 -> Fe2O3', source: 'ionwright' });
  });

  it('answers a hover on the good formula with its molar mass card', () => {
    const [h] = run.report!.hovers;
    const span = rangeIn(note, '`NaCl`', 'NaCl');
    expect(h.position).toEqual({ line: span.start.line, character: span.start.character + 1 });
    expect(h.kind).toBe('markdown');
    // Na 22.98977 + Cl 35.45 = 58.44 g/mol
    // Identity first: formula, name, molar mass.
    expect(h.markdown).toMatch(/^\*\*NaCl\*\* · sodium chloride \(common salt\) · \*\*58\.44 g\/mol\*\*/);
    expect(h.range).toEqual(span);
  });

  it('shuts the server down cleanly (shutdown, exit, status 0)', () => {
    expect(run.report!.server_exit).toEqual({ code: 0, signal: 0 });
    expect(run.proc.status).toBe(0);
  });

  it('reports a server that never answers as an error and exits non-zero instead of hanging', () => {
    const silent = join(work, 'silent-server.js');
    writeFileSync(silent, 'process.stdin.resume();\n');
    const r = runCheck('silent', ['NaCl'], { IONWRIGHT_SERVER: silent, IONWRIGHT_NVIM_TIMEOUT_MS: '1500' });
    expect(r.proc.signal).toBeNull();
    expect(r.proc.status).not.toBe(0);
    expect(r.report?.error).toMatch(/timed out after 1500 ms waiting for the server to initialise/);
    expect(r.ms).toBeLessThan(30_000);
  }, 70_000);

  it('reports a hover target that is not in the note as an error', () => {
    const r = runCheck('missing', ['KMnO4']);
    expect(r.proc.status).not.toBe(0);
    expect(r.report?.error).toMatch(/hover target not found in the note: KMnO4/);
  }, 70_000);
});

/**
 * The typing and navigation requests that Neovim's client (0.7+) supports itself: completion,
 * definition (and Neovim jumping to it), workspace symbols and code lenses. (Inlay hints, semantic tokens
 * and folding ranges come to its client in later versions; the stdio and browser tests cover them.)
 */
describe.skipIf(!NVIM)('Neovim built-in LSP client: completion, definition, symbols, lenses', () => {
  const note = readFileSync(TYPING_NOTE, 'utf8');
  let run: ReturnType<typeof runCheck>;
  const requests = [
    { method: 'textDocument/completion', target: 'Na', at: 2 },
    { method: 'textDocument/completion', target: 'NiCl2·6H2O 0.25 M', at: 'NiCl2·6H2O 0.25 '.length },
    { method: 'textDocument/definition', target: 'through Wood strike W-3', at: 'through Wo'.length, jump: true },
    { method: 'workspace/symbol', params: { query: 'wood' } },
    { method: 'textDocument/codeLens' },
  ];

  beforeAll(() => {
    if (!existsSync(SERVER)) throw new Error(`${SERVER} is missing: run npm run build (npm test builds first).`);
    work = mkdtempSync(join(tmpdir(), 'ionwright-nvim-'));
    const file = join(work, 'requests.json');
    writeFileSync(file, JSON.stringify(requests));
    run = runCheck('typing', ['NiCl2·6H2O'], { IONWRIGHT_NVIM_REQUESTS: file }, TYPING_NOTE);
    const { proc, report } = run;
    if (proc.error || proc.status !== 0 || !report || report.error)
      throw new Error(`lsp_check.lua failed (status ${proc.status}, ${run.ms} ms): ${report?.error ?? 'no report'}\nstderr: ${proc.stderr}`);
  }, 70_000);

  afterAll(() => {
    if (work) rmSync(work, { recursive: true, force: true });
  });

  const answer = (k: number) => run.report!.requests![k];
  const lineOf = (needle: string) => note.split('\n').findIndex((l) => l.includes(needle));

  it('gets substances at the start of a batch line, with molar masses and edits replacing what was typed', () => {
    const items = answer(0).result.items as Array<{ label: string; detail?: string; textEdit: { range: LspRange; newText: string } }>;
    const nacl = items.find((i) => i.label === 'NaCl')!;
    // CIAAW 2021: Na 22.990 + Cl 35.45 = 58.44 g/mol.
    expect(nacl.detail).toBe('58.44 g/mol');
    expect(nacl.textEdit).toEqual({ range: { start: { line: lineOf('Na'), character: 0 }, end: { line: lineOf('Na'), character: 2 } }, newText: 'NaCl ' });
  });

  it('gets the units an ingredient line accepts after its amount', () => {
    const labels = (answer(1).result.items as Array<{ label: string }>).map((i) => i.label);
    expect(labels).toEqual(expect.arrayContaining(['g', 'mg', 'mol', 'M', 'mM', 'wt%']));
  });

  it('jumps from the batch name in prose to its name: line', () => {
    const line = lineOf('name: Wood strike W-3');
    expect(answer(2).result).toEqual([{ uri: run.report!.uri, range: { start: { line, character: 6 }, end: { line, character: 21 } } }]);
    // Neovim moved its cursor there (byte column 6: the line is ASCII up to the name).
    expect(answer(2).jumped).toMatchObject({ line, byte_col: 6 });
  });

  it('finds the batch by name among the workspace symbols', () => {
    const syms = answer(3).result as Array<{ name: string; location: { uri: string } }>;
    expect(syms.map((s) => [s.name, s.location.uri])).toEqual([['Wood strike W-3', run.report!.uri]]);
  });

  it('gets the three lenses above the batch', () => {
    const lenses = answer(4).result as Array<{ command: { title: string; command: string } }>;
    expect(lenses.map((l) => l.command.command)).toEqual(['', 'ionwright.server.insertTableAt', 'ionwright.copyWeighingList']);
    expect(lenses[0].command.title).toMatch(/^2 ingredients · ⚠ 1 line not counted \(incomplete\) · /);
    expect(lenses.slice(1).map((l) => l.command.title)).toEqual(['Insert table', 'Copy as weighing list']);
  });
});
