/**
 * What the command line prints: json and SARIF written item by item (the same text as one
 * JSON.stringify, without the one giant string), output that waits for a slow reader, a reader that
 * goes away early, and control characters that never reach the terminal as they are.
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkText } from '../../server/src/cli/analyse';
import { nodeIO, run, type CliIO } from '../../server/src/cli/main';
import { toSarif, writeSarif } from '../../server/src/cli/sarif';
import { diagnosticJson, indentedJson, jsonText, OutputWriter, visibleLine, visibleText, writeJsonArray } from '../../server/src/cli/text';
import type { LspDiagnostic } from '../../server/src/service/diagnostics';
import { generateNotes } from '../../bench/generate';
import { tempFolders } from '../temp';

const mkdtempSync = tempFolders();
const CLI = join(__dirname, '../../dist/cli.js');

/** An output that keeps what it is given, as CliIO.out does (a newline added). */
function sink() {
  const chunks: string[] = [];
  return { chunks, out: (t: string) => void chunks.push(t + '\n'), text: () => chunks.join('') };
}

/** Every control character but newline and tab, raw: none may reach a terminal. */
const RAW_CONTROL = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/;

describe('json written item by item', () => {
  const texts = [generateNotes(40_000, 7), manyFindings(250), 'Über 🧪 `NaXx` and `Ca(NO3`\r\n', '```batch\nname: A\nvolume: 1 L\nKCl 5 parsecs\n```\n'];
  const diags = texts.flatMap((t, i) => checkText(`n${i}.md`, t).map((d) => [`dir/ñ "${i}".md`, d] as [string, LspDiagnostic]));

  it('gives the text of JSON.stringify(array, null, 2), in chunks of whole lines', async () => {
    expect(diags.length).toBeGreaterThan(20);
    const s = sink();
    const w = new OutputWriter(s.out, 512);
    await writeJsonArray(w, diags, { render: ([file, d], inner) => diagnosticJson(file, d, inner) });
    await w.flush();
    expect(s.text()).toBe(
      JSON.stringify(
        diags.map(([file, d]) => ({ file, ...d })),
        null,
        2,
      ) + '\n',
    );
    expect(s.chunks.length).toBeGreaterThan(10);
    for (const c of s.chunks) expect(c.length).toBeLessThan(512 + 2_000);
    const empty = sink();
    const none = new OutputWriter(empty.out);
    await writeJsonArray(none, []);
    await none.flush();
    expect(empty.text()).toBe('[]\n');
  });

  it('the direct writer of a finding says what indentedJson says, whatever the strings hold', () => {
    for (const [file, d] of diags) expect(diagnosticJson(file, d, '  ')).toBe(indentedJson({ file, ...d }, '  '));
    const text = fc.string({ unit: 'binary', maxLength: 12 });
    fc.assert(
      fc.property(
        text,
        text,
        text,
        fc.nat(),
        fc.nat(),
        fc.constantFrom(1, 2, 3, 4),
        fc.constantFrom('', '    '),
        (file, code, message, line, character, severity, inner) => {
          const d = {
            range: { start: { line, character }, end: { line, character: character + 1 } },
            severity,
            code,
            message,
            source: 'ionwright',
          } as LspDiagnostic;
          expect(diagnosticJson(file, d, inner)).toBe(indentedJson({ file, ...d }, inner));
        },
      ),
      { numRuns: 2_000 },
    );
    const withData = { ...diags[0][1], data: { suggestions: ['NaCl'] } };
    expect(diagnosticJson('a.md', withData, '  ')).toBe(indentedJson({ file: 'a.md', ...withData }, '  '));
  });

  it('SARIF: the same text as the whole log at once, for results, no results, notifications and odd names', async () => {
    const files = [
      { path: '/lab/notes/a b.md', diagnostics: diags.slice(0, 30).map(([, d]) => d) },
      { path: '/elsewhere/c\u0085.md', diagnostics: [{ ...diags[0][1], message: 'a \u009b message \u007f' }] },
      { path: '/lab/empty.md', diagnostics: [] },
    ];
    for (const [list, options] of [
      [files, { cwd: '/lab' }],
      [[], { cwd: '/lab' }],
      [
        files,
        {
          cwd: '/lab',
          problems: [{ path: '/lab/x.md', message: 'skipped: binary (NUL byte at offset 3, line 1)' }],
          notes: [{ path: '/lab/link', message: 'symbolic link not followed' }],
        },
      ],
    ] as const) {
      const s = sink();
      const w = new OutputWriter(s.out, 256);
      await writeSarif(w, [...list], {
        ...options,
        problems: options.problems && [...options.problems],
        notes: options.notes && [...options.notes],
      } as Parameters<typeof writeSarif>[2]);
      await w.flush();
      const whole = toSarif([...list], { ...options } as Parameters<typeof toSarif>[1]);
      expect(s.text()).toBe(jsonText(whole) + '\n');
      expect(s.text()).not.toMatch(/[\u007f-\u009f]/);
      expect(JSON.parse(s.text())).toEqual(JSON.parse(JSON.stringify(whole)));
    }
  });

  it('waits when the output asks it to, and only then', async () => {
    let pending = 0;
    let waits = 0;
    let most = 0;
    let written = '';
    const out = (t: string): Promise<void> => {
      written += t + '\n';
      pending++;
      most = Math.max(most, pending);
      waits++;
      return new Promise((resolve) => setTimeout(() => ((pending -= 1), resolve()), 1));
    };
    const w = new OutputWriter(out, 1024);
    await writeJsonArray(w, diags.slice(0, 200), { render: ([file, d], inner) => diagnosticJson(file, d, inner) });
    await w.flush();
    expect(most).toBe(1); // never a second chunk before the first was taken
    expect(waits).toBeGreaterThan(5);
    expect(JSON.parse(written)).toHaveLength(200);
  });
});

/** A note with `n` findings (ten unknown elements a line, a paragraph each). */
function manyFindings(n: number): string {
  const line = Array.from({ length: 10 }, () => '`Xx`').join(' ') + '\n\n';
  return line.repeat(Math.ceil(n / 10));
}

describe('check with many findings, through a real pipe', () => {
  const dir = mkdtempSync(join(tmpdir(), 'ionwright-many-findings-'));
  writeFileSync(join(dir, 'big.md'), manyFindings(60_000));
  writeFileSync(join(dir, 'second.md'), manyFindings(20_000)); // for two workers

  it.each(['text', 'json', 'sarif'])('%s: all of it arrives, and parses', (format) => {
    const r = spawnSync('node', [CLI, 'check', 'big.md', '--format', format], { cwd: dir, encoding: 'utf8', maxBuffer: 1 << 30 });
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('');
    if (format === 'text') expect(r.stdout.trimEnd().split('\n')).toHaveLength(60_001);
    if (format === 'json') expect(JSON.parse(r.stdout)).toHaveLength(60_000);
    if (format === 'sarif') expect(JSON.parse(r.stdout).runs[0].results).toHaveLength(60_000);
  });

  it.each(['text', 'json', 'sarif'])('%s is handed to the output in bounded chunks, never as one string', async (format) => {
    let most = 0;
    let total = 0;
    const io: CliIO = {
      ...nodeIO,
      cwd: dir,
      env: {},
      startWorker: undefined,
      out: (t) => {
        most = Math.max(most, t.length);
        total += t.length + 1;
      },
      err: () => undefined,
    };
    expect(await run(['check', join(dir, 'big.md'), '--format', format], io)).toBe(1);
    expect(total).toBeGreaterThan(4_000_000);
    expect(most).toBeLessThan(1 << 17);
  });

  /** Run the command, read `bytes` of its output, close the pipe, and wait for it to end. */
  function closeEarly(args: string[], bytes: number): Promise<{ code: number | null; signal: string | null; stderr: string; read: number }> {
    return new Promise((resolve) => {
      const child = spawn('node', [CLI, ...args], { cwd: dir, stdio: ['ignore', 'pipe', 'pipe'] });
      let read = 0;
      let stderr = '';
      child.stderr.setEncoding('utf8');
      child.stderr.on('data', (t: string) => (stderr += t));
      child.stdout.on('data', (b: Buffer) => {
        read += b.length;
        if (read >= bytes) child.stdout.destroy();
      });
      child.on('close', (code, signal) => resolve({ code, signal, stderr, read }));
    });
  }

  it.each([
    [['check', 'big.md']],
    [['check', 'big.md', '--format', 'json']],
    [['check', 'big.md', '--format', 'sarif']],
    [['check', '.', '--format', 'json', '--jobs', '2']],
    [['demo', '.']],
  ])('%j with its reader gone after the first bytes: exit 141 (as SIGPIPE), nothing on stderr', async (args) => {
    const r = await closeEarly(args, 1);
    expect(r.stderr).toBe('');
    expect(r.signal).toBeNull();
    expect(r.code).toBe(141);
  });

  it('in a shell pipeline into head -1: the line, then the status the shell expects, no stack trace', () => {
    const r = spawnSync('bash', ['-c', `node ${JSON.stringify(CLI)} check big.md | head -1; echo "status \${PIPESTATUS[0]}"`], { cwd: dir, encoding: 'utf8' });
    expect(r.stdout).toBe("big.md:1:2 error unknown-element 'Xx' is not an element symbol.\nstatus 141\n");
    expect(r.stderr).toBe('');
  });
});

describe('control characters never reach the terminal', () => {
  const ESC = '\u001b';
  // OSC 52 (clipboard), OSC 8 (hyperlink), CSI (colour, clear screen), BEL, backspace, CR, a C1 CSI.
  const nasty = `${ESC}]52;c;SGVsbG8=\u0007 ${ESC}]8;;https://example.invalid${ESC}\\ ${ESC}[2J\u0008\r\u009b31m`;
  const dir = mkdtempSync(join(tmpdir(), 'ionwright-controls-'));
  const name = `bath${ESC}[31m\r.md`;
  mkdirSync(join(dir, 'notes'));
  writeFileSync(
    join(dir, 'notes', name),
    `Trial ${nasty}\n\nWe used \`Na${ESC}[31mCl\` and \`K\u0007Br\` and \`Ca\u0008\r\`.\n\n\`\`\`batch\nname: B${ESC}]8;;https://x${ESC}\\\nvolume: 1 L\nNaCl 5 g\n\`\`\`\n`,
  );
  const cli = (args: string[]) => spawnSync('node', [CLI, ...args], { cwd: dir, encoding: 'utf8' });

  it.each([
    [['check', 'notes']],
    [['batch', 'notes']],
    [['table', 'notes']],
    [['demo', 'notes']],
    [['card', `Na${ESC}]52;c;eA==\u0007Cl`]],
    [['balance', `H2 + O2 -> H2O${ESC}[2J`]],
    [['check', `notes/missing${ESC}]8;;x${ESC}\\.md`]],
    [['check', `x${ESC}[31m.txt`]],
    [['report', join('notes', name)]],
  ])('%j: shown as pictures on stdout and stderr', (args) => {
    const r = cli(args);
    expect([0, 1, 2]).toContain(r.status);
    expect(r.stdout + r.stderr).not.toMatch(RAW_CONTROL);
    expect(r.stdout + r.stderr).toMatch(/␛/);
  });

  it('the file name keeps its line in check text: one line per finding', () => {
    const r = cli(['check', 'notes']);
    const lines = r.stdout.trimEnd().split('\n');
    for (const l of lines.slice(0, -1)) expect(l.startsWith('notes/bath␛[31m␍.md:')).toBe(true);
  });

  it('json keeps the text as written (escaped by JSON), DEL and C1 escaped too', () => {
    const r = cli(['check', 'notes', '--format', 'json']);
    expect(r.stdout).not.toMatch(/[\u0000-\u0009\u000b-\u001f\u007f-\u009f]/);
    const items = JSON.parse(r.stdout) as Array<{ file: string; message: string }>;
    expect(items[0].file).toBe(`notes/${name}`);
    expect(items.some((d) => d.message.includes('U+001B'))).toBe(true);
    const card = cli(['card', 'Na\u009bCl', '--json']);
    expect(card.stdout).toContain('\\u009b');
    expect(JSON.parse(card.stdout)[0].input).toBe('Na\u009bCl');
  });

  it('the pictures: C0 and DEL as U+2400–U+2421, C1 as \\x hex; lines keep newline and tab in multi-line text', () => {
    expect(visibleText('a\u001b[1mb\u0007\u0008\r\u007f\u009b\tc\nd')).toBe('a␛[1mb␇␈␍␡\\x9b\tc\nd');
    expect(visibleLine('a\nb\tc\u0000')).toBe('a␊b␉c␀');
    expect(visibleText('Fe₂O₃ · 5 H₂O — ü 🧪')).toBe('Fe₂O₃ · 5 H₂O — ü 🧪');
    // Bidirectional overrides reorder what a terminal shows (a file named 'note\u202Edm.exe'): escaped.
    expect(visibleLine('note\u202Edm.txt \u2066x\u2069')).toBe('note\\u202edm.txt \\u2066x\\u2069');
  });

  it('error messages with a file name are one line, shown as pictures (an IO in memory)', async () => {
    let err = '';
    const io: CliIO = { cwd: '/', out: () => undefined, err: (t) => void (err += t + '\n'), readFile: () => '', readDir: () => [], isDirectory: () => false };
    expect(await run(['check', 'evil\n\u001b[2J.txt'], io)).toBe(2);
    expect(err).toBe('ionwright: evil␊␛[2J.txt: not a Markdown (.md, .markdown) or notes (.fnote) file\n');
  });
});
